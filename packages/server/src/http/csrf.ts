import type { Request } from 'express';
import { AppError } from './errors.js';

/**
 * Refuses a state-changing request that a browser sent from another site. Browsers send
 * `Sec-Fetch-Site` (Fetch Metadata) and `Origin` on such requests; a client that sends neither is not a
 * browser and carries no ambient cookie risk (common practice, the same rule as Go's CrossOriginProtection).
 */
export function checkSameOrigin(req: Request): void {
  const site = req.headers['sec-fetch-site'];
  if (typeof site === 'string') {
    if (site === 'same-origin' || site === 'none') return;
    throw new AppError('forbidden', `Cross-site request refused (Sec-Fetch-Site: ${site}).`);
  }
  const origin = req.headers.origin;
  if (origin === undefined) return;
  let host: string;
  try {
    host = new URL(origin).host;
  } catch {
    throw new AppError('forbidden', `Cross-site request refused (Origin: ${origin}).`);
  }
  if (host !== req.headers.host) throw new AppError('forbidden', `Cross-site request refused (Origin: ${origin}).`);
}
