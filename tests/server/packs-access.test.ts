/**
 * Role checks for every pack, order, webhook and download route in the access table: each is called as every
 * persona with a request that succeeds for an allowed caller (packs-fixtures.ts). The expected outcome per rule
 * is written out here (the same table as tests/server/access.test.ts, RFC 9110 §15: 401 without credentials,
 * 403 when not allowed), independently of the server's decision function.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROUTE_ACCESS, type AccessRule, type HttpMethod } from '../../server/auth/access';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { makeShopFixture, makeTestApp, PERSONAS, type Persona, type ShopFixture, type TestContext } from './helpers';
import { isPacksRoute, packsConcreteCall } from './packs-fixtures';

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

const routes = ROUTE_ACCESS.filter((r) => isPacksRoute(r.path));

let ctx: TestContext;
let fx: ShopFixture;
const files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-packs-access-')));

beforeAll(async () => {
  // Every call here checks out from loopback; the limit is tested in packs.test.ts.
  ctx = await makeTestApp({ files, env: { CHECKOUT_RATE_LIMIT: '100000' } });
  fx = await makeShopFixture(ctx);
});
afterAll(() => ctx.close());

describe('pack routes × personas', () => {
  it('covers the fourteen routes of packs, orders, webhook and downloads', () => {
    expect(routes).toHaveLength(14);
  });
  for (const route of routes) {
    for (const persona of PERSONAS) {
      const want = expected(route.access, route.method, persona);
      it(`${route.method} ${route.path} as ${persona} → ${want}`, async () => {
        const call = await packsConcreteCall(ctx.db, files, fx.shopId, route.method, route.path, persona);
        let req = request(ctx.app)[route.method.toLowerCase() as 'get'](call.url);
        if (persona !== 'anonymous') req = req.set('Cookie', fx.people[persona].cookie);
        for (const [k, v] of Object.entries(call.headers ?? {})) req = req.set(k, v);
        const res = call.body === undefined ? await req : await req.send(call.body);
        const got = res.status >= 200 && res.status < 300 ? '2xx' : String(res.status);
        expect(got, JSON.stringify(res.body)).toBe(want);
        if (want !== '2xx') expect(res.body.error.code).toBe(want === '401' ? 'UNAUTHENTICATED' : 'FORBIDDEN');
      });
    }
  }
});
