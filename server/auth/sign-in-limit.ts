/**
 * The sign-in rate limit: at most `max` failed attempts per client address and e-mail in a window, counted in
 * PostgreSQL so that all API servers share the count. Successful sign-ins are not counted, so a person who
 * types their password right is never locked out by their own earlier successes (OWASP Authentication Cheat
 * Sheet, "Protect against automated attacks").
 */
import { createHash } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Db } from '../../db/client';
import { AppError } from '../errors';
import { PostgresRateLimitStore } from './rate-limit-store';

export interface SignInLimitOptions {
  /** Failed attempts allowed per window. */
  max: number;
  windowMs: number;
}

/** The e-mail part of the key, hashed so that any body (even a megabyte-long "email") gives a short key. */
function emailKey(req: Request): string {
  const raw: unknown = (req.body as { email?: unknown } | undefined)?.email;
  const email = typeof raw === 'string' ? raw.trim().toLowerCase() : '';
  return createHash('sha256').update(email).digest('base64url');
}

/** Returns the middleware; over the limit it answers 429 RATE_LIMITED in the API's error shape. */
export function signInLimiter(db: Db, options: SignInLimitOptions): RequestHandler {
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.max,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    store: new PostgresRateLimitStore(db, 'signin:'),
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? 'unknown')}|${emailKey(req)}`,
    handler: (_req, _res, next, used) => {
      const minutes = Math.ceil(used.windowMs / 60_000);
      next(new AppError('RATE_LIMITED', 429, `Too many failed sign-ins; wait up to ${minutes} minutes and try again`));
    },
  });
}
