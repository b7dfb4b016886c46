/**
 * Invitations: an owner invites by e-mail, the mail (caught by the in-process catcher) carries a single-use link
 * that works for 7 days; the token is stored only as its SHA-256 hash (FIPS 180-4; checked against node:crypto
 * and a published test vector); accept needs the invited e-mail; expired, reused, revoked and replaced links are
 * refused with a message saying what to do.
 */
import { createHash } from 'node:crypto';
import { createServer } from 'node:net';
import { and, eq, sql } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memberships, rateLimitHits, shops } from '../../db/schema-core';
import { invitations, sentMail } from '../../db/schema-sharing';
import { hashLinkToken, newLinkToken } from '../../server/mail/link-token';
import { createMailer } from '../../server/mail/send-mail';
import { FIXTURE_PASSWORD, insertPerson, makeShopFixture, sessionCookie, uniqueEmail, type ShopFixture } from './helpers';
import { makeCrewTestApp, TEST_PUBLIC_URL, tokenFromMail, type CrewTestContext } from './mail-test-app';

let ctx: CrewTestContext;
let fx: ShopFixture;
beforeAll(async () => {
  ctx = await makeCrewTestApp();
  fx = await makeShopFixture(ctx);
});
afterAll(async () => {
  await ctx.close();
});

const INVITE_LINK = new RegExp(`${TEST_PUBLIC_URL.replace(/[.]/g, '\\.')}/invite/([A-Za-z0-9_-]{43})`);

/** Invites `email` at `role` as the fixture owner and returns the answer and the token from the caught mail. */
async function invite(email: string, role: 'editor' | 'viewer') {
  const res = await request(ctx.crewApp).post(`/api/shops/${fx.shopId}/invitations`).set('Cookie', fx.people.owner.cookie).send({ email, role });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  const mail = await ctx.mailTo(email);
  return { res, mail, token: tokenFromMail(mail.text, INVITE_LINK) };
}

describe('link tokens', () => {
  it('hash with SHA-256 (FIPS 180-4 test vector for "abc")', () => {
    expect(hashLinkToken('abc')).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });
  it('are 32 random bytes in base64url (RFC 4648 §5): 43 characters, all different', () => {
    const tokens = Array.from({ length: 50 }, () => newLinkToken());
    for (const t of tokens) {
      expect(t.token).toMatch(/^[A-Za-z0-9_-]{43}$/);
      expect(Buffer.from(t.token, 'base64url')).toHaveLength(32);
      expect(t.tokenHash).toBe(createHash('sha256').update(t.token).digest('hex'));
    }
    expect(new Set(tokens.map((t) => t.token)).size).toBe(50);
  });
});

