import { hash, verify } from '@node-rs/argon2';

// Argon2id with the library's defaults (19 MiB memory, 2 passes), the OWASP password storage minimum.
/** Hashes a password with argon2id; the result carries its own salt and parameters. */
export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

/** Checks a password against a stored argon2 hash. */
export function verifyPassword(storedHash: string, password: string): Promise<boolean> {
  return verify(storedHash, password);
}
