/**
 * The invitation-mail limit: at most `max` invitations (new or resent) per shop per hour, counted in PostgreSQL
 * (shared by every API server). Invitations mail addresses the shop chooses, so without a bound one account
 * could use the product to flood strangers' inboxes. Refused requests (not signed in, not an owner, bad input)
 * are not counted, so nobody else can use up a shop's allowance. The default of 30 an hour is common practice.
 */
import type { RequestHandler } from 'express';
import { rateLimit } from 'express-rate-limit';
import type { Db } from '../../db/client';
import { PostgresRateLimitStore } from '../auth/rate-limit-store';
import { AppError } from '../errors';

/** Returns the middleware; over the limit it answers 429 RATE_LIMITED in the API's error shape. */
export function invitationLimiter(db: Db, max: number): RequestHandler {
  return rateLimit({
    windowMs: 60 * 60_000,
    limit: max,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipFailedRequests: true,
    store: new PostgresRateLimitStore(db, 'invite:'),
    keyGenerator: (req) => String(req.params.shopId ?? ''),
    handler: (_req, _res, next) => {
      next(new AppError('RATE_LIMITED', 429, `This shop has sent ${max} invitations in the last hour, the most allowed; wait a while and try again`));
    },
  });
}
