import { describe, expect, it } from 'vitest';
import { offsetRingUm, OFFSET_SCALE } from '../../../geometry/layout/offset-ring';
import { signedAreaMm2 } from '../../../geometry/layout/outline-measure';
import type { PointMm } from '../../../geometry/pattern/pattern-doc';
import { lShape, rectangle, star } from '../../fixtures/pattern-docs/shape-docs';

const turn = (ring: PointMm[], deg: number, dx = 0, dy = 0, k = 1): PointMm[] => {
  const a = (deg * Math.PI) / 180;
  return ring.map(([x, y]) => [k * (Math.cos(a) * x - Math.sin(a) * y) + dx, k * (Math.sin(a) * x + Math.cos(a) * y) + dy]);
};

function pointSegment(p: PointMm, a: PointMm, b: PointMm): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const t = Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / (dx * dx + dy * dy)));
  return Math.hypot(p[0] - a[0] - t * dx, p[1] - a[1] - t * dy);
}
const distanceToRing = (p: PointMm, ring: PointMm[]): number => Math.min(...ring.map((a, i) => pointSegment(p, a, ring[(i + 1) % ring.length])));

/** Every vertex and every edge midpoint of the offset (where a round join's chord comes closest to the piece). */
function offsetSamples(outer: PointMm[]): PointMm[] {
  return outer.flatMap((p, i) => {
    const q = outer[(i + 1) % outer.length];
    return [p, [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2] as PointMm];
  });
}

// Sizes: the original, a 10× smaller and a 10× larger copy, each turned and moved (house style: every
// geometry test under rotation, translation and scale). The offset distance stays 3 mm.
const placements = [
  { deg: 0, dx: 0, dy: 0, k: 1 },
  { deg: 33, dx: 250, dy: -120, k: 1 },
  { deg: 71, dx: -40, dy: 900, k: 0.1 },
  { deg: 200, dx: 5, dy: 5, k: 10 },
];

describe('offsetRingUm', () => {
  it('grows a rectangle by Steiner\'s formula A + P·r + π·r², within the arc and rounding margin', () => {
    for (const { deg, dx, dy, k } of placements) {
      const r = 3;
      const w = 100 * k;
      const h = 50 * k;
      const o = offsetRingUm(turn(rectangle(w, h), deg, dx, dy), r);
      expect(o.paths.length).toBe(1);
      // Steiner 1840: the parallel body of a convex polygon at distance r has area A + P·r + π·r².
      // For 100×50 mm and r = 3 that is 5928.27 mm² (the brief's reference figure 5928).
      const steiner = w * h + 2 * (w + h) * r + Math.PI * r * r;
      const area = signedAreaMm2(o.outerMm);
      // The offset adds at most 15 µm to r (arc shortfall 12 µm + rounding); the inscribed arc chords take back less.
      expect(area).toBeGreaterThanOrEqual(steiner);
      expect(area).toBeLessThanOrEqual(steiner + 2 * (w + h) * 0.015 + 2 * Math.PI * r * 0.015);
      expect(area).toBeGreaterThan(0);
    }
  });

  it('grows an L-shape by A + P·r + (5π/4 − 1)·r²: five convex corners add quarter discs, the reflex corner loses an r×r square', () => {
    for (const { deg, dx, dy, k } of placements) {
      const r = 2;
      const t = 30 * k;
      const s = 80 * k;
      const L = lShape(s, s, t);
      const o = offsetRingUm(turn(L, deg, dx, dy), r);
      // Steiner's formula for polygons generalised to a reflex corner (worked out here): each convex corner of
      // exterior angle θ adds θ·r²/2, a 90° reflex corner removes the r×r square where its two edge strips overlap.
      const A = s * t + (s - t) * t;
      const expected = A + 4 * s * r + (5 * Math.PI / 4 - 1) * r * r;
      const area = signedAreaMm2(o.outerMm);
      expect(area).toBeGreaterThanOrEqual(expected - 1e-3);
      expect(area).toBeLessThanOrEqual(expected + 4 * s * 0.015 + Math.PI * r * 0.03);
    }
  });

  it('keeps every point of a star\'s offset boundary at least the distance away and at most 20 µm more', () => {
    for (const { deg, dx, dy, k } of placements) {
      const s = turn(star(6, 60, 25), deg, dx, dy, k);
      const r = 1.5;
      const o = offsetRingUm(s, r);
      // Definition of the outward offset (Minkowski sum with a disc of radius r): its boundary is the set of
      // points at distance exactly r; vertices and chord midpoints of the approximation are checked.
      for (const p of offsetSamples(o.outerMm)) {
        const d = distanceToRing(p, s);
        expect(d).toBeGreaterThanOrEqual(r - 1e-9);
        expect(d).toBeLessThanOrEqual(r + 0.02);
      }
      expect(o.minX / OFFSET_SCALE).toBeCloseTo(Math.min(...o.outerMm.map((p) => p[0])), 9);
      expect(o.maxY / OFFSET_SCALE).toBeCloseTo(Math.max(...o.outerMm.map((p) => p[1])), 9);
    }
  });

  it('returns a clockwise ring counter-clockwise and unchanged in size at distance 0', () => {
    const cw = rectangle(40, 20).reverse();
    const o = offsetRingUm(cw, 0);
    // Shoelace formula: a 40×20 mm rectangle has area 800 mm²; counter-clockwise is positive.
    expect(signedAreaMm2(o.outerMm)).toBeCloseTo(800, 9);
    expect([o.minX, o.minY, o.maxX, o.maxY]).toEqual([0, 0, 40000, 20000]);
  });
});
