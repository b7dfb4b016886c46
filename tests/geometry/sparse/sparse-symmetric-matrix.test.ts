import { describe, expect, it } from 'vitest';
import { isGeometryError } from '../../../geometry/errors';
import { diagonal, fromTriplets, multiply } from '../../../geometry/sparse/sparse-symmetric-matrix';
import { randomSpd } from './dense-reference';

describe('fromTriplets', () => {
  it('folds both triangles onto one symmetric entry and sums duplicates (CSC assembly, Davis 2006 §2.2)', () => {
    // A = [[4, 1, 0], [1, 5, 2], [0, 2, 6]] given as: (0,1) twice with 0.5 each, (2,1) in the lower
    // triangle, the diagonal of row 1 split in two.
    const a = fromTriplets(3, [0, 1, 0, 1, 1, 2, 2], [0, 0, 1, 1, 1, 1, 2], [4, 0.5, 0.5, 2, 3, 2, 6]);
    expect(Array.from(a.colPtr)).toEqual([0, 2, 5, 7]);
    expect(Array.from(a.rowIdx)).toEqual([0, 1, 0, 1, 2, 1, 2]);
    expect(Array.from(a.values)).toEqual([4, 1, 1, 5, 2, 2, 6]);
    expect(Array.from(diagonal(a))).toEqual([4, 5, 6]);
  });

  it('multiplies like the dense matrix it stands for', () => {
    const n = 40;
    const { rows, cols, vals, dense } = randomSpd(n, 120, 11);
    const a = fromTriplets(n, rows, cols, vals);
    const x = new Float64Array(n).map((_, i) => Math.sin(i + 1));
    const y = multiply(a, x);
    for (let i = 0; i < n; i++) {
      let s = 0;
      for (let j = 0; j < n; j++) s += dense[i * n + j] * x[j];
      expect(y[i]).toBeCloseTo(s, 12);
    }
  });

  it('names the bad triplet', () => {
    const bad = (f: () => unknown, code: string, text: string): void => {
      try {
        f();
        expect.unreachable();
      } catch (e) {
        expect(isGeometryError(e)).toBe(true);
        expect((e as { code: string }).code).toBe(code);
        expect((e as Error).message).toContain(text);
      }
    };
    bad(() => fromTriplets(2, [0, 2], [0, 0], [1, 1]), 'INDEX_OUT_OF_RANGE', 'triplet 1');
    bad(() => fromTriplets(2, [0, 1], [0, 1], [1, NaN]), 'NON_FINITE', 'triplet 1');
    bad(() => fromTriplets(2, [0], [0, 1], [1]), 'BAD_OPTION', 'differ in length');
    bad(() => fromTriplets(-1, [], [], []), 'BAD_OPTION', 'non-negative');
  });
});
