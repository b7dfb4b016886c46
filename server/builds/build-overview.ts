/**
 * Everything the build page shows besides the sculpt versions (which come from the sculpts API): the current
 * pattern and its pieces, the bench checklist totals, sheet plans, print sets and the shop's members.
 */
import type { Db } from '../../db/client';
import type { PrintSetFileEntry } from '../../db/schema-core';
import type { Role } from '../../db/validation';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { notFound } from '../errors';
import type { SessionUser, ShopAccess } from '../http/define-route';
import { selectShopMembers } from '../shops/queries';
import { benchTotals, buildStage, type BenchTotals, type BuildStage } from './build-progress';
import {
  selectBuild,
  selectBuildWork,
  selectCanSeePrintSets,
  selectNewestDoneDoc,
  selectPatternDoc,
  selectPieceTicks,
  selectPrintSetSummaries,
  selectSheetPlanRows,
} from './queries';

type WorkStatus = 'queued' | 'running' | 'done' | 'failed';

/** One piece of the current pattern as the build page lists it. */
export interface OverviewPiece {
  label: string;
  quantity: number;
  thicknessMm: number;
  maxStretchPct: number;
  /** True when the piece's max stretch is over the seam set's stretch budget. */
  overBudget: boolean;
}

export interface OverviewPattern {
  id: string;
  status: WorkStatus;
  progress: number;
  stage: string | null;
  error: string | null;
  createdAt: string;
  finishedAt: string | null;
}

export interface OverviewSheetPlan {
  id: string;
  patternId: string;
  status: WorkStatus;
  error: string | null;
  sheets: number | null;
  /** Piece area over the area of all sheets, percent (null until the plan is done). */
  usedPct: number | null;
  totalCost: number | null;
  createdAt: string;
}

export interface OverviewPrintSet {
  id: string;
  name: string;
  status: WorkStatus;
  formats: string[];
  page: string;
  files: PrintSetFileEntry[];
  error: string | null;
  createdAt: string;
}

export interface BuildOverview {
  buildId: string;
  stage: BuildStage;
  /** The newest pattern of the newest sculpt, whatever its status; null before the first seams are saved. */
  pattern: OverviewPattern | null;
  /** Pieces of the newest finished pattern of the newest sculpt (empty when none has finished). */
  pieces: OverviewPiece[];
  seamCount: number;
  warnings: string[];
  stretchBudgetPct: number | null;
  bench: BenchTotals;
  sheetPlans: OverviewSheetPlan[];
  /** Null when the caller may not see print sets (a viewer without the owner's grant). */
  printSets: OverviewPrintSet[] | null;
  members: { userId: string; name: string; role: Role }[];
}

/** How many sheet plans and print sets the page lists; older ones are on the sheets screen. */
const RECENT = 5;

function finiteOr<T>(v: unknown, fallback: T): number | T {
  return typeof v === 'number' && Number.isFinite(v) ? v : fallback;
}

/**
 * Reads the figures the page shows from a stored sheet plan (geometry/layout/plan-sheets.ts SheetPlan, kept as
 * JSON): the sheet count, the area-weighted share used over all sheets, and the total cost. Missing or
 * malformed fields give null rather than a wrong number.
 */
export function sheetPlanFigures(plan: Record<string, unknown> | null): { sheets: number | null; usedPct: number | null; totalCost: number | null } {
  if (!plan || !Array.isArray(plan.sheets)) return { sheets: null, usedPct: null, totalCost: null };
  let area = 0;
  let used = 0;
  for (const s of plan.sheets as unknown[]) {
    if (!s || typeof s !== 'object') return { sheets: null, usedPct: null, totalCost: null };
    const { widthMm, heightMm, usedPct } = s as Record<string, unknown>;
    const a = finiteOr(widthMm, NaN) * finiteOr(heightMm, NaN);
    const u = finiteOr(usedPct, NaN);
    if (!(a > 0) || !Number.isFinite(u)) return { sheets: plan.sheets.length, usedPct: null, totalCost: finiteOr(plan.totalCost, null) };
    area += a;
    used += (a * u) / 100;
  }
  return { sheets: plan.sheets.length, usedPct: area > 0 ? (used / area) * 100 : null, totalCost: finiteOr(plan.totalCost, null) };
}

/** Lists the pieces of `doc` with their over-budget flag against `budgetPct` (no flag when the budget is unknown). */
export function overviewPieces(doc: PatternDoc | null, budgetPct: number | null): OverviewPiece[] {
  if (!doc) return [];
  return doc.pieces.map((p) => ({
    label: p.label,
    quantity: p.quantity,
    thicknessMm: p.thickness,
    maxStretchPct: p.stretch.maxPct,
    overBudget: budgetPct !== null && p.stretch.maxPct > budgetPct,
  }));
}

/**
 * Returns the overview of build `buildId` of the caller's shop. Print sets are left out (null) for a viewer
 * whose membership lacks the print-set grant, as on the print-set routes; a site admin reading (role null)
 * sees them. Throws 404 NOT_FOUND when the shop has no such build.
 */
export async function getBuildOverview(db: Db, user: SessionUser, shop: ShopAccess, buildId: string): Promise<BuildOverview> {
  const build = await selectBuild(db, shop.id, buildId);
  if (!build) throw notFound('Build');
  const [[work], ticks, members, planRows] = await Promise.all([
    selectBuildWork(db, shop.id, buildId),
    selectPieceTicks(db, shop.id, buildId),
    selectShopMembers(db, shop.id),
    selectSheetPlanRows(db, shop.id, buildId, RECENT),
  ]);
  const seesPrintSets = shop.role !== 'viewer' || (await selectCanSeePrintSets(db, shop.id, user.id));
  const printRows = seesPrintSets ? await selectPrintSetSummaries(db, shop.id, buildId, RECENT) : null;
  const newest = work?.patternId ? await selectPatternDoc(db, shop.id, work.patternId) : null;
  const done = newest?.status === 'done' ? { doc: newest.doc } : work?.sculptId ? await selectNewestDoneDoc(db, shop.id, work.sculptId) : null;
  const doc = done?.doc ?? null;
  const budget = newest?.stretchBudgetPct ?? null;
  const bench = benchTotals(work?.pieceLabels ?? null, ticks);
  return {
    buildId,
    stage: buildStage(work ?? null, bench),
    pattern: newest
      ? {
          id: newest.id,
          status: newest.status,
          progress: newest.progress,
          stage: newest.stage,
          error: newest.error,
          createdAt: newest.createdAt.toISOString(),
          finishedAt: newest.finishedAt?.toISOString() ?? null,
        }
      : null,
    pieces: overviewPieces(doc, budget),
    seamCount: doc?.seams.length ?? 0,
    warnings: doc?.warnings ?? [],
    stretchBudgetPct: budget,
    bench,
    sheetPlans: planRows.map((r) => ({
      id: r.id,
      patternId: r.patternId,
      status: r.status,
      error: r.error,
      ...sheetPlanFigures(r.status === 'done' ? r.plan : null),
      createdAt: r.createdAt.toISOString(),
    })),
    printSets:
      printRows?.map((r) => ({
        id: r.id,
        name: r.name,
        status: r.status,
        formats: r.formats,
        page: r.page,
        files: r.files,
        error: r.error,
        createdAt: r.createdAt.toISOString(),
      })) ?? null,
    members: members.map((m) => ({ userId: m.userId, name: m.name, role: m.role })),
  };
}
