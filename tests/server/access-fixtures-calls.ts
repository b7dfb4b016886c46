/**
 * For the access walk: one entry per route of the access table (server/auth/access.ts), each making the state its
 * call needs and returning the URL and how to finish the request so an allowed caller gets 2xx. A route missing
 * here fails the walk by name (`walkCall` throws, and a test compares the keys with the table), so a new route
 * cannot slip through with a request that fails for another reason than access.
 */
import type { Test } from 'supertest';
import { printSets } from '../../db/schema-core';
import type { HttpMethod, RouteAccess } from '../../server/auth/access';
import { printSetFileKey } from '../../server/print-sets/print-set-files';
import { piece, rectangle } from '../fixtures/pattern-docs/shape-docs';
import { insertFailedJob, insertInvitation, insertMember, insertPatternBuild, insertResetLink, type WalkWorld } from './access-fixtures';
import { FIXTURE_PASSWORD, insertBuild, uniqueEmail, type Persona } from './helpers';
import { packsConcreteCall } from './packs-fixtures';
import { insertDoneSculpt, sculptWalkRequest } from './sculpts-walk';

export interface WalkCall {
  url: string;
  /** Adds the body, files or headers the call needs. */
  finish(req: Test): Test;
}

type Maker = (w: WalkWorld, persona: Persona, route: RouteAccess) => Promise<WalkCall>;

/** Returns `path` with each `:name` replaced by `ids[name]`; throws naming the route when an id is missing. */
function fill(path: string, ids: Record<string, string>): string {
  return path.replace(/:([A-Za-z]+)/g, (_, name: string) => {
    if (!(name in ids)) throw new Error(`the walk has no value for :${name} in ${path}`);
    return encodeURIComponent(ids[name]);
  });
}

const asIs = (req: Test) => req;
const sending = (body: object) => (req: Test) => req.send(body);

/** A call on the fixture shop (and `extra` ids) with an optional JSON body. */
const shopCall =
  (body?: (persona: Persona, w: WalkWorld) => object, extra?: (w: WalkWorld) => Promise<Record<string, string>>): Maker =>
  async (w, persona, route) => ({
    url: fill(route.path, { shopId: w.fx.shopId, ...(extra ? await extra(w) : {}) }),
    finish: body ? sending(body(persona, w)) : asIs,
  });

/** A call on a fresh build of the fixture shop. */
const freshBuildCall = (body?: (persona: Persona, w: WalkWorld) => object): Maker => shopCall(body, async (w) => ({ buildId: await insertBuild(w.ctx.db, w.fx.shopId, 'Walk build') }));

/** A call on the build with the finished cube pattern (ids of its pattern, piece and sheet plan). */
const doneBuildCall = (body?: (persona: Persona, w: WalkWorld) => object): Maker =>
  shopCall(body, async (w) => ({ buildId: w.done.buildId, patternId: w.done.patternId, label: w.done.label, planId: w.done.planId }));

