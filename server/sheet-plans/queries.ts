/** Drizzle queries for sheet plans, scoped to a shop and build. */
import { and, desc, eq, inArray, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { sheetPlans } from '../../db/schema-bench';

export type SheetPlanRow = typeof sheetPlans.$inferSelect;

/** Inserts a queued sheet plan and returns it. */
export async function insertSheetPlan(
  db: DbExecutor,
  row: { shopId: string; buildId: string; patternId: string; options: Record<string, unknown>; createdBy: string | null },
): Promise<SheetPlanRow> {
  const rows = await db.insert(sheetPlans).values(row).returning();
  return rows[0];
}

/** Records the queue's job id on a sheet plan. */
export async function setSheetPlanJobId(db: DbExecutor, id: string, jobId: string): Promise<void> {
  await db.update(sheetPlans).set({ jobId }).where(eq(sheetPlans.id, id));
}

/** The build's sheet plans, newest first. */
export function selectSheetPlans(db: DbExecutor, shopId: string, buildId: string): Promise<SheetPlanRow[]> {
  return db
    .select()
    .from(sheetPlans)
    .where(and(eq(sheetPlans.shopId, shopId), eq(sheetPlans.buildId, buildId)))
    .orderBy(desc(sheetPlans.createdAt), desc(sheetPlans.id));
}

/** One sheet plan of the shop's build, or null. */
export async function selectSheetPlan(db: DbExecutor, shopId: string, buildId: string, id: string): Promise<SheetPlanRow | null> {
  const rows = await db
    .select()
    .from(sheetPlans)
    .where(and(eq(sheetPlans.shopId, shopId), eq(sheetPlans.buildId, buildId), eq(sheetPlans.id, id)));
  return rows[0] ?? null;
}

/** Marks a queued (or, after a crash, running) plan running and returns it; null when gone or finished. */
export async function claimSheetPlan(db: DbExecutor, id: string): Promise<SheetPlanRow | null> {
  const rows = await db
    .update(sheetPlans)
    .set({ status: 'running', error: null })
    .where(and(eq(sheetPlans.id, id), inArray(sheetPlans.status, ['queued', 'running'])))
    .returning();
  return rows[0] ?? null;
}

/** Marks a running plan done with its result. */
export async function markSheetPlanDone(db: DbExecutor, id: string, plan: Record<string, unknown>): Promise<void> {
  await db
    .update(sheetPlans)
    .set({ status: 'done', plan, error: null, finishedAt: sql`now()` })
    .where(and(eq(sheetPlans.id, id), eq(sheetPlans.status, 'running')));
}

/** Marks a plan failed with a message for the maker. */
export async function markSheetPlanFailed(db: DbExecutor, id: string, error: string): Promise<void> {
  await db.update(sheetPlans).set({ status: 'failed', error, finishedAt: sql`now()` }).where(eq(sheetPlans.id, id));
}
