/**
 * The sign-up rate limit: at most `max` sign-up attempts per client address in a window, counted in PostgreSQL
 * (shared by every API server, like the sign-in limit). Every attempt counts, failed ones too: an answer of
 * "that e-mail already has an account" tells an outsider which addresses are registered, so unlimited failed
 * attempts would let them list the members (OWASP Authentication Cheat Sheet, "Account enumeration"). The
 * defaults, 10 per 60 minutes, are common practice for a small site: a class signing up together from one
 * network can raise them with SIGNUP_RATE_LIMIT.
 */
import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Db } from '../../db/client';
import { AppError } from '../errors';
import { PostgresRateLimitStore } from './rate-limit-store';

export interface SignUpLimitOptions {
  /** Sign-up attempts allowed per client address per window. */
  max: number;
  windowMs: number;
}

/**
 * Returns the middleware; over the limit it answers 429 RATE_LIMITED in the API's error shape. IPv6 clients
 * are counted per /56 network (ipKeyGenerator's default), since one subscriber usually holds a whole prefix.
 */
export function signUpLimiter(db: Db, options: SignUpLimitOptions): RequestHandler {
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.max,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new PostgresRateLimitStore(db, 'signup:'),
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
    handler: (_req, _res, next, used) => {
      const minutes = Math.ceil(used.windowMs / 60_000);
      next(new AppError('RATE_LIMITED', 429, `Too many sign-ups from your network address; wait up to ${minutes} minutes and try again`));
    },
  });
}