describe('inviting', () => {
  it('mails a link with the shop, role, inviter and expiry, and stores only the hash of its token', async () => {
    const email = uniqueEmail('crew');
    const { res, mail, token } = await invite(email, 'editor');
    expect(res.body.mail).toEqual({ sent: true });
    expect(res.body.invitation).toMatchObject({ email, role: 'editor', status: 'pending', invitedBy: { id: fx.people.owner.id } });
    const days = (Date.parse(res.body.invitation.expiresAt) - Date.parse(res.body.invitation.createdAt)) / 86_400_000;
    expect(days).toBeCloseTo(7, 3);
    expect(mail.subject).toBe('Test owner invites you to Fixture shop');
    expect(mail.text).toContain('as crew');
    expect(mail.html).toContain(`${TEST_PUBLIC_URL}/invite/${token}`);
    const [row] = await ctx.db.select().from(invitations).where(eq(invitations.id, res.body.invitation.id));
    expect(row.tokenHash).toBe(createHash('sha256').update(token).digest('hex'));
    // The token itself is nowhere in the invitation row or in the record of the sent mail.
    expect(JSON.stringify(row)).not.toContain(token);
    const mails = await ctx.db.select().from(sentMail).where(eq(sentMail.to, email));
    expect(mails).toHaveLength(1);
    expect(JSON.stringify(mails[0])).not.toContain(token);
    const list = await request(ctx.crewApp).get(`/api/shops/${fx.shopId}/invitations`).set('Cookie', fx.people.owner.cookie).expect(200);
    expect(list.body.invitations.map((i: { email: string }) => i.email)).toContain(email);
  });

  it('refuses an address that is already a member, and a role other than editor or viewer', async () => {
    const member = await request(ctx.crewApp).post(`/api/shops/${fx.shopId}/invitations`).set('Cookie', fx.people.owner.cookie).send({ email: fx.people.editor.email, role: 'viewer' }).expect(409);
    expect(member.body.error.code).toBe('ALREADY_MEMBER');
    expect(member.body.error.fields.email).toBe('This person is already a member of this shop');
    const owner = await request(ctx.crewApp).post(`/api/shops/${fx.shopId}/invitations`).set('Cookie', fx.people.owner.cookie).send({ email: uniqueEmail('x'), role: 'owner' }).expect(400);
    expect(owner.body.error.fields.role).toBe('Choose editor (crew) or viewer (client)');
    const bad = await request(ctx.crewApp).post(`/api/shops/${fx.shopId}/invitations`).set('Cookie', fx.people.owner.cookie).send({ email: 'not-an-address', role: 'viewer' }).expect(400);
    expect(bad.body.error.fields.email).toBe('Enter an e-mail address like name@example.com');
  });

  it('keeps the invitation when the mail cannot be sent, says so, and a resend with a working mailer delivers a new link', async () => {
    const port = await new Promise<number>((resolve) => {
      const s = createServer().listen(0, '127.0.0.1', () => {
        const p = (s.address() as { port: number }).port;
        s.close(() => resolve(p));
      });
    });
    const broken = createMailer({ SMTP_URL: `smtp://127.0.0.1:${port}`, MAIL_FROM: 'Sheetsmith <no-reply@sheetsmith.example.com>' }, ctx.db);
    const email = uniqueEmail('unlucky');
    const res = await request(ctx.appWith({ mailer: broken })).post(`/api/shops/${fx.shopId}/invitations`).set('Cookie', fx.people.owner.cookie).send({ email, role: 'viewer' }).expect(201);
    broken.close();
    expect(res.body.mail.sent).toBe(false);
    expect(res.body.mail.message).toMatch(/The invitation is saved but the e-mail did not go out .*ECONNREFUSED.*; use Resend to try again/);
    const [failed] = await ctx.db.select().from(sentMail).where(eq(sentMail.to, email));
    expect(failed.error).toMatch(/ECONNREFUSED/);
    const resent = await request(ctx.crewApp).post(`/api/shops/${fx.shopId}/invitations/${res.body.invitation.id}/resend`).set('Cookie', fx.people.owner.cookie).expect(200);
    expect(resent.body.mail).toEqual({ sent: true });
    const token = tokenFromMail((await ctx.mailTo(email)).text, INVITE_LINK);
    await request(ctx.crewApp).get(`/api/invitations/${token}`).expect(200);
  });
});

