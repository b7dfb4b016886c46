/**
 * E-mail: the mail catcher (server/dev/mail-catcher.ts) started on free ports, messages sent through nodemailer
 * by the Mailer (server/mail/send-mail.ts), read back over the catcher's HTTP API, and the `sent_mail` record of
 * each attempt, sent or failed. The templates are checked for both parts and for HTML escaping.
 */
import { createServer } from 'node:net';
import { desc, eq } from 'drizzle-orm';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { createDb, createPool, type Db } from '../../db/client';
import { sentMail } from '../../db/schema-sharing';
import { startMailCatcher, type CaughtMail, type MailCatcher } from '../../server/dev/mail-catcher';
import { createMailer, MailSendError, type Mailer } from '../../server/mail/send-mail';
import { invitationMail } from '../../server/mail/templates/invitation-mail';
import { escapeHtml } from '../../server/mail/templates/mail-layout';
import { packPublishedMail } from '../../server/mail/templates/pack-published-mail';
import { passwordResetMail } from '../../server/mail/templates/password-reset-mail';
import { formatAmount, receiptMail } from '../../server/mail/templates/receipt-mail';
import { TEST_DATABASE_URL, uniqueEmail } from './helpers';

let catcher: MailCatcher;
let mailer: Mailer;
let db: Db;
const pool = createPool(TEST_DATABASE_URL, 2);

beforeAll(async () => {
  db = createDb(pool);
  catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0 });
  mailer = createMailer({ SMTP_URL: `smtp://127.0.0.1:${catcher.smtpPort}`, MAIL_FROM: 'Sheetsmith <no-reply@sheetsmith.example.com>' }, db);
});
afterAll(async () => {
  mailer.close();
  await catcher.close();
  await pool.end();
});
beforeEach(async () => {
  await fetch(`http://127.0.0.1:${catcher.httpPort}/messages`, { method: 'DELETE' });
});

async function caught(): Promise<CaughtMail[]> {
  const res = await fetch(`http://127.0.0.1:${catcher.httpPort}/messages`);
  expect(res.status).toBe(200);
  return (await res.json()) as CaughtMail[];
}

/** Returns a loopback port nothing listens on (bound, then released). */
async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

describe('the mail catcher and the mailer', () => {
  it('delivers a message with a text part and an HTML part, readable over the HTTP API', async () => {
    const to = uniqueEmail('mail');
    await mailer.send({ kind: 'test', to, subject: 'Foam check', text: 'Plain body: 6 mm EVA', html: '<p>HTML body: <b>6 mm</b> EVA</p>' });
    const list = await caught();
    expect(list).toHaveLength(1);
    expect(list[0].to).toEqual([to]);
    expect(list[0].from).toBe('no-reply@sheetsmith.example.com');
    expect(list[0].subject).toBe('Foam check');
    // Both MIME alternatives (RFC 2046 §5.1.4 multipart/alternative) come back as sent.
    expect(list[0].text.trim()).toBe('Plain body: 6 mm EVA');
    expect(list[0].html).toContain('<b>6 mm</b>');
    const one = await fetch(`http://127.0.0.1:${catcher.httpPort}/messages/${list[0].id}`);
    expect(((await one.json()) as CaughtMail).subject).toBe('Foam check');
  });

  it('records a sent message in sent_mail with the server-given message id and no error', async () => {
    const to = uniqueEmail('record');
    await mailer.send({ kind: 'test', to, subject: 'Recorded', text: 't', html: '<p>h</p>', detail: { note: 'from the mail test' } });
    const [row] = await db.select().from(sentMail).where(eq(sentMail.to, to));
    expect(row.kind).toBe('test');
    expect(row.error).toBeNull();
    // RFC 5322 §3.6.4: msg-id is "<" id-left "@" id-right ">".
    expect(row.messageId).toMatch(/^<[^<>@\s]+@[^<>@\s]+>$/);
    expect(row.detail).toEqual({ note: 'from the mail test' });
  });

  it('rejects with a message naming the address when no mail server answers, and records the failure', async () => {
    const port = await closedPort();
    const broken = createMailer({ SMTP_URL: `smtp://127.0.0.1:${port}`, MAIL_FROM: 'Sheetsmith <no-reply@sheetsmith.example.com>' }, db);
    const to = uniqueEmail('fail');
    const attempt = broken.send({ kind: 'test', to, subject: 'Lost?', text: 't', html: '<p>h</p>' });
    await expect(attempt).rejects.toBeInstanceOf(MailSendError);
    await expect(attempt).rejects.toThrow(new RegExp(`The test e-mail to ${to.replace(/[.+]/g, '\\$&')} could not be sent: .*ECONNREFUSED`));
    broken.close();
    const [row] = await db.select().from(sentMail).where(eq(sentMail.to, to)).orderBy(desc(sentMail.createdAt));
    expect(row.messageId).toBeNull();
    expect(row.error).toMatch(/ECONNREFUSED/);
  });

  it('keeps only the newest messages, dropping the oldest (500 by default)', async () => {
    const small = await startMailCatcher({ smtpPort: 0, httpPort: 0, keep: 3 });
    const direct = createMailer({ SMTP_URL: `smtp://127.0.0.1:${small.smtpPort}`, MAIL_FROM: 'Sheetsmith <no-reply@sheetsmith.example.com>' }, db);
    for (let i = 1; i <= 5; i++) await direct.send({ kind: 'test', to: `bulk-${i}@test.example.com`, subject: `Bulk ${i}`, text: 't', html: 'h' });
    direct.close();
    expect(small.messages().map((m) => m.subject)).toEqual(['Bulk 5', 'Bulk 4', 'Bulk 3']);
    await small.close();
    await db.delete(sentMail).where(eq(sentMail.kind, 'test'));
  });

  it('answers unknown catcher paths with 404 and a hint', async () => {
    const res = await fetch(`http://127.0.0.1:${catcher.httpPort}/inbox`);
    expect(res.status).toBe(404);
    expect(((await res.json()) as { error: string }).error).toMatch(/GET \/messages/);
  });
});

