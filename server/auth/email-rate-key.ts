/** The e-mail part of a rate-limit key, shared by the sign-in and password-reset limits. */
import { createHash } from 'node:crypto';
import type { Request } from 'express';

/**
 * Returns the SHA-256 (base64url) of the request body's `email`, trimmed and lower-cased (empty when absent), so
 * any body — even a megabyte-long "email" — gives a short key, and no address is stored in the counters.
 */
export function emailRateKey(req: Request): string {
  const raw: unknown = (req.body as { email?: unknown } | undefined)?.email;
  const email = typeof raw === 'string' ? raw.trim().toLowerCase() : '';
  return createHash('sha256').update(email).digest('base64url');
}
