/**
 * Where a build stands, from its newest sculpt, its newest pattern and the crew's checklist: the stage word the
 * builds list shows and the share of bench work done.
 */
import type { BuildWorkRow, PieceTickRow } from './queries';

/** The stages a build passes through, in order; `failed` when its newest sculpt or pattern failed. */
export const BUILD_STAGES = ['no-sculpt', 'processing', 'marking-seams', 'flattening', 'pieces-ready', 'at-the-bench', 'finished', 'failed'] as const;
export type BuildStage = (typeof BUILD_STAGES)[number];

/** Checklist totals over the pieces of the current pattern. */
export interface BenchTotals {
  pieces: number;
  cut: number;
  shaped: number;
  glued: number;
  /** Ticks done over ticks possible (three per piece: cut, shaped, glued), percent rounded down; 0 without pieces. */
  progressPct: number;
  /** Checklist rows whose label the current pattern no longer has (kept so no tick is lost by a re-seam). */
  stale: number;
}

/**
 * Returns the checklist totals for the pieces `labels` (the current pattern's piece labels; null or empty
 * when there is no finished pattern) from the build's checklist rows `ticks`. A row for a label not in
 * `labels` counts as stale, not as progress. Rounded down so 100 % means every tick is really done.
 */
export function benchTotals(labels: readonly string[] | null, ticks: readonly PieceTickRow[]): BenchTotals {
  const current = new Set(labels ?? []);
  let cut = 0;
  let shaped = 0;
  let glued = 0;
  let stale = 0;
  for (const t of ticks) {
    if (!current.has(t.label)) {
      stale++;
      continue;
    }
    if (t.cut) cut++;
    if (t.shaped) shaped++;
    if (t.glued) glued++;
  }
  const pieces = current.size;
  const progressPct = pieces === 0 ? 0 : Math.floor(((cut + shaped + glued) * 100) / (3 * pieces));
  return { pieces, cut, shaped, glued, progressPct, stale };
}

/**
 * Returns the stage of a build from its work row `work` (newest sculpt and pattern) and checklist `totals`.
 * A failed sculpt or pattern is `failed`; a sculpt still in the queue or being processed is `processing`; a
 * processed sculpt without a pattern is `marking-seams`; a pattern in the queue or running is `flattening`
 * (even when an older pattern's pieces exist, since they are about to change); then `pieces-ready` until the
 * first tick, `at-the-bench` while ticks are missing, and `finished` when every piece is cut, shaped and glued.
 */
export function buildStage(work: Pick<BuildWorkRow, 'sculptStatus' | 'patternStatus'> | null, totals: BenchTotals): BuildStage {
  if (!work || work.sculptStatus === null) return 'no-sculpt';
  if (work.sculptStatus === 'failed' || work.patternStatus === 'failed') return 'failed';
  if (work.sculptStatus !== 'done') return 'processing';
  if (work.patternStatus === null) return 'marking-seams';
  if (work.patternStatus !== 'done') return 'flattening';
  if (totals.pieces === 0) return 'marking-seams';
  const ticks = totals.cut + totals.shaped + totals.glued;
  if (ticks === 0) return 'pieces-ready';
  return ticks === 3 * totals.pieces ? 'finished' : 'at-the-bench';
}
