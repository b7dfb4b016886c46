/**
 * Sheet-plan rules: a plan nests one finished pattern of the build on the shop's stock; it is recorded, then
 * queued (job sheet-plan), and read back with its usage and cost.
 */
import type { Db } from '../../db/client';
import type { SheetPlanCreateBody } from '../../db/validation-bench';
import { selectBuild } from '../builds/queries';
import { AppError, notFound } from '../errors';
import type { SessionUser } from '../http/define-route';
import type { JobSender } from '../jobs/job-sender';
import { SHEET_PLAN_JOB } from '../patterns/pattern-job-name';
import { selectPattern } from '../patterns/queries';
import { insertSheetPlan, markSheetPlanFailed, selectSheetPlan, selectSheetPlans, setSheetPlanJobId, type SheetPlanRow } from './queries';
import type { StoredSheetPlan } from './sheet-plan-job';

export interface SheetPlanSummary {
  sheets: number;
  /** Piece area over the area of every sheet used, percent (all thicknesses together). */
  usedPct: number;
  totalCost: number;
  currency: string;
  byThickness: StoredSheetPlan['byThickness'];
}

export interface SheetPlanView {
  id: string;
  buildId: string;
  patternId: string;
  status: SheetPlanRow['status'];
  error: string | null;
  options: Record<string, unknown>;
  summary: SheetPlanSummary | null;
  plan: StoredSheetPlan | null;
  createdBy: string | null;
  createdAt: string;
  finishedAt: string | null;
}

/** Returns the summary of a stored plan: sheet count, overall use (area-weighted over sheets), cost. */
export function summarizePlan(plan: StoredSheetPlan): SheetPlanSummary {
  let used = 0;
  let total = 0;
  for (const s of plan.sheets) {
    const area = s.widthMm * s.heightMm;
    used += (s.usedPct / 100) * area;
    total += area;
  }
  return { sheets: plan.sheets.length, usedPct: total > 0 ? (100 * used) / total : 0, totalCost: plan.totalCost, currency: plan.currency, byThickness: plan.byThickness };
}

/** Returns the API view of a sheet-plan row. */
export function sheetPlanView(row: SheetPlanRow): SheetPlanView {
  const plan = (row.plan as unknown as StoredSheetPlan | null) ?? null;
  return {
    id: row.id,
    buildId: row.buildId,
    patternId: row.patternId,
    status: row.status,
    error: row.error,
    options: row.options,
    summary: plan ? summarizePlan(plan) : null,
    plan,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}

/**
 * Records a sheet plan of pattern `body.patternId` and queues it. Throws 404 NOT_FOUND for no such build or
 * pattern of the build, 409 NOT_READY when the pattern is not done, 503 QUEUE_UNAVAILABLE when the job cannot be
 * queued (the plan is then marked failed).
 */
export async function createSheetPlan(db: Db, jobs: JobSender | null, user: SessionUser, shopId: string, buildId: string, body: SheetPlanCreateBody): Promise<SheetPlanView> {
  if (!(await selectBuild(db, shopId, buildId))) throw notFound('Build');
  const pattern = await selectPattern(db, shopId, buildId, body.patternId);
  if (!pattern) throw new AppError('NOT_FOUND', 404, 'Pattern was not found in this build', { patternId: 'must be the id of one of the build’s patterns' });
  if (pattern.status !== 'done') {
    throw new AppError('NOT_READY', 409, `The pattern is ${pattern.status}; a sheet plan can be made from a finished pattern`, { patternId: `the pattern is ${pattern.status}` });
  }
  const row = await insertSheetPlan(db, {
    shopId,
    buildId,
    patternId: pattern.id,
    options: { gapMm: body.gapMm, sparesPct: body.spares, sparesFor: body.sparesFor },
    createdBy: user.id,
  });
  const unavailable = 'The job queue is not available, so the sheet plan could not be started; try again in a moment';
  try {
    if (!jobs) throw new Error('no queue');
    await setSheetPlanJobId(db, row.id, await jobs.send(SHEET_PLAN_JOB, { sheetPlanId: row.id }));
  } catch {
    await markSheetPlanFailed(db, row.id, unavailable);
    throw new AppError('QUEUE_UNAVAILABLE', 503, unavailable);
  }
  return sheetPlanView(row);
}

/** Returns the build's sheet plans, newest first; throws 404 NOT_FOUND for no such build. */
export async function listSheetPlans(db: Db, shopId: string, buildId: string): Promise<SheetPlanView[]> {
  if (!(await selectBuild(db, shopId, buildId))) throw notFound('Build');
  return (await selectSheetPlans(db, shopId, buildId)).map(sheetPlanView);
}

/** Returns one sheet plan; throws 404 NOT_FOUND when the build has no such plan. */
export async function getSheetPlan(db: Db, shopId: string, buildId: string, planId: string): Promise<SheetPlanView> {
  const row = await selectSheetPlan(db, shopId, buildId, planId);
  if (!row) throw notFound('Sheet plan');
  return sheetPlanView(row);
}
