/** Drizzle queries for sculpt versions and their seam sets; reads are scoped to a shop and build. */
import { and, desc, eq, inArray, lt, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { builds } from '../../db/schema-core';
import { seamSets, sculpts, type ModelUnits, type SculptReport, type SeamLine, type SymmetryPlane, type WearerMeasure } from '../../db/schema-sculpts';

export type SculptRow = typeof sculpts.$inferSelect;
export type SeamSetRow = typeof seamSets.$inferSelect;

/** Locks the build row (so two uploads number their versions one after the other) and returns whether it exists. */
export async function lockBuild(db: DbExecutor, shopId: string, buildId: string): Promise<boolean> {
  const rows = await db
    .select({ id: builds.id })
    .from(builds)
    .where(and(eq(builds.shopId, shopId), eq(builds.id, buildId)))
    .for('update');
  return rows.length > 0;
}

/** Returns the highest sculpt version of the build, 0 when it has none. */
export async function selectMaxVersion(db: DbExecutor, buildId: string): Promise<number> {
  const [row] = await db.select({ v: sql<number>`coalesce(max(${sculpts.version}), 0)::int` }).from(sculpts).where(eq(sculpts.buildId, buildId));
  return row?.v ?? 0;
}

export interface NewSculpt {
  id: string;
  shopId: string;
  buildId: string;
  version: number;
  fileName: string;
  format: string;
  sourceKey: string;
  sourceBytes: number;
  units: ModelUnits;
  scale: number;
  wearer: WearerMeasure | null;
  targetTriangles: number;
  createdBy: string;
}

/** Inserts a queued sculpt version and returns it. */
export async function insertSculpt(db: DbExecutor, row: NewSculpt): Promise<SculptRow> {
  const [inserted] = await db.insert(sculpts).values(row).returning();
  return inserted;
}

/** Returns the build's sculpt versions, newest first. */
export function selectSculpts(db: DbExecutor, shopId: string, buildId: string): Promise<SculptRow[]> {
  return db
    .select()
    .from(sculpts)
    .where(and(eq(sculpts.shopId, shopId), eq(sculpts.buildId, buildId)))
    .orderBy(desc(sculpts.version));
}

/** Returns one sculpt version of the shop's build, or null. */
export async function selectSculpt(db: DbExecutor, shopId: string, buildId: string, sculptId: string): Promise<SculptRow | null> {
  const rows = await db
    .select()
    .from(sculpts)
    .where(and(eq(sculpts.shopId, shopId), eq(sculpts.buildId, buildId), eq(sculpts.id, sculptId)));
  return rows[0] ?? null;
}

/** Returns a sculpt by id alone (the worker's view), or null. */
export async function selectSculptById(db: DbExecutor, sculptId: string): Promise<SculptRow | null> {
  const rows = await db.select().from(sculpts).where(eq(sculpts.id, sculptId));
  return rows[0] ?? null;
}

/** Returns the newest finished version of the build older than `version`, or null. */
export async function selectPreviousDoneSculpt(db: DbExecutor, buildId: string, version: number): Promise<SculptRow | null> {
  const rows = await db
    .select()
    .from(sculpts)
    .where(and(eq(sculpts.buildId, buildId), lt(sculpts.version, version), eq(sculpts.status, 'done')))
    .orderBy(desc(sculpts.version))
    .limit(1);
  return rows[0] ?? null;
}

/** Records the queue's job id on a sculpt. */
export async function setSculptJobId(db: DbExecutor, id: string, jobId: string): Promise<void> {
  await db.update(sculpts).set({ jobId }).where(eq(sculpts.id, id));
}

/** Marks a sculpt failed with `error` (a sentence for the maker). */
export async function markSculptFailed(db: DbExecutor, id: string, error: string): Promise<void> {
  await db.update(sculpts).set({ status: 'failed', error, finishedAt: sql`now()` }).where(eq(sculpts.id, id));
}

/**
 * Claims a sculpt for processing: queued or running (a retried job), or failed with `retryableError` (the
 * server error a previous attempt recorded before the queue retried it). Returns the row, or null when the
 * sculpt is gone, done, or failed for a reason a retry would not change.
 */
export async function claimSculpt(db: DbExecutor, id: string, retryableError: string): Promise<SculptRow | null> {
  const rows = await db
    .update(sculpts)
    .set({ status: 'running', startedAt: sql`now()`, finishedAt: null, error: null, progress: 0, stage: 'reading' })
    .where(
      and(
        eq(sculpts.id, id),
        sql`(${sculpts.status} in ('queued', 'running') or (${sculpts.status} = 'failed' and ${sculpts.error} = ${retryableError}))`,
      ),
    )
    .returning();
  return rows[0] ?? null;
}

/** Records progress (0–100) and the stage word on a running sculpt. */
export async function setSculptProgress(db: DbExecutor, id: string, progress: number, stage: string): Promise<void> {
  await db
    .update(sculpts)
    .set({ progress, stage })
    .where(and(eq(sculpts.id, id), eq(sculpts.status, 'running')));
}

/** Marks a running sculpt done with its report, working-mesh key and the scale used; false when it was not running. */
export async function markSculptDone(db: DbExecutor, id: string, done: { report: SculptReport; meshKey: string; scale: number }): Promise<boolean> {
  const rows = await db
    .update(sculpts)
    .set({ status: 'done', progress: 100, stage: 'done', error: null, report: done.report, meshKey: done.meshKey, scale: done.scale, finishedAt: sql`now()` })
    .where(and(eq(sculpts.id, id), eq(sculpts.status, 'running')))
    .returning({ id: sculpts.id });
  return rows.length > 0;
}

/** Stores new units, scale and wearer on a sculpt and queues it again; returns the row, or null when absent. */
export async function requeueSculpt(
  db: DbExecutor,
  shopId: string,
  buildId: string,
  sculptId: string,
  settings: { units: ModelUnits; scale: number; wearer: WearerMeasure | null },
): Promise<SculptRow | null> {
  const rows = await db
    .update(sculpts)
    .set({ ...settings, status: 'queued', progress: 0, stage: null, error: null, startedAt: null, finishedAt: null, jobId: null })
    .where(and(eq(sculpts.shopId, shopId), eq(sculpts.buildId, buildId), eq(sculpts.id, sculptId), inArray(sculpts.status, ['done', 'failed'])))
    .returning();
  return rows[0] ?? null;
}

/** Returns a sculpt's seam set, or null when nothing was ever saved or carried. */
export async function selectSeamSet(db: DbExecutor, sculptId: string): Promise<SeamSetRow | null> {
  const rows = await db.select().from(seamSets).where(eq(seamSets.sculptId, sculptId));
  return rows[0] ?? null;
}

export interface SeamSetWrite {
  seams: SeamLine[];
  symmetry: SymmetryPlane | null;
  stretchBudgetPct: number;
  updatedBy: string | null;
}

/**
 * Saves seams as revision `baseRevision + 1` when the stored revision is still `baseRevision` (a missing set
 * counts as revision 0). Returns the saved row, or null when someone saved in between.
 */
export async function saveSeamSet(db: DbExecutor, shopId: string, sculptId: string, baseRevision: number, write: SeamSetWrite): Promise<SeamSetRow | null> {
  const updated = await db
    .update(seamSets)
    .set({ ...write, revision: baseRevision + 1, updatedAt: sql`now()` })
    .where(and(eq(seamSets.sculptId, sculptId), eq(seamSets.revision, baseRevision)))
    .returning();
  if (updated[0]) return updated[0];
  if (baseRevision !== 0) return null;
  const inserted = await db
    .insert(seamSets)
    .values({ sculptId, shopId, ...write, revision: 1 })
    .onConflictDoNothing()
    .returning();
  return inserted[0] ?? null;
}

/** Replaces a sculpt's seams whatever their revision (the processing job's carry-over), raising the revision. */
export async function replaceSeamSet(db: DbExecutor, shopId: string, sculptId: string, write: SeamSetWrite): Promise<void> {
  await db
    .insert(seamSets)
    .values({ sculptId, shopId, ...write, revision: 1 })
    .onConflictDoUpdate({
      target: seamSets.sculptId,
      set: { seams: write.seams, symmetry: write.symmetry, stretchBudgetPct: write.stretchBudgetPct, updatedBy: write.updatedBy, revision: sql`${seamSets.revision} + 1`, updatedAt: sql`now()` },
    });
}

/** Marks failed, with `error`, every sculpt still running that started more than `minutes` ago; returns their ids. */
export async function failSculptsRunningLongerThan(db: DbExecutor, minutes: number, error: string): Promise<string[]> {
  const rows = await db
    .update(sculpts)
    .set({ status: 'failed', error, finishedAt: sql`now()` })
    .where(and(eq(sculpts.status, 'running'), lt(sculpts.startedAt, sql`now() - make_interval(mins => ${minutes})`)))
    .returning({ id: sculpts.id });
  return rows.map((r) => r.id);
}
