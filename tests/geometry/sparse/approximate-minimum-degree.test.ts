import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { approximateMinimumDegree } from '../../../geometry/sparse/approximate-minimum-degree';
import { choleskyFactor } from '../../../geometry/sparse/cholesky';
import { nestedDissectionOrdering } from '../../../geometry/sparse/nested-dissection';
import { fromTriplets, type SparseSymmetricMatrix } from '../../../geometry/sparse/sparse-symmetric-matrix';
import { gridLaplacian, isPermutation, laplacianOf, parkMiller, randomSpd } from './dense-reference';

describe('approximateMinimumDegree', () => {
  it('orders every tree without fill (Parter 1961: eliminating leaves first creates no new edge)', () => {
    // Minimum degree always finds a vertex of degree ≤ 1 in a forest, so nnz(L) = number of edges.
    for (const seed of [1, 2, 3]) {
      const rnd = parkMiller(seed);
      const n = 500;
      const edges: [number, number][] = [];
      for (let v = 1; v < n; v++) edges.push([Math.floor(rnd() * v), v]);
      const a = laplacianOf(n, edges);
      const p = approximateMinimumDegree(a);
      expect(isPermutation(p, n)).toBe(true);
      expect(choleskyFactor(a, p).nnzL).toBe(n - 1);
    }
    // A star (arrow matrix): the hub must come last, or its elimination fills the whole matrix.
    const star: [number, number][] = Array.from({ length: 99 }, (_, k) => [0, k + 1] as [number, number]);
    const p = approximateMinimumDegree(laplacianOf(100, star));
    expect(choleskyFactor(laplacianOf(100, star), p).nnzL).toBe(99);
  });

  it('handles the trivial cases: empty, diagonal, a clique, disconnected parts', () => {
    expect(approximateMinimumDegree(fromTriplets(0, [], [], [])).length).toBe(0);
    const diag = fromTriplets(5, [0, 1, 2, 3, 4], [0, 1, 2, 3, 4], [1, 1, 1, 1, 1]);
    expect(isPermutation(approximateMinimumDegree(diag), 5)).toBe(true);
    // K_8: every order fills the full lower triangle, 8·7/2 = 28 entries.
    const clique: [number, number][] = [];
    for (let i = 0; i < 8; i++) for (let j = i + 1; j < 8; j++) clique.push([i, j]);
    const k8 = laplacianOf(8, clique);
    expect(choleskyFactor(k8, approximateMinimumDegree(k8)).nnzL).toBe(28);
    // Two grids side by side, not connected: a permutation, and no fill between them.
    const g = gridLaplacian(10, 1);
    const rows = [...g.rows, ...g.rows.map((r) => r + 100)];
    const cols = [...g.cols, ...g.cols.map((c) => c + 100)];
    const twin = fromTriplets(200, rows, cols, [...g.vals, ...g.vals]);
    const p = approximateMinimumDegree(twin);
    expect(isPermutation(p, 200)).toBe(true);
    const single = fromTriplets(100, g.rows, g.cols, g.vals);
    expect(choleskyFactor(twin, p).nnzL).toBeLessThanOrEqual(2 * choleskyFactor(single, approximateMinimumDegree(single)).nnzL);
  });

  it('reduces fill on grid Laplacians and random sparse matrices at least as well as nested dissection', () => {
    // Amestoy, Davis & Duff 1996 (Table 2) find approximate minimum degree within a few percent of exact
    // minimum degree; on 2D meshes of this size both are at or below the nested-dissection fill of
    // George 1973. Checked against this engine's own nested dissection with 10 % slack.
    const cases: SparseSymmetricMatrix[] = [];
    const g = gridLaplacian(60, 1);
    cases.push(fromTriplets(3600, g.rows, g.cols, g.vals));
    for (const seed of [5, 6]) {
      const r = randomSpd(400, 1600, seed);
      cases.push(fromTriplets(400, r.rows, r.cols, r.vals));
    }
    for (const a of cases) {
      const amd = choleskyFactor(a, approximateMinimumDegree(a)).nnzL;
      const nd = choleskyFactor(a, nestedDissectionOrdering(a)).nnzL;
      expect(amd).toBeLessThanOrEqual(1.1 * nd);
    }
    // The 60×60 grid: natural order fills at least (n − k)·k = 212,400 (George & Liu 1981, ch. 4); a
    // fill-reducing order must do several times better (measured: 3.8×; asked: 3×).
    expect(choleskyFactor(cases[0], approximateMinimumDegree(cases[0])).nnzL).toBeLessThan(212400 / 3);
  });

  it('is deterministic', () => {
    const r = randomSpd(300, 1000, 8);
    const a = fromTriplets(300, r.rows, r.cols, r.vals);
    expect(Array.from(approximateMinimumDegree(a))).toEqual(Array.from(approximateMinimumDegree(a)));
  });

  it('returns a permutation for any sparsity pattern, sparse to dense (fast-check, seeded)', () => {
    // Dense patterns overflow the initial workspace and exercise its compaction.
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 120 }),
        fc.array(fc.tuple(fc.nat(), fc.nat()), { maxLength: 3000 }),
        (n, pairs) => {
          const edges = pairs.map(([i, j]) => [i % n, j % n] as [number, number]).filter(([i, j]) => i !== j);
          const p = approximateMinimumDegree(laplacianOf(n, edges));
          expect(isPermutation(p, n)).toBe(true);
        },
      ),
      { seed: 1996, numRuns: 150 },
    );
  });
});
