/**
 * Set-up shared by the crew, invitation and password-reset API tests: the usual test app (tests/server/helpers.ts)
 * rebuilt with a mailer pointed at an in-process mail catcher on free ports, and helpers to read caught mail.
 */
import { randomUUID } from 'node:crypto';
import type { Express } from 'express';
import { expect } from 'vitest';
import { createApp } from '../../server/app';
import { startMailCatcher, type CaughtMail, type MailCatcher } from '../../server/dev/mail-catcher';
import { parseEnv } from '../../server/env';
import { createLogger } from '../../server/logger';
import { createMailer, type Mailer } from '../../server/mail/send-mail';
import type { PasswordResetLimitOptions } from '../../server/password-reset/reset-limit';
import { makeTestApp, TEST_DATABASE_URL, type TestContext } from './helpers';

/** The origin the mailed links use in these tests (PUBLIC_URL). */
export const TEST_PUBLIC_URL = 'https://sheetsmith.test.example.com';

export interface CrewTestContext extends TestContext {
  /** The app with the catcher's mailer (use this one, not `app`'s default). */
  crewApp: Express;
  catcher: MailCatcher;
  mailer: Mailer;
  /** Waits until a mail to `to` has been caught and returns the newest one. */
  mailTo(to: string): Promise<CaughtMail>;
  /** Rebuilds an app with other settings over the same database (e.g. rate limits, a broken mailer). */
  appWith(options: { mailer?: Mailer; passwordResetLimit?: PasswordResetLimitOptions | null; trustProxy?: string; env?: Record<string, string> }): Express;
}

/** Starts the catcher and returns the context; `close` stops the catcher, the mailer and the pool. */
export async function makeCrewTestApp(): Promise<CrewTestContext> {
  const ctx = await makeTestApp({ signInLimit: { max: 1000, windowMs: 60_000 } });
  const catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0 });
  const mailer = createMailer({ SMTP_URL: `smtp://127.0.0.1:${catcher.smtpPort}`, MAIL_FROM: 'Sheetsmith <no-reply@sheetsmith.example.com>' }, ctx.db);
  const appWith: CrewTestContext['appWith'] = (options) =>
    createApp({
      env: parseEnv({ NODE_ENV: 'test', DATABASE_URL: TEST_DATABASE_URL, WEB_ROOT: '/nonexistent-web-root', PUBLIC_URL: TEST_PUBLIC_URL, TRUST_PROXY: options.trustProxy ?? 'loopback', ...options.env }),
      pool: ctx.pool,
      db: ctx.db,
      sessionSecret: ctx.secret,
      logger: createLogger('silent', 'test'),
      signInLimit: { max: 1000, windowMs: 60_000 },
      signUpLimit: null,
      mailer: options.mailer ?? mailer,
      passwordResetLimit: 'passwordResetLimit' in options ? options.passwordResetLimit : null,
    });
  const mailTo = async (to: string): Promise<CaughtMail> => {
    const deadline = Date.now() + 5_000;
    for (;;) {
      const found = catcher.messages().find((m) => m.to.includes(to));
      if (found) return found;
      if (Date.now() > deadline) throw new Error(`no mail to ${to} was caught within 5 s`);
      await new Promise((resolve) => setTimeout(resolve, 25));
    }
  };
  return {
    ...ctx,
    crewApp: appWith({}),
    catcher,
    mailer,
    mailTo,
    appWith,
    close: async () => {
      mailer.close();
      await catcher.close();
      await ctx.close();
    },
  };
}

/** Returns the first capture group of `pattern` in `text` (the token of a mailed link); fails the test when absent. */
export function tokenFromMail(text: string, pattern: RegExp): string {
  const match = pattern.exec(text);
  expect(match, `no link matching ${pattern} in:\n${text}`).not.toBeNull();
  return (match as RegExpExecArray)[1];
}

/** Returns a client address for X-Forwarded-For that no other test uses (so rate-limit counts start at zero). */
export function freshClientAddress(): string {
  const hex = randomUUID().replace(/-/g, '');
  return `2001:db8:${hex.slice(0, 4)}:${hex.slice(4, 8)}::1`;
}
