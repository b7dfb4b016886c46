/**
 * Site admin API: paged and filtered lists of people, shops and orders, the job queue with failed jobs and
 * their retry through pg-boss, and the caught mail of the local mail catcher. Real PostgreSQL (the test
 * database), a real pg-boss queue on it, and the mail catcher started in-process on random ports.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import nodemailer from 'nodemailer';
import type PgBoss from 'pg-boss';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { memberships, printSets, shops } from '../../db/schema-core';
import { downloadLinks, orders, packs } from '../../db/schema-packs';
import { createApp } from '../../server/app';
import { parseEnv } from '../../server/env';
import { pgBossJobAdmin } from '../../server/jobs/job-admin';
import { startQueue, stopQueue } from '../../server/jobs/queue';
import { registerWorkers } from '../../server/jobs/register-workers';
import { createLogger } from '../../server/logger';
import { startMailCatcher, type MailCatcher } from '../../server/dev/mail-catcher';
import { helmetLikeDoc } from '../fixtures/pattern-docs/shape-docs';
import { insertBuild, insertPerson, makeShopFixture, makeTestApp, TEST_DATABASE_URL, type ShopFixture, type TestContext } from './helpers';

const logger = createLogger('silent', 'test');
let ctx: TestContext;
let fx: ShopFixture;
let boss: PgBoss;
let catcher: MailCatcher;
let app: ReturnType<typeof createApp>;
/** Tag shared by everything this file creates, so filters find only this run's rows in a shared database. */
const tag = `adm${randomUUID().slice(0, 8)}`;
const PROBE_QUEUE = `ops-admin-probe-${tag}`;

function appWith(env: Record<string, string>) {
  return createApp({
    env: parseEnv({ NODE_ENV: 'test', DATABASE_URL: TEST_DATABASE_URL, WEB_ROOT: '/nonexistent-web-root', ...env }),
    pool: ctx.pool,
    db: ctx.db,
    sessionSecret: ctx.secret,
    logger,
    signUpLimit: null,
    payments: null,
    jobAdmin: pgBossJobAdmin(boss),
  });
}

beforeAll(async () => {
  ctx = await makeTestApp();
  fx = await makeShopFixture(ctx);
  boss = await startQueue(TEST_DATABASE_URL, logger, { supervise: false, schedule: false });
  catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0 });
  app = appWith({ MAIL_CATCHER_URL: `http://127.0.0.1:${catcher.httpPort}` });
});
afterAll(async () => {
  await stopQueue(boss, 5_000).catch(() => undefined);
  await catcher?.close();
  await ctx?.close();
});

const admin = () => fx.people.admin.cookie;

