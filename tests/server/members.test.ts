/**
 * Members of a shop: the list (e-mails only for owners), role changes, removal, the last-owner protection, the
 * print-set grant for viewers (commission clients) on every print-set route, and /api/me's flag for it. Access
 * per persona for these routes is walked here with the same expectation table as tests/server/access.test.ts
 * (RFC 9110 §15.5.2/§15.5.4: 401 without credentials, 403 when not allowed).
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { auditLog, memberships, printSets, shops } from '../../db/schema-core';
import { createApp } from '../../server/app';
import { PRINT_SET_GRANT_ROUTES } from '../../server/auth/access';
import { parseEnv } from '../../server/env';
import { createLogger } from '../../server/logger';
import { printSetFileKey } from '../../server/print-sets/print-set-files';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { piece, rectangle } from '../fixtures/pattern-docs/shape-docs';
import { insertBuild, insertPerson, makeShopFixture, PERSONAS, sessionCookie, TEST_DATABASE_URL, type Persona, type ShopFixture } from './helpers';
import { makeCrewTestApp, type CrewTestContext } from './mail-test-app';

let ctx: CrewTestContext;
let fx: ShopFixture;

beforeAll(async () => {
  ctx = await makeCrewTestApp();
  fx = await makeShopFixture(ctx);
});
afterAll(async () => {
  await ctx.close();
});

/** Adds a new person to the fixture shop at `role` and returns their id and cookie. */
async function addMember(role: 'owner' | 'editor' | 'viewer', tag: string) {
  const person = await insertPerson(ctx.db, tag);
  await ctx.db.insert(memberships).values({ userId: person.id, shopId: fx.shopId, role });
  return { ...person, cookie: await sessionCookie(ctx.key, person.id) };
}

describe('GET /api/shops/:shopId/members', () => {
  it('lists owners first with role and print-set visibility; e-mails only for owners and site admins', async () => {
    const asOwner = await request(ctx.crewApp).get(`/api/shops/${fx.shopId}/members`).set('Cookie', fx.people.owner.cookie).expect(200);
    const roles = asOwner.body.members.map((m: { role: string }) => m.role);
    expect(roles[0]).toBe('owner');
    expect(roles.indexOf('viewer')).toBeGreaterThan(roles.indexOf('editor'));
    const viewer = asOwner.body.members.find((m: { userId: string }) => m.userId === fx.people.viewer.id);
    expect(viewer).toMatchObject({ role: 'viewer', canSeePrintSets: false, email: fx.people.viewer.email });
    const editor = asOwner.body.members.find((m: { userId: string }) => m.userId === fx.people.editor.id);
    expect(editor.canSeePrintSets).toBe(true);
    const asAdmin = await request(ctx.crewApp).get(`/api/shops/${fx.shopId}/members`).set('Cookie', fx.people.admin.cookie).expect(200);
    expect(asAdmin.body.members.every((m: { email?: string }) => typeof m.email === 'string')).toBe(true);
    for (const persona of ['editor', 'viewer'] as const) {
      const res = await request(ctx.crewApp).get(`/api/shops/${fx.shopId}/members`).set('Cookie', fx.people[persona].cookie).expect(200);
      for (const m of res.body.members) expect(m).not.toHaveProperty('email');
    }
  });
});

