/**
 * Walks the access table (server/auth/access.ts): every route is called as each persona and the status class
 * must match the rule. The expectations below are written out per rule here, independently of the server's
 * own decision function, so a wrong rule or a wrong check shows up as a failure.
 *
 * Status meanings follow RFC 9110 §15: 401 when no valid credentials were given, 403 when the credentials are
 * understood but not allowed.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import express from 'express';
import type PgBoss from 'pg-boss';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROUTE_ACCESS, type AccessRule, type HttpMethod, type RouteAccess } from '../../server/auth/access';
import { buildParams, shopParams } from '../../server/http/params';
import { defineRoute, mountRoutes, type AccessGuard } from '../../server/http/define-route';
import { pgBossJobSender } from '../../server/jobs/job-sender';
import { startQueue, stopQueue } from '../../server/jobs/queue';
import { createLogger } from '../../server/logger';
import { printSetFileKey } from '../../server/print-sets/print-set-files';
import { printSetFileParams, printSetParams } from '../../server/print-sets/print-set-request';
import type { FileStore } from '../../server/storage/file-store';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { printSets } from '../../db/schema';
import { piece, rectangle } from '../fixtures/pattern-docs/shape-docs';
import { currentSessionCookie, insertBuild, makeShopFixture, makeTestApp, PERSONAS, uniqueEmail, FIXTURE_PASSWORD, TEST_DATABASE_URL, type Persona, type ShopFixture, type TestContext } from './helpers';

type Outcome = '2xx' | '401' | '403';

/** Expected outcome per rule and persona; the admin reads any shop but writes only as a member. */
function expected(rule: AccessRule, method: HttpMethod, persona: Persona): Outcome {
  const table: Record<string, Record<Persona, Outcome>> = {
    public: { anonymous: '2xx', viewer: '2xx', editor: '2xx', owner: '2xx', otherOwner: '2xx', admin: '2xx' },
    signedIn: { anonymous: '401', viewer: '2xx', editor: '2xx', owner: '2xx', otherOwner: '2xx', admin: '2xx' },
    admin: { anonymous: '401', viewer: '403', editor: '403', owner: '403', otherOwner: '403', admin: '2xx' },
    'shop viewer': { anonymous: '401', viewer: '2xx', editor: '2xx', owner: '2xx', otherOwner: '403', admin: '2xx' },
    'shop editor': { anonymous: '401', viewer: '403', editor: '2xx', owner: '2xx', otherOwner: '403', admin: '2xx' },
    'shop owner': { anonymous: '401', viewer: '403', editor: '403', owner: '2xx', otherOwner: '403', admin: '2xx' },
  };
  const key = typeof rule === 'string' ? rule : `shop ${rule.shopRole}`;
  const outcome = table[key][persona];
  if (persona === 'admin' && typeof rule === 'object' && method !== 'GET') return '403';
  return outcome;
}

function buildOrShopParams(path: string) {
  if (path.includes(':fileName')) return printSetFileParams;
  if (path.includes(':printSetId')) return printSetParams;
  return path.includes(':buildId') ? buildParams : shopParams;
}

let ctx: TestContext;
let fx: ShopFixture;
let boss: PgBoss;
let files: FileStore;
beforeAll(async () => {
  // Creating a print set queues a job, so this app has a real queue (no worker: the jobs stay queued).
  boss = await startQueue(TEST_DATABASE_URL, createLogger('silent', 'test'), { supervise: false, schedule: false });
  files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-access-')));
  ctx = await makeTestApp({ signInLimit: { max: 1000, windowMs: 60_000 }, jobs: pgBossJobSender(boss), files });
  fx = await makeShopFixture(ctx);
});
afterAll(async () => {
  await stopQueue(boss, 5_000);
  await ctx.close();
});

const walkPattern = () => ({ units: 'mm', pieces: [piece('W', rectangle(40, 30))], seams: [], warnings: [] });

/** Inserts a finished print set with one stored file into the build and returns its id and the file's name. */
async function insertDonePrintSet(buildId: string): Promise<{ id: string; fileName: string }> {
  const svg = new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg" width="40mm" height="30mm"/>');
  const [row] = await ctx.db
    .insert(printSets)
    .values({
      shopId: fx.shopId,
      buildId,
      name: 'Access walk',
      status: 'done',
      formats: ['svg'],
      page: 'a4',
      mode: 'tiled',
      pieceCount: 1,
      pattern: { units: 'mm', pieces: [piece('W', rectangle(40, 30))], seams: [], warnings: [] },
      files: [{ name: 'pattern.svg', sizeBytes: svg.byteLength, contentType: 'image/svg+xml' }],
    })
    .returning({ id: printSets.id });
  await files.put(printSetFileKey(row.id, 'pattern.svg'), svg);
  return { id: row.id, fileName: 'pattern.svg' };
}

