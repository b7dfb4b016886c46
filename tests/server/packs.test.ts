/**
 * Pattern packs end to end in-process: the API on a real port, the payment fake driven as the buyer would
 * (its pay page), signed webhooks back to the API, receipts through the real Mailer into the local mail
 * catcher, and the download link's limits. Webhook signatures follow the provider's documented scheme
 * (t=<ts>,v1=HMAC-SHA256 of "<ts>.<payload>"), checked on our side by the provider SDK's constructEvent.
 */
import { createServer, type Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { printSets } from '../../db/schema-core';
import { downloadLinks, orders } from '../../db/schema-packs';
import { startMailCatcher, type MailCatcher } from '../../server/dev/mail-catcher';
import { signWebhookPayload, SIGNATURE_HEADER, startPaymentFake, type PaymentFake } from '../../server/dev/payment-fake';
import { createMailer, type Mailer } from '../../server/mail/send-mail';
import { printSetFileKey } from '../../server/print-sets/print-set-files';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { piece, rectangle } from '../fixtures/pattern-docs/shape-docs';
import { createApp } from '../../server/app';
import { parseEnv } from '../../server/env';
import { createLogger } from '../../server/logger';
import { insertBuild, makeShopFixture, makeTestApp, TEST_DATABASE_URL, type ShopFixture, type TestContext } from './helpers';

const API_KEY = 'local-test-key-packs';
const SECRET = 'local-test-webhook-secret-packs-0123';

let ctx: TestContext;
let fx: ShopFixture;
let fake: PaymentFake;
let catcher: MailCatcher;
let mailer: Mailer;
let server: Server;
let appUrl: string;
let buildId: string;
let limitedApp: import('express').Express;
const files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-packs-')));
/** A minimal PDF header and trailer; the download must hand back exactly these bytes. */
const PDF_BYTES = new TextEncoder().encode('%PDF-1.4\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n');
/** The 8-byte PNG signature (ISO/IEC 15948 §5.2) followed by a few bytes: enough for the type check. */
const PNG_BYTES = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);

beforeAll(async () => {
  let handler: ((req: import('node:http').IncomingMessage, res: import('node:http').ServerResponse) => void) | null = null;
  server = createServer((req, res) => handler!(req, res));
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', () => r()));
  appUrl = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  fake = await startPaymentFake({ port: 0, webhookUrl: `${appUrl}/api/pay/webhook`, webhookSecret: SECRET, apiKey: API_KEY });
  catcher = await startMailCatcher({ smtpPort: 0, httpPort: 0 });
  ctx = await makeTestApp({ files });
  mailer = createMailer({ SMTP_URL: `smtp://127.0.0.1:${catcher.smtpPort}`, MAIL_FROM: 'Sheetsmith <no-reply@sheetsmith.example.com>' }, ctx.db);
  // helpers.ts builds an app without a mailer, so this one is built here over the same database and secret.
  const env = parseEnv({ NODE_ENV: 'test', DATABASE_URL: TEST_DATABASE_URL, WEB_ROOT: '/nonexistent-web-root', PUBLIC_URL: appUrl, PAY_API_URL: fake.url, PAY_API_KEY: API_KEY, PAY_WEBHOOK_SECRET: SECRET });
  const app = (checkoutLimit: { max: number; windowMs: number } | null) =>
    createApp({ env, pool: ctx.pool, db: ctx.db, sessionSecret: ctx.secret, logger: createLogger('silent', 'test'), signUpLimit: null, files, mailer, checkoutLimit });
  ctx.app = app(null);
  limitedApp = app({ max: 2, windowMs: 60_000 });
  handler = ctx.app as unknown as typeof handler;
  fx = await makeShopFixture(ctx);
  buildId = await insertBuild(ctx.db, fx.shopId, 'Horned helm');
});
afterAll(async () => {
  mailer.close();
  await fake.close();
  await catcher.close();
  await new Promise<void>((r) => server.close(() => r()));
  await ctx.close();
});

