/**
 * Print sets through the API end to end: create (202, queued, audited) → a real pg-boss worker on the test
 * database renders it → status done → the files download with their media types, and the PDF and DXF read
 * back as what they claim to be. A pattern the engine refuses ends as failed with its message and no files.
 */
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import DxfParser from 'dxf-parser';
import type PgBoss from 'pg-boss';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PatternDoc, PointMm } from '../../geometry/pattern/pattern-doc';
import { JOB_TYPES } from '../../server/jobs/job-types';
import { pgBossJobSender } from '../../server/jobs/job-sender';
import { registerWorkers } from '../../server/jobs/register-workers';
import { startQueue, stopQueue } from '../../server/jobs/queue';
import { createLogger } from '../../server/logger';
import { PRINT_SET_JOB } from '../../server/print-sets/print-set-job';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { helmetLikeDoc, piece, rectangle } from '../fixtures/pattern-docs/shape-docs';
import { grantPrintSets, insertBuild, makeShopFixture, makeTestApp, TEST_DATABASE_URL, type ShopFixture, type TestContext } from './helpers';

let ctx: TestContext;
let fx: ShopFixture;
let boss: PgBoss;
let filesDir: string;
let buildId: string;

beforeAll(async () => {
  filesDir = mkdtempSync(path.join(tmpdir(), 'sheetsmith-print-sets-'));
  const logger = createLogger('silent', 'test');
  boss = await startQueue(TEST_DATABASE_URL, logger, { supervise: false, schedule: false });
  const files = localDiskStore(filesDir);
  ctx = await makeTestApp({ jobs: pgBossJobSender(boss), files });
  fx = await makeShopFixture(ctx);
  // The viewer here is a client the owner shared print sets with; without the grant they are refused (below).
  await grantPrintSets(ctx.db, fx.shopId, fx.people.viewer.id);
  buildId = await insertBuild(ctx.db, fx.shopId, 'Hornet visor');
  await registerWorkers(boss, { db: ctx.db, files }, logger, {
    schedule: false,
    pollingIntervalSeconds: 0.5,
    jobTypes: JOB_TYPES.filter((t) => t.name === PRINT_SET_JOB),
  });
});
afterAll(async () => {
  await stopQueue(boss, 10_000);
  await ctx.close();
});

const base = () => `/api/shops/${fx.shopId}/builds/${buildId}/print-sets`;

/** Collects a response body as bytes whatever its media type (supertest parses only text and JSON). */
function binary(res: unknown, done: (err: Error | null, body: Buffer) => void): void {
  const stream = res as NodeJS.ReadableStream;
  const chunks: Buffer[] = [];
  stream.on('error', (err: Error) => done(err, Buffer.alloc(0)));
  stream.on('data', (c: Buffer) => chunks.push(c));
  stream.on('end', () => done(null, Buffer.concat(chunks)));
}

async function waitFinished(id: string, cookie: string, listUrl = base()): Promise<{ status: string; error: string | null; files: Array<{ name: string; sizeBytes: number; contentType: string; url: string }> }> {
  for (let i = 0; i < 120; i++) {
    const res = await request(ctx.app).get(`${listUrl}/${id}`).set('Cookie', cookie);
    expect(res.status).toBe(200);
    if (res.body.printSet.status === 'done' || res.body.printSet.status === 'failed') return res.body.printSet;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`print set ${id} did not finish within 30 s`);
}

function perimeter(ring: readonly PointMm[]): number {
  let s = 0;
  for (let i = 0; i < ring.length; i++) {
    const [a, b] = [ring[i], ring[(i + 1) % ring.length]];
    s += Math.hypot(b[0] - a[0], b[1] - a[1]);
  }
  return s;
}