describe('accepting', () => {
  it('previews the invitation publicly, then lets the invited person in at the invited role, once', async () => {
    const client = await insertPerson(ctx.db, 'client');
    const { token } = await invite(client.email, 'viewer');
    const preview = await request(ctx.crewApp).get(`/api/invitations/${token}`).expect(200);
    expect(preview.body.invitation).toMatchObject({ shopName: 'Fixture shop', role: 'viewer', email: client.email, invitedByName: 'Test owner', status: 'pending', hasAccount: true });
    const cookie = await sessionCookie(ctx.key, client.id);
    const accepted = await request(ctx.crewApp).post(`/api/invitations/${token}/accept`).set('Cookie', cookie).expect(200);
    expect(accepted.body).toEqual({ shopId: fx.shopId, shopName: 'Fixture shop', role: 'viewer' });
    await request(ctx.crewApp).get(`/api/shops/${fx.shopId}/builds`).set('Cookie', cookie).expect(200);
    await request(ctx.crewApp).post(`/api/shops/${fx.shopId}/builds`).set('Cookie', cookie).send({ name: 'Not mine to make' }).expect(403);
    const again = await request(ctx.crewApp).post(`/api/invitations/${token}/accept`).set('Cookie', cookie).expect(410);
    expect(again.body.error.code).toBe('INVITATION_USED');
    expect((await request(ctx.crewApp).get(`/api/invitations/${token}`).expect(200)).body.invitation.status).toBe('accepted');
  });

  it('refuses someone signed in with another e-mail (403, naming both addresses) and leaves the invitation usable', async () => {
    const invited = uniqueEmail('invited');
    const { token } = await invite(invited, 'editor');
    const res = await request(ctx.crewApp).post(`/api/invitations/${token}/accept`).set('Cookie', fx.people.otherOwner.cookie).expect(403);
    expect(res.body.error.code).toBe('EMAIL_MISMATCH');
    expect(res.body.error.message).toBe(`This invitation is for ${invited}, but you are signed in as ${fx.people.otherOwner.email}; sign out and sign in or sign up with ${invited}`);
    expect((await request(ctx.crewApp).get(`/api/invitations/${token}`)).body.invitation).toMatchObject({ status: 'pending', hasAccount: false });
    // A new account with the invited address can then accept.
    const signup = await request(ctx.crewApp).post('/api/auth/signup').send({ name: 'New crew', email: invited, password: FIXTURE_PASSWORD });
    expect(signup.status).toBe(201);
    const cookie = (signup.headers['set-cookie'] as unknown as string[])[0].split(';')[0];
    expect((await request(ctx.crewApp).post(`/api/invitations/${token}/accept`).set('Cookie', cookie)).body.role).toBe('editor');
  });

  it('refuses an expired link (410, with the expiry date) and an anonymous accept (401)', async () => {
    const person = await insertPerson(ctx.db, 'late');
    const { res, token } = await invite(person.email, 'viewer');
    await request(ctx.crewApp).post(`/api/invitations/${token}/accept`).expect(401);
    await ctx.db.update(invitations).set({ expiresAt: sql`now() - interval '1 minute'` }).where(eq(invitations.id, res.body.invitation.id));
    const late = await request(ctx.crewApp).post(`/api/invitations/${token}/accept`).set('Cookie', await sessionCookie(ctx.key, person.id)).expect(410);
    expect(late.body.error.code).toBe('INVITATION_EXPIRED');
    expect(late.body.error.message).toMatch(/^This invitation expired on .* GMT; ask the shop owner to send it again$/);
    const rows = await ctx.db.select().from(memberships).where(and(eq(memberships.userId, person.id), eq(memberships.shopId, fx.shopId)));
    expect(rows).toHaveLength(0);
  });

  it('refuses a revoked link (410) and, after a resend, the replaced link (404)', async () => {
    const person = await insertPerson(ctx.db, 'revoked');
    const first = await invite(person.email, 'viewer');
    const cookie = await sessionCookie(ctx.key, person.id);
    await request(ctx.crewApp).post(`/api/shops/${fx.shopId}/invitations/${first.res.body.invitation.id}/resend`).set('Cookie', fx.people.owner.cookie).expect(200);
    const replaced = await request(ctx.crewApp).post(`/api/invitations/${first.token}/accept`).set('Cookie', cookie).expect(404);
    expect(replaced.body.error.message).toMatch(/not valid \(it may have been replaced by a newer one\)/);
    await request(ctx.crewApp).delete(`/api/shops/${fx.shopId}/invitations/${first.res.body.invitation.id}`).set('Cookie', fx.people.owner.cookie).expect(204);
    const newest = ctx.catcher.messages().find((m) => m.to.includes(person.email));
    const secondToken = tokenFromMail(newest?.text ?? '', INVITE_LINK);
    expect(secondToken).not.toBe(first.token);
    const revoked = await request(ctx.crewApp).post(`/api/invitations/${secondToken}/accept`).set('Cookie', cookie).expect(410);
    expect(revoked.body.error.code).toBe('INVITATION_REVOKED');
    const list = await request(ctx.crewApp).get(`/api/shops/${fx.shopId}/invitations`).set('Cookie', fx.people.owner.cookie).expect(200);
    expect(list.body.invitations.map((i: { email: string }) => i.email)).not.toContain(person.email);
  });

  it('resends an expired invitation with a fresh 7-day link that works', async () => {
    const person = await insertPerson(ctx.db, 'renewed');
    const { res } = await invite(person.email, 'editor');
    await ctx.db.update(invitations).set({ expiresAt: sql`now() - interval '1 day'` }).where(eq(invitations.id, res.body.invitation.id));
    const list = await request(ctx.crewApp).get(`/api/shops/${fx.shopId}/invitations`).set('Cookie', fx.people.owner.cookie).expect(200);
    expect(list.body.invitations.find((i: { id: string }) => i.id === res.body.invitation.id).status).toBe('expired');
    const before = ctx.catcher.messages().length;
    const resent = await request(ctx.crewApp).post(`/api/shops/${fx.shopId}/invitations/${res.body.invitation.id}/resend`).set('Cookie', fx.people.owner.cookie).expect(200);
    expect(resent.body.invitation.status).toBe('pending');
    expect((Date.parse(resent.body.invitation.expiresAt) - Date.now()) / 86_400_000).toBeCloseTo(7, 2);
    await expect.poll(() => ctx.catcher.messages().length).toBe(before + 1);
    const token = tokenFromMail(ctx.catcher.messages()[0].text, INVITE_LINK);
    const accepted = await request(ctx.crewApp).post(`/api/invitations/${token}/accept`).set('Cookie', await sessionCookie(ctx.key, person.id)).expect(200);
    expect(accepted.body.role).toBe('editor');
  });

  it('accepts a link used twice at the same moment only once', async () => {
    const person = await insertPerson(ctx.db, 'twice');
    const { token } = await invite(person.email, 'viewer');
    const cookie = await sessionCookie(ctx.key, person.id);
    const answers = await Promise.all([1, 2].map(() => request(ctx.crewApp).post(`/api/invitations/${token}/accept`).set('Cookie', cookie)));
    expect(answers.map((a) => a.status).sort()).toEqual([200, 410]);
  });

  it('never lowers the role of someone already in the shop', async () => {
    const person = await insertPerson(ctx.db, 'already');
    const { token } = await invite(person.email, 'viewer');
    await ctx.db.insert(memberships).values({ userId: person.id, shopId: fx.shopId, role: 'editor' });
    const res = await request(ctx.crewApp).post(`/api/invitations/${token}/accept`).set('Cookie', await sessionCookie(ctx.key, person.id)).expect(200);
    expect(res.body.role).toBe('editor');
  });

  it('answers 400 naming the token for a damaged link and 404 for an unknown one', async () => {
    const damaged = await request(ctx.crewApp).get('/api/invitations/abc').expect(400);
    expect(damaged.body.error.fields.token).toMatch(/incomplete or damaged/);
    const unknown = await request(ctx.crewApp).get(`/api/invitations/${newLinkToken().token}`).expect(404);
    expect(unknown.body.error.code).toBe('INVITATION_NOT_FOUND');
  });

  it('hides invitations of one shop from the owner of another (404 on revoke/resend through their own shop)', async () => {
    const { res } = await invite(uniqueEmail('foreign'), 'viewer');
    const [other] = await ctx.db.select({ shopId: memberships.shopId }).from(memberships).where(eq(memberships.userId, fx.people.otherOwner.id));
    await request(ctx.crewApp).delete(`/api/shops/${other.shopId}/invitations/${res.body.invitation.id}`).set('Cookie', fx.people.otherOwner.cookie).expect(404);
    await request(ctx.crewApp).post(`/api/shops/${other.shopId}/invitations/${res.body.invitation.id}/resend`).set('Cookie', fx.people.otherOwner.cookie).expect(404);
  });
});