async function insertPrintSet(status: 'done' | 'running', shopId = fx.shopId, build = buildId): Promise<string> {
  const [row] = await ctx.db
    .insert(printSets)
    .values({
      shopId,
      buildId: build,
      name: 'Helm set',
      status,
      formats: ['pdf'],
      page: 'a4',
      mode: 'tiled',
      pieceCount: 1,
      pattern: { units: 'mm', pieces: [piece('A', rectangle(40, 30))], seams: [], warnings: [] },
      files: status === 'done' ? [{ name: 'print-set.pdf', sizeBytes: PDF_BYTES.byteLength, contentType: 'application/pdf' }] : [],
    })
    .returning({ id: printSets.id });
  if (status === 'done') await files.put(printSetFileKey(row.id, 'print-set.pdf'), PDF_BYTES);
  return row.id;
}

const owner = () => fx.people.owner.cookie;

async function makePack(priceCents: number, title = 'Horned helm'): Promise<{ id: string; slug: string }> {
  const printSetId = await insertPrintSet('done');
  const res = await request(ctx.app)
    .post(`/api/shops/${fx.shopId}/packs`)
    .set('Cookie', owner())
    .send({ printSetId, title, description: 'Twelve pieces in 6 mm foam.', licence: 'Personal use; do not resell the pattern.', priceCents, currency: 'EUR' });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { id: res.body.pack.id, slug: res.body.pack.slug };
}

async function publish(id: string): Promise<void> {
  const res = await request(ctx.app).patch(`/api/shops/${fx.shopId}/packs/${id}`).set('Cookie', owner()).send({ status: 'published' });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
}

/** Waits for a mail to `to` in the catcher (the webhook mails after it commits). */
async function mailTo(to: string, subjectPart: string) {
  for (let i = 0; i < 100; i++) {
    const found = catcher.messages().find((m) => m.to.includes(to) && m.subject.includes(subjectPart));
    if (found) return found;
    await new Promise((r) => setTimeout(r, 30));
  }
  throw new Error(`no mail to ${to} about "${subjectPart}" arrived`);
}

function tokenFrom(text: string): string {
  const match = /\/downloads\/([A-Za-z0-9_-]{43})/.exec(text);
  if (!match) throw new Error(`no download link in: ${text}`);
  return match[1];
}

function binary(res: unknown, done: (err: Error | null, body: Buffer) => void): void {
  const stream = res as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}

/** Sends a webhook body signed with `secret` (default: the right one) and returns the answer. */
function postEvent(event: object, secret = SECRET) {
  const payload = JSON.stringify(event);
  return request(ctx.app)
    .post('/api/pay/webhook')
    .set('Content-Type', 'application/json')
    .set(SIGNATURE_HEADER, signWebhookPayload(payload, secret, Math.floor(Date.now() / 1000)))
    .send(payload);
}

