/**
 * Outside checks on thickness compensation for shapes with sharp corners. A hollow box built of boards t thick
 * with outside size a is a − 2t inside, and the inner face of each board is the outside face moved a full t
 * inward, cut back by t at every corner (elementary solid geometry). The same holds for any right prism: its
 * inner cross-section is the outline offset inward by t (a regular n-gon of apothem ρ becomes one of apothem
 * ρ − t, side 2(ρ − t)·tan(π/n)), and its inner height is h − 2t.
 */
import { describe, expect, it } from 'vitest';
import type { PatternDoc } from '../../../geometry/pattern/pattern-doc';
import { objFile } from '../../fixtures/reference/model-files';
import { lOutline, moved, prismOver, regularPolygon, type PolyShape } from '../../fixtures/reference/reference-shapes';
import { patternOfFile } from './reference-checks';

const t = 6;

function panels(shape: PolyShape, surface: 'mid' | 'inner'): PatternDoc {
  return patternOfFile(objFile(shape), 'box.obj', { seams: { crease: 10 }, thickness: t, surface });
}

/** Side lengths of a piece outline, sorted. */
const sides = (outline: [number, number][]): number[] =>
  outline.map((p, i) => Math.hypot(outline[(i + 1) % outline.length][0] - p[0], outline[(i + 1) % outline.length][1] - p[1])).sort((x, y) => x - y);

describe('regression: thickness at sharp corners (the inner face of a box was a − 2t/√3, not a − 2t)', () => {
  it('a 100 mm cube in 6 mm foam: inner-face panels 88 × 88 mm, mid-surface panels 94 × 94 mm', () => {
    const cube = moved(prismOver([[0, 0], [100, 0], [100, 100], [0, 100]], 100), [1, 1, 0], 0.5, 1, [40, -20, 5]);
    for (const [surface, depth] of [['inner', t], ['mid', t / 2]] as const) {
      const doc = panels(cube, surface);
      expect(doc.pieces).toHaveLength(1);
      expect(doc.pieces[0].quantity).toBe(6);
      for (const s of sides(doc.pieces[0].outline)) expect(s).toBeCloseTo(100 - 2 * depth, 6);
      expect(doc.pieces[0].perimeterChangeMm).toBeCloseTo(-8 * depth, 6);
      // Each seam's 2D length on either panel is the inner (or middle) edge length.
      for (const s of doc.seams) for (const l of s.lengths) expect(l).toBeCloseTo(100 - 2 * depth, 6);
    }
  });

  it('a hexagonal prism: inner side panels (s − 2t·tan 30°) × (h − 2t), inner caps of apothem ρ·cos 30° − t', () => {
    const rho = 40, h = 80, n = 6;
    const apothem = rho * Math.cos(Math.PI / n);
    const doc = panels(prismOver(regularPolygon(n, rho), h), 'inner');
    const innerSide = 2 * (apothem - t) * Math.tan(Math.PI / n);
    const side = doc.pieces.find((p) => p.outline.length === 4)!;
    const cap = doc.pieces.find((p) => p.outline.length === 6)!;
    expect(side.quantity).toBe(6);
    expect(cap.quantity).toBe(2);
    const [w1, w2, h1, h2] = sides(side.outline);
    expect(w1).toBeCloseTo(innerSide, 6);
    expect(w2).toBeCloseTo(innerSide, 6);
    expect(h1).toBeCloseTo(h - 2 * t, 6);
    expect(h2).toBeCloseTo(h - 2 * t, 6);
    for (const s of sides(cap.outline)) expect(s).toBeCloseTo(innerSide, 6);
    // Area of a regular hexagon of apothem r: 2√3·r² (elementary geometry).
    expect(cap.area2d).toBeCloseTo(2 * Math.sqrt(3) * (apothem - t) ** 2, 5);
  });

  it('an L bracket, inside corner included: the inner cross-section is the L offset inward by t', () => {
    const a = 80, b = 30, h = 50;
    const doc = panels(prismOver(lOutline(a, b), h), 'inner');
    // Outer sides a, b, a − b, a − b, b, a become a − 2t, b − 2t, a − b, a − b, b − 2t, a − 2t inside.
    const cap = doc.pieces.find((p) => p.outline.length === 6)!;
    const want = [a - 2 * t, b - 2 * t, a - b, a - b, b - 2 * t, a - 2 * t].sort((x, y) => x - y);
    sides(cap.outline).forEach((s, i) => expect(s).toBeCloseTo(want[i], 6));
    expect(cap.area2d).toBeCloseTo((a - 2 * t) * (b - 2 * t) + (b - 2 * t) * (a - b), 5);
    const sidePanels = doc.pieces.filter((p) => p.outline.length === 4);
    const widths = sidePanels.flatMap((p) => Array(p.quantity).fill(p.area2d / (h - 2 * t))).sort((x, y) => x - y);
    widths.forEach((w, i) => expect(w).toBeCloseTo(want[i], 5));
  });
});
