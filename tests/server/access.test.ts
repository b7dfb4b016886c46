/**
 * Walks the access table (server/auth/access.ts): every route is called as each persona — anonymous, viewer
 * (a client without the print-set grant), editor, owner, another shop's owner, site admin — with a request that
 * succeeds for an allowed caller (access-fixtures-calls.ts), and the status class must match the rule. The
 * expectations below are written out per rule here, independently of the server's own decision function, so a
 * wrong rule or a wrong check shows up as a failure. A granted client is walked over the print-set routes too.
 *
 * Status meanings follow RFC 9110 §15: 401 when no valid credentials were given, 403 when the credentials are
 * understood but not allowed.
 */
import express from 'express';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PRINT_SET_GRANT_ROUTES, ROUTE_ACCESS, type AccessRule, type HttpMethod, type RouteAccess } from '../../server/auth/access';
import { buildParams, shopParams } from '../../server/http/params';
import { defineRoute, mountRoutes, type AccessGuard } from '../../server/http/define-route';
import { printSetFileParams, printSetParams } from '../../server/print-sets/print-set-request';
import { makeWalkWorld, type WalkWorld } from './access-fixtures';
import { routeKey, WALK_CALLS, walkCall } from './access-fixtures-calls';
import { currentSessionCookie, insertBuild, PERSONAS, type Persona } from './helpers';

type Outcome = '2xx' | '401' | '403';

/**
 * Expected outcome per rule and persona; the admin reads any shop but writes only as a member. A client
 * (viewer) sees print sets only when the owner granted them (issue 6), and the walk's viewer has no grant.
 */
function expected(route: RouteAccess, persona: Persona): Outcome {
  const table: Record<string, Record<Persona, Outcome>> = {
    public: { anonymous: '2xx', viewer: '2xx', editor: '2xx', owner: '2xx', otherOwner: '2xx', admin: '2xx' },
    signedIn: { anonymous: '401', viewer: '2xx', editor: '2xx', owner: '2xx', otherOwner: '2xx', admin: '2xx' },
    admin: { anonymous: '401', viewer: '403', editor: '403', owner: '403', otherOwner: '403', admin: '2xx' },
    'shop viewer': { anonymous: '401', viewer: '2xx', editor: '2xx', owner: '2xx', otherOwner: '403', admin: '2xx' },
    'shop editor': { anonymous: '401', viewer: '403', editor: '2xx', owner: '2xx', otherOwner: '403', admin: '2xx' },
    'shop owner': { anonymous: '401', viewer: '403', editor: '403', owner: '2xx', otherOwner: '403', admin: '2xx' },
  };
  const rule: AccessRule = route.access;
  const key = typeof rule === 'string' ? rule : `shop ${rule.shopRole}`;
  if (persona === 'admin' && typeof rule === 'object' && route.method !== 'GET') return '403';
  if (persona === 'viewer' && isGrantRoute(route.method, route.path)) return '403';
  return table[key][persona];
}

const isGrantRoute = (method: HttpMethod, path: string) => PRINT_SET_GRANT_ROUTES.some((r) => r.method === method && r.path === path);

function buildOrShopParams(path: string) {
  if (path.includes(':fileName')) return printSetFileParams;
  if (path.includes(':printSetId')) return printSetParams;
  return path.includes(':buildId') ? buildParams : shopParams;
}

let w: WalkWorld;
beforeAll(async () => {
  w = await makeWalkWorld();
}, 30_000);
afterAll(async () => {
  await w?.close();
});

function outcomeOf(status: number): Outcome | `other ${number}` {
  if (status >= 200 && status < 300) return '2xx';
  if (status === 401) return '401';
  if (status === 403) return '403';
  return `other ${status}`;
}

/** Makes `route`'s call as `cookie` (none for anonymous) and returns the response. */
async function callRoute(route: RouteAccess, persona: Persona, cookie: string | null) {
  const call = await walkCall(w, route, persona);
  let req = request(w.app)[route.method.toLowerCase() as 'get'](call.url);
  if (cookie) req = req.set('Cookie', cookie);
  return call.finish(req);
}

describe('every route × every persona', () => {
  it('has a call for every route of the access table and none for a route the table lacks', () => {
    const table = ROUTE_ACCESS.map((r) => routeKey(r.method, r.path)).sort();
    expect(Object.keys(WALK_CALLS).sort()).toEqual(table);
  });

  for (const route of ROUTE_ACCESS) {
    for (const persona of PERSONAS) {
      const want = expected(route, persona);
      it(`${route.method} ${route.path} as ${persona} → ${want}`, async () => {
        const res = await callRoute(route, persona, persona === 'anonymous' ? null : w.fx.people[persona].cookie);
        expect(outcomeOf(res.status), JSON.stringify(res.body)).toBe(want);
        if (want !== '2xx') expect(res.body.error.code).toBe(want === '401' ? 'UNAUTHENTICATED' : 'FORBIDDEN');
        if (want === '403' && persona === 'viewer' && isGrantRoute(route.method, route.path)) {
          expect(res.body.error.message).toBe('The shop owner has not shared print sets with you; ask them to allow it in the members list');
        }
        // Sign-out ends every session of the persona (server/auth/session.ts), so later calls need a new cookie.
        if (route.path === '/api/auth/signout' && persona !== 'anonymous') {
          await request(w.app).get('/api/me').set('Cookie', w.fx.people[persona].cookie).expect(401);
          w.fx.people[persona].cookie = await currentSessionCookie(w.ctx, w.fx.people[persona].id);
        }
      });
    }
  }
});