/** Page objects of a PDF: dictionaries of /Type /Page (ISO 32000-1 §7.7.3.3), not the /Pages tree nodes. */
function pdfPages(pdf: Buffer): { count: number; treeCount: number; mediaBoxes: number[][] } {
  const text = pdf.toString('latin1');
  const count = (text.match(/\/Type\s*\/Page(?![a-zA-Z])/g) ?? []).length;
  const root = /\/Type\s*\/Pages[\s\S]*?\/Count\s+(\d+)/.exec(text);
  const mediaBoxes = [...text.matchAll(/\/MediaBox\s*\[\s*([\d.\s-]+)\]/g)].map((m) => m[1].trim().split(/\s+/).map(Number));
  return { count, treeCount: root ? Number(root[1]) : -1, mediaBoxes };
}

describe('print sets', () => {
  it('queues a print set, renders it on a worker, and serves the PDF, SVG and DXF', async () => {
    const doc = helmetLikeDoc();
    const created = await request(ctx.app).post(base()).set('Cookie', fx.people.editor.cookie).send({ pattern: doc, formats: ['pdf', 'svg', 'dxf'], page: 'a4' });
    expect(created.status, JSON.stringify(created.body)).toBe(202);
    expect(created.body.printSet).toMatchObject({ status: 'queued', buildId, formats: ['pdf', 'svg', 'dxf'], page: 'a4', mode: 'tiled', pieceCount: 6, name: 'Test helmet', files: [], error: null });
    const id = created.body.printSet.id;

    const done = await waitFinished(id, fx.people.viewer.cookie);
    expect(done.error).toBeNull();
    expect(done.status).toBe('done');
    expect(done.files.map((f) => f.name)).toEqual(['sheet-plan.json', 'print-set.pdf', 'bench-card.pdf', 'pattern.svg', 'pattern.dxf']);

    // Media types: application/pdf (RFC 8118), image/svg+xml (IANA), image/vnd.dxf (IANA), application/json (RFC 8259).
    const byName = Object.fromEntries(done.files.map((f) => [f.name, f]));
    expect(byName['print-set.pdf'].contentType).toBe('application/pdf');
    expect(byName['pattern.svg'].contentType).toBe('image/svg+xml');
    expect(byName['pattern.dxf'].contentType).toBe('image/vnd.dxf');

    const pdfRes = await request(ctx.app).get(byName['print-set.pdf'].url).set('Cookie', fx.people.viewer.cookie).buffer(true).parse(binary);
    expect(pdfRes.status).toBe(200);
    expect(pdfRes.headers['content-type']).toBe('application/pdf');
    // RFC 6266 §4.1: attachment with the file name, so the browser saves it rather than showing it in the app.
    expect(pdfRes.headers['content-disposition']).toBe('attachment; filename="print-set.pdf"');
    const pdf = pdfRes.body as Buffer;
    expect(pdf.length).toBe(byName['print-set.pdf'].sizeBytes);
    // ISO 32000-1 §7.5.2 header "%PDF-1.n" and §7.5.5 trailer ending "%%EOF".
    expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(pdf.subarray(-6).toString('latin1')).toMatch(/%%EOF\s*$/);
    const pages = pdfPages(pdf);
    // The cover page plus at least one drawing page; every page object is counted by the page tree.
    expect(pages.count).toBeGreaterThanOrEqual(2);
    expect(pages.treeCount).toBe(pages.count);
    // A4 is 210×297 mm (ISO 216) = 595.28×841.89 pt at 72 pt per inch (ISO 32000-1 §8.3.2.3); tiles may be landscape.
    for (const box of pages.mediaBoxes) {
      const [w, h] = [box[2] - box[0], box[3] - box[1]].sort((a, b) => a - b);
      expect(w).toBeCloseTo(595.28, 1);
      expect(h).toBeCloseTo(841.89, 1);
    }

    const planRes = await request(ctx.app).get(byName['sheet-plan.json'].url).set('Cookie', fx.people.viewer.cookie).buffer(true).parse(binary);
    const plan = JSON.parse((planRes.body as Buffer).toString('utf8')) as { placements: Array<{ pieceLabel: string }> };

    const dxfRes = await request(ctx.app).get(byName['pattern.dxf'].url).set('Cookie', fx.people.owner.cookie).buffer(true).parse(binary);
    expect(dxfRes.status).toBe(200);
    expect(dxfRes.headers['content-disposition']).toBe('attachment; filename="pattern.dxf"');
    const dxf = new DxfParser().parseSync((dxfRes.body as Buffer).toString('utf8'));
    // DXF reference, HEADER section: $INSUNITS 4 = millimetres.
    expect(dxf?.header.$INSUNITS).toBe(4);
    type Poly = { type: string; layer: string; shape?: boolean; vertices: Array<{ x: number; y: number }> };
    const cuts = (dxf?.entities as unknown as Poly[]).filter((e) => e.type === 'LWPOLYLINE' && e.layer === 'SS_CUT');
    // One closed outline per placed copy (quantities and spares included), each as long as the sent outline.
    expect(cuts.length).toBe(plan.placements.length);
    const wanted = plan.placements.map((p) => perimeter(doc.pieces.find((q) => q.label === p.pieceLabel)!.outline)).sort((a, b) => a - b);
    const got = cuts.map((e) => perimeter(e.vertices.map((v) => [v.x, v.y] as PointMm))).sort((a, b) => a - b);
    for (const c of cuts) expect(c.shape).toBe(true);
    got.forEach((g, i) => expect(Math.abs(g - wanted[i])).toBeLessThan(0.01));

    const svgRes = await request(ctx.app).get(byName['pattern.svg'].url).set('Cookie', fx.people.viewer.cookie).buffer(true).parse(binary);
    expect(svgRes.headers['content-type']).toBe('image/svg+xml');
    // SVG 1.1 §7.10: width and height in mm make user units millimetres at 1:1.
    expect((svgRes.body as Buffer).toString('utf8')).toMatch(/<svg[^>]*width="[\d.]+mm"/);
  });

  it('prints one small piece on Letter: a cover page and one drawing page of 8.5×11 in', async () => {
    const doc: PatternDoc = { units: 'mm', name: 'Gauntlet cuff', pieces: [piece('K', rectangle(100, 60))], seams: [], warnings: [] };
    const created = await request(ctx.app).post(base()).set('Cookie', fx.people.owner.cookie).send({ pattern: doc, formats: ['pdf'], page: 'letter' });
    expect(created.status).toBe(202);
    const done = await waitFinished(created.body.printSet.id, fx.people.owner.cookie);
    expect(done.status).toBe('done');
    expect(done.files.map((f) => f.name)).toEqual(['sheet-plan.json', 'print-set.pdf', 'bench-card.pdf']);
    const pdf = (await request(ctx.app).get(done.files[1].url).set('Cookie', fx.people.owner.cookie).buffer(true).parse(binary)).body as Buffer;
    const pages = pdfPages(pdf);
    // 100×60 mm fits one Letter page inside its margins, so: the cover with the page map, then one tile.
    expect(pages.count).toBe(2);
    // Letter is 8.5×11 in (ANSI/ASME Y14.1) = 612×792 pt (ISO 32000-1 §8.3.2.3).
    for (const box of pages.mediaBoxes) {
      const [w, h] = [box[2] - box[0], box[3] - box[1]].sort((a, b) => a - b);
      expect(w).toBeCloseTo(612, 1);
      expect(h).toBeCloseTo(792, 1);
    }
  });

  it('fails a print set whose piece is bigger than every stock sheet, with the engine message and no files', async () => {
    // 2000 mm is longer than the diagonal of the 1000×500 mm default 6 mm sheet (1118 mm, common-practice size).
    const doc: PatternDoc = { units: 'mm', name: 'Banner', pieces: [piece('LONG', rectangle(2000, 100))], seams: [], warnings: [] };
    const created = await request(ctx.app).post(base()).set('Cookie', fx.people.editor.cookie).send({ pattern: doc, formats: ['pdf', 'dxf'] });
    expect(created.status).toBe(202);
    const id = created.body.printSet.id;
    const failed = await waitFinished(id, fx.people.editor.cookie);
    expect(failed.status).toBe('failed');
    expect(failed.error).toMatch(/^piece LONG \(2000\.0×100\.0 mm\) does not fit on any 6 mm stock sheet/);
    expect(failed.files).toEqual([]);
    expect(readdirSync(filesDir).includes('print-sets') ? readdirSync(path.join(filesDir, 'print-sets')) : []).not.toContain(id);
    const file = await request(ctx.app).get(`${base()}/${id}/files/print-set.pdf`).set('Cookie', fx.people.editor.cookie);
    expect(file.status).toBe(404);
    expect(file.body.error.message).toBe('The print set has no file "print-set.pdf" (it has no files)');
  });

  it("lays the print set out on the shop's own stock sheets, the same stock its sheet plans use", async () => {
    // The 2000 mm banner that fits no default sheet (test above) fits the shop's 2500×200 mm 6 mm strip stock.
    const stock = await request(ctx.app)
      .put(`/api/shops/${fx.shopId}/stock`)
      .set('Cookie', fx.people.editor.cookie)
      .send({ sheets: [{ thicknessMm: 6, name: '6 mm strip', widthMm: 2500, heightMm: 200, price: 4, currency: 'EUR' }] });
    expect(stock.status).toBe(200);
    try {
      const doc: PatternDoc = { units: 'mm', name: 'Banner', pieces: [piece('LONG', rectangle(2000, 100))], seams: [], warnings: [] };
      const created = await request(ctx.app).post(base()).set('Cookie', fx.people.editor.cookie).send({ pattern: doc, formats: ['svg'] });
      const done = await waitFinished(created.body.printSet.id, fx.people.editor.cookie);
      expect(done.status).toBe('done');
      const planFile = done.files.find((f) => f.name === 'sheet-plan.json')!;
      const planRes = await request(ctx.app).get(planFile.url).set('Cookie', fx.people.editor.cookie).buffer(true).parse(binary);
      const plan = JSON.parse((planRes.body as Buffer).toString('utf8')) as { sheets: Array<{ widthMm: number; heightMm: number; pricePerSheet: number }> };
      expect(plan.sheets).toHaveLength(1);
      expect(plan.sheets[0]).toMatchObject({ widthMm: 2500, heightMm: 200, pricePerSheet: 4 });
    } finally {
      await request(ctx.app).put(`/api/shops/${fx.shopId}/stock`).set('Cookie', fx.people.editor.cookie).send({ sheets: [] });
    }
  });

  it('lists a build’s print sets newest first and records the creation in the audit trail', async () => {
    const doc: PatternDoc = { units: 'mm', pieces: [piece('S', rectangle(50, 50))], seams: [], warnings: [] };
    const other = await insertBuild(ctx.db, fx.shopId, 'Ember bracers');
    const url = `/api/shops/${fx.shopId}/builds/${other}/print-sets`;
    const a = await request(ctx.app).post(url).set('Cookie', fx.people.owner.cookie).send({ pattern: doc, formats: ['svg'] });
    const b = await request(ctx.app).post(url).set('Cookie', fx.people.owner.cookie).send({ pattern: doc, formats: ['dxf'], mode: 'stock-sheet', page: 'a3' });
    expect([a.status, b.status]).toEqual([202, 202]);
    // Without a name in the pattern the print set takes the build's name.
    expect(a.body.printSet.name).toBe('Ember bracers');
    const list = await request(ctx.app).get(url).set('Cookie', fx.people.viewer.cookie);
    expect(list.status).toBe(200);
    expect(list.body.printSets.map((p: { id: string }) => p.id)).toEqual([b.body.printSet.id, a.body.printSet.id]);
    expect(list.body.printSets[0]).toMatchObject({ mode: 'stock-sheet', page: 'a3', formats: ['dxf'] });
    expect(JSON.stringify(list.body)).not.toContain('outline');

    const audit = await request(ctx.app).get(`/api/shops/${fx.shopId}/audit`).set('Cookie', fx.people.owner.cookie);
    const entry = audit.body.entries.find((e: { target: string }) => e.target === `print-set:${b.body.printSet.id}`);
    expect(entry).toMatchObject({ action: 'print-set.create', detail: { build: 'Ember bracers', formats: ['dxf'], page: 'a3', mode: 'stock-sheet', pieces: 1 }, user: { id: fx.people.owner.id } });
    expect((await waitFinished(b.body.printSet.id, fx.people.owner.cookie, url)).status).toBe('done');
  });

  it('answers 404 for an unknown build, a print set of another build, and a file not in the print set', async () => {
    const doc: PatternDoc = { units: 'mm', pieces: [piece('S', rectangle(50, 50))], seams: [], warnings: [] };
    const ghost = '0b6c3d2e-5f41-4a7b-8c9d-0e1f2a3b4c5d';
    const noBuild = await request(ctx.app).post(`/api/shops/${fx.shopId}/builds/${ghost}/print-sets`).set('Cookie', fx.people.owner.cookie).send({ pattern: doc, formats: ['svg'] });
    expect(noBuild.status).toBe(404);
    expect(noBuild.body.error.message).toBe('Build was not found');
    const foreignBuild = await insertBuild(ctx.db, fx.otherShopId, 'Not yours');
    const foreign = await request(ctx.app).get(`/api/shops/${fx.shopId}/builds/${foreignBuild}/print-sets`).set('Cookie', fx.people.owner.cookie);
    expect(foreign.status).toBe(404);

    const made = await request(ctx.app).post(base()).set('Cookie', fx.people.owner.cookie).send({ pattern: doc, formats: ['svg'] });
    const id = made.body.printSet.id;
    const otherBuild = await insertBuild(ctx.db, fx.shopId, 'Sibling build');
    expect((await request(ctx.app).get(`/api/shops/${fx.shopId}/builds/${otherBuild}/print-sets/${id}`).set('Cookie', fx.people.owner.cookie)).status).toBe(404);
    const done = await waitFinished(id, fx.people.owner.cookie);
    expect(done.status).toBe('done');
    const missing = await request(ctx.app).get(`${base()}/${id}/files/pattern.dxf`).set('Cookie', fx.people.owner.cookie);
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toBe('The print set has no file "pattern.dxf" (it has sheet-plan.json, pattern.svg)');
    const traversal = await request(ctx.app).get(`${base()}/${id}/files/..%2F..%2Fsession-secret`).set('Cookie', fx.people.owner.cookie);
    expect(traversal.status).toBe(400);
    expect(Object.keys(traversal.body.error.fields)).toEqual(['fileName']);
  });

  it('lets a granted viewer read and download but not create', async () => {
    const doc: PatternDoc = { units: 'mm', pieces: [piece('S', rectangle(50, 50))], seams: [], warnings: [] };
    const res = await request(ctx.app).post(base()).set('Cookie', fx.people.viewer.cookie).send({ pattern: doc, formats: ['svg'] });
    expect(res.status).toBe(403);
    expect(res.body.error.message).toBe('Your role in this shop (viewer) does not allow this; it needs editor');
    expect((await request(ctx.app).get(base()).set('Cookie', fx.people.viewer.cookie)).status).toBe(200);
  });

  it('refuses a viewer the owner has not granted print sets, and lets them in once granted', async () => {
    await grantPrintSets(ctx.db, fx.shopId, fx.people.viewer.id, false);
    try {
      const refused = await request(ctx.app).get(base()).set('Cookie', fx.people.viewer.cookie);
      expect(refused.status).toBe(403);
      expect(refused.body.error).toEqual({ code: 'FORBIDDEN', message: 'The shop owner has not shared print sets with you; ask them to allow it in the members list' });
    } finally {
      await grantPrintSets(ctx.db, fx.shopId, fx.people.viewer.id);
    }
    expect((await request(ctx.app).get(base()).set('Cookie', fx.people.viewer.cookie)).status).toBe(200);
  });
});
