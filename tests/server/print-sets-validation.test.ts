/**
 * Print-set requests the server must refuse at the door, each with a message naming the bad path, and the
 * states where a print set exists but cannot serve files. This app has no job queue, so a valid request
 * shows the 503 answer and no render ever starts here.
 */
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { printSets } from '../../db/schema';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { PATTERN_LIMITS } from '../../server/print-sets/pattern-doc-schema';
import { piece, rectangle, regularPolygon } from '../fixtures/pattern-docs/shape-docs';
import { grantPrintSets, insertBuild, makeShopFixture, makeTestApp, type ShopFixture, type TestContext } from './helpers';

let ctx: TestContext;
let fx: ShopFixture;
let buildId: string;
beforeAll(async () => {
  ctx = await makeTestApp();
  fx = await makeShopFixture(ctx);
  // A client reads print sets only with the owner's grant (issue 6); the checks below read as such a client.
  await grantPrintSets(ctx.db, fx.shopId, fx.people.viewer.id);
  buildId = await insertBuild(ctx.db, fx.shopId, 'Validation build');
});
afterAll(async () => {
  await ctx.close();
});

const url = () => `/api/shops/${fx.shopId}/builds/${buildId}/print-sets`;
const goodDoc = (): PatternDoc => ({ units: 'mm', name: 'Pauldron', pieces: [piece('A', rectangle(120, 80)), piece('B', rectangle(60, 40))], seams: [], warnings: [] });

async function post(body: unknown) {
  return request(ctx.app).post(url()).set('Cookie', fx.people.owner.cookie).send(body as object);
}

async function rowCount(): Promise<number> {
  return (await ctx.db.select({ id: printSets.id }).from(printSets).where(eq(printSets.buildId, buildId))).length;
}

