import { describe, expect, it } from 'vitest';
import { isGeometryError } from '../../../geometry/errors';
import { choleskyFactor } from '../../../geometry/sparse/cholesky';
import { amdOrdering } from '../../../geometry/sparse/fill-ordering';
import { pcgSolve } from '../../../geometry/sparse/pcg';
import { fromTriplets, multiply } from '../../../geometry/sparse/sparse-symmetric-matrix';
import { denseSolve, gridLaplacian, parkMiller, randomSpd } from './dense-reference';

const natural = (n: number): Int32Array => Int32Array.from({ length: n }, (_, i) => i);

describe('choleskyFactor', () => {
  it.each([
    [30, 60, 1],
    [120, 400, 2],
    [250, 1200, 3],
  ])('solves random SPD systems like dense Gaussian elimination (n=%i)', (n, off, seed) => {
    const { rows, cols, vals, dense } = randomSpd(n, off, seed);
    const a = fromTriplets(n, rows, cols, vals);
    const rnd = parkMiller(seed + 100);
    const b = new Float64Array(n).map(() => rnd() - 0.5);
    // Reference: Golub & Van Loan Algorithm 3.4.1 (see dense-reference.ts). The matrices are diagonally
    // dominant, so condition numbers stay below ~100 and 1e-10 is far above rounding (n·eps·cond).
    const expected = denseSolve(dense, b, n);
    const factor = choleskyFactor(a);
    const x = factor.solve(b);
    for (let i = 0; i < n; i++) expect(Math.abs(x[i] - expected[i])).toBeLessThan(1e-10);
    // Factor once, solve many: a second right-hand side through the same factor, written into `out`.
    const b2 = new Float64Array(n).map((_, i) => Math.cos(i));
    const out = new Float64Array(n);
    factor.solve(b2, out);
    const expected2 = denseSolve(dense, b2, n);
    for (let i = 0; i < n; i++) expect(Math.abs(out[i] - expected2[i])).toBeLessThan(1e-10);
  });

  it('solves two right-hand sides at once, each bit for bit as solve does and as dense elimination', () => {
    const n = 120;
    const { rows, cols, vals, dense } = randomSpd(n, 400, 7);
    const factor = choleskyFactor(fromTriplets(n, rows, cols, vals));
    const rnd = parkMiller(17);
    // The second vector has zeros where the first has none and the reverse, so every skip path is taken.
    const a = new Float64Array(n).map((_, i) => (i % 3 === 0 ? 0 : rnd() - 0.5));
    const b = new Float64Array(n).map((_, i) => (i % 3 === 1 ? 0 : rnd() - 0.5));
    const outA = new Float64Array(n);
    const outB = new Float64Array(n);
    factor.solvePair(a, b, outA, outB);
    expect(Array.from(outA)).toEqual(Array.from(factor.solve(a)));
    expect(Array.from(outB)).toEqual(Array.from(factor.solve(b)));
    // Reference: Golub & Van Loan Algorithm 3.4.1 (dense-reference.ts), as above.
    const ea = denseSolve(dense, a, n);
    const eb = denseSolve(dense, b, n);
    for (let i = 0; i < n; i++) {
      expect(Math.abs(outA[i] - ea[i])).toBeLessThan(1e-10);
      expect(Math.abs(outB[i] - eb[i])).toBeLessThan(1e-10);
    }
    expect(() => factor.solvePair(a, new Float64Array(n - 1), outA, outB)).toThrow(/second right-hand side has length 119/);
  });

  it('solves the grid Laplacian + I against its closed-form eigenvectors', () => {
    // The k×k grid graph Laplacian is diagonalised by products of DCT-II vectors
    // φ(i, j) = cos(π p (i + ½)/k)·cos(π q (j + ½)/k) with eigenvalue 4 sin²(πp/2k) + 4 sin²(πq/2k)
    // (Strang 1999, "The discrete cosine transform", SIAM Review 41, §2). So (L + I)x = φ has x = φ/(1 + λ).
    const k = 40;
    const { rows, cols, vals } = gridLaplacian(k, 1);
    const factor = choleskyFactor(fromTriplets(k * k, rows, cols, vals));
    for (const [p, q] of [
      [0, 0],
      [1, 0],
      [3, 7],
      [39, 39],
    ]) {
      const lambda = 4 * Math.sin((Math.PI * p) / (2 * k)) ** 2 + 4 * Math.sin((Math.PI * q) / (2 * k)) ** 2;
      const phi = new Float64Array(k * k);
      for (let i = 0; i < k; i++) {
        for (let j = 0; j < k; j++) {
          phi[i * k + j] = Math.cos((Math.PI * p * (i + 0.5)) / k) * Math.cos((Math.PI * q * (j + 0.5)) / k);
        }
      }
      const x = factor.solve(phi);
      for (let v = 0; v < k * k; v++) expect(x[v]).toBeCloseTo(phi[v] / (1 + lambda), 12);
    }
  });

  it('reduces fill against the natural order on a grid Laplacian (nnz(L) reported)', () => {
    // Natural (row-by-row) order on a k×k grid fills the whole envelope: every column but the last k has
    // k entries below the diagonal, so nnz(L) ≥ (n − k)·k = 212,400 for k = 60 (George & Liu 1981,
    // "Computer Solution of Large Sparse Positive Definite Systems", ch. 4, envelope methods); nested
    // dissection gives O(n log n) (George 1973, SIAM J. Numer. Anal. 10).
    const k = 60;
    const { rows, cols, vals } = gridLaplacian(k, 1e-3);
    const a = fromTriplets(k * k, rows, cols, vals);
    const nnzNatural = choleskyFactor(a, natural(k * k)).nnzL;
    const nnzOrdered = choleskyFactor(a, amdOrdering(a)).nnzL;
    console.info(`nnz(L) on a ${k}×${k} grid: natural ${nnzNatural}, fill-reducing ${nnzOrdered}`);
    expect(nnzNatural).toBeGreaterThanOrEqual((k * k - k) * k);
    expect(nnzOrdered).toBeLessThan(nnzNatural / 3);
  });

  it('returns an ordering that is a permutation, the same on every call', () => {
    const { rows, cols, vals } = gridLaplacian(25, 1);
    const a = fromTriplets(625, rows, cols, vals);
    const p = amdOrdering(a);
    expect(Array.from(p).sort((x, y) => x - y)).toEqual(Array.from(natural(625)));
    expect(Array.from(amdOrdering(a))).toEqual(Array.from(p));
  });

  it('reports NOT_POSITIVE_DEFINITE with the failing column on an indefinite matrix', () => {
    // [[1, 2], [2, 1]] has eigenvalues 3 and −1 (trace 2, determinant −3): the second pivot is 1 − 4 = −3.
    try {
      choleskyFactor(fromTriplets(2, [0, 0, 1], [0, 1, 1], [1, 2, 1]), natural(2));
      expect.unreachable();
    } catch (e) {
      expect(isGeometryError(e)).toBe(true);
      expect((e as { code: string }).code).toBe('NOT_POSITIVE_DEFINITE');
      expect((e as Error).message).toContain('column 1');
      expect((e as Error).message).toContain('-3.000e+0');
    }
    // A grid Laplacian with nothing pinned is singular (constants are in its kernel, Botsch et al. 2010).
    const { rows, cols, vals } = gridLaplacian(10, 0);
    expect(() => choleskyFactor(fromTriplets(100, rows, cols, vals))).toThrow(/not positive definite/);
  });

  it('rejects an ordering that is not a permutation', () => {
    const a = fromTriplets(3, [0, 1, 2], [0, 1, 2], [1, 1, 1]);
    expect(() => choleskyFactor(a, Int32Array.of(0, 0, 2))).toThrow(/not a permutation: entry 1/);
    expect(() => choleskyFactor(a, Int32Array.of(0, 1))).toThrow(/length 2/);
    expect(() => choleskyFactor(a).solve(new Float64Array(2))).toThrow(/length 2/);
  });
});