/** Returns the concrete URL and a body that would succeed for an allowed caller. */
async function concreteCall(method: HttpMethod, path: string, persona: Persona): Promise<{ url: string; body?: object }> {
  const buildId = path.includes(':buildId') ? await insertBuild(ctx.db, fx.shopId, 'Access walk build') : '';
  const printSet = path.includes(':printSetId') ? await insertDonePrintSet(buildId) : { id: '', fileName: '' };
  const url = path.replace(':shopId', fx.shopId).replace(':buildId', buildId).replace(':printSetId', printSet.id).replace(':fileName', printSet.fileName);
  if (path.endsWith('/print-sets') && method === 'POST') return { url, body: { pattern: walkPattern(), formats: ['svg'] } };
  if (path === '/api/auth/signup') return { url, body: { name: 'Walker', email: uniqueEmail('walk'), password: 'long-enough-pw' } };
  if (path === '/api/auth/signin') {
    const email = persona === 'anonymous' ? fx.people.owner.email : fx.people[persona].email;
    return { url, body: { email, password: FIXTURE_PASSWORD } };
  }
  if (method === 'POST' || method === 'PATCH' || method === 'PUT') return { url, body: { name: `Walked by ${persona}` } };
  return { url };
}

function outcomeOf(status: number): Outcome | `other ${number}` {
  if (status >= 200 && status < 300) return '2xx';
  if (status === 401) return '401';
  if (status === 403) return '403';
  return `other ${status}`;
}

describe('every route × every persona', () => {
  for (const route of ROUTE_ACCESS) {
    for (const persona of PERSONAS) {
      const want = expected(route.access, route.method, persona);
      it(`${route.method} ${route.path} as ${persona} → ${want}`, async () => {
        const call = await concreteCall(route.method, route.path, persona);
        let req = request(ctx.app)[route.method.toLowerCase() as 'get'](call.url);
        if (persona !== 'anonymous') req = req.set('Cookie', fx.people[persona].cookie);
        const res = call.body ? await req.send(call.body) : await req;
        expect(outcomeOf(res.status), JSON.stringify(res.body)).toBe(want);
        if (want !== '2xx') expect(res.body.error.code).toBe(want === '401' ? 'UNAUTHENTICATED' : 'FORBIDDEN');
        // Sign-out ends every session of the persona (server/auth/session.ts), so later calls need a new cookie.
        if (route.path === '/api/auth/signout' && persona !== 'anonymous') {
          await request(ctx.app).get('/api/me').set('Cookie', fx.people[persona].cookie).expect(401);
          fx.people[persona].cookie = await currentSessionCookie(ctx, fx.people[persona].id);
        }
      });
    }
  }
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
    const anon = await request(ctx.app).get('/api/shops/12345/builds');
    expect(anon.status).toBe(401);
    const res = await request(ctx.app).get('/api/shops/12345/builds/also-bad').set('Cookie', fx.people.owner.cookie);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('VALIDATION');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['buildId', 'shopId']);
  });

  it('answers 404 NOT_FOUND for an unknown build and for a build of another shop reached through your own', async () => {
    const unknown = await request(ctx.app).get(`/api/shops/${fx.shopId}/builds/0b6c3d2e-5f41-4a7b-8c9d-0e1f2a3b4c5d`).set('Cookie', fx.people.owner.cookie);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('NOT_FOUND');
    const foreign = await insertBuild(ctx.db, fx.otherShopId, 'Not yours');
    for (const method of ['get', 'patch', 'delete'] as const) {
      const res = await request(ctx.app)[method](`/api/shops/${fx.shopId}/builds/${foreign}`).set('Cookie', fx.people.owner.cookie).send({ name: 'Taken' });
      expect(res.status, method).toBe(404);
    }
  });

  it('answers a site admin 404 for a shop that does not exist, and a non-member 403 whether or not it exists', async () => {
    const ghost = '7d3e2f10-4b5c-4d6e-8f70-8192a3b4c5d6';
    const admin = await request(ctx.app).get(`/api/shops/${ghost}`).set('Cookie', fx.people.admin.cookie);
    expect(admin.status).toBe(404);
    const outsider = await request(ctx.app).get(`/api/shops/${ghost}`).set('Cookie', fx.people.otherOwner.cookie);
    expect(outsider.status).toBe(403);
  });

  it('tells a member which role a refused action needs', async () => {
    const res = await request(ctx.app).post(`/api/shops/${fx.shopId}/builds`).set('Cookie', fx.people.viewer.cookie).send({ name: 'Nope' });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toBe('Your role in this shop (viewer) does not allow this; it needs editor');
  });
});
