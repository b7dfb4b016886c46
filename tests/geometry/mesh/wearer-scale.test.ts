import { describe, expect, it } from 'vitest';
import { GeometryError } from '../../../geometry/errors';
import { ellipsePerimeterMm, headSection, wearerScale } from '../../../geometry/mesh/wearer-scale';
import { cylinder, transformMesh } from '../../../geometry/shapes';

/**
 * Exact ellipse perimeter by Gauss's arithmetic-geometric mean: P = (2π / M(a, b)) · (a² − Σ 2^(n−1) c_n²),
 * c_0² = a² − b², c_(n+1) = (a_n − b_n)/2 (DLMF §19.8(i), eqs. 19.8.1 and 19.8.6). Independent of the code
 * under test, which uses Ramanujan's closed form.
 */
function agmPerimeter(a: number, b: number): number {
  let an = a;
  let bn = b;
  let sum = 0.5 * (a * a - b * b);
  let pow = 0.5;
  for (let i = 0; i < 30; i++) {
    const cn = (an - bn) / 2;
    [an, bn] = [(an + bn) / 2, Math.sqrt(an * bn)];
    pow *= 2;
    sum += pow * cn * cn;
  }
  return ((2 * Math.PI) / an) * (a * a - sum);
}

describe('ellipsePerimeterMm (Ramanujan 1914, second approximation)', () => {
  it('is 2πr for a circle', () => {
    for (const r of [0.001, 1, 87.5, 1e6]) expect(ellipsePerimeterMm(r, r)).toBeCloseTo(2 * Math.PI * r, 9 - Math.log10(r));
  });

  it('matches the exact perimeter within Ramanujan\'s error term 3h⁵/2¹⁷ (h = ((a−b)/(a+b))²)', () => {
    // a = 1, b = 0.5: exact perimeter 4.8442241102738... (4·E(k²=3/4), k the eccentricity; value from memory, re-derived by the AGM here).
    expect(agmPerimeter(1, 0.5)).toBeCloseTo(4.84422411027384, 12);
    for (const [a, b] of [[1, 0.5], [100, 80], [95, 72], [10, 3]]) {
      const h = ((a - b) / (a + b)) ** 2;
      const exact = agmPerimeter(a, b);
      const rel = Math.abs(ellipsePerimeterMm(a, b) - exact) / exact;
      // 3h⁵/2¹⁷ is the leading error term; the next terms add up to about 60 % more at h ≈ 0.3 (a = 10, b = 3).
      expect(rel).toBeLessThanOrEqual(2 * (3 * h ** 5) / 2 ** 17 + 1e-15);
      // Symmetric in the axes.
      expect(ellipsePerimeterMm(b, a)).toBeCloseTo(ellipsePerimeterMm(a, b), 12);
    }
  });

  it('for a flat ellipse (b = 0) gives 14π/11·a, about 0.04 % under the exact 4a (known worst case; figure from memory)', () => {
    expect(ellipsePerimeterMm(1, 0)).toBeCloseTo((14 * Math.PI) / 11, 12);
    expect(Math.abs(ellipsePerimeterMm(1, 0) - 4) / 4).toBeLessThan(4.1e-4);
  });

  it('refuses negative or non-finite axes', () => {
    expect(() => ellipsePerimeterMm(-1, 2)).toThrow(GeometryError);
    expect(() => ellipsePerimeterMm(Number.NaN, 2)).toThrow(/finite and ≥ 0/);
  });
});

describe('headSection and wearerScale', () => {
  // A 64-sided tube of radius 90 mm, 200 mm tall, axis z: vertices at 0°, 90°, 180°, 270° give extents 2r.
  const tube = cylinder(90, 200, 64, 4);

  it('reads a round tube as a circle: circumference 2πr, height h', () => {
    const s = headSection(tube.positions, tube.triangles, { upAxis: 2, heightFraction: 0.5 })!;
    expect(s.widthMm).toBeCloseTo(180, 9);
    expect(s.depthMm).toBeCloseTo(180, 9);
    expect(s.circumferenceMm).toBeCloseTo(2 * Math.PI * 90, 8);
    expect(s.heightMm).toBeCloseTo(200, 9);
    expect(s.atHeightMm).toBeCloseTo(100, 9);
  });

  it('reads an elliptic tube (scaled 1.1 × 0.85) as that ellipse, moved and scaled anywhere', () => {
    for (const [k, t] of [[1, [0, 0, 0]], [0.01, [5, -3, 40]], [25, [-1e3, 2e3, 7]]] as const) {
      const m = transformMesh(tube, { scale: [1.1 * k, 0.85 * k, k], translation: [...t] });
      const s = headSection(m.positions, m.triangles, { upAxis: 2, heightFraction: 0.3 })!;
      const exact = agmPerimeter(99 * k, 76.5 * k);
      expect(Math.abs(s.circumferenceMm - exact) / exact).toBeLessThan(1e-9);
      expect(s.heightMm).toBeCloseTo(200 * k, 6);
    }
  });

  it('returns null for a flat mesh and refuses a fraction outside [0, 1]', () => {
    const flat = Float64Array.from(tube.positions, (v, i) => (i % 3 === 2 ? 0 : v));
    expect(headSection(flat, tube.triangles, { upAxis: 2 })).toBeNull();
    expect(() => headSection(tube.positions, tube.triangles, { heightFraction: 1.5 })).toThrow(/fraction from 0 to 1/);
  });

  it('scales to a head circumference so the section then measures it', () => {
    const s = headSection(tube.positions, tube.triangles, { upAxis: 2 })!;
    const r = wearerScale(s, [180, 180, 200], { headCircumferenceMm: 580 });
    expect(r.factor).toBeCloseTo(580 / (2 * Math.PI * 90), 10);
    expect(r.after.circumferenceMm).toBeCloseTo(580, 9);
    expect(r.after.sizeMm[2]).toBeCloseTo(200 * r.factor, 9);
    expect(r.byHeight).toBeNull();
    expect(r.disagreement).toBeNull();
    // Scaling the mesh by the factor and measuring again gives the head circumference (independent check).
    const scaled = transformMesh(tube, { scale: r.factor });
    expect(headSection(scaled.positions, scaled.triangles, { upAxis: 2 })!.circumferenceMm).toBeCloseTo(580, 8);
  });

  it('takes the geometric mean of two measures and says when they disagree by more than 10 %', () => {
    const s = headSection(tube.positions, tube.triangles, { upAxis: 2 })!;
    const close = wearerScale(s, [180, 180, 200], { headCircumferenceMm: 2 * Math.PI * 90 * 1.05, headHeightMm: 200 * 1.02 });
    expect(close.factor).toBeCloseTo(Math.sqrt(1.05 * 1.02), 10);
    expect(close.disagreement).toBeNull();
    const far = wearerScale(s, [180, 180, 200], { headCircumferenceMm: 2 * Math.PI * 90, headHeightMm: 260 });
    expect(far.disagreement).toMatch(/geometric mean/);
    expect(wearerScale(s, [180, 180, 200], {}).factor).toBe(1);
    expect(() => wearerScale(s, [180, 180, 200], { headHeightMm: -3 })).toThrow(/head height must be a positive/);
  });
});