describe('pcgSolve', () => {
  it('agrees with the Cholesky solve on the grid Laplacian + I and on a random SPD matrix', () => {
    const { rows, cols, vals } = gridLaplacian(30, 0.5);
    const a = fromTriplets(900, rows, cols, vals);
    const b = new Float64Array(900).map((_, i) => Math.sin(0.1 * i));
    const direct = choleskyFactor(a).solve(b);
    const iter = pcgSolve(a, b, { tol: 1e-12, preconditioner: 'jacobi' });
    // Relative residual 1e-12 and cond(L + ½I) ≤ 17 bound the error by 2e-11 relative (Saad 2003, §6.11).
    for (let i = 0; i < 900; i++) expect(Math.abs(iter.x[i] - direct[i])).toBeLessThan(1e-9);
    const r = multiply(a, iter.x);
    let res = 0;
    let bn = 0;
    for (let i = 0; i < 900; i++) {
      res += (r[i] - b[i]) ** 2;
      bn += b[i] ** 2;
    }
    expect(Math.sqrt(res / bn)).toBeLessThanOrEqual(1e-12);
    expect(iter.relativeResidual).toBeLessThanOrEqual(1e-12);

    const spd = randomSpd(200, 800, 9);
    const m = fromTriplets(200, spd.rows, spd.cols, spd.vals);
    const b2 = new Float64Array(200).map((_, i) => (i % 7) - 3);
    const x2 = pcgSolve(m, b2, { tol: 1e-13, preconditioner: 'none' }).x;
    const ref = denseSolve(spd.dense, b2, 200);
    for (let i = 0; i < 200; i++) expect(Math.abs(x2[i] - ref[i])).toBeLessThan(1e-9);
  });

  it('says when it runs out of iterations or meets negative curvature', () => {
    const { rows, cols, vals } = gridLaplacian(30, 0.01);
    const a = fromTriplets(900, rows, cols, vals);
    const b = new Float64Array(900).fill(1).map((_, i) => (i % 2 ? 1 : -1));
    expect(() => pcgSolve(a, b, { maxIter: 3 })).toThrow(/stopped after 3 iterations/);
    const indefinite = fromTriplets(2, [0, 0, 1], [0, 1, 1], [1, 2, 1]);
    expect(() => pcgSolve(indefinite, Float64Array.of(1, -1), { preconditioner: 'none' })).toThrow(
      /not positive definite/,
    );
  });
});
