/**
 * Match marks on grouped pieces: a cube cut on its creases is one template ×6, but each of the six cut
 * faces carries its own four seam numbers. A match mark only works when the number appears on exactly
 * the two pieces that meet (DESIGN.md step 5: "printed as ticks on both pieces so they line up at
 * glue-up"), so every seam number must be drawn exactly twice over the cut pieces, in every print mode.
 */
import { describe, expect, it } from 'vitest';
import { buildPattern } from '../../../geometry/pattern/build-pattern';
import { planSheets } from '../../../geometry/layout/plan-sheets';
import { printSetPages } from '../../../geometry/export/print-set-pages';
import type { PatternDoc } from '../../../geometry/pattern/pattern-doc';
import { platonicSolid } from '../../../geometry/shapes';
import { modelOf } from '../pattern/pattern-fixtures';

function cubeDoc(): PatternDoc {
  return buildPattern(modelOf(platonicSolid('cube', 80)), { seams: { crease: 30 }, thickness: 4, surface: 'outer', stretchBudgetPct: 3 });
}

/** How often each seam number is drawn as a match-mark number over the given print mode's pages. */
function matchNumberCounts(doc: PatternDoc, mode: 'tiled' | 'piece-per-page' | 'stock-sheet'): Map<string, number> {
  const plan = planSheets(doc, { sparesPct: 0 });
  const { areas } = printSetPages(doc, plan, { page: 'a4', mode });
  const counts = new Map<string, number>();
  for (const area of areas) {
    for (const d of area.drawings) {
      for (const t of d.texts) if (t.style === 'match') counts.set(t.text, (counts.get(t.text) ?? 0) + 1);
    }
  }
  return counts;
}

describe('match marks on copies of one template', () => {
  const doc = cubeDoc();

  it('groups the cube into one template of six (the fixture this test relies on)', () => {
    expect(doc.pieces).toHaveLength(1);
    expect(doc.pieces[0].quantity).toBe(6);
    // A cube has 12 edges (Euler: V − E + F = 2 with V = 8, F = 6).
    expect(doc.seams).toHaveLength(12);
  });

  for (const mode of ['tiled', 'piece-per-page', 'stock-sheet'] as const) {
    it(`draws every seam number on exactly two cut pieces (${mode})`, () => {
      const counts = matchNumberCounts(doc, mode);
      expect([...counts.keys()].sort((a, b) => Number(a) - Number(b))).toEqual(doc.seams.map((s) => s.label).sort((a, b) => Number(a) - Number(b)));
      for (const [seam, n] of counts) expect(n, `seam ${seam}`).toBe(2);
    });
  }
});