describe('admin lists', () => {
  it('pages through people filtered by e-mail or name, never showing password hashes', async () => {
    const made = [];
    for (let i = 0; i < 3; i++) made.push(await insertPerson(ctx.db, `${tag}p${i}`));
    const first = await request(app).get(`/api/admin/users?q=${tag}&pageSize=2`).set('Cookie', admin());
    expect(first.status).toBe(200);
    expect(first.body.total).toBe(3);
    expect(first.body.users).toHaveLength(2);
    const second = await request(app).get(`/api/admin/users?q=${tag}&pageSize=2&page=2`).set('Cookie', admin());
    expect(second.body.users).toHaveLength(1);
    const seen = [...first.body.users, ...second.body.users].map((u: { email: string }) => u.email);
    // Ordered by e-mail, each person once across the pages.
    expect(seen).toEqual(made.map((m) => m.email).sort());
    expect(JSON.stringify(first.body)).not.toMatch(/passwordHash|argon2/);
  });

  it('answers 400 naming the bad query parameter', async () => {
    const res = await request(app).get('/api/admin/users?page=0&pageSize=500').set('Cookie', admin());
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('VALIDATION');
    expect(res.body.error.fields).toEqual({ page: 'must be 1 or more', pageSize: 'must be at most 200' });
  });

  it('lists shops with member and build counts and owners, filtered by name', async () => {
    const [shop] = await ctx.db.insert(shops).values({ name: `Foamworks ${tag}` }).returning({ id: shops.id });
    const owner = await insertPerson(ctx.db, `${tag}owner`);
    const crew = await insertPerson(ctx.db, `${tag}crew`);
    await ctx.db.insert(memberships).values([
      { shopId: shop.id, userId: owner.id, role: 'owner' },
      { shopId: shop.id, userId: crew.id, role: 'editor' },
    ]);
    await insertBuild(ctx.db, shop.id, 'Visor');
    await insertBuild(ctx.db, shop.id, 'Gauntlet');
    await insertBuild(ctx.db, shop.id, 'Pauldron');
    const res = await request(app).get(`/api/admin/shops?q=${tag}`).set('Cookie', admin());
    expect(res.status).toBe(200);
    expect(res.body.total).toBe(1);
    expect(res.body.shops[0]).toMatchObject({ id: shop.id, name: `Foamworks ${tag}`, memberCount: 2, buildCount: 3, ownerEmails: [owner.email] });
  });

  it('lists orders newest first with pack and shop, filtered by status and by buyer or pack title', async () => {
    const buildId = await insertBuild(ctx.db, fx.shopId, 'Helm');
    const doc = helmetLikeDoc();
    const [ps] = await ctx.db
      .insert(printSets)
      .values({ shopId: fx.shopId, buildId, name: 'Helm', status: 'done', formats: ['pdf'], page: 'a4', mode: 'tiled', pieceCount: doc.pieces.length, pattern: doc })
      .returning({ id: printSets.id });
    const [pack] = await ctx.db
      .insert(packs)
      .values({ shopId: fx.shopId, printSetId: ps.id, slug: `helm-${tag}`, title: `Helm pack ${tag}`, description: 'A helm', licence: 'Personal use', priceCents: 1200, status: 'published' })
      .returning({ id: packs.id });
    const at = (min: number) => new Date(Date.now() - min * 60_000);
    await ctx.db.insert(orders).values([
      { packId: pack.id, email: `a-${tag}@buyer.example.com`, amountCents: 1200, currency: 'eur', status: 'paid', createdAt: at(30), paidAt: at(29) },
      { packId: pack.id, email: `b-${tag}@buyer.example.com`, amountCents: 1200, currency: 'eur', status: 'pending', createdAt: at(20) },
      { packId: pack.id, email: `c-${tag}@buyer.example.com`, amountCents: 1200, currency: 'eur', status: 'refunded', createdAt: at(10), paidAt: at(9), refundedAt: at(5) },
    ]);
    const all = await request(app).get(`/api/admin/orders?q=${tag}`).set('Cookie', admin());
    expect(all.status).toBe(200);
    expect(all.body.orders.map((o: { email: string }) => o.email[0])).toEqual(['c', 'b', 'a']);
    expect(all.body.orders[0]).toMatchObject({ status: 'refunded', amountCents: 1200, pack: { id: pack.id, slug: `helm-${tag}` }, shop: { id: fx.shopId, name: 'Fixture shop' } });
    const paid = await request(app).get(`/api/admin/orders?q=${tag}&status=paid`).set('Cookie', admin());
    expect(paid.body.total).toBe(1);
    expect(paid.body.orders[0].email).toBe(`a-${tag}@buyer.example.com`);
    const byBuyer = await request(app).get(`/api/admin/orders?q=b-${tag}`).set('Cookie', admin());
    expect(byBuyer.body.orders.map((o: { status: string }) => o.status)).toEqual(['pending']);
    const bad = await request(app).get('/api/admin/orders?status=lost').set('Cookie', admin());
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields)).toEqual(['status']);
  });

  it('refunds any shop\'s paid order by that shop\'s rules (links revoked), and refuses a pending or unknown one', async () => {
    const buildId = await insertBuild(ctx.db, fx.otherShopId, 'Bracer');
    const doc = helmetLikeDoc();
    const [ps] = await ctx.db
      .insert(printSets)
      .values({ shopId: fx.otherShopId, buildId, name: 'Bracer', status: 'done', formats: ['pdf'], page: 'a4', mode: 'tiled', pieceCount: doc.pieces.length, pattern: doc })
      .returning({ id: printSets.id });
    const [pack] = await ctx.db
      .insert(packs)
      .values({ shopId: fx.otherShopId, printSetId: ps.id, slug: `bracer-${tag}`, title: `Bracer ${tag}`, description: 'Free bracer', licence: 'Personal use', priceCents: 0, status: 'published' })
      .returning({ id: packs.id });
    const [free] = await ctx.db.insert(orders).values({ packId: pack.id, email: `free-${tag}@buyer.example.com`, amountCents: 0, currency: 'eur', status: 'paid', paidAt: new Date() }).returning({ id: orders.id });
    await ctx.db.insert(downloadLinks).values({ orderId: free.id, tokenHash: `hash-${tag}`, expiresAt: new Date(Date.now() + 86_400_000), maxUses: 5 });
    const [pending] = await ctx.db.insert(orders).values({ packId: pack.id, email: `wait-${tag}@buyer.example.com`, amountCents: 0, currency: 'eur', status: 'pending' }).returning({ id: orders.id });

    // The site admin belongs to neither shop's staff for this (the fixture admin is no member of the other shop).
    const res = await request(app).post(`/api/admin/orders/${free.id}/refund`).set('Cookie', admin());
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.order).toMatchObject({ id: free.id, status: 'refunded' });
    const [link] = await ctx.db.select({ revokedAt: downloadLinks.revokedAt }).from(downloadLinks).where(eq(downloadLinks.orderId, free.id));
    expect(link.revokedAt).not.toBeNull();

    const notPaid = await request(app).post(`/api/admin/orders/${pending.id}/refund`).set('Cookie', admin());
    expect(notPaid.status).toBe(409);
    expect(notPaid.body.error.code).toBe('NOT_PAID');
    const unknown = await request(app).post(`/api/admin/orders/${randomUUID()}/refund`).set('Cookie', admin());
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.message).toBe('Order was not found');
    expect((await request(app).post(`/api/admin/orders/${free.id}/refund`).set('Cookie', fx.people.otherOwner.cookie)).status).toBe(403);
  });

  it('refuses every admin route to a shop owner who is not a site admin (403) and to anonymous callers (401)', async () => {
    for (const path of ['/api/admin/users', '/api/admin/shops', '/api/admin/orders', '/api/admin/jobs', '/api/admin/mail']) {
      expect((await request(app).get(path).set('Cookie', fx.people.owner.cookie)).status, path).toBe(403);
      expect((await request(app).get(path)).status, path).toBe(401);
    }
  });
});

