import type { Request, Response } from 'express';
import type { PreparedFile } from '../services/prepared-file.js';

/** Whether an `If-None-Match` header names `etag` (weak comparison, as RFC 9110 §13.1.2 asks for GET). */
export function ifNoneMatchHits(header: string | undefined, etag: string): boolean {
  if (header === undefined) return false;
  const opaque = etag.replace(/^W\//, '');
  return header.split(',').some((part) => {
    const tag = part.trim();
    return tag === '*' || tag.replace(/^W\//, '') === opaque;
  });
}

/**
 * Sends a prepared file as a download: gzipped when the client accepts it, with its strong ETag,
 * `Cache-Control: private, no-cache` (caches keep it for this user and ask again every time) and
 * `304 Not Modified` when the client already holds the same bytes.
 */
export async function sendPreparedFile(
  req: Request,
  res: Response,
  file: PreparedFile,
  disposition: string,
): Promise<void> {
  const zipped = req.acceptsEncodings('gzip', 'identity') === 'gzip';
  const { body, etag } = zipped ? await file.gzipped() : file;
  res.setHeader('ETag', etag);
  res.setHeader('Cache-Control', 'private, no-cache');
  res.setHeader('Vary', 'Accept-Encoding');
  if (ifNoneMatchHits(req.headers['if-none-match'], etag)) {
    res.status(304).end();
    return;
  }
  // The charset Express would add to a text body (the bytes are UTF-8).
  res.setHeader(
    'Content-Type',
    /;\s*charset=/i.test(file.contentType) ? file.contentType : `${file.contentType}; charset=utf-8`,
  );
  res.setHeader('Content-Disposition', disposition);
  if (zipped) res.setHeader('Content-Encoding', 'gzip');
  res.setHeader('Content-Length', String(body.byteLength));
  res.end(req.method === 'HEAD' ? undefined : body);
}