describe('print-set request validation', () => {
  const cases: Array<[string, (doc: PatternDoc) => unknown, string, RegExp]> = [
    ['an outline of two points', (d) => ((d.pieces[0].outline = [[0, 0], [1, 0]]), { pattern: d, formats: ['pdf'] }), 'pattern.pieces.0.outline', /at least 3 points/],
    ['a coordinate that is text', (d) => ((d.pieces[1].outline[2] = ['x', 4] as never), { pattern: d, formats: ['pdf'] }), 'pattern.pieces.1.outline.2.0', /must be a number of millimetres/],
    ['a coordinate beyond 100 m', (d) => ((d.pieces[0].outline[1] = [2e5, 0]), { pattern: d, formats: ['pdf'] }), 'pattern.pieces.0.outline.1.0', /within ±100000 mm/],
    ['inch units', (d) => ({ pattern: { ...d, units: 'in' }, formats: ['pdf'] }), 'pattern.units', /units must be "mm"/],
    ['no pieces', (d) => ({ pattern: { ...d, pieces: [] }, formats: ['pdf'] }), 'pattern.pieces', /the pattern has no pieces/],
    ['a duplicate piece label', (d) => ((d.pieces[1].label = 'A'), { pattern: d, formats: ['pdf'] }), 'pattern.pieces.1.label', /already used by piece 0/],
    ['a zero thickness', (d) => ((d.pieces[0].thickness = 0), { pattern: d, formats: ['pdf'] }), 'pattern.pieces.0.thickness', /more than 0 mm/],
    ['a fractional quantity', (d) => ((d.pieces[1].quantity = 1.5), { pattern: d, formats: ['pdf'] }), 'pattern.pieces.1.quantity', /whole number/],
    ['an empty label', (d) => ((d.pieces[0].label = '  '), { pattern: d, formats: ['pdf'] }), 'pattern.pieces.0.label', /must not be empty/],
    [
      'a seam naming a missing piece',
      (d) => ({
        pattern: { ...d, seams: [{ label: '1', pieces: ['A', 'Q'], length3d: 10, lengths: [10, 10], dihedral: { min: 120, mean: 120, max: 120 }, bevel: { min: 30, mean: 30, max: 30 }, convex: true, stations: [] }] },
        formats: ['pdf'],
      }),
      'pattern.seams.0.pieces.1',
      /names piece "Q"/,
    ],
    [
      'a seam edge naming a missing seam',
      (d) => ((d.pieces[0].seamEdges = [{ seam: '9', side: 0, path: [[0, 0], [120, 0]], bevelDeg: 20, bevelFace: 'inner' }]), { pattern: d, formats: ['pdf'] }),
      'pattern.pieces.0.seamEdges.0.seam',
      /names seam "9"/,
    ],
    [
      'a seam edge on a copy the piece does not have',
      (d) => {
        d.pieces[0].quantity = 2;
        d.pieces[0].seamEdges = [{ seam: '1', side: 0, path: [[0, 0], [120, 0]], bevelDeg: 20, bevelFace: 'inner', copy: 2 }];
        const seam = { label: '1', pieces: [d.pieces[0].label, d.pieces[0].label], length3d: 120, lengths: [120, 120], dihedral: { min: 140, mean: 140, max: 140 }, bevel: { min: 20, mean: 20, max: 20 }, convex: true, stations: [] };
        return { pattern: { ...d, seams: [seam] }, formats: ['pdf'] };
      },
      'pattern.pieces.0.seamEdges.0.copy',
      /below the quantity \(2\)/,
    ],
    ['an unknown format', (d) => ({ pattern: d, formats: ['pdf', 'png'] }), 'formats.1', /one of pdf, svg, dxf/],
    ['a repeated format', (d) => ({ pattern: d, formats: ['pdf', 'pdf'] }), 'formats', /each format once/],
    ['no formats', (d) => ({ pattern: d, formats: [] }), 'formats', /at least one format/],
    ['an unknown page size', (d) => ({ pattern: d, formats: ['pdf'], page: 'b5' }), 'page', /one of a4, letter, a3, tabloid/],
    ['an unknown mode', (d) => ({ pattern: d, formats: ['pdf'], mode: 'poster' }), 'mode', /one of tiled, piece-per-page, stock-sheet/],
    ['no pattern', () => ({ formats: ['pdf'] }), 'pattern', /./],
  ];
  for (const [what, make, field, message] of cases) {
    it(`refuses ${what} with 400 naming ${field}`, async () => {
      const before = await rowCount();
      const res = await post(make(goodDoc()));
      expect(res.status, JSON.stringify(res.body)).toBe(400);
      expect(res.body.error.code).toBe('VALIDATION');
      expect(res.body.error.fields[field], JSON.stringify(res.body.error.fields)).toMatch(message);
      expect(await rowCount()).toBe(before);
    });
  }

  it('refuses a non-finite number (JSON 1e400 parses to Infinity, RFC 8259 §6 leaves such range to the parser)', async () => {
    const raw = JSON.stringify({ pattern: goodDoc(), formats: ['dxf'] }).replace('[[0,0],[120,0]', '[[0,0],[1e400,0]');
    const res = await request(ctx.app).post(url()).set('Cookie', fx.people.owner.cookie).set('Content-Type', 'application/json').send(raw);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(['pattern.pieces.0.outline.1.0']);
  });

  it(`refuses an outline over ${PATTERN_LIMITS.pointsPerPath} points and a pattern over ${PATTERN_LIMITS.totalPoints} points in all`, async () => {
    const big = goodDoc();
    big.pieces[0].outline = regularPolygon(100, PATTERN_LIMITS.pointsPerPath + 1);
    const one = await post({ pattern: big, formats: ['pdf'] });
    expect(one.status).toBe(400);
    expect(one.body.error.fields['pattern.pieces.0.outline']).toBe(`an outline has more than ${PATTERN_LIMITS.pointsPerPath} points`);

    const many = goodDoc();
    const perPiece = PATTERN_LIMITS.pointsPerPath;
    const count = Math.floor(PATTERN_LIMITS.totalPoints / perPiece) + 1;
    const ring = regularPolygon(100, perPiece).map(([x, y]) => [Math.round(x), Math.round(y)] as [number, number]);
    many.pieces = Array.from({ length: count }, (_, i) => piece(`P${i}`, ring));
    const all = await post({ pattern: many, formats: ['pdf'] });
    expect(all.status).toBe(400);
    expect(all.body.error.fields['pattern.pieces']).toBe(`the pattern has ${count * perPiece} points in all; at most ${PATTERN_LIMITS.totalPoints} are accepted`);
  });

  it('refuses a body over 8 MB with 413 TOO_LARGE before reading it', async () => {
    const res = await request(ctx.app)
      .post(url())
      .set('Cookie', fx.people.owner.cookie)
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ pattern: goodDoc(), formats: ['pdf'], padding: 'x'.repeat(8 * 1024 * 1024) }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('TOO_LARGE');
  });

  it('keeps the 1 MB limit on other routes', async () => {
    const res = await request(ctx.app).post(`/api/shops/${fx.shopId}/builds`).set('Cookie', fx.people.owner.cookie).send({ name: 'x'.repeat(1024 * 1024 + 10) });
    expect(res.status).toBe(413);
  });

  it('answers 503 QUEUE_UNAVAILABLE without a job queue and marks the print set failed rather than leaving it queued', async () => {
    const res = await post({ pattern: goodDoc(), formats: ['svg'] });
    expect(res.status).toBe(503);
    expect(res.body.error.code).toBe('QUEUE_UNAVAILABLE');
    const list = await request(ctx.app).get(url()).set('Cookie', fx.people.viewer.cookie);
    expect(list.body.printSets[0]).toMatchObject({ status: 'failed', error: res.body.error.message, files: [] });
  });

  it('answers 409 NOT_READY for a file of a print set that is still queued', async () => {
    const [row] = await ctx.db
      .insert(printSets)
      .values({ shopId: fx.shopId, buildId, createdBy: fx.people.owner.id, name: 'Waiting', formats: ['pdf'], page: 'a4', mode: 'tiled', pieceCount: 2, pattern: goodDoc() })
      .returning({ id: printSets.id });
    const res = await request(ctx.app).get(`${url()}/${row.id}/files/print-set.pdf`).set('Cookie', fx.people.viewer.cookie);
    expect(res.status).toBe(409);
    expect(res.body.error).toEqual({ code: 'NOT_READY', message: 'The print set is still queued; its files are ready when its status is done' });
  });
});
