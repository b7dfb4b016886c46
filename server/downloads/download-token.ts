/**
 * Download-link tokens: 32 random bytes (256 bits) in base64url, handed out once in the buyer's e-mail and
 * stored only as their SHA-256 hex digest (FIPS 180-4), so the database never holds a usable link.
 */
import { createHash, randomBytes } from 'node:crypto';

/** Returns the stored form of `token`: its SHA-256 digest as 64 hex characters. */
export function hashDownloadToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** Returns a new token (43 base64url characters) and its hash. */
export function newDownloadToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, hash: hashDownloadToken(token) };
}

/** A token has this shape; anything else is refused before the database is asked. */
export const DOWNLOAD_TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;
