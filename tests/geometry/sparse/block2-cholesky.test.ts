import { describe, expect, it } from 'vitest';
import { isGeometryError } from '../../../geometry/errors';
import { choleskyFactor2x2 } from '../../../geometry/sparse/block2-cholesky';
import { choleskyFactor } from '../../../geometry/sparse/cholesky';
import { fromTriplets } from '../../../geometry/sparse/sparse-symmetric-matrix';
import { denseSolve, gridLaplacian, parkMiller, randomSpd } from './dense-reference';

describe('choleskyFactor2x2', () => {
  it.each([
    [40, 100, 4],
    [300, 1500, 5],
  ])('solves random SPD systems (n=%i) like dense Gaussian elimination', (n, off, seed) => {
    // Golub & Van Loan Algorithm 3.4.1 as the reference (dense-reference.ts); diagonally dominant, so
    // well conditioned and 1e-10 is far above rounding. Pairs (2b, 2b+1) are coupled by random entries.
    const { rows, cols, vals, dense } = randomSpd(n, off, seed);
    const a = fromTriplets(n, rows, cols, vals);
    const rnd = parkMiller(seed * 7);
    const b = new Float64Array(n).map(() => rnd() - 0.5);
    const expected = denseSolve(dense, b, n);
    const factor = choleskyFactor2x2(a);
    const x = factor.solve(b);
    for (let i = 0; i < n; i++) expect(Math.abs(x[i] - expected[i])).toBeLessThan(1e-10);
    const again = new Float64Array(n);
    factor.solve(b, again);
    expect(Array.from(again)).toEqual(Array.from(x));
  });

  it('agrees with the scalar factor on two coupled grid Laplacians (an LSCM-shaped system)', () => {
    // [[L + I, S], [Sᵀ, L + I]] interleaved per vertex, S antisymmetric on a few couplings: the shape of the
    // conformal-map system (Lévy et al. 2002). Both factors are exact up to rounding on this
    // well-conditioned matrix.
    const k = 20;
    const lap = gridLaplacian(k, 1);
    const rows: number[] = [];
    const cols: number[] = [];
    const vals: number[] = [];
    for (let t = 0; t < lap.rows.length; t++) {
      for (let c = 0; c < 2; c++) {
        rows.push(2 * lap.rows[t] + c);
        cols.push(2 * lap.cols[t] + c);
        vals.push(lap.vals[t]);
      }
    }
    for (let j = 0; j + 1 < k; j++) {
      rows.push(2 * j, 2 * (j + 1));
      cols.push(2 * (j + 1) + 1, 2 * j + 1);
      vals.push(-0.5, 0.5);
    }
    const a = fromTriplets(2 * k * k, rows, cols, vals);
    const b = new Float64Array(2 * k * k).map((_, i) => Math.cos(0.3 * i));
    const x = choleskyFactor2x2(a).solve(b);
    const y = choleskyFactor(a).solve(b);
    for (let i = 0; i < b.length; i++) expect(Math.abs(x[i] - y[i])).toBeLessThan(1e-11);
  });

  it('reports a 2×2 pivot that is not positive definite, and bad arguments', () => {
    // [[1, 2], [2, 1]] has determinant −3: Sylvester's criterion fails on the first block.
    try {
      choleskyFactor2x2(fromTriplets(2, [0, 0, 1], [0, 1, 1], [1, 2, 1]));
      expect.unreachable();
    } catch (e) {
      expect(isGeometryError(e)).toBe(true);
      expect((e as { code: string }).code).toBe('NOT_POSITIVE_DEFINITE');
      expect((e as Error).message).toContain('columns 0–1');
    }
    const a = fromTriplets(4, [0, 1, 2, 3], [0, 1, 2, 3], [1, 1, 1, 1]);
    expect(() => choleskyFactor2x2(fromTriplets(3, [0], [0], [1]))).toThrow(/even size, got 3/);
    expect(() => choleskyFactor2x2(a, Int32Array.of(1, 1))).toThrow(/not a permutation: entry 1/);
    expect(() => choleskyFactor2x2(a).solve(new Float64Array(3))).toThrow(/length 3/);
  });
});