describe('the invitation-mail limit per shop', () => {
  it('allows a set number of invitations and resends per shop per hour, not counting refused requests', async () => {
    const app = ctx.appWith({ env: { INVITATION_RATE_LIMIT: '2' } });
    const [shop] = await ctx.db.insert(shops).values({ name: 'Busy shop' }).returning({ id: shops.id });
    const owner = await insertPerson(ctx.db, 'busy-owner');
    const editor = await insertPerson(ctx.db, 'busy-editor');
    await ctx.db.insert(memberships).values([
      { userId: owner.id, shopId: shop.id, role: 'owner' },
      { userId: editor.id, shopId: shop.id, role: 'editor' },
    ]);
    const ownerCookie = await sessionCookie(ctx.key, owner.id);
    const url = `/api/shops/${shop.id}/invitations`;
    // Refused calls (anonymous 401, editor 403, bad body 400) do not use up the shop's allowance.
    await request(app).post(url).send({ email: uniqueEmail('nope'), role: 'viewer' }).expect(401);
    await request(app).post(url).set('Cookie', await sessionCookie(ctx.key, editor.id)).send({ email: uniqueEmail('nope'), role: 'viewer' }).expect(403);
    await request(app).post(url).set('Cookie', ownerCookie).send({ email: 'bad', role: 'viewer' }).expect(400);
    // express-rate-limit takes a refused request back when its answer has been sent, a moment after the client has it.
    const hits = async () => (await ctx.db.select({ hits: rateLimitHits.hits }).from(rateLimitHits).where(eq(rateLimitHits.key, `invite:${shop.id}`)))[0]?.hits ?? 0;
    await expect.poll(hits).toBe(0);
    const first = await request(app).post(url).set('Cookie', ownerCookie).send({ email: uniqueEmail('busy1'), role: 'viewer' }).expect(201);
    await request(app).post(`${url}/${first.body.invitation.id}/resend`).set('Cookie', ownerCookie).expect(200);
    const over = await request(app).post(url).set('Cookie', ownerCookie).send({ email: uniqueEmail('busy3'), role: 'viewer' }).expect(429);
    expect(over.body.error).toEqual({ code: 'RATE_LIMITED', message: 'This shop has sent 2 invitations in the last hour, the most allowed; wait a while and try again' });
    // Another shop of the same owner is not affected.
    const [calm] = await ctx.db.insert(shops).values({ name: 'Calm shop' }).returning({ id: shops.id });
    await ctx.db.insert(memberships).values({ userId: owner.id, shopId: calm.id, role: 'owner' });
    await request(app).post(`/api/shops/${calm.id}/invitations`).set('Cookie', ownerCookie).send({ email: uniqueEmail('calm'), role: 'viewer' }).expect(201);
  });
});
