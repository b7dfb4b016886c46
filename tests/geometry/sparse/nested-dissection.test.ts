import { describe, expect, it } from 'vitest';
import { choleskyFactor } from '../../../geometry/sparse/cholesky';
import { nestedDissectionOrdering } from '../../../geometry/sparse/nested-dissection';
import { fromTriplets } from '../../../geometry/sparse/sparse-symmetric-matrix';
import { gridLaplacian, isPermutation, laplacianOf } from './dense-reference';

describe('nestedDissectionOrdering', () => {
  it('terminates on a graph with few, uneven breadth-first levels (regression: it once looped forever)', () => {
    // Root, 3 children, 10 grandchildren each: levels of 1, 3 and 30 vertices, no level starting in the
    // middle band; the ordering used to push the same part back on its stack without end.
    const edges: [number, number][] = [];
    for (let c = 1; c <= 3; c++) {
      edges.push([0, c]);
      for (let g = 0; g < 10; g++) edges.push([c, 4 + (c - 1) * 10 + g]);
    }
    const p = nestedDissectionOrdering(laplacianOf(34, edges));
    expect(isPermutation(p, 34)).toBe(true);
    // A tree eliminated leaves-first has no fill at all (Parter 1961, "The use of linear graphs in Gauss
    // elimination", SIAM Review 3): nnz(L) = number of edges is the best any order can do; ours stays close.
    const a = laplacianOf(34, edges);
    expect(choleskyFactor(a, p).nnzL).toBeLessThanOrEqual(2 * edges.length);
  });

  it('splits a graph made of many small pieces into all of them at once', () => {
    // 2000 disjoint triangles: no fill is possible and the order must still be a permutation.
    const edges: [number, number][] = [];
    for (let t = 0; t < 2000; t++) edges.push([3 * t, 3 * t + 1], [3 * t + 1, 3 * t + 2], [3 * t, 3 * t + 2]);
    const a = laplacianOf(6000, edges);
    const p = nestedDissectionOrdering(a);
    expect(isPermutation(p, 6000)).toBe(true);
    expect(choleskyFactor(a, p).nnzL).toBe(3 * 2000);
  });

  it('numbers the middle separator of a long strip last', () => {
    // A 3×200 grid: the best single separator is 3 vertices across it near the middle (George 1973); from
    // a corner the breadth-first levels run diagonally, so the 3 may sit on neighbouring rows.
    const k = 3;
    const len = 200;
    const edges: [number, number][] = [];
    for (let i = 0; i < len; i++) {
      for (let j = 0; j < k; j++) {
        const v = i * k + j;
        if (j + 1 < k) edges.push([v, v + 1]);
        if (i + 1 < len) edges.push([v, v + k]);
      }
    }
    const p = nestedDissectionOrdering(laplacianOf(k * len, edges));
    const lastRows = Array.from(p.subarray(p.length - k), (v) => Math.floor(v / k));
    for (const r of lastRows) expect(Math.abs(r - len / 2)).toBeLessThan(len * 0.2);
    expect(Math.max(...lastRows) - Math.min(...lastRows)).toBeLessThanOrEqual(k - 1);
  });

  it('gives the grid Laplacian a fill of O(n log n): at most 40 n for a 100×100 grid', () => {
    // George 1973: nested dissection of a k×k grid fills 31/4·n·log2(n) + O(n) entries at most; for
    // n = 10⁴ that bound is ≈ 1.0·10⁶, and a fill of 40 n = 4·10⁵ is well inside it.
    const { rows, cols, vals } = gridLaplacian(100, 1);
    const a = fromTriplets(10000, rows, cols, vals);
    const nnz = choleskyFactor(a, nestedDissectionOrdering(a)).nnzL;
    expect(nnz).toBeLessThan(40 * 10000);
  });
});
