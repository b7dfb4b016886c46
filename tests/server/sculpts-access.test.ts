/**
 * Each sculpt route as each persona, with a request that succeeds for an allowed caller (sculpts-walk.ts), so
 * a refusal is the access rule's and not a bad request's. Expectations are written out here per route (RFC 9110
 * §15.5.2 and §15.5.4: 401 without credentials, 403 for a known caller who may not), independently of
 * server/auth/access.ts; the site admin reads any shop but writes only where a member.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { randomUUID } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROUTE_ACCESS } from '../../server/auth/access';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { insertBuild, makeShopFixture, makeTestApp, PERSONAS, type Persona, type ShopFixture, type TestContext } from './helpers';
import { insertDoneSculpt, sculptWalkRequest } from './sculpts-walk';

const files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-sculpts-access-')));
let ctx: TestContext;
let fx: ShopFixture;
beforeAll(async () => {
  ctx = await makeTestApp({ files, jobs: { send: async () => randomUUID() } });
  fx = await makeShopFixture(ctx);
});
afterAll(async () => {
  await ctx.close();
});

const read = { anonymous: 401, viewer: 2, editor: 2, owner: 2, otherOwner: 403, admin: 2 } as const;
const write = { anonymous: 401, viewer: 403, editor: 2, owner: 2, otherOwner: 403, admin: 403 } as const;
const S = '/api/shops/:shopId/builds/:buildId/sculpts';
const routes: Array<[string, string, Record<Persona, number>]> = [
  ['POST', S, write],
  ['GET', S, read],
  ['GET', `${S}/:sculptId`, read],
  ['PATCH', `${S}/:sculptId`, write],
  ['GET', `${S}/:sculptId/mesh`, read],
  ['GET', `${S}/:sculptId/seams`, read],
  ['PUT', `${S}/:sculptId/seams`, write],
];

describe('sculpt routes × personas', () => {
  it('lists exactly these sculpt routes in the access table', () => {
    const table = ROUTE_ACCESS.filter((r) => r.path.includes('/sculpts')).map((r) => `${r.method} ${r.path}`).sort();
    expect(table).toEqual(routes.map(([m, p]) => `${m} ${p}`).sort());
  });
  for (const [method, route, table] of routes) {
    for (const persona of PERSONAS) {
      const want = table[persona];
      it(`${method} ${route} as ${persona} → ${want === 2 ? '2xx' : want}`, async () => {
        const buildId = await insertBuild(ctx.db, fx.shopId, 'Walk');
        const sculptId = await insertDoneSculpt(ctx.db, files, fx.shopId, buildId);
        const url = route.replace(':shopId', fx.shopId).replace(':buildId', buildId).replace(':sculptId', sculptId);
        let req = request(ctx.app)[method.toLowerCase() as 'get'](url);
        if (persona !== 'anonymous') req = req.set('Cookie', fx.people[persona].cookie);
        const res = await sculptWalkRequest(method, route)!(req);
        if (want === 2) expect(Math.floor(res.status / 100), JSON.stringify(res.body)).toBe(2);
        else expect(res.status, JSON.stringify(res.body)).toBe(want);
      });
    }
  }
});
