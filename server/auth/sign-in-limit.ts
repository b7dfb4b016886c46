/**
 * The sign-in rate limit: at most `max` failed attempts per client address and e-mail in a window, counted in
 * PostgreSQL so that all API servers share the count. Successful sign-ins are not counted, so a person who
 * types their password right is never locked out by their own earlier successes (OWASP Authentication Cheat
 * Sheet, "Protect against automated attacks").
 */
import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Db } from '../../db/client';
import { AppError } from '../errors';
import { emailRateKey } from './email-rate-key';
import { PostgresRateLimitStore } from './rate-limit-store';

export interface SignInLimitOptions {
  /** Failed attempts allowed per window. */
  max: number;
  windowMs: number;
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
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? 'unknown')}|${emailRateKey(req)}`,
    handler: (_req, _res, next, used) => {
      const minutes = Math.ceil(used.windowMs / 60_000);
      next(new AppError('RATE_LIMITED', 429, `Too many failed sign-ins; wait up to ${minutes} minutes and try again`));
    },
  });
}
