/**
 * Secret tokens for links sent by e-mail (invitations, password resets): 32 random bytes from the operating
 * system's CSPRNG, written base64url (RFC 4648 §5, 43 characters). Only the SHA-256 hash is stored, so a copy
 * of the database cannot be used to open a link; a plain hash suffices (no salt or slow hash) because the token
 * has 256 bits of entropy and cannot be guessed (OWASP Forgot Password Cheat Sheet).
 */
import { createHash, randomBytes } from 'node:crypto';

/** Returns the SHA-256 of `token` as lower-case hex (64 characters), the form kept in `token_hash` columns. */
export function hashLinkToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

/** Returns a new random token and its hash; mail the token, store the hash. */
export function newLinkToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashLinkToken(token) };
}
