/**
 * The demo build's work: a sculpt of the demo helmet (geometry/shapes/helmet-shell.ts, our own stylised helm)
 * stored as an OBJ and processed, automatic seams, a finished pattern, piece rows with some ticks and a note,
 * the shop's stock for 2, 4, 6 and 10 mm foam, and a finished sheet plan. Everything runs through the same
 * functions the workers call (processSculpt, runPatternJob, runSheetPlanJob), synchronously, so no worker is
 * needed at seed time.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { seamMaskLines } from '../components/studio/seam-mask-lines';
import { decodeWorkingMesh } from '../geometry/io/working-mesh';
import { DEFAULT_STOCK_SHEETS } from '../geometry/layout/stock-sheets';
import { buildTwins } from '../geometry/mesh/half-edges';
import type { TriMesh } from '../geometry/mesh/tri-mesh';
import { autoSeams } from '../geometry/seams/auto-seams';
import { helmetShell } from '../geometry/shapes';
import { runPatternJob } from '../server/patterns/pattern-job';
import { patternSettingsFrom } from '../server/patterns/pattern-settings';
import { insertPattern } from '../server/patterns/queries';
import { readStoredBytes } from '../server/storage/read-stored-bytes';
import { upsertPiece, insertNote } from '../server/pieces/queries';
import { processSculpt } from '../server/sculpts/process-sculpt';
import { sculptMeshKey, sculptSourceKey } from '../server/sculpts/sculpt-files';
import { insertSheetPlan } from '../server/sheet-plans/queries';
import { runSheetPlanJob } from '../server/sheet-plans/sheet-plan-job';
import type { FileStore } from '../server/storage/file-store';
import type { Db } from './client';
import { patterns, sculpts, seamSets, type SeamLine } from './schema-sculpts';
import { stockSheets } from './schema-bench';

/** Stretch budget of the demo seams, percent (the engine's default). */
const DEMO_BUDGET_PCT = 3;

/** Returns the mesh as OBJ text (1-based `v` and `f` lines, millimetres), as a maker's export would be. */
export function meshToObj(mesh: TriMesh, name: string): string {
  const lines = [`# ${name}: demo sculpt made by Sheetsmith's seed (millimetres)`, `o ${name.replace(/\s+/g, '_')}`];
  for (let v = 0; v < mesh.positions.length / 3; v++) {
    lines.push(`v ${mesh.positions[3 * v].toFixed(4)} ${mesh.positions[3 * v + 1].toFixed(4)} ${mesh.positions[3 * v + 2].toFixed(4)}`);
  }
  for (let f = 0; f < mesh.triangles.length / 3; f++) {
    lines.push(`f ${mesh.triangles[3 * f] + 1} ${mesh.triangles[3 * f + 1] + 1} ${mesh.triangles[3 * f + 2] + 1}`);
  }
  return `${lines.join('\n')}\n`;
}

/**
 * Fills the demo build `buildId` of shop `shopId`: sculpt, seams, pattern, piece ticks and a note, stock, sheet
 * plan. `ownerId` and `crewId` are the demo owner and crew member. Throws when a step fails (a failed sculpt or
 * pattern is a bug in the demo, not something to hide).
 */
export async function seedDemoBuild(db: Db, files: FileStore, ids: { shopId: string; buildId: string; ownerId: string; crewId: string }): Promise<void> {
  const { shopId, buildId, ownerId, crewId } = ids;
  const obj = new TextEncoder().encode(meshToObj(helmetShell(), 'Beetle knight helmet'));
  const sculptId = randomUUID();
  const sourceKey = sculptSourceKey(sculptId, 'obj');
  await files.put(sourceKey, obj);
  await db.insert(sculpts).values({
    id: sculptId, shopId, buildId, version: 1, fileName: 'beetle-knight-helmet.obj', format: 'obj', sourceKey,
    sourceBytes: obj.byteLength, units: 'mm', scale: 1, targetTriangles: 100_000, createdBy: ownerId,
  });
  await processSculpt({ db, files }, sculptId);
  const [sculpt] = await db.select({ status: sculpts.status, error: sculpts.error }).from(sculpts).where(eq(sculpts.id, sculptId));
  if (sculpt.status !== 'done') throw new Error(`the demo sculpt did not process: ${sculpt.error ?? sculpt.status}`);

  const bytes = await readStoredBytes(files, sculptMeshKey(sculptId));
  if (!bytes) throw new Error('the demo working mesh is missing from the file store');
  const working = decodeWorkingMesh(bytes);
  const mesh = { positions: Float64Array.from(working.positions), triangles: working.triangles };
  const twin = buildTwins(mesh.triangles, mesh.positions.length / 3);
  const mask = autoSeams(mesh, twin, { stretchBudgetPct: DEMO_BUDGET_PCT, symmetric: true });
  const seams: SeamLine[] = seamMaskLines(mask, mesh.triangles, twin).map((path, i) => ({
    id: `auto-${i + 1}`,
    picks: [path[0], path[path.length - 1]],
    path,
    source: 'auto',
  }));
  await db.insert(seamSets).values({ sculptId, shopId, revision: 1, seams, stretchBudgetPct: DEMO_BUDGET_PCT, updatedBy: ownerId });

  const pattern = await insertPattern(db, { shopId, buildId, sculptId, seamRevision: 1, settings: patternSettingsFrom(DEMO_BUDGET_PCT, []) });
  await runPatternJob({ db, files }, { patternId: pattern.id });
  const [made] = await db.select({ status: patterns.status, error: patterns.error, doc: patterns.doc }).from(patterns).where(eq(patterns.id, pattern.id));
  if (made.status !== 'done' || !made.doc) throw new Error(`the demo pattern was not made: ${made.error ?? made.status}`);

  // The crew has cut the first three pieces and shaped the first; the owner left a note on the first.
  const labels = made.doc.pieces.map((p) => p.label);
  for (const [i, label] of labels.slice(0, 3).entries()) {
    await upsertPiece(db, { shopId, buildId, label }, { cut: true, shaped: i === 0 }, crewId);
  }
  await insertNote(db, { shopId, buildId, label: labels[0], body: 'Crown piece: heat-form the dome before gluing the side seams.', authorId: ownerId });

  await db.insert(stockSheets).values(
    DEFAULT_STOCK_SHEETS.map((s) => ({
      shopId,
      thicknessMm: s.thicknessMm,
      name: `${s.thicknessMm} mm ${s.note.split(' (')[0]}`,
      widthMm: s.widthMm,
      heightMm: s.heightMm,
      price: s.pricePerSheet,
      currency: 'EUR',
    })),
  );
  const plan = await insertSheetPlan(db, { shopId, buildId, patternId: pattern.id, options: { gapMm: 3, sparesPct: 10, sparesFor: 'repeated' }, createdBy: ownerId });
  await runSheetPlanJob({ db, files }, { sheetPlanId: plan.id });
}
