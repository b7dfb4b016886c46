/**
 * Drizzle queries for patterns, their sculpt and seams, and the build's piece settings. Reads are scoped to a
 * shop and build so one shop's id never reaches another's pattern.
 */
import { and, desc, eq, gt, inArray, ne, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { buildPieces } from '../../db/schema-bench';
import { patterns, sculpts } from '../../db/schema-sculpts';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import type { PatternSettings } from './pattern-settings';

export const patternColumns = {
  id: patterns.id,
  shopId: patterns.shopId,
  buildId: patterns.buildId,
  sculptId: patterns.sculptId,
  seamRevision: patterns.seamRevision,
  settings: patterns.settings,
  status: patterns.status,
  progress: patterns.progress,
  stage: patterns.stage,
  error: patterns.error,
  doc: patterns.doc,
  facesKey: patterns.facesKey,
  createdAt: patterns.createdAt,
  finishedAt: patterns.finishedAt,
};

export type PatternRow = {
  id: string;
  shopId: string;
  buildId: string;
  sculptId: string;
  seamRevision: number;
  settings: Record<string, unknown>;
  status: 'queued' | 'running' | 'done' | 'failed';
  progress: number;
  stage: string | null;
  error: string | null;
  doc: PatternDoc | null;
  facesKey: string | null;
  createdAt: Date;
  finishedAt: Date | null;
};

/** The sculpt a pattern is made from: its build, processing status and working-mesh key; null when absent. */
export async function selectSculptForPattern(db: DbExecutor, shopId: string, buildId: string, sculptId: string) {
  const rows = await db
    .select({ id: sculpts.id, status: sculpts.status, meshKey: sculpts.meshKey, version: sculpts.version })
    .from(sculpts)
    .where(and(eq(sculpts.shopId, shopId), eq(sculpts.buildId, buildId), eq(sculpts.id, sculptId)));
  return rows[0] ?? null;
}

/** The build's newest sculpt version (any status), or null when none was uploaded. */
export async function selectNewestSculpt(db: DbExecutor, shopId: string, buildId: string) {
  const rows = await db
    .select({ id: sculpts.id, status: sculpts.status, meshKey: sculpts.meshKey, version: sculpts.version })
    .from(sculpts)
    .where(and(eq(sculpts.shopId, shopId), eq(sculpts.buildId, buildId)))
    .orderBy(desc(sculpts.version))
    .limit(1);
  return rows[0] ?? null;
}

/** The maker's piece settings of a build (only the rows, unset fields null). */
export function selectPieceSettingRows(db: DbExecutor, buildId: string) {
  return db
    .select({ label: buildPieces.label, thicknessMm: buildPieces.thicknessMm, surface: buildPieces.surface, quantity: buildPieces.quantity, mirrored: buildPieces.mirrored })
    .from(buildPieces)
    .where(eq(buildPieces.buildId, buildId));
}

/** Inserts a queued pattern and returns it. */
export async function insertPattern(
  db: DbExecutor,
  row: { shopId: string; buildId: string; sculptId: string; seamRevision: number; settings: PatternSettings },
): Promise<PatternRow> {
  const rows = await db
    .insert(patterns)
    .values({ ...row, settings: row.settings as unknown as Record<string, unknown> })
    .returning(patternColumns);
  return rows[0];
}

/** Records the queue's job id on a pattern. */
export async function setPatternJobId(db: DbExecutor, id: string, jobId: string): Promise<void> {
  await db.update(patterns).set({ jobId }).where(eq(patterns.id, id));
}

/** Marks a pattern failed with a message for the maker and returns nothing. */
export async function markPatternFailed(db: DbExecutor, id: string, error: string): Promise<void> {
  await db.update(patterns).set({ status: 'failed', error, stage: null, finishedAt: sql`now()` }).where(eq(patterns.id, id));
}

/** Marks a queued (or, after a worker crash, running) pattern as running and returns it; null when gone or finished. */
export async function claimPattern(db: DbExecutor, id: string): Promise<PatternRow | null> {
  const rows = await db
    .update(patterns)
    .set({ status: 'running', progress: 1, stage: 'loading', error: null })
    .where(and(eq(patterns.id, id), inArray(patterns.status, ['queued', 'running'])))
    .returning(patternColumns);
  return rows[0] ?? null;
}

/**
 * Whether a pattern of the same sculpt was queued after `row` (a newer seam or settings save). Compared in SQL,
 * since the database keeps microseconds and a JavaScript Date only milliseconds.
 */
export async function hasNewerPattern(db: DbExecutor, row: { id: string; sculptId: string }): Promise<boolean> {
  const rows = await db
    .select({ id: patterns.id })
    .from(patterns)
    .where(
      and(
        eq(patterns.sculptId, row.sculptId),
        ne(patterns.id, row.id),
        gt(patterns.createdAt, sql`(SELECT p.created_at FROM patterns p WHERE p.id = ${row.id})`),
      ),
    )
    .limit(1);
  return rows.length > 0;
}

/** Stores a running pattern's progress (0–100) and stage word. */
export async function setPatternProgress(db: DbExecutor, id: string, progress: number, stage: string): Promise<void> {
  await db
    .update(patterns)
    .set({ progress, stage })
    .where(and(eq(patterns.id, id), eq(patterns.status, 'running')));
}

/** Marks a running pattern done with its document and faces file; false when it is gone or no longer running. */
export async function markPatternDone(db: DbExecutor, id: string, result: { doc: PatternDoc; facesKey: string; seamRevision: number }): Promise<boolean> {
  const rows = await db
    .update(patterns)
    .set({ status: 'done', progress: 100, stage: null, error: null, doc: result.doc, facesKey: result.facesKey, seamRevision: result.seamRevision, finishedAt: sql`now()` })
    .where(and(eq(patterns.id, id), eq(patterns.status, 'running')))
    .returning({ id: patterns.id });
  return rows.length > 0;
}

/** One pattern of the shop's build, or null. */
export async function selectPattern(db: DbExecutor, shopId: string, buildId: string, id: string): Promise<PatternRow | null> {
  const rows = await db
    .select(patternColumns)
    .from(patterns)
    .where(and(eq(patterns.shopId, shopId), eq(patterns.buildId, buildId), eq(patterns.id, id)));
  return rows[0] ?? null;
}

/** The newest pattern of one sculpt, or null. */
export async function selectNewestPatternOfSculpt(db: DbExecutor, sculptId: string): Promise<PatternRow | null> {
  const rows = await db
    .select(patternColumns)
    .from(patterns)
    .where(eq(patterns.sculptId, sculptId))
    .orderBy(desc(patterns.createdAt), desc(patterns.id))
    .limit(1);
  return rows[0] ?? null;
}

/** The build's newest finished pattern (of any sculpt version, newest version first), or null. */
export async function selectNewestDonePattern(db: DbExecutor, shopId: string, buildId: string): Promise<PatternRow | null> {
  const rows = await db
    .select(patternColumns)
    .from(patterns)
    .innerJoin(sculpts, eq(sculpts.id, patterns.sculptId))
    .where(and(eq(patterns.shopId, shopId), eq(patterns.buildId, buildId), eq(patterns.status, 'done')))
    .orderBy(desc(sculpts.version), desc(patterns.createdAt), desc(patterns.id))
    .limit(1);
  return rows[0] ?? null;
}