describe('admin jobs', () => {
  it('shows a failed job with its error, retries it through pg-boss, and refuses to retry one that is not failed', async () => {
    let attempts = 0;
    await registerWorkers(boss, { db: ctx.db, files: null as never }, logger, {
      schedule: false,
      pollingIntervalSeconds: 0.5,
      jobTypes: [
        {
          name: PROBE_QUEUE,
          queue: { retryLimit: 0 },
          run: async () => {
            attempts += 1;
            if (attempts === 1) throw new Error(`sheet stock file for ${tag} is unreadable`);
            return { attempts };
          },
        },
      ],
    });
    const id = await boss.send(PROBE_QUEUE, { tag });
    const failed = await waitForJob(id!, 'failed');
    expect(failed).toMatchObject({ id, name: PROBE_QUEUE, state: 'failed', error: `sheet stock file for ${tag} is unreadable`, data: { tag } });

    const list = await request(app).get(`/api/admin/jobs?state=failed&name=${PROBE_QUEUE}`).set('Cookie', admin());
    expect(list.body.jobs.map((j: { id: string }) => j.id)).toEqual([id]);

    const retried = await request(app).post(`/api/admin/jobs/${id}/retry`).set('Cookie', admin());
    expect(retried.status).toBe(200);
    expect(retried.body.job).toEqual({ id, name: PROBE_QUEUE, state: 'retry' });
    await waitForJob(id!, 'completed');
    expect(attempts).toBe(2);

    const again = await request(app).post(`/api/admin/jobs/${id}/retry`).set('Cookie', admin());
    expect(again.status).toBe(409);
    expect(again.body.error).toMatchObject({ code: 'JOB_NOT_FAILED', message: `Job ${id} is completed, not failed; only failed jobs can be retried` });
    const missing = randomUUID();
    expect((await request(app).post(`/api/admin/jobs/${missing}/retry`).set('Cookie', admin())).body.error.message).toBe(`Job ${missing} was not found`);
    const malformed = await request(app).post('/api/admin/jobs/not-a-job/retry').set('Cookie', admin());
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields).toEqual({ id: 'must be a job id (a UUID)' });
    await boss.offWork(PROBE_QUEUE);
  });

  it('answers 503 for a retry on a server running without the queue', async () => {
    const noQueue = createApp({
      env: parseEnv({ NODE_ENV: 'test', DATABASE_URL: TEST_DATABASE_URL, WEB_ROOT: '/nonexistent-web-root' }),
      pool: ctx.pool,
      db: ctx.db,
      sessionSecret: ctx.secret,
      logger,
      payments: null,
    });
    const res = await request(noQueue).post(`/api/admin/jobs/${randomUUID()}/retry`).set('Cookie', admin());
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('QUEUE_UNAVAILABLE');
  });
});

