/** HTTP routes for password reset: ask for a link, then set a new password with it. */
import type { Db } from '../../db/client';
import { passwordResetConfirmBody, passwordResetRequestBody } from '../../db/validation-crew';
import { defineRoute, type MountableRoute } from '../http/define-route';
import type { Mailer } from '../mail/send-mail';
import { resetConfirmLimiter, resetRequestLimiters, type PasswordResetLimitOptions } from './reset-limit';
import { confirmPasswordReset, requestPasswordReset, RESET_REQUESTED_MESSAGE } from './service';

/** Returns the password-reset routes; `limit` null turns the rate limits off (tests about other things). */
export function passwordResetRoutes(deps: { db: Db; mailer: Mailer; baseUrl: string; limit: PasswordResetLimitOptions | null }): MountableRoute[] {
  return [
    defineRoute({
      method: 'POST',
      path: '/api/auth/password-reset',
      access: 'public',
      body: passwordResetRequestBody,
      before: deps.limit ? resetRequestLimiters(deps.db, deps.limit) : [],
      handler: async ({ body, req }) => {
        requestPasswordReset(deps, body.email, req.log);
        return { status: 202, json: { message: RESET_REQUESTED_MESSAGE } };
      },
    }),
    defineRoute({
      method: 'POST',
      path: '/api/auth/password-reset/confirm',
      access: 'public',
      body: passwordResetConfirmBody,
      before: deps.limit ? [resetConfirmLimiter(deps.db, deps.limit)] : [],
      handler: async ({ body }) => ({ status: 200, json: await confirmPasswordReset(deps.db, body) }),
    }),
  ];
}
