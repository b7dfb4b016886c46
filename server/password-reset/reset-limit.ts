/**
 * Rate limits for password reset, counted in PostgreSQL like the sign-in limit (server/auth/sign-in-limit.ts):
 * requests per client address and per e-mail address (so one inbox cannot be flooded from many addresses, and
 * one address cannot probe many inboxes), and failed confirmations per client address (OWASP Forgot Password
 * Cheat Sheet, "rate limiting"). The defaults (10 per address, 3 per e-mail, per hour) are common practice.
 */
import type { Request, RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Db } from '../../db/client';
import { emailRateKey } from '../auth/email-rate-key';
import { PostgresRateLimitStore } from '../auth/rate-limit-store';
import { AppError } from '../errors';

export interface PasswordResetLimitOptions {
  /** Requests (and failed confirmations) allowed per client address per window. */
  perIp: number;
  /** Requests allowed per e-mail address per window. */
  perEmail: number;
  windowMs: number;
}

function tooMany(what: string) {
  return (_req: Request, _res: unknown, next: (err: AppError) => void, used: { windowMs: number }) => {
    const minutes = Math.ceil(used.windowMs / 60_000);
    next(new AppError('RATE_LIMITED', 429, `Too many ${what}; wait up to ${minutes} minutes and try again`));
  };
}

/** Returns the middleware for POST /api/auth/password-reset: per client address, then per e-mail. */
export function resetRequestLimiters(db: Db, options: PasswordResetLimitOptions): RequestHandler[] {
  const common = { windowMs: options.windowMs, standardHeaders: 'draft-8' as const, legacyHeaders: false };
  return [
    rateLimit({
      ...common,
      limit: options.perIp,
      store: new PostgresRateLimitStore(db, 'reset-ip:'),
      keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
      handler: tooMany('password-reset requests from your network address'),
    }),
    rateLimit({
      ...common,
      limit: options.perEmail,
      store: new PostgresRateLimitStore(db, 'reset-email:'),
      keyGenerator: emailRateKey,
      handler: tooMany('password-reset requests for this e-mail address'),
    }),
  ];
}

/** Returns the middleware for POST /api/auth/password-reset/confirm: failed attempts per client address. */
export function resetConfirmLimiter(db: Db, options: PasswordResetLimitOptions): RequestHandler {
  return rateLimit({
    windowMs: options.windowMs,
    limit: options.perIp,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    store: new PostgresRateLimitStore(db, 'reset-confirm:'),
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? 'unknown'),
    handler: tooMany('failed password-reset attempts from your network address'),
  });
}
