/** Drizzle queries for builds; every query is scoped to a shop so one shop's id never reaches another's build. */
import { and, desc, eq, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { buildPieces, sheetPlans } from '../../db/schema-bench';
import { builds, memberships, printSets } from '../../db/schema-core';
import { patterns, seamSets } from '../../db/schema-sculpts';

const buildColumns = { id: builds.id, shopId: builds.shopId, name: builds.name, createdAt: builds.createdAt, updatedAt: builds.updatedAt };

export type BuildRow = { id: string; shopId: string; name: string; createdAt: Date; updatedAt: Date };

/** Returns the shop's builds, newest first. */
export function selectBuilds(db: DbExecutor, shopId: string): Promise<BuildRow[]> {
  return db.select(buildColumns).from(builds).where(eq(builds.shopId, shopId)).orderBy(desc(builds.createdAt), desc(builds.id));
}

/** Returns one build of the shop, or null. */
export async function selectBuild(db: DbExecutor, shopId: string, buildId: string): Promise<BuildRow | null> {
  const rows = await db.select(buildColumns).from(builds).where(and(eq(builds.shopId, shopId), eq(builds.id, buildId)));
  return rows[0] ?? null;
}

/** Inserts a build and returns it. */
export async function insertBuild(db: DbExecutor, shopId: string, name: string): Promise<BuildRow> {
  const rows = await db.insert(builds).values({ shopId, name }).returning(buildColumns);
  return rows[0];
}

/** Renames a build of the shop and returns it (null when there is no such build). */
export async function updateBuildName(db: DbExecutor, shopId: string, buildId: string, name: string): Promise<BuildRow | null> {
  const rows = await db
    .update(builds)
    .set({ name, updatedAt: sql`now()` })
    .where(and(eq(builds.shopId, shopId), eq(builds.id, buildId)))
    .returning(buildColumns);
  return rows[0] ?? null;
}

/** Deletes a build of the shop and returns what it was (null when there was none). */
export async function deleteBuild(db: DbExecutor, shopId: string, buildId: string): Promise<BuildRow | null> {
  const rows = await db.delete(builds).where(and(eq(builds.shopId, shopId), eq(builds.id, buildId))).returning(buildColumns);
  return rows[0] ?? null;
}

/** The newest sculpt version of a build, its newest pattern and the piece labels of its newest finished pattern. */
export interface BuildWorkRow {
  buildId: string;
  sculptId: string | null;
  sculptVersion: number | null;
  sculptStatus: 'queued' | 'running' | 'done' | 'failed' | null;
  sculptProgress: number | null;
  patternId: string | null;
  patternStatus: 'queued' | 'running' | 'done' | 'failed' | null;
  patternProgress: number | null;
  /** Labels of the pieces of the newest finished pattern of that sculpt; null when none has finished. */
  pieceLabels: string[] | null;
}

/**
 * Returns, for every build of the shop (or only `buildId` when given), the newest sculpt version, that
 * version's newest pattern, and the piece labels of its newest finished pattern. One query, so the builds list
 * costs one round trip whatever its length.
 */
export async function selectBuildWork(db: DbExecutor, shopId: string, buildId?: string): Promise<BuildWorkRow[]> {
  const result = await db.execute<{
    build_id: string;
    sculpt_id: string | null;
    sculpt_version: number | null;
    sculpt_status: BuildWorkRow['sculptStatus'];
    sculpt_progress: number | null;
    pattern_id: string | null;
    pattern_status: BuildWorkRow['patternStatus'];
    pattern_progress: number | null;
    piece_labels: string[] | null;
  }>(sql`
    select b.id as build_id, s.id as sculpt_id, s.version as sculpt_version, s.status as sculpt_status,
           s.progress as sculpt_progress, p.id as pattern_id, p.status as pattern_status,
           p.progress as pattern_progress, d.labels as piece_labels
    from builds b
    left join lateral (
      select id, version, status, progress from sculpts where build_id = b.id order by version desc limit 1
    ) s on true
    left join lateral (
      select id, status, progress from patterns where sculpt_id = s.id order by created_at desc limit 1
    ) p on true
    left join lateral (
      select coalesce((select array_agg(e->>'label') from jsonb_array_elements(doc->'pieces') e), '{}') as labels
      from patterns where sculpt_id = s.id and status = 'done' and doc is not null order by created_at desc limit 1
    ) d on true
    where b.shop_id = ${shopId} ${buildId === undefined ? sql`` : sql`and b.id = ${buildId}`}
  `);
  return result.rows.map((r) => ({
    buildId: r.build_id,
    sculptId: r.sculpt_id,
    sculptVersion: r.sculpt_version,
    sculptStatus: r.sculpt_status,
    sculptProgress: r.sculpt_progress,
    patternId: r.pattern_id,
    patternStatus: r.pattern_status,
    patternProgress: r.pattern_progress,
    pieceLabels: r.piece_labels,
  }));
}

/** One piece's checklist row. */
export interface PieceTickRow {
  buildId: string;
  label: string;
  cut: boolean;
  shaped: boolean;
  glued: boolean;
}

/** Returns the checklist rows of the shop's builds (or of `buildId` only). */
export function selectPieceTicks(db: DbExecutor, shopId: string, buildId?: string): Promise<PieceTickRow[]> {
  const where = buildId === undefined ? eq(buildPieces.shopId, shopId) : and(eq(buildPieces.shopId, shopId), eq(buildPieces.buildId, buildId));
  return db
    .select({ buildId: buildPieces.buildId, label: buildPieces.label, cut: buildPieces.cut, shaped: buildPieces.shaped, glued: buildPieces.glued })
    .from(buildPieces)
    .where(where);
}

/** Returns the pattern document of pattern `patternId` with the build's stretch budget, or null. */
export async function selectPatternDoc(db: DbExecutor, shopId: string, patternId: string) {
  const rows = await db
    .select({
      id: patterns.id,
      status: patterns.status,
      progress: patterns.progress,
      stage: patterns.stage,
      error: patterns.error,
      doc: patterns.doc,
      createdAt: patterns.createdAt,
      finishedAt: patterns.finishedAt,
      stretchBudgetPct: seamSets.stretchBudgetPct,
    })
    .from(patterns)
    .leftJoin(seamSets, eq(seamSets.sculptId, patterns.sculptId))
    .where(and(eq(patterns.shopId, shopId), eq(patterns.id, patternId)));
  return rows[0] ?? null;
}

/** Returns the newest finished pattern document of sculpt `sculptId`, or null. */
export async function selectNewestDoneDoc(db: DbExecutor, shopId: string, sculptId: string) {
  const rows = await db
    .select({ id: patterns.id, doc: patterns.doc })
    .from(patterns)
    .where(and(eq(patterns.shopId, shopId), eq(patterns.sculptId, sculptId), eq(patterns.status, 'done')))
    .orderBy(desc(patterns.createdAt))
    .limit(1);
  return rows[0] ?? null;
}

/** Returns the build's newest sheet plans (at most `limit`), newest first. */
export function selectSheetPlanRows(db: DbExecutor, shopId: string, buildId: string, limit: number) {
  return db
    .select({ id: sheetPlans.id, patternId: sheetPlans.patternId, status: sheetPlans.status, error: sheetPlans.error, plan: sheetPlans.plan, createdAt: sheetPlans.createdAt })
    .from(sheetPlans)
    .where(and(eq(sheetPlans.shopId, shopId), eq(sheetPlans.buildId, buildId)))
    .orderBy(desc(sheetPlans.createdAt))
    .limit(limit);
}

/** Returns the build's newest print sets (at most `limit`) without their pattern copies, newest first. */
export function selectPrintSetSummaries(db: DbExecutor, shopId: string, buildId: string, limit: number) {
  return db
    .select({ id: printSets.id, name: printSets.name, status: printSets.status, formats: printSets.formats, page: printSets.page, files: printSets.files, error: printSets.error, createdAt: printSets.createdAt })
    .from(printSets)
    .where(and(eq(printSets.shopId, shopId), eq(printSets.buildId, buildId)))
    .orderBy(desc(printSets.createdAt))
    .limit(limit);
}

/** Returns whether member `userId` of the shop may see print sets (the grant a viewer needs), false for a non-member. */
export async function selectCanSeePrintSets(db: DbExecutor, shopId: string, userId: string): Promise<boolean> {
  const rows = await db
    .select({ can: memberships.canSeePrintSets })
    .from(memberships)
    .where(and(eq(memberships.shopId, shopId), eq(memberships.userId, userId)));
  return rows[0]?.can ?? false;
}