describe('a client the owner granted print sets', () => {
  it('lists exactly the three print-set reads as needing the grant', () => {
    expect(PRINT_SET_GRANT_ROUTES.map((r) => routeKey(r.method, r.path)).sort()).toEqual(
      ROUTE_ACCESS.filter((r) => r.method === 'GET' && r.path.includes('/print-sets')).map((r) => routeKey(r.method, r.path)).sort(),
    );
  });
  for (const route of ROUTE_ACCESS.filter((r) => isGrantRoute(r.method, r.path))) {
    it(`${route.method} ${route.path} → 2xx`, async () => {
      const res = await callRoute(route, 'viewer', w.grantedViewer.cookie);
      expect(outcomeOf(res.status), JSON.stringify(res.body)).toBe('2xx');
    });
  }
  it('still may not create a print set (it needs editor)', async () => {
    const route = ROUTE_ACCESS.find((r) => r.method === 'POST' && r.path.endsWith('/print-sets'));
    expect(route).toBeDefined();
    const res = await callRoute(route as RouteAccess, 'viewer', w.grantedViewer.cookie);
    expect(res.status).toBe(403);
    expect(res.body.error.message).toBe('Your role in this shop (viewer) does not allow this; it needs editor');
  });
});

describe('the access table and the mounted routes', () => {
  const guard: AccessGuard = async () => ({ user: null });
  const handler = async () => ({ status: 204 });
  const routeFor = (e: RouteAccess, access: AccessRule = e.access) =>
    defineRoute({ method: e.method, path: e.path, access, params: typeof access === 'object' ? buildOrShopParams(e.path) : undefined, handler });

  it('refuses to mount a route missing from the table', () => {
    const routes = ROUTE_ACCESS.map((e) => routeFor(e));
    routes.push(defineRoute({ method: 'GET', path: '/api/secret-report', access: 'signedIn', handler }));
    expect(() => mountRoutes(express.Router(), routes, guard)).toThrow(/GET \/api\/secret-report has no entry in the access table/);
  });

  it('refuses to mount a route whose rule differs from the table', () => {
    const routes = ROUTE_ACCESS.map((e) => routeFor(e, e.path === '/api/admin/users' ? 'signedIn' : e.access));
    expect(() => mountRoutes(express.Router(), routes, guard)).toThrow(/declares access "signedIn" but the access table says "admin"/);
  });

  it('refuses to start when a table entry has no route', () => {
    const routes = ROUTE_ACCESS.slice(1).map((e) => routeFor(e));
    expect(() => mountRoutes(express.Router(), routes, guard)).toThrow(/nothing serves: GET \/api\/health/);
  });

  it('refuses a shop route that does not validate its path ids', () => {
    expect(() => defineRoute({ method: 'GET', path: '/api/shops/:shopId/things', access: { shopRole: 'viewer' }, handler })).toThrow(
      /must declare a params schema with shopId/,
    );
  });

  it('refuses a route declared twice', () => {
    const routes = ROUTE_ACCESS.map((e) => routeFor(e));
    routes.push(routes[0]);
    expect(() => mountRoutes(express.Router(), routes, guard)).toThrow(/declared twice/);
  });

  it('lists each method and path once, all under /api', () => {
    const keys = ROUTE_ACCESS.map((e) => `${e.method} ${e.path}`);
    expect(new Set(keys).size).toBe(keys.length);
    for (const e of ROUTE_ACCESS) expect(e.path.startsWith('/api/')).toBe(true);
    // Routes naming a shop must check a shop role; nothing else may carry one.
    for (const e of ROUTE_ACCESS) expect(e.path.includes(':shopId')).toBe(typeof e.access === 'object');
  });
});

describe('shop ids and builds across shops', () => {
  it('answers 400 VALIDATION with fields for ids that are not UUIDs (RFC 9562 form), after checking sign-in', async () => {
    const anon = await request(w.app).get('/api/shops/12345/builds');
    expect(anon.status).toBe(401);
    const res = await request(w.app).get('/api/shops/12345/builds/also-bad').set('Cookie', w.fx.people.owner.cookie);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('VALIDATION');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['buildId', 'shopId']);
  });

  it('answers 404 NOT_FOUND for an unknown build and for a build of another shop reached through your own', async () => {
    const unknown = await request(w.app).get(`/api/shops/${w.fx.shopId}/builds/0b6c3d2e-5f41-4a7b-8c9d-0e1f2a3b4c5d`).set('Cookie', w.fx.people.owner.cookie);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('NOT_FOUND');
    const foreign = await insertBuild(w.ctx.db, w.fx.otherShopId, 'Not yours');
    for (const method of ['get', 'patch', 'delete'] as const) {
      const res = await request(w.app)[method](`/api/shops/${w.fx.shopId}/builds/${foreign}`).set('Cookie', w.fx.people.owner.cookie).send({ name: 'Taken' });
      expect(res.status, method).toBe(404);
    }
  });

  it('answers a site admin 404 for a shop that does not exist, and a non-member 403 whether or not it exists', async () => {
    const ghost = '7d3e2f10-4b5c-4d6e-8f70-8192a3b4c5d6';
    const admin = await request(w.app).get(`/api/shops/${ghost}`).set('Cookie', w.fx.people.admin.cookie);
    expect(admin.status).toBe(404);
    const outsider = await request(w.app).get(`/api/shops/${ghost}`).set('Cookie', w.fx.people.otherOwner.cookie);
    expect(outsider.status).toBe(403);
  });

  it('tells a member which role a refused action needs', async () => {
    const res = await request(w.app).post(`/api/shops/${w.fx.shopId}/builds`).set('Cookie', w.fx.people.viewer.cookie).send({ name: 'Nope' });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toBe('Your role in this shop (viewer) does not allow this; it needs editor');
  });
});