/** Inserts a finished print set with one stored SVG into a fresh build and returns the ids a print-set URL needs. */
async function donePrintSetIds(w: WalkWorld): Promise<Record<string, string>> {
  const buildId = await insertBuild(w.ctx.db, w.fx.shopId, 'Walk print build');
  const svg = new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg" width="40mm" height="30mm"/>');
  const [row] = await w.ctx.db
    .insert(printSets)
    .values({
      shopId: w.fx.shopId,
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
  await w.files.put(printSetFileKey(row.id, 'pattern.svg'), svg);
  return { buildId, printSetId: row.id, fileName: 'pattern.svg' };
}

/** The packs area's own fixtures (packs-fixtures.ts): a published pack, a paid free order and a download link per call. */
const packsCall: Maker = async (w, persona, route) => {
  const call = await packsConcreteCall(w.ctx.db, w.files, w.fx.shopId, route.method, route.path, persona);
  return {
    url: call.url,
    finish: (req) => {
      for (const [k, v] of Object.entries(call.headers ?? {})) req = req.set(k, v);
      return call.body === undefined ? req : req.send(call.body);
    },
  };
};

/** The sculpt area's own fixtures (sculpts-walk.ts): a processed sculpt with its working mesh per call. */
const sculptCall: Maker = async (w, _persona, route) => {
  const buildId = await insertBuild(w.ctx.db, w.fx.shopId, 'Walk sculpt build');
  const sculptId = await insertDoneSculpt(w.ctx.db, w.files, w.fx.shopId, buildId);
  const finish = sculptWalkRequest(route.method, route.path);
  if (!finish) throw new Error(`sculpts-walk.ts has no request for ${route.method} ${route.path}`);
  return { url: fill(route.path, { shopId: w.fx.shopId, buildId, sculptId }), finish };
};

const publicCall =
  (body?: (w: WalkWorld, persona: Persona) => Promise<object> | object, ids?: (w: WalkWorld, persona: Persona) => Promise<Record<string, string>>): Maker =>
  async (w, persona, route) => {
    const url = fill(route.path, ids ? await ids(w, persona) : {});
    return { url, finish: body ? sending(await body(w, persona)) : asIs };
  };

const walkPattern = () => ({ units: 'mm', pieces: [piece('W', rectangle(40, 30))], seams: [], warnings: [] });
const stockSheets = { sheets: [{ thicknessMm: 6, name: 'Walk sheet', widthMm: 1000, heightMm: 500, price: 12.5, currency: 'EUR' }] };
const S = '/api/shops/:shopId';
const B = `${S}/builds/:buildId`;

/** Every route of the access table, keyed "METHOD path", with the call that succeeds for an allowed caller. */
export const WALK_CALLS: Readonly<Record<string, Maker>> = {
  'GET /api/health': publicCall(),
  'POST /api/auth/signup': publicCall(() => ({ name: 'Walker', email: uniqueEmail('walk'), password: 'long-enough-pw' })),
  // Anonymous signs in as the owner; a persona signs in as themself.
  'POST /api/auth/signin': publicCall((w, p) => ({ email: w.fx.people[p === 'anonymous' ? 'owner' : p].email, password: FIXTURE_PASSWORD })),
  'POST /api/auth/signout': publicCall(),
  'GET /api/me': publicCall(),
  [`GET ${S}/members`]: shopCall(),
  [`PATCH ${S}/members/:userId`]: shopCall(() => ({ canSeePrintSets: true }), async (w) => ({ userId: await insertMember(w) })),
  [`DELETE ${S}/members/:userId`]: shopCall(undefined, async (w) => ({ userId: await insertMember(w) })),
  [`GET ${S}/invitations`]: shopCall(),
  [`POST ${S}/invitations`]: shopCall(() => ({ email: uniqueEmail('walk-invite'), role: 'viewer' })),
  [`DELETE ${S}/invitations/:invitationId`]: shopCall(undefined, async (w) => ({ invitationId: (await insertInvitation(w, { shopId: w.fx.shopId })).id })),
  [`POST ${S}/invitations/:invitationId/resend`]: shopCall(undefined, async (w) => ({ invitationId: (await insertInvitation(w, { shopId: w.fx.shopId })).id })),
  'GET /api/invitations/:token': publicCall(undefined, async (w) => ({ token: (await insertInvitation(w)).token })),
  // The link is for the caller's own address (accepting needs it), in a shop of its own.
  'POST /api/invitations/:token/accept': publicCall(undefined, async (w, p) => ({ token: (await insertInvitation(w, p === 'anonymous' ? {} : { email: w.fx.people[p].email })).token })),
  'POST /api/auth/password-reset': publicCall(() => ({ email: uniqueEmail('walk-forgot') })),
  'POST /api/auth/password-reset/confirm': publicCall(async (w) => ({ token: await insertResetLink(w), password: 'walked-new-password' })),
  'POST /api/shops': publicCall((_w, p) => ({ name: `Walk shop of ${p}` })),
  [`GET ${S}`]: shopCall(),
  [`GET ${S}/builds`]: shopCall(),
  [`POST ${S}/builds`]: shopCall((p) => ({ name: `Walked by ${p}` })),
  [`GET ${B}`]: freshBuildCall(),
  [`PATCH ${B}`]: freshBuildCall((p) => ({ name: `Walked by ${p}` })),
  [`DELETE ${B}`]: freshBuildCall(),
  [`GET ${B}/overview`]: freshBuildCall(),
  [`POST ${B}/print-sets`]: freshBuildCall(() => ({ pattern: walkPattern(), formats: ['svg'] })),
  [`GET ${B}/print-sets`]: shopCall(undefined, donePrintSetIds),
  [`GET ${B}/print-sets/:printSetId`]: shopCall(undefined, donePrintSetIds),
  [`GET ${B}/print-sets/:printSetId/files/:fileName`]: shopCall(undefined, donePrintSetIds),
  [`GET ${S}/audit`]: shopCall(),
  'GET /api/admin/users': publicCall(),
  'GET /api/admin/shops': publicCall(),
  'GET /api/admin/orders': publicCall(),
  // A paid free order of a published pack, made by the packs fixtures (their path names the id :orderId).
  'POST /api/admin/orders/:id/refund': async (w, persona) => {
    const call = await packsConcreteCall(w.ctx.db, w.files, w.fx.shopId, 'POST', '/api/admin/orders/:orderId/refund', persona);
    return { url: call.url, finish: asIs };
  },
  'GET /api/admin/jobs': publicCall(),
  'POST /api/admin/jobs/:id/retry': publicCall(undefined, async (w) => ({ id: await insertFailedJob(w) })),
  'GET /api/admin/mail': publicCall(),
  [`POST ${S}/packs`]: packsCall,
  [`GET ${S}/packs`]: packsCall,
  [`PATCH ${S}/packs/:packId`]: packsCall,
  [`PUT ${S}/packs/:packId/cover`]: packsCall,
  [`GET ${S}/packs/:packId/cover`]: packsCall,
  'GET /api/packs': packsCall,
  'GET /api/packs/:slug': packsCall,
  'GET /api/packs/:slug/cover': packsCall,
  'POST /api/packs/:slug/checkout': packsCall,
  'POST /api/pay/webhook': packsCall,
  [`GET ${S}/orders`]: packsCall,
  [`POST ${S}/orders/:orderId/refund`]: packsCall,
  'GET /api/downloads/:token': packsCall,
  'GET /api/downloads/:token/files/:name': packsCall,
  [`POST ${B}/sculpts`]: sculptCall,
  [`GET ${B}/sculpts`]: sculptCall,
  [`GET ${B}/sculpts/:sculptId`]: sculptCall,
  [`PATCH ${B}/sculpts/:sculptId`]: sculptCall,
  [`GET ${B}/sculpts/:sculptId/mesh`]: sculptCall,
  [`GET ${B}/sculpts/:sculptId/seams`]: sculptCall,
  [`PUT ${B}/sculpts/:sculptId/seams`]: sculptCall,
  [`GET ${B}/pattern`]: doneBuildCall(),
  // Re-making a pattern needs only a processed sculpt; a fresh one keeps the finished build's pattern current.
  [`POST ${B}/pattern`]: shopCall(undefined, async (w) => {
    const buildId = await insertBuild(w.ctx.db, w.fx.shopId, 'Walk remake');
    await insertDoneSculpt(w.ctx.db, w.files, w.fx.shopId, buildId);
    return { buildId };
  }),
  [`GET ${B}/patterns/:patternId/faces`]: doneBuildCall(),
  [`GET ${B}/pieces`]: doneBuildCall(),
  // A settings change queues a new pattern, so it gets a finished build of its own.
  [`PATCH ${B}/pieces/:label`]: shopCall(() => ({ thicknessMm: 4 }), async (w) => ({ buildId: (await insertPatternBuild(w, w.fx.shopId, 'Walk settings')).buildId, label: w.done.label })),
  [`PATCH ${B}/pieces/:label/progress`]: doneBuildCall(() => ({ cut: true })),
  [`GET ${B}/pieces/:label/notes`]: doneBuildCall(),
  [`POST ${B}/pieces/:label/notes`]: doneBuildCall((p) => ({ body: `Checked by ${p} on the walk` })),
  [`GET ${S}/stock`]: shopCall(),
  [`PUT ${S}/stock`]: shopCall(() => stockSheets),
  [`POST ${B}/sheet-plans`]: doneBuildCall((_p, w) => ({ patternId: w.done.patternId })),
  [`GET ${B}/sheet-plans`]: doneBuildCall(),
  [`GET ${B}/sheet-plans/:planId`]: doneBuildCall(),
  [`GET ${B}/bench`]: doneBuildCall(),
};

/** Returns the call for `route` as `persona`; throws naming the route when the walk has none. */
export async function walkCall(w: WalkWorld, route: RouteAccess, persona: Persona): Promise<WalkCall> {
  const maker = WALK_CALLS[routeKey(route.method, route.path)];
  if (!maker) throw new Error(`the access walk has no call for ${route.method} ${route.path}; add one to tests/server/access-fixtures-calls.ts`);
  return maker(w, persona, route);
}

/** Returns the key of a route in WALK_CALLS. */
export function routeKey(method: HttpMethod, path: string): string {
  return `${method} ${path}`;
}