describe('the mail templates', () => {
  const expires = new Date('2026-03-08T12:00:00Z');

  it('escapes the five HTML-special characters (OWASP XSS Prevention Cheat Sheet, output encoding for HTML contexts)', () => {
    expect(escapeHtml(`<a href="x">Tom & Jo's</a>`)).toBe('&lt;a href=&quot;x&quot;&gt;Tom &amp; Jo&#39;s&lt;/a&gt;');
  });

  it('invitation: shop, role, inviter, link and expiry in both parts; names escaped in HTML', () => {
    const mail = invitationMail({ shopName: 'Foam & <Fire>', role: 'viewer', invitedByName: 'Ada', acceptUrl: 'https://app.example.com/invite/abc?x=1&y=2', expiresAt: expires });
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain('Ada');
      expect(part).toContain('as a client');
      expect(part).toContain('Sun, 08 Mar 2026 12:00:00 GMT');
    }
    expect(mail.text).toContain('Foam & <Fire>');
    expect(mail.text).toContain('https://app.example.com/invite/abc?x=1&y=2');
    expect(mail.html).toContain('Foam &amp; &lt;Fire&gt;');
    expect(mail.html).not.toContain('<Fire>');
    expect(mail.html).toContain('href="https://app.example.com/invite/abc?x=1&amp;y=2"');
  });

  it('password reset: link, one hour, and "ignore if you did not ask"', () => {
    const mail = passwordResetMail({ resetUrl: 'https://app.example.com/reset-password?token=t0k', validMinutes: 60 });
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain('https://app.example.com/reset-password?token=t0k');
      expect(part).toContain('for 1 hour');
      expect(part).toContain('If you did not ask for this, ignore this mail');
    }
  });

  it('receipt: amount in major units per ISO 4217 minor-unit digits, link, uses and expiry, foam cautions', () => {
    // ISO 4217: EUR has 2 minor-unit digits, JPY has 0.
    expect(formatAmount(1250, 'eur')).toBe('12.50 EUR');
    expect(formatAmount(1250, 'jpy')).toBe('1250 JPY');
    const mail = receiptMail({ packTitle: 'Ridge helmet', amountCents: 1250, currency: 'eur', downloadUrl: 'https://app.example.com/api/downloads/t', expiresAt: expires, maxUses: 5, orderId: 'o-1' });
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain('12.50 EUR');
      expect(part).toContain('works 5 times');
      expect(part).toContain('safety data sheet');
    }
    const free = receiptMail({ packTitle: 'Free bracer', amountCents: 0, currency: 'eur', downloadUrl: 'https://x.example.com/d', expiresAt: expires, maxUses: 1, orderId: 'o-2' });
    expect(free.text).toContain('nothing was charged');
    expect(free.text).toContain('works 1 time,');
  });

  it('pack published: title, shop, price and link', () => {
    const mail = packPublishedMail({ packTitle: 'Ridge helmet', shopName: 'Bench 4', priceCents: 900, currency: 'usd', packUrl: 'https://app.example.com/packs/ridge-helmet' });
    expect(mail.subject).toBe('Published: Ridge helmet');
    for (const part of [mail.text, mail.html]) {
      expect(part).toContain('9.00 USD');
      expect(part).toContain('Bench 4');
      expect(part).toContain('https://app.example.com/packs/ridge-helmet');
    }
  });
});
