/**
 * Patterns, pieces, stock, sheet plans, print sets from a pattern and the bench view through the API, on the real
 * test database. Sculpts are inserted as processed rows with a working mesh in a temporary file store; jobs are
 * recorded by a JobSender and run here by calling the same functions the worker calls.
 */
import { randomUUID } from 'node:crypto';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sculpts, seamSets, type SeamLine } from '../../db/schema-sculpts';
import { encodeWorkingMesh } from '../../geometry/io/working-mesh';
import { signedAreaMm2 } from '../../geometry/layout/outline-measure';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { cylinder, platonicSolid } from '../../geometry/shapes';
import type { JobSender } from '../../server/jobs/job-sender';
import { PATTERN_JOB, SHEET_PLAN_JOB } from '../../server/patterns/pattern-job-name';
import { PATTERN_SUPERSEDED, runPatternJob } from '../../server/patterns/pattern-job';
import { runSheetPlanJob } from '../../server/sheet-plans/sheet-plan-job';
import { localDiskStore } from '../../server/storage/local-disk-store';
import type { FileStore } from '../../server/storage/file-store';
import { insertBuild, makeShopFixture, makeTestApp, type ShopFixture, type TestContext } from './helpers';

let ctx: TestContext;
let fx: ShopFixture;
let files: FileStore;
const sent: Array<{ name: string; data: Record<string, unknown> }> = [];
const recorder: JobSender = {
  async send(name, data) {
    sent.push({ name, data });
    return randomUUID();
  },
};

beforeAll(async () => {
  files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-patterns-')));
  ctx = await makeTestApp({ jobs: recorder, files });
  fx = await makeShopFixture(ctx);
});
afterAll(async () => {
  await ctx.close();
});

/** Inserts a processed sculpt of `mesh` with `seams` (vertex paths) into a new build; returns the ids. */
async function sculptBuild(name: string, mesh: { positions: Float64Array; triangles: Uint32Array }, seams: number[][]): Promise<{ buildId: string; sculptId: string }> {
  const buildId = await insertBuild(ctx.db, fx.shopId, name);
  const sculptId = randomUUID();
  const meshKey = `sculpts/${sculptId}/mesh.bin`;
  await files.put(meshKey, encodeWorkingMesh(mesh.positions, mesh.triangles));
  await ctx.db.insert(sculpts).values({
    id: sculptId, shopId: fx.shopId, buildId, version: 1, fileName: `${name}.obj`, format: 'obj', sourceKey: `sculpts/${sculptId}/source.obj`,
    sourceBytes: 1, units: 'mm', targetTriangles: 100_000, status: 'done', meshKey,
  });
  const lines: SeamLine[] = seams.map((p, i) => ({ id: `s${i}`, picks: [p[0], p[p.length - 1]], path: p, source: 'picked' }));
  await ctx.db.insert(seamSets).values({ sculptId, shopId: fx.shopId, revision: 1, seams: lines });
  return { buildId, sculptId };
}

/** Runs every recorded job of `name` (oldest first) and forgets them. */
async function runJobs(name: string): Promise<void> {
  const jobs = sent.filter((j) => j.name === name);
  sent.splice(0, sent.length, ...sent.filter((j) => j.name !== name));
  for (const j of jobs) await (name === PATTERN_JOB ? runPatternJob : runSheetPlanJob)({ db: ctx.db, files }, j.data);
}

const as = (persona: keyof ShopFixture['people']) => fx.people[persona].cookie;
const buildUrl = (buildId: string) => `/api/shops/${fx.shopId}/builds/${buildId}`;

/** The 12 edges of platonicSolid('cube', a) as two-vertex seam paths. */
function cubeEdges(positions: Float64Array, a: number): number[][] {
  const out: number[][] = [];
  for (let i = 0; i < positions.length / 3; i++) {
    for (let j = i + 1; j < positions.length / 3; j++) {
      const d = Math.hypot(positions[3 * j] - positions[3 * i], positions[3 * j + 1] - positions[3 * i + 1], positions[3 * j + 2] - positions[3 * i + 2]);
      if (Math.abs(d - a) < 1e-6) out.push([i, j]);
    }
  }
  return out;
}

