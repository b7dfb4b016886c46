/**
 * Role checks for every pack, order, webhook and download route in the access table: each is called as every
 * persona with a request that succeeds for an allowed caller. The expected outcome per rule is written out
 * here (the same table as tests/server/access.test.ts, RFC 9110 §15: 401 without credentials, 403 when not
 * allowed), independently of the server's decision function.
 */
import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { printSets } from '../../db/schema-core';
import { downloadLinks, orders, packs } from '../../db/schema-packs';
import { ROUTE_ACCESS, type AccessRule, type HttpMethod } from '../../server/auth/access';
import { signWebhookPayload, SIGNATURE_HEADER } from '../../server/dev/payment-fake';
import { newDownloadToken } from '../../server/downloads/download-token';
import { parseEnv } from '../../server/env';
import { printSetFileKey } from '../../server/print-sets/print-set-files';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { piece, rectangle } from '../fixtures/pattern-docs/shape-docs';
import { insertBuild, makeShopFixture, makeTestApp, PERSONAS, type Persona, type ShopFixture, type TestContext } from './helpers';

type Outcome = '2xx' | '401' | '403';

function expected(rule: AccessRule, method: HttpMethod, persona: Persona): Outcome {
  if (rule === 'public') return '2xx';
  if (persona === 'anonymous') return '401';
  if (rule === 'signedIn') return '2xx';
  if (rule === 'admin') return persona === 'admin' ? '2xx' : '403';
  if (persona === 'admin') return method === 'GET' ? '2xx' : '403';
  if (persona === 'otherOwner') return '403';
  const rank = { viewer: 1, editor: 2, owner: 3 } as const;
  return rank[persona] >= rank[rule.shopRole] ? '2xx' : '403';
}

const MINE = ['/api/shops/:shopId/packs', '/api/packs', '/api/pay/', '/api/shops/:shopId/orders', '/api/downloads/'];
const routes = ROUTE_ACCESS.filter((r) => MINE.some((m) => r.path.startsWith(m)));

let ctx: TestContext;
let fx: ShopFixture;
const files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-packs-access-')));
const PNG = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 1, 2, 3]);
const secret = parseEnv({}).PAY_WEBHOOK_SECRET;

beforeAll(async () => {
  ctx = await makeTestApp({ files });
  fx = await makeShopFixture(ctx);
});
afterAll(() => ctx.close());

async function donePrintSet(): Promise<string> {
  const buildId = await insertBuild(ctx.db, fx.shopId, 'Access build');
  const [row] = await ctx.db
    .insert(printSets)
    .values({
      shopId: fx.shopId,
      buildId,
      name: 'Access set',
      status: 'done',
      formats: ['svg'],
      page: 'a4',
      mode: 'tiled',
      pieceCount: 1,
      pattern: { units: 'mm', pieces: [piece('A', rectangle(10, 10))], seams: [], warnings: [] },
      files: [{ name: 'pattern.svg', sizeBytes: 6, contentType: 'image/svg+xml' }],
    })
    .returning({ id: printSets.id });
  await files.put(printSetFileKey(row.id, 'pattern.svg'), new TextEncoder().encode('<svg/>'));
  return row.id;
}

/** A published free pack with a cover, a paid (free) order and a fresh download link. */
async function fixturePack() {
  const printSetId = await donePrintSet();
  const slug = `access-${randomUUID().slice(0, 8)}`;
  const coverKey = `packs/${randomUUID()}/cover-x.png`;
  await files.put(coverKey, PNG);
  const [pack] = await ctx.db
    .insert(packs)
    .values({ shopId: fx.shopId, printSetId, slug, title: 'Access pack', description: 'd', licence: 'l', priceCents: 0, currency: 'eur', status: 'published', publishedAt: new Date(), coverKey })
    .returning();
  const [order] = await ctx.db.insert(orders).values({ packId: pack.id, email: 'a@test.example.com', amountCents: 0, currency: 'eur', status: 'paid', paidAt: new Date() }).returning();
  const { token, hash } = newDownloadToken();
  await ctx.db.insert(downloadLinks).values({ orderId: order.id, tokenHash: hash, expiresAt: new Date(Date.now() + 3_600_000), maxUses: 5 });
  return { printSetId, pack, order, token };
}

async function call(method: HttpMethod, routePath: string, persona: Persona) {
  const f = await fixturePack();
  const url = routePath
    .replace(':shopId', fx.shopId)
    .replace(':packId', f.pack.id)
    .replace(':slug', f.pack.slug)
    .replace(':orderId', f.order.id)
    .replace(':token', f.token)
    .replace(':name', 'pattern.svg');
  let req = request(ctx.app)[method.toLowerCase() as 'get'](url);
  if (persona !== 'anonymous') req = req.set('Cookie', fx.people[persona].cookie);
  if (routePath === '/api/pay/webhook') {
    const payload = JSON.stringify({ id: `evt_${randomUUID()}`, type: 'customer.created', data: { object: {} } });
    return req.set('Content-Type', 'application/json').set(SIGNATURE_HEADER, signWebhookPayload(payload, secret, Math.floor(Date.now() / 1000))).send(payload);
  }
  if (routePath.endsWith('/cover') && method === 'PUT') return req.send({ dataUrl: `data:image/png;base64,${Buffer.from(PNG).toString('base64')}` });
  if (routePath === '/api/shops/:shopId/packs' && method === 'POST') {
    return req.send({ printSetId: f.printSetId, title: 'Walked', description: 'd', licence: 'l', priceCents: 0, currency: 'eur' });
  }
  if (routePath.endsWith('/checkout')) return req.send({ email: 'walker@test.example.com' });
  if (method === 'PATCH') return req.send({ title: `Walked by ${persona}` });
  return req;
}

describe('pack routes × personas', () => {
  it('covers the fourteen routes of packs, orders, webhook and downloads', () => {
    expect(routes).toHaveLength(14);
  });
  for (const route of routes) {
    for (const persona of PERSONAS) {
      const want = expected(route.access, route.method, persona);
      it(`${route.method} ${route.path} as ${persona} → ${want}`, async () => {
        const res = await call(route.method, route.path, persona);
        const got = res.status >= 200 && res.status < 300 ? '2xx' : String(res.status);
        expect(got, JSON.stringify(res.body)).toBe(want);
        if (want !== '2xx') expect(res.body.error.code).toBe(want === '401' ? 'UNAUTHENTICATED' : 'FORBIDDEN');
      });
    }
  }
});