describe('PATCH and DELETE /api/shops/:shopId/members/:userId', () => {
  it('changes a role and records it in the audit log', async () => {
    const crew = await addMember('viewer', 'promote');
    const res = await request(ctx.crewApp).patch(`/api/shops/${fx.shopId}/members/${crew.id}`).set('Cookie', fx.people.owner.cookie).send({ role: 'editor' }).expect(200);
    expect(res.body.member).toMatchObject({ userId: crew.id, role: 'editor', canSeePrintSets: true });
    const [row] = await ctx.db.select({ role: memberships.role }).from(memberships).where(and(eq(memberships.userId, crew.id), eq(memberships.shopId, fx.shopId)));
    expect(row.role).toBe('editor');
    const audit = await ctx.db.select().from(auditLog).where(and(eq(auditLog.action, 'member.change'), eq(auditLog.target, `user:${crew.id}`)));
    expect(audit).toHaveLength(1);
    // The new role takes effect on the next request: the editor may now create a build.
    await request(ctx.crewApp).post(`/api/shops/${fx.shopId}/builds`).set('Cookie', crew.cookie).send({ name: 'Crew build' }).expect(201);
  });

  it('refuses an empty change and a role that does not exist, naming the field', async () => {
    const empty = await request(ctx.crewApp).patch(`/api/shops/${fx.shopId}/members/${fx.people.viewer.id}`).set('Cookie', fx.people.owner.cookie).send({}).expect(400);
    expect(empty.body.error.fields.role).toBe('Send a new role or canSeePrintSets');
    const bad = await request(ctx.crewApp).patch(`/api/shops/${fx.shopId}/members/${fx.people.viewer.id}`).set('Cookie', fx.people.owner.cookie).send({ role: 'boss' }).expect(400);
    expect(bad.body.error.fields.role).toBe('Choose owner, editor or viewer');
  });

  it('answers 404 for a person who is not a member of this shop', async () => {
    const res = await request(ctx.crewApp).delete(`/api/shops/${fx.shopId}/members/${fx.people.otherOwner.id}`).set('Cookie', fx.people.owner.cookie).expect(404);
    expect(res.body.error.message).toBe('Member was not found');
  });

  it('never leaves a shop without an owner: the only owner can be neither demoted nor removed', async () => {
    const [shopOnly] = await ctx.db.select().from(memberships).where(eq(memberships.userId, fx.people.otherOwner.id));
    const demote = await request(ctx.crewApp).patch(`/api/shops/${shopOnly.shopId}/members/${fx.people.otherOwner.id}`).set('Cookie', fx.people.otherOwner.cookie).send({ role: 'editor' }).expect(409);
    expect(demote.body.error.code).toBe('LAST_OWNER');
    expect(demote.body.error.message).toMatch(/only owner, so they cannot be demoted; make another member an owner first/);
    const remove = await request(ctx.crewApp).delete(`/api/shops/${shopOnly.shopId}/members/${fx.people.otherOwner.id}`).set('Cookie', fx.people.otherOwner.cookie).expect(409);
    expect(remove.body.error.message).toMatch(/cannot be removed/);
  });

  it('lets one of two owners step down or be removed, and the removed member loses access at once', async () => {
    const second = await addMember('owner', 'second-owner');
    await request(ctx.crewApp).patch(`/api/shops/${fx.shopId}/members/${second.id}`).set('Cookie', fx.people.owner.cookie).send({ role: 'editor' }).expect(200);
    await request(ctx.crewApp).get(`/api/shops/${fx.shopId}/builds`).set('Cookie', second.cookie).expect(200);
    await request(ctx.crewApp).delete(`/api/shops/${fx.shopId}/members/${second.id}`).set('Cookie', fx.people.owner.cookie).expect(204);
    const after = await request(ctx.crewApp).get(`/api/shops/${fx.shopId}/builds`).set('Cookie', second.cookie).expect(403);
    expect(after.body.error.message).toBe('You are not a member of this shop');
  });

  it('keeps one owner when two owners demote each other at the same moment (rows locked in one transaction)', async () => {
    const [shop] = await ctx.db.insert(shops).values({ name: 'Race shop' }).returning();
    const a = await insertPerson(ctx.db, 'race-a');
    const b = await insertPerson(ctx.db, 'race-b');
    await ctx.db.insert(memberships).values([
      { userId: a.id, shopId: shop.id, role: 'owner' },
      { userId: b.id, shopId: shop.id, role: 'owner' },
    ]);
    const [ra, rb] = await Promise.all([
      request(ctx.crewApp).patch(`/api/shops/${shop.id}/members/${b.id}`).set('Cookie', await sessionCookie(ctx.key, a.id)).send({ role: 'viewer' }),
      request(ctx.crewApp).patch(`/api/shops/${shop.id}/members/${a.id}`).set('Cookie', await sessionCookie(ctx.key, b.id)).send({ role: 'viewer' }),
    ]);
    // One wins; the other is refused either by the guard (no longer an owner, 403) or, when it passed the guard
    // first, by the locked count of owners (409 LAST_OWNER).
    const statuses = [ra.status, rb.status].sort();
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const owners = await ctx.db.select().from(memberships).where(and(eq(memberships.shopId, shop.id), eq(memberships.role, 'owner')));
    expect(owners).toHaveLength(1);
  });
});