function binary(res: unknown, done: (err: Error | null, body: Buffer) => void): void {
  const stream = res as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}

const chordFactor = (n: number): number => (n * Math.sin(Math.PI / n)) / Math.PI;

describe('pattern-build job and pattern routes', () => {
  it('unrolls a tube cut along one line into 2πr × h and serves the faces file (4 + 8F bytes)', async () => {
    const r = 40, h = 80, seg = 48;
    const mesh = cylinder(r, h, seg, 4);
    const { buildId } = await sculptBuild('Tube vambrace', mesh, [Array.from({ length: 5 }, (_, k) => k * seg)]);
    const queued = await request(ctx.app).post(`${buildUrl(buildId)}/pattern`).set('Cookie', as('editor'));
    expect(queued.status).toBe(202);
    expect(queued.body.pattern.status).toBe('queued');
    await runJobs(PATTERN_JOB);
    const res = await request(ctx.app).get(`${buildUrl(buildId)}/pattern`).set('Cookie', as('viewer'));
    expect(res.status).toBe(200);
    const { pattern } = res.body as { pattern: { status: string; doc: PatternDoc; facesUrl: string; progress: number } };
    expect(pattern.status).toBe('done');
    expect(pattern.progress).toBe(100);
    expect(pattern.doc.pieces).toHaveLength(1);
    // Development of a cylinder: a rectangle 2πr × h (descriptive geometry); the 48-gon keeps its chord factor.
    // The working mesh is float32, so lengths hold to about 1e-5 relative.
    const xs = pattern.doc.pieces[0].outline.map((p) => p[0]);
    const ys = pattern.doc.pieces[0].outline.map((p) => p[1]);
    const dims = [Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys)].sort((a, b) => b - a);
    expect(dims[0]).toBeCloseTo(2 * Math.PI * r * chordFactor(seg), 2);
    expect(dims[1]).toBeCloseTo(h, 2);
    const faces = await request(ctx.app).get(pattern.facesUrl).set('Cookie', as('viewer')).buffer(true).parse(binary);
    expect(faces.status).toBe(200);
    const F = mesh.triangles.length / 3;
    expect(faces.body.byteLength).toBe(4 + 8 * F);
    expect(faces.body.readUInt32LE(0)).toBe(F);
    for (let f = 0; f < F; f++) expect(faces.body.readInt32LE(4 + 4 * f)).toBe(0);
  });

  it('marks an older queued pattern superseded by a newer save; the newest one is made', async () => {
    const mesh = cylinder(30, 40, 24, 2);
    const { buildId } = await sculptBuild('Bracer', mesh, [[0, 24, 48]]);
    const first = await request(ctx.app).post(`${buildUrl(buildId)}/pattern`).set('Cookie', as('owner'));
    await new Promise((r) => setTimeout(r, 5));
    const second = await request(ctx.app).post(`${buildUrl(buildId)}/pattern`).set('Cookie', as('owner'));
    await runJobs(PATTERN_JOB);
    const rows = await ctx.pool.query('SELECT id, status, error FROM patterns WHERE build_id = $1', [buildId]);
    const byId = new Map(rows.rows.map((r) => [r.id, r]));
    expect(byId.get(first.body.pattern.id)).toMatchObject({ status: 'failed', error: PATTERN_SUPERSEDED });
    expect(byId.get(second.body.pattern.id).status).toBe('done');
  });

  it('fails a pattern with the engine’s message when the working mesh is unreadable, and its faces answer 409', async () => {
    const { buildId, sculptId } = await sculptBuild('Broken mesh', cylinder(20, 20, 12, 1), [[0, 12]]);
    await files.put(`sculpts/${sculptId}/mesh.bin`, new TextEncoder().encode('not a working mesh'));
    const queued = await request(ctx.app).post(`${buildUrl(buildId)}/pattern`).set('Cookie', as('editor'));
    const facesUrl = `${buildUrl(buildId)}/patterns/${queued.body.pattern.id}/faces`;
    const early = await request(ctx.app).get(facesUrl).set('Cookie', as('viewer'));
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('NOT_READY');
    await runJobs(PATTERN_JOB);
    const { body } = await request(ctx.app).get(`${buildUrl(buildId)}/pattern`).set('Cookie', as('viewer'));
    expect(body.pattern.status).toBe('failed');
    expect(body.pattern.error).toMatch(/working mesh/);
    expect(body.pattern.facesUrl).toBeNull();
    const late = await request(ctx.app).get(facesUrl).set('Cookie', as('viewer'));
    expect(late.body.error.code).toBe('PATTERN_FAILED');
  });

  it('answers 409 NO_SCULPT for a build without a sculpt and 404 for another shop’s build', async () => {
    const empty = await insertBuild(ctx.db, fx.shopId, 'No sculpt yet');
    const res = await request(ctx.app).post(`${buildUrl(empty)}/pattern`).set('Cookie', as('editor'));
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('NO_SCULPT');
    expect((await request(ctx.app).get(`${buildUrl(empty)}/pattern`).set('Cookie', as('viewer'))).body).toEqual({ pattern: null });
    const other = await insertBuild(ctx.db, fx.otherShopId, 'Other shop build');
    expect((await request(ctx.app).get(`${buildUrl(other)}/pattern`).set('Cookie', as('viewer'))).status).toBe(404);
  });
});

