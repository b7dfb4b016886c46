/**
 * Password reset by e-mail (OWASP Forgot Password Cheat Sheet): the request answers the same whether or not an
 * account uses the address; the link holds a random 32-byte token, stored only as its SHA-256 hash, that works
 * once and for one hour; setting the new password ends every session of the person (their session generation
 * goes up) and voids every other outstanding link.
 */
import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import type { PasswordResetConfirmBody } from '../../db/validation-crew';
import { insertAuditEntry } from '../audit/queries';
import { hashPassword } from '../auth/passwords';
import { AppError } from '../errors';
import { hashLinkToken, newLinkToken } from '../mail/link-token';
import type { Mailer } from '../mail/send-mail';
import { passwordResetMail } from '../mail/templates/password-reset-mail';
import { insertPasswordReset, selectResetForUpdate, selectUserIdByEmail, setPasswordAndEndSessions, useAllResetsOf } from './queries';

/** How long a reset link works: 1 hour (OWASP Forgot Password Cheat Sheet suggests a short expiry). */
export const RESET_LIFETIME_MINUTES = 60;

/** The one answer to a reset request, whatever happened. */
export const RESET_REQUESTED_MESSAGE = 'If an account uses this e-mail address, a link to set a new password is on its way. It works for 1 hour.';

export interface PasswordResetDeps {
  db: Db;
  mailer: Mailer;
  baseUrl: string;
}

/** Returns the reset-page URL for a token. */
export function resetUrl(baseUrl: string, token: string): string {
  return `${baseUrl}/reset-password?token=${token}`;
}

/**
 * Answers at once and, for an account with `email`, stores a reset token and mails the link in the background:
 * the answer then takes the same time whether or not the address has an account (OWASP Forgot Password Cheat
 * Sheet: "ensure responses return in a consistent amount of time", by doing the work asynchronously). A failure
 * there is logged and, for the mail, recorded in sent_mail; the person can ask again.
 */
export function requestPasswordReset(deps: PasswordResetDeps, email: string, log: Logger): void {
  const work = async () => {
    const userId = await selectUserIdByEmail(deps.db, email);
    if (!userId) return;
    const { token, tokenHash } = newLinkToken();
    await insertPasswordReset(deps.db, { userId, tokenHash, expiresAt: new Date(Date.now() + RESET_LIFETIME_MINUTES * 60_000) });
    const content = passwordResetMail({ resetUrl: resetUrl(deps.baseUrl, token), validMinutes: RESET_LIFETIME_MINUTES });
    await deps.mailer.send({ kind: 'password-reset', to: email, ...content, detail: { userId } });
  };
  work().catch((err: unknown) => log.warn({ err }, 'password reset link not stored or not mailed'));
}

/**
 * Sets the new password for a valid, unused, unexpired token and returns the account's e-mail (for the sign-in
 * form). Throws 400 RESET_LINK_INVALID / RESET_LINK_USED / RESET_LINK_EXPIRED with a message saying what to do.
 */
export async function confirmPasswordReset(db: Db, input: PasswordResetConfirmBody): Promise<{ email: string }> {
  // Hashing takes tens of milliseconds of CPU; doing it before the transaction keeps the row lock short.
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const reset = await selectResetForUpdate(tx, hashLinkToken(input.token));
    if (!reset) throw new AppError('RESET_LINK_INVALID', 400, 'This reset link is not valid; ask for a new one on the "Forgot password" page', { token: 'Unknown reset link' });
    if (reset.usedAt) throw new AppError('RESET_LINK_USED', 400, 'This reset link was already used (each link works once); ask for a new one if you need to', { token: 'Link already used' });
    if (reset.expiresAt.getTime() <= Date.now()) {
      throw new AppError('RESET_LINK_EXPIRED', 400, `This reset link expired (links work for ${RESET_LIFETIME_MINUTES} minutes); ask for a new one`, { token: 'Link expired' });
    }
    await setPasswordAndEndSessions(tx, reset.userId, passwordHash);
    await useAllResetsOf(tx, reset.userId);
    await insertAuditEntry(tx, { shopId: null, userId: reset.userId, action: 'user.password-reset', target: `user:${reset.userId}` });
    return { email: reset.email };
  });
}