describe('creating and publishing packs', () => {
  it('makes a draft with a slug from the title, unique per title, hidden from the public until published; publishing mails the owner', async () => {
    // The test database keeps packs between runs, so the title carries a tag of this run.
    const tag = Math.random().toString(36).slice(2, 8);
    const a = await makePack(900, `Horned Helm — Mk II ${tag}`);
    const b = await makePack(900, `Horned Helm — Mk II ${tag}`);
    expect(a.slug).toBe(`horned-helm-mk-ii-${tag}`);
    expect(b.slug).toBe(`horned-helm-mk-ii-${tag}-2`);
    await request(ctx.app).get(`/api/packs/${a.slug}`).expect(404);
    await publish(a.id);
    const got = await request(ctx.app).get(`/api/packs/${a.slug}`).expect(200);
    expect(got.body.pack).toMatchObject({ title: `Horned Helm — Mk II ${tag}`, priceCents: 900, currency: 'eur', priceLabel: '9.00 EUR', shopName: 'Fixture shop', pieceCount: 1 });
    expect(got.body.pack.cautions).toMatch(/safety data sheet/);
    const mail = await mailTo(fx.people.owner.email, 'Published');
    expect(mail.text).toContain(`${appUrl}/packs/${a.slug}`);
    const list = await request(ctx.app).get('/api/packs?perPage=60').expect(200);
    const slugs = list.body.packs.map((p: { slug: string }) => p.slug);
    expect(slugs).toContain(a.slug);
    expect(slugs).not.toContain(b.slug);
    await request(ctx.app).patch(`/api/shops/${fx.shopId}/packs/${a.id}`).set('Cookie', owner()).send({ status: 'withdrawn' }).expect(200);
    const gone = await request(ctx.app).get(`/api/packs/${a.slug}`).expect(410);
    expect(gone.body.error.code).toBe('WITHDRAWN');
  });

  it('refuses a print set that is not finished, one of another shop, and bad fields, saying which', async () => {
    const running = await insertPrintSet('running');
    const body = { title: 'T', description: 'D', licence: 'L', priceCents: 0, currency: 'eur' };
    const r1 = await request(ctx.app).post(`/api/shops/${fx.shopId}/packs`).set('Cookie', owner()).send({ ...body, printSetId: running });
    expect(r1.status).toBe(409);
    expect(r1.body.error.message).toMatch(/running/);
    const otherBuild = await insertBuild(ctx.db, fx.otherShopId, 'Other build');
    const foreign = await insertPrintSet('done', fx.otherShopId, otherBuild);
    await request(ctx.app).post(`/api/shops/${fx.shopId}/packs`).set('Cookie', owner()).send({ ...body, printSetId: foreign }).expect(404);
    const r3 = await request(ctx.app).post(`/api/shops/${fx.shopId}/packs`).set('Cookie', owner()).send({ ...body, printSetId: running, priceCents: -5, currency: 'euro' });
    expect(r3.status).toBe(400);
    expect(Object.keys(r3.body.error.fields).sort()).toEqual(['currency', 'priceCents']);
  });

  it('takes a cover as an upload or a data URL, checked by content, and serves it', async () => {
    const { id, slug } = await makePack(0, 'Cover test');
    const up = await request(ctx.app).put(`/api/shops/${fx.shopId}/packs/${id}/cover`).set('Cookie', owner()).attach('cover', Buffer.from(PNG_BYTES), 'cover.png');
    expect(up.status, JSON.stringify(up.body)).toBe(200);
    expect(up.body.pack.coverUrl).toBe(`/api/shops/${fx.shopId}/packs/${id}/cover`);
    const fakePng = await request(ctx.app).put(`/api/shops/${fx.shopId}/packs/${id}/cover`).set('Cookie', owner()).attach('cover', Buffer.from('<svg/>'), 'cover.png');
    expect(fakePng.status).toBe(400);
    expect(fakePng.body.error.message).toMatch(/"cover.png"\) is not a PNG or JPEG/);
    const jpeg = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0, 16, 0x4a, 0x46, 0x49, 0x46]);
    const viaData = await request(ctx.app).put(`/api/shops/${fx.shopId}/packs/${id}/cover`).set('Cookie', owner()).send({ dataUrl: `data:image/jpeg;base64,${jpeg.toString('base64')}` });
    expect(viaData.status, JSON.stringify(viaData.body)).toBe(200);
    const big = Buffer.alloc(5 * 1024 * 1024 + 1, 0);
    PNG_BYTES.forEach((b, i) => (big[i] = b));
    const tooBig = await request(ctx.app).put(`/api/shops/${fx.shopId}/packs/${id}/cover`).set('Cookie', owner()).attach('cover', big, 'big.png');
    expect(tooBig.status).toBe(413);
    await publish(id);
    const cover = await request(ctx.app).get(`/api/packs/${slug}/cover`).buffer(true).parse(binary).expect(200);
    expect(cover.headers['content-type']).toBe('image/jpeg');
    expect(Buffer.compare(cover.body as Buffer, jpeg)).toBe(0);
  });
});

