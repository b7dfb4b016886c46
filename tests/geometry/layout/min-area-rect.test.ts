import { describe, expect, it } from 'vitest';
import { arrangeTemplates } from '../../../geometry/export/arrange-templates';
import { convexHull, minAreaRect } from '../../../geometry/layout/min-area-rect';
import { signedAreaMm2 } from '../../../geometry/layout/outline-measure';
import { boundsOf, placeRing } from '../../../geometry/layout/outline-transform';
import type { PatternDoc, PointMm } from '../../../geometry/pattern/pattern-doc';
import { irregularPolygon, lShape, piece, rectangle, seededRandom, star } from '../../fixtures/pattern-docs/shape-docs';

const turn = (ring: PointMm[], deg: number, dx = 0, dy = 0, k = 1): PointMm[] => {
  const a = (deg * Math.PI) / 180;
  return ring.map(([x, y]) => [k * (Math.cos(a) * x - Math.sin(a) * y) + dx, k * (Math.sin(a) * x + Math.cos(a) * y) + dy]);
};

/** Independent check: the bounding-box area minimised over 0.01° steps of a half turn (brute force). */
function bruteForceMinArea(ring: PointMm[]): number {
  let best = Infinity;
  for (let i = 0; i < 18000; i++) {
    const b = boundsOf(turn(ring, i / 100));
    best = Math.min(best, (b.maxX - b.minX) * (b.maxY - b.minY));
  }
  return best;
}

describe('convexHull', () => {
  it('keeps the 5 tips of a star and drops its inner corners (a star is the hull of its tips)', () => {
    const s = star(5, 40, 18);
    const h = convexHull(s);
    expect(h.length).toBe(5);
    expect(signedAreaMm2(h)).toBeGreaterThan(0);
    // Regular pentagon of circumradius R: area (5/2)·R²·sin 72° (standard formula).
    expect(signedAreaMm2(h)).toBeCloseTo(2.5 * 40 * 40 * Math.sin((72 * Math.PI) / 180), 6);
  });
});

describe('minAreaRect (Freeman and Shapira 1975: one side lies on a hull edge)', () => {
  it('turns a 45° diamond (a cube face as the flattener may leave it) square to the axes', () => {
    const diamond = turn(rectangle(100, 100), 45, 30, -20);
    const r = minAreaRect(diamond);
    expect(r.areaMm2).toBeCloseTo(10000, 6);
    const b = boundsOf(placeRing(diamond, { mirrored: false, rotationDeg: r.rotationDeg, x: 0, y: 0 }));
    expect(b.maxX - b.minX).toBeCloseTo(100, 6);
    expect(b.maxY - b.minY).toBeCloseTo(100, 6);
  });

  it('lays a 30×10 mm rectangle turned 30° with its long side along x, under rotation, translation and scale', () => {
    for (const [deg, k] of [[30, 1], [-73, 0.001], [151, 1000]] as const) {
      const ring = turn(rectangle(30, 10), deg, 500 * k, 77 * k, k);
      const r = minAreaRect(ring);
      expect(r.widthMm / k).toBeCloseTo(30, 6);
      expect(r.heightMm / k).toBeCloseTo(10, 6);
      const b = boundsOf(placeRing(ring, { mirrored: false, rotationDeg: r.rotationDeg, x: 0, y: 0 }));
      expect((b.maxX - b.minX) / k).toBeCloseTo(30, 6);
      expect((b.maxY - b.minY) / k).toBeCloseTo(10, 6);
    }
  });

  it('agrees with a brute-force search over turns on irregular outlines and an L-shape', () => {
    const rand = seededRandom(5);
    const rings = [irregularPolygon(rand, 80, 13), irregularPolygon(rand, 30, 9), turn(lShape(120, 70, 25), 17)];
    for (const ring of rings) {
      const r = minAreaRect(ring);
      const brute = bruteForceMinArea(ring);
      // The calipers' answer is exact; the 0.01° brute force can only be a hair larger.
      expect(r.areaMm2).toBeLessThanOrEqual(brute + 1e-6);
      expect(r.areaMm2).toBeGreaterThan(brute * (1 - 1e-5));
      expect(r.widthMm).toBeGreaterThanOrEqual(r.heightMm);
    }
  });

  it('leaves an outline already square to the axes unturned', () => {
    expect(minAreaRect(rectangle(80, 40)).rotationDeg).toBeCloseTo(0, 9);
    expect(Math.abs(minAreaRect(rectangle(40, 80)).rotationDeg)).toBeCloseTo(90, 9);
  });
});

describe('arrangeTemplates', () => {
  it('prints a diamond-posed square piece square to the page', () => {
    const doc: PatternDoc = { units: 'mm', pieces: [piece('A', turn(rectangle(100, 100), 45))], seams: [], warnings: [] };
    const arr = arrangeTemplates(doc, 'a4');
    const placed = placeRing(arr.items[0].piece.outline, arr.items[0].transform);
    const b = boundsOf(placed);
    expect(b.maxX - b.minX).toBeCloseTo(100, 6);
    expect(b.maxY - b.minY).toBeCloseTo(100, 6);
  });
});