describe('a cube build: piece settings, checklist, notes, stock, sheet plan, print set, bench', () => {
  let buildId: string;
  beforeAll(async () => {
    const cube = platonicSolid('cube', 100);
    ({ buildId } = await sculptBuild('Crate prop', cube, cubeEdges(cube.positions, 100)));
    await request(ctx.app).post(`${buildUrl(buildId)}/pattern`).set('Cookie', as('editor'));
    await runJobs(PATTERN_JOB);
  });

  it('lists one square template cut six times, then flattens it on the inner face of 6 mm foam as 88 mm', async () => {
    const list = await request(ctx.app).get(`${buildUrl(buildId)}/pieces`).set('Cookie', as('viewer'));
    expect(list.status).toBe(200);
    // A cube has 6 congruent square faces (Coxeter, Regular Polytopes, Table I).
    expect(list.body.pieces).toEqual([expect.objectContaining({ label: 'A', quantity: 6, thicknessMm: 6, surface: 'outer', stale: false, cut: false, notes: 0 })]);
    const patch = await request(ctx.app).patch(`${buildUrl(buildId)}/pieces/A`).set('Cookie', as('editor')).send({ surface: 'inner', thicknessMm: 6 });
    expect(patch.status).toBe(200);
    expect(patch.body.piece).toMatchObject({ label: 'A', surface: 'inner', updatedBy: fx.people.editor.id });
    expect(patch.body.pattern.status).toBe('queued');
    await runJobs(PATTERN_JOB);
    const { body } = await request(ctx.app).get(`${buildUrl(buildId)}/pattern`).set('Cookie', as('viewer'));
    // The inner face of a 100 mm cube shell t thick is a face of the (100 − 2t) mm cube: 88 × 88 mm at t = 6.
    expect(signedAreaMm2(body.pattern.doc.pieces[0].outline)).toBeCloseTo(88 * 88, 1);
    // Put the outer skin back for the rest of this build's checks.
    await request(ctx.app).patch(`${buildUrl(buildId)}/pieces/A`).set('Cookie', as('editor')).send({ surface: null, thicknessMm: null });
    await runJobs(PATTERN_JOB);
  });

  it('refuses bad settings with a message per field and an unknown piece with 404', async () => {
    const bad = await request(ctx.app).patch(`${buildUrl(buildId)}/pieces/A`).set('Cookie', as('editor')).send({ quantity: 0, surface: 'side' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toMatchObject({ quantity: 'must be at least 1', surface: 'must be outer, mid or inner' });
    const none = await request(ctx.app).patch(`${buildUrl(buildId)}/pieces/ZZ/progress`).set('Cookie', as('editor')).send({ cut: true });
    expect(none.status).toBe(404);
    expect(none.body.error.message).toBe('Piece ZZ of the build was not found');
  });

  it('ticks the checklist (who and when), keeps notes, and refuses a viewer', async () => {
    const tick = await request(ctx.app).patch(`${buildUrl(buildId)}/pieces/A/progress`).set('Cookie', as('editor')).send({ cut: true });
    expect(tick.status).toBe(200);
    expect(tick.body.piece).toMatchObject({ cut: true, shaped: false, updatedBy: fx.people.editor.id });
    expect(Date.parse(tick.body.piece.updatedAt)).toBeGreaterThan(Date.now() - 60_000);
    expect((await request(ctx.app).patch(`${buildUrl(buildId)}/pieces/A/progress`).set('Cookie', as('viewer')).send({ glued: true })).status).toBe(403);
    const empty = await request(ctx.app).post(`${buildUrl(buildId)}/pieces/A/notes`).set('Cookie', as('editor')).send({ body: '   ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.body).toBe('write something in the note');
    const long = await request(ctx.app).post(`${buildUrl(buildId)}/pieces/A/notes`).set('Cookie', as('editor')).send({ body: 'x'.repeat(2001) });
    expect(long.body.error.fields.body).toBe('keep the note to 2000 characters');
    const note = await request(ctx.app).post(`${buildUrl(buildId)}/pieces/A/notes`).set('Cookie', as('editor')).send({ body: 'Heat the lid corners before gluing.' });
    expect(note.status).toBe(201);
    const notes = await request(ctx.app).get(`${buildUrl(buildId)}/pieces/A/notes`).set('Cookie', as('viewer'));
    expect(notes.body.notes).toEqual([expect.objectContaining({ body: 'Heat the lid corners before gluing.', authorName: 'Test editor' })]);
    const list = await request(ctx.app).get(`${buildUrl(buildId)}/pieces`).set('Cookie', as('viewer'));
    expect(list.body.pieces[0]).toMatchObject({ cut: true, notes: 1 });
  });

  it('shows default stock until the shop sets its own, and checks each sheet', async () => {
    const defaults = await request(ctx.app).get(`/api/shops/${fx.shopId}/stock`).set('Cookie', as('viewer'));
    expect(defaults.body.stock.map((s: { thicknessMm: number }) => s.thicknessMm)).toEqual([2, 4, 6, 10]);
    expect(defaults.body.stock.every((s: { source: string }) => s.source === 'default')).toBe(true);
    const bad = await request(ctx.app)
      .put(`/api/shops/${fx.shopId}/stock`)
      .set('Cookie', as('editor'))
      .send({ sheets: [{ thicknessMm: 6, name: 'Roll cut', widthMm: -1, heightMm: 500, price: 9, currency: 'eur' }] });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ 'sheets.0.widthMm': 'must be more than 0 mm', 'sheets.0.currency': 'must be a three-letter currency code such as EUR' });
    const mixed = await request(ctx.app)
      .put(`/api/shops/${fx.shopId}/stock`)
      .set('Cookie', as('editor'))
      .send({ sheets: [{ thicknessMm: 6, name: 'A', widthMm: 1000, heightMm: 500, price: 9, currency: 'EUR' }, { thicknessMm: 4, name: 'B', widthMm: 1000, heightMm: 500, price: 7, currency: 'USD' }] });
    expect(mixed.status).toBe(400);
    expect(mixed.body.error.fields['sheets.1.currency']).toBe('must be EUR, like the other sheets');
    expect((await request(ctx.app).put(`/api/shops/${fx.shopId}/stock`).set('Cookie', as('viewer')).send({ sheets: [] })).status).toBe(403);
    const ok = await request(ctx.app)
      .put(`/api/shops/${fx.shopId}/stock`)
      .set('Cookie', as('editor'))
      .send({ sheets: [{ thicknessMm: 6, name: 'Mid sheet', widthMm: 1000, heightMm: 500, price: 12.5, currency: 'EUR' }] });
    expect(ok.status).toBe(200);
    expect(ok.body.stock).toEqual([{ thicknessMm: 6, name: 'Mid sheet', widthMm: 1000, heightMm: 500, price: 12.5, currency: 'EUR', source: 'shop' }]);
  });

  it('plans sheets: 7 squares (6 + 1 spare) use 7·100²/(1000·500) = 14 % of one sheet at the shop price', async () => {
    const pattern = (await request(ctx.app).get(`${buildUrl(buildId)}/pattern`).set('Cookie', as('viewer'))).body.pattern;
    const created = await request(ctx.app).post(`${buildUrl(buildId)}/sheet-plans`).set('Cookie', as('editor')).send({ patternId: pattern.id });
    expect(created.status).toBe(202);
    expect(created.body.sheetPlan.status).toBe('queued');
    await runJobs(SHEET_PLAN_JOB);
    const got = await request(ctx.app).get(`${buildUrl(buildId)}/sheet-plans/${created.body.sheetPlan.id}`).set('Cookie', as('viewer'));
    const plan = got.body.sheetPlan;
    expect(plan.status).toBe('done');
    // Spares: ceil(6 × 10 %) = 1 for a repeated piece (planSheets' rule, common practice). Use = piece area over
    // sheet area: 7 × 100 × 100 mm² / (1000 × 500 mm²).
    expect(plan.plan.placements).toHaveLength(7);
    expect(plan.summary.sheets).toBe(1);
    expect(plan.summary.usedPct).toBeCloseTo((100 * 7 * 100 * 100) / (1000 * 500), 1);
    expect(plan.summary.totalCost).toBe(12.5);
    expect(plan.summary.currency).toBe('EUR');
    const list = await request(ctx.app).get(`${buildUrl(buildId)}/sheet-plans`).set('Cookie', as('viewer'));
    expect(list.body.sheetPlans.map((p: { id: string }) => p.id)).toEqual([plan.id]);
    const unknown = await request(ctx.app).post(`${buildUrl(buildId)}/sheet-plans`).set('Cookie', as('editor')).send({ patternId: randomUUID(), gapMm: -1 });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.fields.gapMm).toBe('must be 0 mm or more');
  });

  it('records the engine’s message when a piece fits no stock sheet of its thickness', async () => {
    const pattern = (await request(ctx.app).get(`${buildUrl(buildId)}/pattern`).set('Cookie', as('viewer'))).body.pattern;
    const small = { thicknessMm: 6, name: 'Offcut', widthMm: 80, heightMm: 80, price: 1, currency: 'EUR' };
    await request(ctx.app).put(`/api/shops/${fx.shopId}/stock`).set('Cookie', as('editor')).send({ sheets: [small] }).expect(200);
    const created = await request(ctx.app).post(`${buildUrl(buildId)}/sheet-plans`).set('Cookie', as('editor')).send({ patternId: pattern.id });
    await runJobs(SHEET_PLAN_JOB);
    const got = await request(ctx.app).get(`${buildUrl(buildId)}/sheet-plans/${created.body.sheetPlan.id}`).set('Cookie', as('viewer'));
    // A 100 mm square does not fit an 80 mm sheet in any rotation (its narrowest width is 100 mm).
    expect(got.body.sheetPlan).toMatchObject({ status: 'failed', plan: null, summary: null });
    expect(got.body.sheetPlan.error).toMatch(/^piece A \(.*\) does not fit on any 6 mm stock sheet \(80×80 mm\)/);
    await request(ctx.app)
      .put(`/api/shops/${fx.shopId}/stock`)
      .set('Cookie', as('editor'))
      .send({ sheets: [{ thicknessMm: 6, name: 'Mid sheet', widthMm: 1000, heightMm: 500, price: 12.5, currency: 'EUR' }] })
      .expect(200);
  });

  it('makes a print set from the pattern id, and refuses a pattern of another build', async () => {
    const pattern = (await request(ctx.app).get(`${buildUrl(buildId)}/pattern`).set('Cookie', as('viewer'))).body.pattern;
    const res = await request(ctx.app).post(`${buildUrl(buildId)}/print-sets`).set('Cookie', as('editor')).send({ patternId: pattern.id, formats: ['pdf'] });
    expect(res.status).toBe(202);
    expect(res.body.printSet.pieceCount).toBe(1);
    const elsewhere = await insertBuild(ctx.db, fx.shopId, 'Empty build');
    const wrong = await request(ctx.app).post(`${buildUrl(elsewhere)}/print-sets`).set('Cookie', as('editor')).send({ patternId: pattern.id, formats: ['pdf'] });
    expect(wrong.status).toBe(404);
    expect(wrong.body.error.fields.patternId).toMatch(/one of the build’s patterns/);
    const both = await request(ctx.app).post(`${buildUrl(buildId)}/print-sets`).set('Cookie', as('editor')).send({ patternId: pattern.id, pattern: pattern.doc, formats: ['pdf'] });
    expect(both.status).toBe(400);
    expect(both.body.error.fields.patternId).toBe('send either a pattern document or a patternId, not both');
  });

  it('gives the bench: counts with spares, checklist, 12 seams at 45° each side on outside corners, cautions', async () => {
    const res = await request(ctx.app).get(`${buildUrl(buildId)}/bench`).set('Cookie', as('viewer'));
    expect(res.status).toBe(200);
    const bench = res.body.bench;
    expect(bench.thicknesses).toEqual([{ thicknessMm: 6, count: 7, pieces: [expect.objectContaining({ label: 'A', quantity: 6, spares: 1, count: 7, cut: true })] }]);
    expect(bench.checklist).toEqual({ pieces: 1, cut: 1, shaped: 0, glued: 0 });
    // A cube has 12 edges with a 90° dihedral (Coxeter, Table I); a symmetric mitre cuts (180° − 90°)/2 = 45° on
    // each side (common joinery practice), and every edge is an outside corner.
    expect(bench.seams).toHaveLength(12);
    for (const seam of bench.seams) {
      expect(seam.corner).toBe('outside');
      expect(seam.sides.map((s: { bevelDeg: number }) => s.bevelDeg)).toEqual([expect.closeTo(45, 3), expect.closeTo(45, 3)]);
      expect(seam.lengthMm).toBeCloseTo(100, 3);
    }
    expect(bench.cautions.some((c: string) => /safety data sheet/.test(c))).toBe(true);
  });
});

describe('who may call the pattern routes', () => {
  it('lets viewers read, editors write, and keeps others out', async () => {
    const buildId = await insertBuild(ctx.db, fx.shopId, 'Access build');
    const reads = [`${buildUrl(buildId)}/pattern`, `${buildUrl(buildId)}/pieces`, `${buildUrl(buildId)}/bench`, `${buildUrl(buildId)}/sheet-plans`, `/api/shops/${fx.shopId}/stock`];
    for (const url of reads) {
      expect((await request(ctx.app).get(url)).status, url).toBe(401);
      expect((await request(ctx.app).get(url).set('Cookie', as('otherOwner'))).status, url).toBe(403);
      expect((await request(ctx.app).get(url).set('Cookie', as('viewer'))).status, url).toBe(200);
      expect((await request(ctx.app).get(url).set('Cookie', as('admin'))).status, url).toBe(200);
    }
    const writes: Array<[string, string, object]> = [
      ['post', `${buildUrl(buildId)}/pattern`, {}],
      ['post', `${buildUrl(buildId)}/sheet-plans`, { patternId: randomUUID() }],
      ['put', `/api/shops/${fx.shopId}/stock`, { sheets: [] }],
      ['patch', `${buildUrl(buildId)}/pieces/A`, { quantity: 2 }],
      ['post', `${buildUrl(buildId)}/pieces/A/notes`, { body: 'hello' }],
    ];
    for (const [verb, url, body] of writes) {
      const call = (cookie?: string) => {
        const r = (request(ctx.app) as unknown as Record<string, (u: string) => request.Test>)[verb](url);
        return (cookie ? r.set('Cookie', cookie) : r).send(body);
      };
      expect((await call()).status, url).toBe(401);
      expect((await call(as('viewer'))).status, url).toBe(403);
      expect((await call(as('admin'))).status, url).toBe(403);
      expect([200, 404, 409]).toContain((await call(as('editor'))).status);
    }
  });
});