describe('buying a paid pack', () => {
  it('checkout → pay page → signed webhook → order paid → receipt in the catcher → 5 downloads, then 410', async () => {
    const { slug } = await makePack(1250, 'Paid helm');
    const pack = await request(ctx.app).get(`/api/shops/${fx.shopId}/packs`).set('Cookie', owner());
    await publish(pack.body.packs.find((p: { slug: string }) => p.slug === slug).id);
    const email = `buyer-${Date.now()}@test.example.com`;
    const checkout = await request(ctx.app).post(`/api/packs/${slug}/checkout`).send({ email }).expect(200);
    expect(checkout.body.url).toMatch(new RegExp(`^${fake.url}/pay/`));
    const [pending] = await ctx.db.select().from(orders).where(eq(orders.email, email));
    expect(pending.status).toBe('pending');
    expect(pending.amountCents).toBe(1250);

    const paid = await fetch(checkout.body.url, { method: 'POST', redirect: 'manual' });
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(`${appUrl}/packs/${slug}?paid=1`);
    expect(fake.events().at(-1)).toMatchObject({ type: 'checkout.session.completed', status: 200 });
    const [done] = await ctx.db.select().from(orders).where(eq(orders.id, pending.id));
    expect(done.status).toBe('paid');
    expect(done.paymentIntentId).toMatch(/^pi_/);

    const mail = await mailTo(email, 'Paid helm');
    expect(mail.text).toContain('12.50 EUR');
    const token = tokenFrom(mail.text);
    expect(mail.html).toContain(`/downloads/${token}`);
    const [link] = await ctx.db.select().from(downloadLinks).where(eq(downloadLinks.orderId, pending.id));
    // 24 h expiry (issue 6), within a minute of now + 24 h.
    expect(Math.abs(link.expiresAt.getTime() - (Date.now() + 24 * 3_600_000))).toBeLessThan(60_000);
    expect(link.tokenHash).not.toContain(token);

    const listing = await request(ctx.app).get(`/api/downloads/${token}`).expect(200);
    expect(listing.body.download).toMatchObject({ packTitle: 'Paid helm', uses: 0, maxUses: 5 });
    const url = listing.body.download.files[0].url;
    for (let i = 1; i <= 5; i++) {
      const file = await request(ctx.app).get(url).buffer(true).parse(binary).expect(200);
      expect(Buffer.compare(file.body as Buffer, Buffer.from(PDF_BYTES))).toBe(0);
      expect(file.headers['content-type']).toBe('application/pdf');
    }
    const sixth = await request(ctx.app).get(url).expect(410);
    expect(sixth.body.error.code).toBe('LINK_USED_UP');
    await request(ctx.app).get(`/api/downloads/${token}`).expect(410);
  });

  it('a replayed event fulfils once; a second, different event for the same session changes nothing', async () => {
    const { id, slug } = await makePack(500, 'Replay helm');
    await publish(id);
    const email = `replay-${Date.now()}@test.example.com`;
    const checkout = await request(ctx.app).post(`/api/packs/${slug}/checkout`).send({ email }).expect(200);
    const sessionId = String(checkout.body.url).split('/pay/')[1];
    const event = { id: `evt_replay_${Date.now()}`, object: 'event', type: 'checkout.session.completed', data: { object: { id: sessionId, object: 'checkout.session', payment_status: 'paid', payment_intent: 'pi_replay', metadata: {} } } };
    expect((await postEvent(event).expect(200)).body.outcome).toBe('fulfilled');
    expect((await postEvent(event).expect(200)).body.outcome).toBe('replayed');
    expect((await postEvent({ ...event, id: `${event.id}_b` }).expect(200)).body.outcome).toBe('no-pending-order');
    const [order] = await ctx.db.select().from(orders).where(eq(orders.email, email));
    expect(await ctx.db.select().from(downloadLinks).where(eq(downloadLinks.orderId, order.id))).toHaveLength(1);
    await mailTo(email, 'Replay helm');
    await new Promise((r) => setTimeout(r, 150));
    expect(catcher.messages().filter((m) => m.to.includes(email))).toHaveLength(1);
  });

  it('pays an order by its id in the session metadata when the session was never recorded on it', async () => {
    const { id, slug } = await makePack(400, 'Metadata helm');
    await publish(id);
    const email = `meta-${Date.now()}@test.example.com`;
    const [pack] = (await request(ctx.app).get(`/api/shops/${fx.shopId}/packs`).set('Cookie', owner())).body.packs.filter((p: { slug: string }) => p.slug === slug);
    const [order] = await ctx.db.insert(orders).values({ packId: pack.id, email, amountCents: 400, currency: 'eur' }).returning();
    const event = { id: `evt_meta_${Date.now()}`, type: 'checkout.session.completed', data: { object: { id: `cs_meta_${Date.now()}`, payment_status: 'paid', payment_intent: 'pi_meta', metadata: { orderId: order.id } } } };
    expect((await postEvent(event).expect(200)).body.outcome).toBe('fulfilled');
    await mailTo(email, 'Metadata helm');
    // An id that is not a UUID is ignored rather than failing the webhook (the provider would retry for ever).
    const junk = { ...event, id: `${event.id}_junk`, data: { object: { ...event.data.object, id: 'cs_other', metadata: { orderId: 'not-a-uuid' } } } };
    expect((await postEvent(junk).expect(200)).body.outcome).toBe('no-pending-order');
  });

  it('answers 400 to a bad or missing signature and acts on nothing', async () => {
    const event = { id: `evt_bad_${Date.now()}`, type: 'checkout.session.completed', data: { object: { id: 'cs_none', payment_status: 'paid' } } };
    const wrong = await postEvent(event, 'not-the-webhook-secret-at-all');
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.code).toBe('BAD_SIGNATURE');
    const none = await request(ctx.app).post('/api/pay/webhook').set('Content-Type', 'application/json').send(JSON.stringify(event));
    expect(none.status).toBe(400);
    // The event id was not recorded, so a correctly signed delivery later is still acted on.
    expect((await postEvent(event).expect(200)).body.outcome).toBe('no-pending-order');
  });

  it('an expired link answers 410 with the date', async () => {
    const { id, slug } = await makePack(0, 'Expiry helm');
    await publish(id);
    const email = `expiry-${Date.now()}@test.example.com`;
    await request(ctx.app).post(`/api/packs/${slug}/checkout`).send({ email }).expect(200);
    const token = tokenFrom((await mailTo(email, 'Expiry helm')).text);
    const [order] = await ctx.db.select().from(orders).where(eq(orders.email, email));
    await ctx.db.update(downloadLinks).set({ expiresAt: new Date(Date.now() - 1000) }).where(eq(downloadLinks.orderId, order.id));
    const res = await request(ctx.app).get(`/api/downloads/${token}`).expect(410);
    expect(res.body.error.code).toBe('LINK_EXPIRED');
    expect(res.body.error.message).toMatch(/expired on/);
  });

  it('the owner refunds a paid order through the payment service; its links stop working', async () => {
    const { id, slug } = await makePack(700, 'Refund helm');
    await publish(id);
    const email = `refund-${Date.now()}@test.example.com`;
    const checkout = await request(ctx.app).post(`/api/packs/${slug}/checkout`).send({ email }).expect(200);
    await fetch(checkout.body.url, { method: 'POST', redirect: 'manual' });
    const token = tokenFrom((await mailTo(email, 'Refund helm')).text);
    await request(ctx.app).get(`/api/downloads/${token}`).expect(200);
    const [order] = await ctx.db.select().from(orders).where(eq(orders.email, email));
    const before = fake.events().length;
    const refund = await request(ctx.app).post(`/api/shops/${fx.shopId}/orders/${order.id}/refund`).set('Cookie', owner()).expect(200);
    expect(refund.body.order.status).toBe('refunded');
    const gone = await request(ctx.app).get(`/api/downloads/${token}`).expect(410);
    expect(gone.body.error.code).toBe('LINK_REVOKED');
    const delivered = () => fake.events().length > before && fake.events().at(-1)!.status !== null;
    for (let i = 0; i < 100 && !delivered(); i++) await new Promise((r) => setTimeout(r, 20));
    expect(fake.events().at(-1)).toMatchObject({ type: 'charge.refunded', status: 200 });
    const again = await request(ctx.app).post(`/api/shops/${fx.shopId}/orders/${order.id}/refund`).set('Cookie', owner()).expect(409);
    expect(again.body.error.message).toMatch(/refunded/);
    const listed = await request(ctx.app).get(`/api/shops/${fx.shopId}/orders`).set('Cookie', owner()).expect(200);
    expect(listed.body.orders.find((o: { id: string }) => o.id === order.id)).toMatchObject({ status: 'refunded', packTitle: 'Refund helm' });
  });

  it('a charge.refunded event alone refunds the order and revokes its links', async () => {
    const { id, slug } = await makePack(300, 'Event refund helm');
    await publish(id);
    const email = `evrefund-${Date.now()}@test.example.com`;
    const checkout = await request(ctx.app).post(`/api/packs/${slug}/checkout`).send({ email }).expect(200);
    await fetch(checkout.body.url, { method: 'POST', redirect: 'manual' });
    const token = tokenFrom((await mailTo(email, 'Event refund helm')).text);
    const [order] = await ctx.db.select().from(orders).where(eq(orders.email, email));
    const event = { id: `evt_ch_${Date.now()}`, type: 'charge.refunded', data: { object: { id: 'ch_1', object: 'charge', payment_intent: order.paymentIntentId, refunded: true } } };
    expect((await postEvent(event).expect(200)).body.outcome).toBe('refunded');
    expect((await request(ctx.app).get(`/api/downloads/${token}`).expect(410)).body.error.code).toBe('LINK_REVOKED');
  });
});

