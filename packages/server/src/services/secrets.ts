import { createHash, randomBytes } from 'node:crypto';

/** The prefix every Leadline API token starts with, so secret scanners and people can recognise one. */
export const API_TOKEN_PREFIX = 'llt_';

/** A new random secret: 32 bytes (256 bits) as base64url, optionally behind a prefix. */
export function createSecret(prefix = ''): string {
  return `${prefix}${randomBytes(32).toString('base64url')}`;
}

/**
 * SHA-256 of a secret, hex. A fast hash is enough here because the secrets are 256-bit random values,
 * not passwords people chose (common practice for API tokens).
 */
export function hashSecret(secret: string): string {
  return createHash('sha256').update(secret, 'utf8').digest('hex');
}
