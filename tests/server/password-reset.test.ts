/**
 * Password reset (OWASP Forgot Password Cheat Sheet): the same answer whether or not the address has an
 * account; a mailed single-use link that works for 1 hour; only the token's SHA-256 hash is stored; the new
 * password ends every earlier session; requests are rate-limited per client address and per e-mail address,
 * failed confirmations per client address (429 in the API's error shape).
 */
import { eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { users } from '../../db/schema-core';
import { passwordResets, sentMail } from '../../db/schema-sharing';
import { hashLinkToken, newLinkToken } from '../../server/mail/link-token';
import { RESET_REQUESTED_MESSAGE } from '../../server/password-reset/service';
import { FIXTURE_PASSWORD, insertPerson, sessionCookie, setCookies, uniqueEmail } from './helpers';
import { freshClientAddress, makeCrewTestApp, TEST_PUBLIC_URL, tokenFromMail, type CrewTestContext } from './mail-test-app';

let ctx: CrewTestContext;
beforeAll(async () => {
  ctx = await makeCrewTestApp();
});
afterAll(async () => {
  await ctx.close();
});

const RESET_LINK = new RegExp(`${TEST_PUBLIC_URL.replace(/[.]/g, '\\.')}/reset-password\\?token=([A-Za-z0-9_-]{43})`);
const NEW_PASSWORD = 'fresh-foam-password-2';

/** Asks for a reset for `email` and returns the token from the caught mail. */
async function requestReset(email: string): Promise<string> {
  await request(ctx.crewApp).post('/api/auth/password-reset').send({ email }).expect(202);
  return tokenFromMail((await ctx.mailTo(email)).text, RESET_LINK);
}

describe('asking for a reset link', () => {
  it('answers the same for an address with an account and one without, and mails only the account', async () => {
    const person = await insertPerson(ctx.db, 'forgetful');
    const known = await request(ctx.crewApp).post('/api/auth/password-reset').send({ email: person.email });
    const stranger = uniqueEmail('nobody');
    const unknown = await request(ctx.crewApp).post('/api/auth/password-reset').send({ email: stranger });
    expect([known.status, unknown.status]).toEqual([202, 202]);
    expect(known.body).toEqual(unknown.body);
    expect(known.body).toEqual({ message: RESET_REQUESTED_MESSAGE });
    const mail = await ctx.mailTo(person.email);
    expect(mail.subject).toBe('Your Sheetsmith password reset link');
    expect(mail.text).toContain('for 1 hour');
    expect(mail.html).toContain('If you did not ask for this, ignore this mail');
    // Give a stray send to the unknown address time to show up before saying there was none.
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(ctx.catcher.messages().some((m) => m.to.includes(stranger))).toBe(false);
    expect(await ctx.db.select().from(sentMail).where(eq(sentMail.to, stranger))).toHaveLength(0);
  });

  it('stores only the SHA-256 of the token, with a 1-hour expiry; the token itself is nowhere in the database row', async () => {
    const person = await insertPerson(ctx.db, 'hashed');
    const token = await requestReset(person.email);
    const rows = await ctx.db.select().from(passwordResets).where(eq(passwordResets.userId, person.id));
    expect(rows).toHaveLength(1);
    expect(rows[0].tokenHash).toBe(hashLinkToken(token));
    expect(JSON.stringify(rows[0])).not.toContain(token);
    const minutes = (rows[0].expiresAt.getTime() - rows[0].createdAt.getTime()) / 60_000;
    expect(minutes).toBeGreaterThan(59.9);
    expect(minutes).toBeLessThan(60.1);
  });

  it('names the field when the address is malformed', async () => {
    const res = await request(ctx.crewApp).post('/api/auth/password-reset').send({ email: 'foam at bench' }).expect(400);
    expect(res.body.error.fields.email).toBe('Enter an e-mail address like name@example.com');
  });
});

describe('setting the new password', () => {
  it('sets the password, ends earlier sessions, and the old password stops working', async () => {
    const person = await insertPerson(ctx.db, 'renew');
    const oldCookie = await sessionCookie(ctx.key, person.id);
    await request(ctx.crewApp).get('/api/me').set('Cookie', oldCookie).expect(200);
    const token = await requestReset(person.email);
    const res = await request(ctx.crewApp).post('/api/auth/password-reset/confirm').send({ token, password: NEW_PASSWORD }).expect(200);
    expect(res.body).toEqual({ email: person.email });
    const ended = await request(ctx.crewApp).get('/api/me').set('Cookie', oldCookie).expect(401);
    expect(ended.body.error.message).toBe('This session was ended by a sign-out; sign in again');
    await request(ctx.crewApp).post('/api/auth/signin').send({ email: person.email, password: FIXTURE_PASSWORD }).expect(401);
    const signin = await request(ctx.crewApp).post('/api/auth/signin').send({ email: person.email, password: NEW_PASSWORD }).expect(200);
    expect(setCookies(signin.headers)).toHaveLength(1);
    const [row] = await ctx.db.select({ hash: users.passwordHash }).from(users).where(eq(users.id, person.id));
    // RFC 9106 argon2id in PHC string form, never the password itself.
    expect(row.hash).toMatch(/^\$argon2id\$v=19\$/);
  });

  it('works once: the same link again is refused, and so is an older link of the same person', async () => {
    const person = await insertPerson(ctx.db, 'once');
    const older = await requestReset(person.email);
    await request(ctx.crewApp).post('/api/auth/password-reset').send({ email: person.email }).expect(202);
    await new Promise((resolve) => setTimeout(resolve, 300));
    const newest = tokenFromMail(ctx.catcher.messages().find((m) => m.to.includes(person.email))?.text ?? '', RESET_LINK);
    expect(newest).not.toBe(older);
    await request(ctx.crewApp).post('/api/auth/password-reset/confirm').send({ token: newest, password: NEW_PASSWORD }).expect(200);
    const again = await request(ctx.crewApp).post('/api/auth/password-reset/confirm').send({ token: newest, password: 'another-long-pass' }).expect(400);
    expect(again.body.error.code).toBe('RESET_LINK_USED');
    const old = await request(ctx.crewApp).post('/api/auth/password-reset/confirm').send({ token: older, password: 'another-long-pass' }).expect(400);
    expect(old.body.error.code).toBe('RESET_LINK_USED');
    await request(ctx.crewApp).post('/api/auth/signin').send({ email: person.email, password: NEW_PASSWORD }).expect(200);
  });

  it('refuses a link past its hour, and an unknown or damaged token, each with a message saying what to do', async () => {
    const person = await insertPerson(ctx.db, 'expired');
    const token = await requestReset(person.email);
    await ctx.db.update(passwordResets).set({ expiresAt: sql`now() - interval '1 second'` }).where(eq(passwordResets.userId, person.id));
    const late = await request(ctx.crewApp).post('/api/auth/password-reset/confirm').send({ token, password: NEW_PASSWORD }).expect(400);
    expect(late.body.error).toMatchObject({ code: 'RESET_LINK_EXPIRED', message: 'This reset link expired (links work for 60 minutes); ask for a new one' });
    const unknown = await request(ctx.crewApp).post('/api/auth/password-reset/confirm').send({ token: newLinkToken().token, password: NEW_PASSWORD }).expect(400);
    expect(unknown.body.error.code).toBe('RESET_LINK_INVALID');
    const damaged = await request(ctx.crewApp).post('/api/auth/password-reset/confirm').send({ token: token.slice(0, 20), password: 'short' }).expect(400);
    expect(Object.keys(damaged.body.error.fields).sort()).toEqual(['password', 'token']);
    expect(damaged.body.error.fields.password).toBe('Use at least 10 characters');
    await request(ctx.crewApp).post('/api/auth/signin').send({ email: person.email, password: FIXTURE_PASSWORD }).expect(200);
  });
});

describe('rate limits', () => {
  it('allows 3 requests per e-mail address per window, from any client address, then answers 429', async () => {
    const app = ctx.appWith({ passwordResetLimit: { perIp: 100, perEmail: 3, windowMs: 60_000 } });
    const email = uniqueEmail('flooded');
    for (let i = 0; i < 3; i++) await request(app).post('/api/auth/password-reset').set('X-Forwarded-For', freshClientAddress()).send({ email }).expect(202);
    const res = await request(app).post('/api/auth/password-reset').set('X-Forwarded-For', freshClientAddress()).send({ email }).expect(429);
    expect(res.body.error).toEqual({ code: 'RATE_LIMITED', message: 'Too many password-reset requests for this e-mail address; wait up to 1 minutes and try again' });
    // Another address is not affected.
    await request(app).post('/api/auth/password-reset').set('X-Forwarded-For', freshClientAddress()).send({ email: uniqueEmail('calm') }).expect(202);
  });

  it('allows a set number of requests per client address across e-mails, then answers 429', async () => {
    const app = ctx.appWith({ passwordResetLimit: { perIp: 4, perEmail: 100, windowMs: 60_000 } });
    const client = freshClientAddress();
    for (let i = 0; i < 4; i++) await request(app).post('/api/auth/password-reset').set('X-Forwarded-For', client).send({ email: uniqueEmail(`probe${i}`) }).expect(202);
    const res = await request(app).post('/api/auth/password-reset').set('X-Forwarded-For', client).send({ email: uniqueEmail('probe-last') }).expect(429);
    expect(res.body.error.message).toMatch(/from your network address/);
  });

  it('counts failed confirmations per client address; a correct one is not counted', async () => {
    const app = ctx.appWith({ passwordResetLimit: { perIp: 3, perEmail: 100, windowMs: 60_000 } });
    const client = freshClientAddress();
    const person = await insertPerson(ctx.db, 'guard');
    const token = await requestReset(person.email);
    await request(app).post('/api/auth/password-reset/confirm').set('X-Forwarded-For', client).send({ token, password: NEW_PASSWORD }).expect(200);
    for (let i = 0; i < 3; i++) await request(app).post('/api/auth/password-reset/confirm').set('X-Forwarded-For', client).send({ token: newLinkToken().token, password: NEW_PASSWORD }).expect(400);
    const res = await request(app).post('/api/auth/password-reset/confirm').set('X-Forwarded-For', client).send({ token: newLinkToken().token, password: NEW_PASSWORD }).expect(429);
    expect(res.body.error.message).toMatch(/failed password-reset attempts/);
  });
});
