import { describe, expect, it } from 'vitest';
import { triangleStretch } from '../../../geometry/flatten/triangle-stretch';

// One 3D triangle, tilted out of every coordinate plane, and its isometric layout in the plane.
const tri = Uint32Array.of(0, 1, 2);
const p = Float64Array.of(1, 2, 3, 4, 2, 7, 1, 6, 3); // edges (3,0,4) and (0,4,0): perpendicular, 5 and 4 long
const iso = Float64Array.of(0, 0, 5, 0, 0, 4);

function mapped(m: [number, number, number, number]): Float64Array {
  const out = new Float64Array(6);
  for (let v = 0; v < 3; v++) {
    out[2 * v] = m[0] * iso[2 * v] + m[1] * iso[2 * v + 1];
    out[2 * v + 1] = m[2] * iso[2 * v] + m[3] * iso[2 * v + 1];
  }
  return out;
}

describe('triangleStretch', () => {
  it('is zero for an isometric layout, under any rotation of the plane', () => {
    for (const t of [0, 0.7, 2.5]) {
      const s = triangleStretch(p, tri, mapped([Math.cos(t), -Math.sin(t), Math.sin(t), Math.cos(t)]));
      expect(s.sigmaMax[0]).toBeCloseTo(1, 12);
      expect(s.sigmaMin[0]).toBeCloseTo(1, 12);
      expect(s.summary.maxPct).toBeLessThan(1e-10);
      expect(s.summary.flipped).toBe(0);
    }
  });

  it('gives the singular values of a known linear map (Sander et al. 2001, §3)', () => {
    // Uniform scale 1.1: σ1 = σ2 = 1.1, so 10 %.
    const scaled = triangleStretch(p, tri, mapped([1.1, 0, 0, 1.1]));
    expect(scaled.pct[0]).toBeCloseTo(10, 10);
    // Axis stretch diag(1.03, 0.98): σ = 1.03 and 0.98, so max(3 %, 2 %) = 3 %.
    const axes = triangleStretch(p, tri, mapped([1.03, 0, 0, 0.98]));
    expect(axes.sigmaMax[0]).toBeCloseTo(1.03, 12);
    expect(axes.sigmaMin[0]).toBeCloseTo(0.98, 12);
    expect(axes.pct[0]).toBeCloseTo(3, 10);
    // Shear [[1, k], [0, 1]]: AᵀA has trace 2 + k² and determinant 1, so σ1·σ2 = 1 and σ1 − σ2 = k,
    // giving σ = (√(k² + 4) ± k)/2 (singular values as square roots of the eigenvalues of AᵀA; Golub &
    // Van Loan, "Matrix Computations", 4th ed., §2.4). k = 0.3.
    const k = 0.3;
    const shear = triangleStretch(p, tri, mapped([1, k, 0, 1]));
    expect(shear.sigmaMax[0]).toBeCloseTo((Math.sqrt(k * k + 4) + k) / 2, 12);
    expect(shear.sigmaMin[0]).toBeCloseTo((Math.sqrt(k * k + 4) - k) / 2, 12);
  });

  it('counts a mirrored triangle as flipped with stretch of at least 100 %', () => {
    const s = triangleStretch(p, tri, mapped([-1, 0, 0, 1]));
    expect(s.summary.flipped).toBe(1);
    expect(s.sigmaMin[0]).toBeCloseTo(-1, 12);
    expect(s.pct[0]).toBeCloseTo(200, 10);
  });

  it('weights the RMS by 3D area', () => {
    // Two triangles: the second is 4× the area of the first (every coordinate doubled), stretched 2 % vs 10 %.
    const pos = Float64Array.of(0, 0, 0, 1, 0, 0, 0, 1, 0, 0, 0, 5, 2, 0, 5, 0, 2, 5);
    const tris = Uint32Array.of(0, 1, 2, 3, 4, 5);
    const uv = Float64Array.of(0, 0, 1.1, 0, 0, 1.1, 10, 0, 10 + 2 * 1.02, 0, 10, 2 * 1.02);
    const s = triangleStretch(pos, tris, uv);
    expect(s.summary.maxPct).toBeCloseTo(10, 9);
    // √((1·10² + 4·2²)/5) = √23.2
    expect(s.summary.rmsPct).toBeCloseTo(Math.sqrt(23.2), 9);
  });

  it('rejects a flattening of the wrong size and a zero-area triangle', () => {
    expect(() => triangleStretch(p, tri, new Float64Array(4))).toThrow(/has 4 values, the piece has 3 vertices/);
    const flat = Float64Array.of(0, 0, 0, 1, 1, 1, 2, 2, 2);
    expect(() => triangleStretch(flat, tri, new Float64Array(6))).toThrow(/triangle 0 has zero area/);
  });
});