describe('print sets for viewers (commission clients)', () => {
  let buildId: string;
  let printSetId: string;
  let grantApp: ReturnType<typeof createApp>;

  beforeAll(async () => {
    const files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-grant-')));
    grantApp = createApp({
      env: parseEnv({ NODE_ENV: 'test', DATABASE_URL: TEST_DATABASE_URL, WEB_ROOT: '/nonexistent-web-root' }),
      pool: ctx.pool,
      db: ctx.db,
      sessionSecret: ctx.secret,
      logger: createLogger('silent', 'test'),
      signUpLimit: null,
      mailer: ctx.mailer,
      passwordResetLimit: null,
      files,
    });
    buildId = await insertBuild(ctx.db, fx.shopId, 'Client helmet');
    const svg = new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg" width="40mm" height="30mm"/>');
    const [row] = await ctx.db
      .insert(printSets)
      .values({
        shopId: fx.shopId,
        buildId,
        name: 'Client check',
        status: 'done',
        formats: ['svg'],
        page: 'a4',
        mode: 'tiled',
        pieceCount: 1,
        pattern: { units: 'mm', pieces: [piece('C', rectangle(40, 30))], seams: [], warnings: [] },
        files: [{ name: 'pattern.svg', sizeBytes: svg.byteLength, contentType: 'image/svg+xml' }],
      })
      .returning({ id: printSets.id });
    printSetId = row.id;
    await files.put(printSetFileKey(row.id, 'pattern.svg'), svg);
  });

  const urls = () => PRINT_SET_GRANT_ROUTES.map((r) => r.path.replace(':shopId', fx.shopId).replace(':buildId', buildId).replace(':printSetId', printSetId).replace(':fileName', 'pattern.svg'));

  it('refuses a viewer without the grant on every print-set route, with a message saying who can allow it', async () => {
    const client = await addMember('viewer', 'client-no-grant');
    expect(urls()).toHaveLength(3);
    for (const url of urls()) {
      const res = await request(grantApp).get(url).set('Cookie', client.cookie);
      expect(res.status, url).toBe(403);
      expect(res.body.error).toEqual({ code: 'FORBIDDEN', message: 'The shop owner has not shared print sets with you; ask them to allow it in the members list' });
    }
    // The build itself stays visible to the client.
    await request(grantApp).get(`/api/shops/${fx.shopId}/builds/${buildId}`).set('Cookie', client.cookie).expect(200);
    const me = await request(grantApp).get('/api/me').set('Cookie', client.cookie).expect(200);
    expect(me.body.memberships.find((m: { shopId: string }) => m.shopId === fx.shopId).canSeePrintSets).toBe(false);
  });

  it('lets the viewer in once the owner grants it, and out again when withdrawn; editors never need it', async () => {
    const client = await addMember('viewer', 'client-grant');
    const grant = await request(grantApp).patch(`/api/shops/${fx.shopId}/members/${client.id}`).set('Cookie', fx.people.owner.cookie).send({ canSeePrintSets: true }).expect(200);
    expect(grant.body.member).toMatchObject({ role: 'viewer', canSeePrintSets: true });
    for (const url of urls()) expect((await request(grantApp).get(url).set('Cookie', client.cookie)).status, url).toBe(200);
    const me = await request(grantApp).get('/api/me').set('Cookie', client.cookie).expect(200);
    expect(me.body.memberships.find((m: { shopId: string }) => m.shopId === fx.shopId).canSeePrintSets).toBe(true);
    await request(grantApp).patch(`/api/shops/${fx.shopId}/members/${client.id}`).set('Cookie', fx.people.owner.cookie).send({ canSeePrintSets: false }).expect(200);
    for (const url of urls()) expect((await request(grantApp).get(url).set('Cookie', client.cookie)).status, url).toBe(403);
    for (const url of urls()) expect((await request(grantApp).get(url).set('Cookie', fx.people.editor.cookie)).status, url).toBe(200);
  });
});

type Outcome = '2xx' | '401' | '403';
/** Same table as tests/server/access.test.ts, written out again so a wrong rule in the server shows up here. */
const EXPECTED: Record<string, Record<Persona, Outcome>> = {
  public: { anonymous: '2xx', viewer: '2xx', editor: '2xx', owner: '2xx', otherOwner: '2xx', admin: '2xx' },
  signedIn: { anonymous: '401', viewer: '2xx', editor: '2xx', owner: '2xx', otherOwner: '2xx', admin: '2xx' },
  'shop viewer': { anonymous: '401', viewer: '2xx', editor: '2xx', owner: '2xx', otherOwner: '403', admin: '2xx' },
  'shop owner': { anonymous: '401', viewer: '403', editor: '403', owner: '2xx', otherOwner: '403', admin: '2xx' },
};

describe('members routes × personas', () => {
  const cases: { method: 'get' | 'patch' | 'delete'; path: string; rule: string }[] = [
    { method: 'get', path: '/members', rule: 'shop viewer' },
    { method: 'patch', path: '/members/:target', rule: 'shop owner' },
    { method: 'delete', path: '/members/:target', rule: 'shop owner' },
  ];
  for (const c of cases) {
    for (const persona of PERSONAS) {
      // A site admin reads any shop but changes none it is not a member of.
      const want: Outcome = persona === 'admin' && c.method !== 'get' ? '403' : EXPECTED[c.rule][persona];
      it(`${c.method.toUpperCase()} ${c.path} as ${persona} → ${want}`, async () => {
        const target = await addMember('viewer', `walk-${persona}`);
        let req = request(ctx.crewApp)[c.method](`/api/shops/${fx.shopId}${c.path.replace(':target', target.id)}`);
        if (persona !== 'anonymous') req = req.set('Cookie', fx.people[persona].cookie);
        const res = c.method === 'patch' ? await req.send({ canSeePrintSets: true }) : await req;
        const got = res.status >= 200 && res.status < 300 ? '2xx' : String(res.status);
        expect(got, JSON.stringify(res.body)).toBe(want);
      });
    }
  }
});