async function waitForJob(id: string, state: string): Promise<Record<string, unknown>> {
  let last: unknown;
  for (let i = 0; i < 80; i++) {
    const res = await request(app).get(`/api/admin/jobs?name=${PROBE_QUEUE}`).set('Cookie', admin());
    const job = (res.body.jobs as Array<Record<string, unknown>>).find((j) => j.id === id);
    last = job;
    if (job?.state === state) return job;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`job ${id} did not reach ${state} within 20 s; last seen ${JSON.stringify(last)}`);
}

describe('caught mail', () => {
  it('lists the messages the local catcher caught, newest first, with text and HTML parts', async () => {
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: catcher.smtpPort, secure: false, ignoreTLS: true });
    for (const n of [1, 2]) {
      await transport.sendMail({ from: 'no-reply@sheetsmith.example.com', to: `crew-${tag}@test.example.com`, subject: `Invitation ${n} ${tag}`, text: `plain ${n}`, html: `<p>rich ${n}</p>` });
      await new Promise((r) => setTimeout(r, 20));
    }
    const res = await request(app).get('/api/admin/mail').set('Cookie', admin());
    expect(res.status).toBe(200);
    const mine = (res.body.messages as Array<{ subject: string; to: string; text: string; html: string }>).filter((m) => m.subject.endsWith(tag));
    expect(mine.map((m) => m.subject)).toEqual([`Invitation 2 ${tag}`, `Invitation 1 ${tag}`]);
    expect(mine[0]).toMatchObject({ to: `crew-${tag}@test.example.com`, text: expect.stringContaining('plain 2'), html: expect.stringContaining('<p>rich 2</p>') });
  });

  it('answers 404 with a clear message when no catcher is configured, and 502 when it does not answer', async () => {
    const none = await request(appWith({})).get('/api/admin/mail').set('Cookie', admin());
    expect(none.status).toBe(404);
    expect(none.body.error.code).toBe('MAIL_CATCHER_NOT_CONFIGURED');
    expect(none.body.error.message).toMatch(/MAIL_CATCHER_URL is not set/);
    // Port 9 (discard) is closed on loopback here, so the connection is refused.
    const down = await request(appWith({ MAIL_CATCHER_URL: 'http://127.0.0.1:9' })).get('/api/admin/mail').set('Cookie', admin());
    expect(down.status).toBe(502);
    expect(down.body.error.message).toMatch(/^The mail catcher at http:\/\/127\.0\.0\.1:9\/messages did not answer/);
  });
});
