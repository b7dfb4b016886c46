/**
 * Unit tests of the build stage and bench totals (server/builds/build-progress.ts) and of the sheet-plan figures
 * on the build page (server/builds/build-overview.ts). Expected values are worked by hand from the definitions:
 * three ticks per piece (cut, shaped, glued; DESIGN.md step 9 checklist), percent rounded down; a sheet plan's
 * usage is the area-weighted mean of each sheet's usedPct (geometry/layout/plan-sheets.ts).
 */
import { describe, expect, it } from 'vitest';
import { benchTotals, buildStage } from '../../../server/builds/build-progress';
import { sheetPlanFigures } from '../../../server/builds/build-overview';

const tick = (label: string, cut = false, shaped = false, glued = false) => ({ buildId: 'b', label, cut, shaped, glued });

describe('benchTotals', () => {
  it('counts ticks of current pieces only and rounds the share down', () => {
    // A done (3), B cut (1), C nothing: 4 of 9 ticks = 44.4 % → 44.
    const t = benchTotals(['A', 'B', 'C'], [tick('A', true, true, true), tick('B', true), tick('old', true, true, true)]);
    expect(t).toEqual({ pieces: 3, cut: 2, shaped: 1, glued: 1, progressPct: 44, stale: 1 });
  });

  it('reaches 100 only when every tick is done, and is 0 without pieces', () => {
    // 8 of 9 ticks = 88.9 % → 88, never rounded up to look finished.
    expect(benchTotals(['A', 'B', 'C'], [tick('A', true, true, true), tick('B', true, true, true), tick('C', true, true)]).progressPct).toBe(88);
    expect(benchTotals(['A'], [tick('A', true, true, true)]).progressPct).toBe(100);
    expect(benchTotals(null, [tick('A', true)])).toEqual({ pieces: 0, cut: 0, shaped: 0, glued: 0, progressPct: 0, stale: 1 });
  });
});

describe('buildStage', () => {
  const none = benchTotals([], []);
  it('follows the job from sculpt to finished build (DESIGN.md steps 1–9)', () => {
    expect(buildStage(null, none)).toBe('no-sculpt');
    expect(buildStage({ sculptStatus: 'queued', patternStatus: null }, none)).toBe('processing');
    expect(buildStage({ sculptStatus: 'running', patternStatus: null }, none)).toBe('processing');
    expect(buildStage({ sculptStatus: 'done', patternStatus: null }, none)).toBe('marking-seams');
    expect(buildStage({ sculptStatus: 'done', patternStatus: 'running' }, none)).toBe('flattening');
    const two = benchTotals(['A', 'B'], []);
    expect(buildStage({ sculptStatus: 'done', patternStatus: 'done' }, two)).toBe('pieces-ready');
    expect(buildStage({ sculptStatus: 'done', patternStatus: 'done' }, benchTotals(['A', 'B'], [tick('A', true)]))).toBe('at-the-bench');
    expect(buildStage({ sculptStatus: 'done', patternStatus: 'done' }, benchTotals(['A', 'B'], [tick('A', true, true, true), tick('B', true, true, true)]))).toBe('finished');
  });

  it('reports a failed sculpt or pattern as failed, and a finished pattern with no pieces as still marking seams', () => {
    expect(buildStage({ sculptStatus: 'failed', patternStatus: null }, none)).toBe('failed');
    expect(buildStage({ sculptStatus: 'done', patternStatus: 'failed' }, none)).toBe('failed');
    expect(buildStage({ sculptStatus: 'done', patternStatus: 'done' }, none)).toBe('marking-seams');
  });
});

describe('sheetPlanFigures', () => {
  it('weights each sheet’s usage by its area', () => {
    // 1220 × 610 at 70 % and 610 × 610 at 40 %: (520 940 + 148 840) / 1 116 300 = 60 %.
    const f = sheetPlanFigures({ sheets: [{ widthMm: 1220, heightMm: 610, usedPct: 70 }, { widthMm: 610, heightMm: 610, usedPct: 40 }], totalCost: 12 });
    expect(f.sheets).toBe(2);
    expect(f.usedPct).toBeCloseTo(60, 9);
    expect(f.totalCost).toBe(12);
  });

  it('gives null figures for a missing or malformed plan instead of a wrong number', () => {
    expect(sheetPlanFigures(null)).toEqual({ sheets: null, usedPct: null, totalCost: null });
    expect(sheetPlanFigures({ sheets: 'x' })).toEqual({ sheets: null, usedPct: null, totalCost: null });
    expect(sheetPlanFigures({ sheets: [{ widthMm: 100, heightMm: 100, usedPct: 'high' }], totalCost: 3 })).toEqual({ sheets: 1, usedPct: null, totalCost: 3 });
  });
});
