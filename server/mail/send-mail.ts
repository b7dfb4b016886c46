/**
 * Sending e-mail: nodemailer over SMTP (SMTP_URL; locally the mail catcher of server/dev/mail-catcher.ts), every
 * message with a plain-text and an HTML part, and every attempt recorded in `sent_mail` whether it went or not.
 * The caller keeps whatever asked for the mail (an invitation, a reset, an order) in its own table first, so a
 * failed send loses nothing: the record says it failed and the person can ask for the mail again.
 */
import nodemailer from 'nodemailer';
import type { Db } from '../../db/client';
import { sentMail } from '../../db/schema-sharing';

/** What kind of mail it is, kept in `sent_mail.kind` (admins filter the list by it). */
export type MailKind = 'invitation' | 'password-reset' | 'receipt' | 'pack-published' | (string & {});

/** A finished message: both parts are required, since some mail readers show only one of them. */
export interface MailMessage {
  kind: MailKind;
  /** One recipient address. */
  to: string;
  subject: string;
  text: string;
  html: string;
  /** Extra facts for the record (ids, never tokens or links that grant access). */
  detail?: Record<string, unknown>;
}

/** A message's subject and its two bodies, as the templates in server/mail/templates/ return them. */
export interface MailContent {
  subject: string;
  text: string;
  html: string;
}

export interface Mailer {
  /**
   * Hands the message to the SMTP server and records it. Resolves when the server accepted it; rejects with a
   * MailSendError (after recording the failure) when it did not, so callers can tell people to try again.
   */
  send(msg: MailMessage): Promise<void>;
  /** Closes the SMTP connections (on shutdown and at the end of tests). */
  close(): void;
}

/** A send the SMTP server did not accept; `message` says which address and why. */
export class MailSendError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'MailSendError';
  }
}

export interface MailerSettings {
  /** smtp:// or smtps:// URL of the mail server, e.g. smtp://127.0.0.1:8471. */
  SMTP_URL: string;
  /** Sender, "Name <address>". */
  MAIL_FROM: string;
}

/** Connection and answer timeouts: a mail server that does not answer must not hold a request for minutes. */
const SMTP_TIMEOUTS_MS = { connectionTimeout: 10_000, greetingTimeout: 10_000, socketTimeout: 20_000 };

/**
 * Returns a Mailer sending through `settings.SMTP_URL` from `settings.MAIL_FROM` and recording each attempt in
 * `sent_mail` through `db`. No connection is opened until the first send.
 */
export function createMailer(settings: MailerSettings, db: Db): Mailer {
  const transport = nodemailer.createTransport({ url: settings.SMTP_URL, ...SMTP_TIMEOUTS_MS });
  return {
    async send(msg) {
      let messageId: string | null = null;
      let error: string | null = null;
      try {
        const info = await transport.sendMail({ from: settings.MAIL_FROM, to: msg.to, subject: msg.subject, text: msg.text, html: msg.html });
        messageId = info.messageId ?? null;
      } catch (err) {
        error = err instanceof Error ? err.message : String(err);
      }
      await db.insert(sentMail).values({ kind: msg.kind, to: msg.to, subject: msg.subject, messageId, error, detail: msg.detail ?? {} });
      if (error !== null) throw new MailSendError(`The ${msg.kind} e-mail to ${msg.to} could not be sent: ${error}`);
    },
    close() {
      transport.close();
    },
  };
}
