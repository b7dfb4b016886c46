/**
 * The routes for bringing people into a shop and back into their account: members, invitations and password
 * reset, with the mailer and the public origin they share. Mounted by server/app.ts.
 */
import type { AppDeps } from '../app';
import { invitationRoutes } from '../invitations/router';
import type { MountableRoute } from '../http/define-route';
import { publicUrl } from '../mail/public-url';
import { createMailer } from '../mail/send-mail';
import { passwordResetRoutes } from '../password-reset/router';
import { memberRoutes } from './router';

/**
 * Returns the members, invitation and password-reset routes. Without `deps.mailer` a mailer on SMTP_URL is made;
 * `deps.passwordResetLimit` undefined takes the limits from the environment, null turns them off.
 */
export function crewRoutes(deps: AppDeps): MountableRoute[] {
  const mailer = deps.mailer ?? createMailer(deps.env, deps.db);
  const baseUrl = publicUrl(deps.env);
  const limit =
    deps.passwordResetLimit === undefined
      ? {
          perIp: deps.env.PASSWORD_RESET_RATE_LIMIT_IP,
          perEmail: deps.env.PASSWORD_RESET_RATE_LIMIT_EMAIL,
          windowMs: deps.env.PASSWORD_RESET_RATE_WINDOW_MINUTES * 60_000,
        }
      : deps.passwordResetLimit;
  return [
    ...memberRoutes(deps.db),
    ...invitationRoutes({ db: deps.db, mailer, baseUrl, perShopHourly: deps.env.INVITATION_RATE_LIMIT }),
    ...passwordResetRoutes({ db: deps.db, mailer, baseUrl, limit }),
  ];
}
