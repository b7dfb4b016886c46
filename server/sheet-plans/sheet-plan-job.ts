/**
 * The worker side of a sheet plan: nest every copy of the pattern's pieces (quantity, mirrored copies, spares)
 * on the shop's stock sheets per thickness with planSheets, and store the plan with its usage and cost. A
 * pattern the engine cannot lay out (a piece larger than every sheet of its thickness) ends as status `failed`
 * with the engine's message.
 */
import { z } from 'zod';
import { patterns } from '../../db/schema-sculpts';
import { isGeometryError } from '../../geometry/errors';
import { planSheets, type SheetPlan, type SparesFor } from '../../geometry/layout/plan-sheets';
import { eq } from 'drizzle-orm';
import type { JobContext } from '../jobs/job-types';
import { stockForPlanning } from '../stock/service';
import { claimSheetPlan, markSheetPlanDone, markSheetPlanFailed } from './queries';

/** What a stored plan holds: the engine's plan, the stock's currency and whether the stock was the defaults. */
export interface StoredSheetPlan extends SheetPlan {
  currency: string;
  stockSource: 'shop' | 'default';
}

const jobData = z.object({ sheetPlanId: z.string().uuid() });

/** Message stored on a plan that failed for a reason other than the pattern or the stock. */
export const SHEET_PLAN_INTERNAL_FAILURE = 'the sheet plan could not be made because of a server error; it has been logged, try again later';

/**
 * Runs one sheet-plan job for `data` = { sheetPlanId }. Resolves to a short summary. Throws (the queue may
 * retry) only for failures outside the engine; the plan is then marked failed with SHEET_PLAN_INTERNAL_FAILURE.
 */
export async function runSheetPlanJob({ db }: JobContext, data: unknown): Promise<Record<string, unknown>> {
  const parsed = jobData.safeParse(data);
  if (!parsed.success) throw new Error(`sheet-plan job data must be { sheetPlanId: <uuid> }, got ${JSON.stringify(data)}`);
  const id = parsed.data.sheetPlanId;
  const row = await claimSheetPlan(db, id);
  if (!row) return { sheetPlanId: id, skipped: 'gone or already finished' };
  try {
    const [pattern] = await db.select({ doc: patterns.doc, status: patterns.status }).from(patterns).where(eq(patterns.id, row.patternId));
    if (!pattern?.doc || pattern.status !== 'done') {
      await markSheetPlanFailed(db, id, 'the pattern is not finished, so its pieces cannot be laid out yet');
      return { sheetPlanId: id, status: 'failed', reason: 'pattern not done' };
    }
    const { stock, currency, source } = await stockForPlanning(db, row.shopId);
    const options = row.options as { gapMm: number; sparesPct: number; sparesFor: SparesFor };
    let plan: SheetPlan;
    try {
      plan = planSheets(pattern.doc, { stock, gapMm: options.gapMm, sparesPct: options.sparesPct, sparesFor: options.sparesFor });
    } catch (err) {
      if (isGeometryError(err)) {
        await markSheetPlanFailed(db, id, err.message);
        return { sheetPlanId: id, status: 'failed', code: err.code };
      }
      throw err;
    }
    const stored: StoredSheetPlan = { ...plan, currency, stockSource: source };
    await markSheetPlanDone(db, id, stored as unknown as Record<string, unknown>);
    return { sheetPlanId: id, status: 'done', sheets: plan.sheets.length };
  } catch (err) {
    await markSheetPlanFailed(db, id, SHEET_PLAN_INTERNAL_FAILURE);
    throw err;
  }
}
