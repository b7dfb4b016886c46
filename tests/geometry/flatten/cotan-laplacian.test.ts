import { describe, expect, it } from 'vitest';
import { cotanLaplacian } from '../../../geometry/flatten/cotan-laplacian';
import { cotanWeights } from '../../../geometry/flatten/cotan-weights';
import { fromTriplets, type SparseSymmetricMatrix } from '../../../geometry/sparse/sparse-symmetric-matrix';
import { gridPiece } from './test-meshes';

function entry(a: SparseSymmetricMatrix, row: number, col: number): number {
  for (let p = a.colPtr[col]; p < a.colPtr[col + 1]; p++) if (a.rowIdx[p] === row) return a.values[p];
  return 0;
}

describe('cotanLaplacian', () => {
  it('is the five-point stencil on a flat square grid split into right triangles', () => {
    // Known result: on a uniform square grid cut along one diagonal per cell the cotangent weights of the
    // diagonals vanish (both opposite angles are 90°) and each axis edge gets ½(cot 45° + cot 45°) = 1, so an
    // interior row is the finite-difference Laplacian 4, −1, −1, −1, −1 (Pinkall & Polthier 1993; stated
    // from memory as in Botsch et al. 2010, "Polygon Mesh Processing", §3.3).
    const k = 4;
    const { positions, triangles } = gridPiece(k, 2.5);
    const L = cotanLaplacian(triangles, cotanWeights(positions, triangles), positions.length / 3);
    for (let i = 1; i < k; i++) {
      for (let j = 1; j < k; j++) {
        const v = i * (k + 1) + j;
        expect(entry(L, v, v)).toBeCloseTo(4, 12);
        for (const n of [v - 1, v + 1, v - (k + 1), v + (k + 1)]) expect(entry(L, n, v)).toBeCloseTo(-1, 12);
        for (const n of [v + k + 2, v - (k + 2)]) expect(Math.abs(entry(L, n, v))).toBeLessThan(1e-12);
      }
    }
  });

  it('matches the general triplet assembly to the last bit on a curved piece', () => {
    // Reference: the same definition assembled by fromTriplets (one diagonal term per end of every half-edge,
    // one off-diagonal term per half-edge), which sums repeated entries in the same half-edge order.
    const { positions, triangles } = gridPiece(7, 3, (x, y) => 0.05 * x * y - 0.1 * x * x + Math.sin(y));
    const nv = positions.length / 3;
    const cot = cotanWeights(positions, triangles);
    const nh = triangles.length;
    const rows = new Int32Array(3 * nh);
    const cols = new Int32Array(3 * nh);
    const vals = new Float64Array(3 * nh);
    let t = 0;
    for (let h = 0; h < nh; h++) {
      const a = triangles[h];
      const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
      const w = 0.5 * cot[h];
      rows[t] = a;
      cols[t] = a;
      vals[t++] = w;
      rows[t] = b;
      cols[t] = b;
      vals[t++] = w;
      rows[t] = a;
      cols[t] = b;
      vals[t++] = -w;
    }
    const reference = fromTriplets(nv, rows, cols, vals);
    const L = cotanLaplacian(triangles, cot, nv);
    expect(Array.from(L.colPtr)).toEqual(Array.from(reference.colPtr));
    expect(Array.from(L.rowIdx)).toEqual(Array.from(reference.rowIdx));
    expect(Array.from(L.values)).toEqual(Array.from(reference.values));
    // Every row of a Laplacian sums to zero (constants are in its kernel).
    for (let c = 0; c < nv; c++) {
      let sum = 0;
      let scale = 0;
      for (let p = L.colPtr[c]; p < L.colPtr[c + 1]; p++) {
        sum += L.values[p];
        scale = Math.max(scale, Math.abs(L.values[p]));
      }
      expect(Math.abs(sum)).toBeLessThan(1e-12 * scale);
    }
  });
});
