/**
 * The checkout rate limit: at most `max` checkouts per client address in a window, counted in PostgreSQL (shared
 * by every API server, like the sign-in limit). Taking a free pack mails whatever address is typed in, so
 * without a limit the form could be used to flood someone's inbox; paid checkouts also open a session at the
 * payment provider each time. The default, 30 per 60 minutes, is common practice for a small shop.
 */
import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Db } from '../../db/client';
import { PostgresRateLimitStore } from '../auth/rate-limit-store';
import { AppError } from '../errors';

export interface CheckoutLimitOptions {
  /** Checkouts allowed per client address per window. */
  max: number;
  windowMs: number;
}

/** Returns the middleware; over the limit it answers 429 RATE_LIMITED in the API's error shape (IPv6 per /56). */
export function checkoutLimiter(db: Db, options: CheckoutLimitOptions): RequestHandler {
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.max,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    store: new PostgresRateLimitStore(db, 'checkout:'),
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
    handler: (_req, _res, next, used) => {
      const minutes = Math.ceil(used.windowMs / 60_000);
      next(new AppError('RATE_LIMITED', 429, `Too many checkouts from your network address; wait up to ${minutes} minutes and try again`));
    },
  });
}