describe('taking a free pack', () => {
  it('pays the order at once and mails a working link; no payment page', async () => {
    const { id, slug } = await makePack(0, 'Free bracer');
    await publish(id);
    const email = `free-${Date.now()}@test.example.com`;
    const res = await request(ctx.app).post(`/api/packs/${slug}/checkout`).send({ email }).expect(200);
    expect(res.body).toEqual({ url: null, emailed: true });
    const mail = await mailTo(email, 'Free bracer');
    expect(mail.text).toMatch(/free/i);
    const token = tokenFrom(mail.text);
    const listing = await request(ctx.app).get(`/api/downloads/${token}`).expect(200);
    await request(ctx.app).get(listing.body.download.files[0].url).expect(200);
    const after = await request(ctx.app).get(`/api/downloads/${token}`).expect(200);
    expect(after.body.download.uses).toBe(1);
    const bad = await request(ctx.app).post(`/api/packs/${slug}/checkout`).send({ email: 'not-an-address' }).expect(400);
    expect(bad.body.error.fields.email).toBeTruthy();
  });

  it('unknown and malformed tokens answer 404 without touching any link', async () => {
    await request(ctx.app).get(`/api/downloads/${'A'.repeat(43)}`).expect(404);
    const res = await request(ctx.app).get('/api/downloads/short').expect(404);
    expect(res.body.error.message).toMatch(/not known/);
  });
});

describe('the checkout limit', () => {
  it('answers 429 RATE_LIMITED after the allowed checkouts from one address, and counts addresses apart', async () => {
    const { id, slug } = await makePack(0, 'Limit bracer');
    await publish(id);
    // Addresses from the IPv6 documentation prefix (RFC 3849), a random /56 per run: the count lives in the
    // database and outlasts a run. The app trusts X-Forwarded-For from loopback (TRUST_PROXY default).
    const net = () => `2001:db8:${Math.floor(Math.random() * 0xffff).toString(16)}:${Math.floor(Math.random() * 0xff).toString(16)}00::1`;
    const a = net();
    const take = (ip: string) => request(limitedApp).post(`/api/packs/${slug}/checkout`).set('X-Forwarded-For', ip).send({ email: `limit-${Date.now()}@test.example.com` });
    expect((await take(a)).status).toBe(200);
    expect((await take(a)).status).toBe(200);
    const third = await take(a);
    expect(third.status).toBe(429);
    expect(third.body.error.code).toBe('RATE_LIMITED');
    expect((await take(net())).status).toBe(200);
  });
});
