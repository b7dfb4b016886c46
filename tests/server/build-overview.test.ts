/**
 * API tests for the builds list summary and GET /builds/:buildId/overview: newest sculpt, pieces of the newest
 * finished pattern, bench checklist totals, sheet plans, print sets (hidden from a viewer without the grant)
 * and members. Rows are made directly in the database, the way the sculpt, pattern and sheet-plan jobs leave
 * them (db/schema-sculpts.ts, db/schema-bench.ts); expected figures follow from the definitions in
 * server/builds/build-progress.ts and geometry/layout/plan-sheets.ts (usedPct per sheet, area-weighted).
 */
import { and, eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { buildPieces, sheetPlans } from '../../db/schema-bench';
import { memberships, printSets } from '../../db/schema-core';
import { patterns, seamSets, sculpts } from '../../db/schema-sculpts';
import { helmetLikeDoc } from '../fixtures/pattern-docs/shape-docs';
import { insertBuild, makeShopFixture, makeTestApp, type ShopFixture, type TestContext } from './helpers';

let ctx: TestContext;
let fx: ShopFixture;
beforeAll(async () => {
  ctx = await makeTestApp();
  fx = await makeShopFixture(ctx);
});
afterAll(async () => {
  await ctx.close();
});

async function addSculpt(buildId: string, version: number, status: 'queued' | 'running' | 'done' | 'failed', progress = 100) {
  const [row] = await ctx.db
    .insert(sculpts)
    .values({
      shopId: fx.shopId,
      buildId,
      version,
      fileName: `helm-v${version}.obj`,
      format: 'obj',
      sourceKey: `sculpts/x/source.obj`,
      sourceBytes: 1000,
      units: 'mm',
      targetTriangles: 50000,
      status,
      progress,
    })
    .returning({ id: sculpts.id });
  return row.id;
}

describe('builds list summary', () => {
  it('gives each build its stage, newest sculpt version, piece count and bench progress', async () => {
    const cookie = fx.people.viewer.cookie;
    const empty = await insertBuild(ctx.db, fx.shopId, 'Summary: nothing yet');
    const processing = await insertBuild(ctx.db, fx.shopId, 'Summary: processing');
    await addSculpt(processing, 1, 'done');
    await addSculpt(processing, 2, 'running', 40);
    const bench = await insertBuild(ctx.db, fx.shopId, 'Summary: at the bench');
    const sculptId = await addSculpt(bench, 1, 'done');
    const doc = helmetLikeDoc();
    await ctx.db.insert(patterns).values({ shopId: fx.shopId, buildId: bench, sculptId, seamRevision: 1, status: 'done', progress: 100, doc });
    const labels = doc.pieces.map((p) => p.label);
    // First piece fully done, second only cut, plus a row for a label no longer in the pattern.
    await ctx.db.insert(buildPieces).values([
      { buildId: bench, shopId: fx.shopId, label: labels[0], cut: true, shaped: true, glued: true },
      { buildId: bench, shopId: fx.shopId, label: labels[1], cut: true },
      { buildId: bench, shopId: fx.shopId, label: 'ZZ-gone', cut: true, shaped: true, glued: true },
    ]);

    const res = await request(ctx.app).get(`/api/shops/${fx.shopId}/builds`).set('Cookie', cookie);
    expect(res.status).toBe(200);
    const by = new Map<string, { summary: Record<string, unknown> }>(res.body.builds.map((b: { id: string }) => [b.id, b]));
    expect(by.get(empty)!.summary).toEqual({
      stage: 'no-sculpt', sculptVersion: null, sculptStatus: null, sculptProgress: null, patternStatus: null, pieceCount: 0, progressPct: 0,
    });
    // The newest version (2) decides, even though version 1 finished.
    expect(by.get(processing)!.summary).toMatchObject({ stage: 'processing', sculptVersion: 2, sculptStatus: 'running', sculptProgress: 40, pieceCount: 0 });
    // 4 ticks of 3 × pieces possible, rounded down; the stale row does not count.
    const expectedPct = Math.floor((4 * 100) / (3 * labels.length));
    expect(by.get(bench)!.summary).toMatchObject({ stage: 'at-the-bench', sculptVersion: 1, patternStatus: 'done', pieceCount: labels.length, progressPct: expectedPct });
  });
});

describe('build overview', () => {
  it('shows pieces with over-budget flags, checklist totals, sheet plans, print sets and members', async () => {
    const buildId = await insertBuild(ctx.db, fx.shopId, 'Overview: helm');
    const sculptId = await addSculpt(buildId, 1, 'done');
    await ctx.db.insert(seamSets).values({ sculptId, shopId: fx.shopId, revision: 2, stretchBudgetPct: 3 });
    const doc = helmetLikeDoc();
    doc.pieces[0].stretch = { maxPct: 4.5, rmsPct: 1 };
    doc.pieces[1].stretch = { maxPct: 2.5, rmsPct: 1 };
    const [done] = await ctx.db
      .insert(patterns)
      .values({ shopId: fx.shopId, buildId, sculptId, seamRevision: 1, status: 'done', progress: 100, doc, createdAt: new Date(Date.now() - 60_000) })
      .returning({ id: patterns.id });
    // A newer pattern is being flattened: its status shows, the finished one's pieces stay listed.
    await ctx.db.insert(patterns).values({ shopId: fx.shopId, buildId, sculptId, seamRevision: 2, status: 'running', progress: 30, stage: 'flattening' });
    await ctx.db.insert(sheetPlans).values({
      shopId: fx.shopId,
      buildId,
      patternId: done.id,
      status: 'done',
      // Two sheets: 1000 × 500 mm at 50 % and 500 × 500 mm at 80 % → (250 000 + 200 000) / 750 000 = 60 %.
      plan: { sheets: [{ widthMm: 1000, heightMm: 500, usedPct: 50 }, { widthMm: 500, heightMm: 500, usedPct: 80 }], totalCost: 17.5 },
    });
    await ctx.db.insert(printSets).values({
      shopId: fx.shopId, buildId, name: 'Helm A4', status: 'done', formats: ['pdf'], page: 'a4', mode: 'tiled', pieceCount: doc.pieces.length, pattern: doc,
      files: [{ name: 'pattern.pdf', sizeBytes: 1234, contentType: 'application/pdf' }],
    });
    await ctx.db.insert(buildPieces).values({ buildId, shopId: fx.shopId, label: doc.pieces[0].label, cut: true, shaped: true });

    const url = `/api/shops/${fx.shopId}/builds/${buildId}/overview`;
    const res = await request(ctx.app).get(url).set('Cookie', fx.people.editor.cookie);
    expect(res.status).toBe(200);
    const o = res.body.overview;
    expect(o.stage).toBe('flattening');
    expect(o.pattern).toMatchObject({ status: 'running', progress: 30, stage: 'flattening' });
    expect(o.pieces.map((p: { label: string }) => p.label)).toEqual(doc.pieces.map((p) => p.label));
    expect(o.pieces[0]).toMatchObject({ maxStretchPct: 4.5, overBudget: true });
    expect(o.pieces[1]).toMatchObject({ maxStretchPct: 2.5, overBudget: false });
    expect(o.seamCount).toBe(doc.seams.length);
    expect(o.stretchBudgetPct).toBe(3);
    expect(o.bench).toMatchObject({ pieces: doc.pieces.length, cut: 1, shaped: 1, glued: 0, stale: 0 });
    expect(o.sheetPlans).toHaveLength(1);
    expect(o.sheetPlans[0].sheets).toBe(2);
    expect(o.sheetPlans[0].usedPct).toBeCloseTo(60, 9);
    expect(o.sheetPlans[0].totalCost).toBe(17.5);
    expect(o.printSets).toHaveLength(1);
    expect(o.printSets[0]).toMatchObject({ name: 'Helm A4', status: 'done', files: [{ name: 'pattern.pdf', sizeBytes: 1234 }] });
    expect(o.printSets[0]).not.toHaveProperty('pattern');
    const roles = new Map(o.members.map((m: { userId: string; role: string }) => [m.userId, m.role]));
    expect(roles.get(fx.people.owner.id)).toBe('owner');
    expect(roles.get(fx.people.viewer.id)).toBe('viewer');
    expect(JSON.stringify(o.members)).not.toContain('@');

    // A viewer sees print sets only with the owner's grant (CONTRACTS.md, canSeePrintSets).
    const viewer = await request(ctx.app).get(url).set('Cookie', fx.people.viewer.cookie);
    expect(viewer.status).toBe(200);
    expect(viewer.body.overview.printSets).toBeNull();
    await ctx.db.update(memberships).set({ canSeePrintSets: true }).where(and(eq(memberships.shopId, fx.shopId), eq(memberships.userId, fx.people.viewer.id)));
    const granted = await request(ctx.app).get(url).set('Cookie', fx.people.viewer.cookie);
    expect(granted.body.overview.printSets).toHaveLength(1);
    await ctx.db.update(memberships).set({ canSeePrintSets: false }).where(and(eq(memberships.shopId, fx.shopId), eq(memberships.userId, fx.people.viewer.id)));
  });

  it('answers 404 for a build of another shop and for an unknown build, with the build named', async () => {
    const foreign = await insertBuild(ctx.db, fx.otherShopId, 'Overview: not yours');
    const cross = await request(ctx.app).get(`/api/shops/${fx.shopId}/builds/${foreign}/overview`).set('Cookie', fx.people.owner.cookie);
    expect(cross.status).toBe(404);
    expect(cross.body.error.message).toMatch(/build/i);
    const unknown = await request(ctx.app)
      .get(`/api/shops/${fx.shopId}/builds/00000000-0000-4000-8000-000000000000/overview`)
      .set('Cookie', fx.people.owner.cookie);
    expect(unknown.status).toBe(404);
  });

  it('gives an empty overview for a build with no sculpt yet', async () => {
    const buildId = await insertBuild(ctx.db, fx.shopId, 'Overview: empty');
    const res = await request(ctx.app).get(`/api/shops/${fx.shopId}/builds/${buildId}/overview`).set('Cookie', fx.people.owner.cookie);
    expect(res.status).toBe(200);
    expect(res.body.overview).toMatchObject({ stage: 'no-sculpt', pattern: null, pieces: [], seamCount: 0, sheetPlans: [], printSets: [] });
    expect(res.body.overview.bench).toEqual({ pieces: 0, cut: 0, shaped: 0, glued: 0, progressPct: 0, stale: 0 });
  });
});
