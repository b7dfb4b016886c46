import { GeometryError } from '../errors';
import { amdOrdering } from './fill-ordering';
import type { SparseSymmetricMatrix } from './sparse-symmetric-matrix';

/**
 * A sparse LDLᵀ factorization P·A·Pᵀ = L·D·Lᵀ of a symmetric positive definite matrix: L unit lower
 * triangular by columns (diagonal not stored), D diagonal, P the fill-reducing permutation. Built once by
 * `choleskyFactor`, then `solve` is called as often as needed (factor once, solve many).
 */
export class CholeskyFactor {
  /** Number of stored off-diagonal entries of L (the fill measure reported by the tests and bench). */
  readonly nnzL: number;

  constructor(
    readonly n: number,
    /** perm[k] = original index of the k-th pivot. */
    readonly perm: Int32Array,
    private readonly lp: Int32Array,
    private readonly li: Int32Array,
    private readonly lx: Float64Array,
    private readonly d: Float64Array,
    private readonly work: Float64Array,
  ) {
    this.nnzL = lp[n];
  }

  /** Second work vector for solvePair, made on first use. */
  private workB: Float64Array | null = null;

  /**
   * Returns x with A·x = b (length n). `out` (length n) receives x when given; it may be `b` itself.
   * Forward substitution with L, division by D, back substitution with Lᵀ (Davis 2006, §4.1, ldl_lsolve,
   * ldl_dsolve, ldl_ltsolve).
   */
  solve(b: Float64Array, out?: Float64Array): Float64Array {
    const { n, perm, lp, li, lx, d } = this;
    if (b.length !== n) {
      throw new GeometryError('BAD_OPTION', `right-hand side has length ${b.length}, the factor is ${n}×${n}`);
    }
    const y = this.work;
    for (let k = 0; k < n; k++) y[k] = b[perm[k]];
    for (let j = 0; j < n; j++) {
      const yj = y[j];
      if (yj === 0) continue;
      for (let p = lp[j]; p < lp[j + 1]; p++) y[li[p]] -= lx[p] * yj;
    }
    for (let j = 0; j < n; j++) y[j] /= d[j];
    for (let j = n - 1; j >= 0; j--) {
      let yj = y[j];
      for (let p = lp[j]; p < lp[j + 1]; p++) yj -= lx[p] * y[li[p]];
      y[j] = yj;
    }
    const x = out ?? new Float64Array(n);
    for (let k = 0; k < n; k++) x[perm[k]] = y[k];
    return x;
  }

  /**
   * Solves A·x = b for two right-hand sides at once (the u and v coordinates of a flattening), writing
   * into `outA` and `outB` (length n each; they may be `a` and `b`). Each result is the same to the last
   * bit as from solve; one pass over L serves both, so the index work is paid once.
   */
  solvePair(a: Float64Array, b: Float64Array, outA: Float64Array, outB: Float64Array): void {
    const { n, perm, lp, li, lx, d } = this;
    for (const [name, v] of [['first', a], ['second', b], ['first output', outA], ['second output', outB]] as const) {
      if (v.length !== n) {
        throw new GeometryError('BAD_OPTION', `${name} right-hand side has length ${v.length}, the factor is ${n}×${n}`);
      }
    }
    const y = this.work;
    if (this.workB === null) this.workB = new Float64Array(n);
    const z = this.workB;
    for (let k = 0; k < n; k++) {
      y[k] = a[perm[k]];
      z[k] = b[perm[k]];
    }
    for (let j = 0; j < n; j++) {
      const yj = y[j];
      const zj = z[j];
      // Skip a zero exactly as solve does, so a zero never turns a −0 into +0 and the results match bitwise.
      if (yj !== 0 && zj !== 0) {
        for (let p = lp[j]; p < lp[j + 1]; p++) {
          const l = lx[p];
          const r = li[p];
          y[r] -= l * yj;
          z[r] -= l * zj;
        }
      } else if (yj !== 0) {
        for (let p = lp[j]; p < lp[j + 1]; p++) y[li[p]] -= lx[p] * yj;
      } else if (zj !== 0) {
        for (let p = lp[j]; p < lp[j + 1]; p++) z[li[p]] -= lx[p] * zj;
      }
    }
    for (let j = 0; j < n; j++) {
      y[j] /= d[j];
      z[j] /= d[j];
    }
    for (let j = n - 1; j >= 0; j--) {
      let yj = y[j];
      let zj = z[j];
      for (let p = lp[j]; p < lp[j + 1]; p++) {
        const l = lx[p];
        const r = li[p];
        yj -= l * y[r];
        zj -= l * z[r];
      }
      y[j] = yj;
      z[j] = zj;
    }
    for (let k = 0; k < n; k++) {
      outA[perm[k]] = y[k];
      outB[perm[k]] = z[k];
    }
  }
}

/**
 * Returns the LDLᵀ factor of the symmetric positive definite matrix `a` (see CholeskyFactor).
 * `ordering` is a permutation (perm[k] = original index of pivot k); by default the engine's
 * fill-reducing ordering `amdOrdering`. Symbolic phase: elimination tree and column counts; numeric
 * phase: up-looking, one row of L per step from a sparse triangular solve whose pattern is the row's
 * reach in the elimination tree (Davis 2006, "Direct Methods for Sparse Linear Systems", SIAM, §4.1
 * and §4.4; the LDL package, Davis 2005, ACM TOMS 31). Throws GeometryError NOT_POSITIVE_DEFINITE naming
 * the original column whose pivot is not positive, BAD_OPTION for a malformed ordering.
 */
export function choleskyFactor(a: SparseSymmetricMatrix, ordering?: Int32Array): CholeskyFactor {
  const n = a.n;
  const perm = ordering ?? amdOrdering(a);
  const pinv = new Int32Array(n).fill(-1);
  if (perm.length !== n) {
    throw new GeometryError('BAD_OPTION', `ordering has length ${perm.length}, the matrix is ${n}×${n}`);
  }
  for (let k = 0; k < n; k++) {
    const j = perm[k];
    if (j < 0 || j >= n || pinv[j] !== -1) {
      throw new GeometryError('BAD_OPTION', `ordering is not a permutation: entry ${k} is ${j}`);
    }
    pinv[j] = k;
  }
  const { colPtr, rowIdx, values } = a;

  // Symbolic: elimination tree and the number of entries in each column of L.
  const parent = new Int32Array(n);
  const flag = new Int32Array(n);
  const lnz = new Int32Array(n);
  for (let k = 0; k < n; k++) {
    parent[k] = -1;
    flag[k] = k;
    const j = perm[k];
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      let i = pinv[rowIdx[p]];
      if (i >= k) continue;
      for (; flag[i] !== k; i = parent[i]) {
        if (parent[i] === -1) parent[i] = k;
        lnz[i]++;
        flag[i] = k;
      }
    }
  }
  const lp = new Int32Array(n + 1);
  for (let k = 0; k < n; k++) lp[k + 1] = lp[k] + lnz[k];
  const li = new Int32Array(lp[n]);
  const lx = new Float64Array(lp[n]);
  const d = new Float64Array(n);
  const y = new Float64Array(n);
  const pattern = new Int32Array(n);

  // Numeric: row k of L solves L(0:k,0:k)·D·l = A(0:k,k) over the row's pattern in topological order.
  lnz.fill(0);
  for (let k = 0; k < n; k++) {
    let top = n;
    flag[k] = k;
    const j = perm[k];
    let akk = 0;
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) {
      let i = pinv[rowIdx[p]];
      if (i > k) continue;
      y[i] += values[p];
      if (i === k) akk = Math.abs(values[p]);
      let len = 0;
      for (; flag[i] !== k; i = parent[i]) {
        pattern[len++] = i;
        flag[i] = k;
      }
      while (len > 0) pattern[--top] = pattern[--len];
    }
    let dk = y[k];
    y[k] = 0;
    for (; top < n; top++) {
      const i = pattern[top];
      const yi = y[i];
      y[i] = 0;
      const pEnd = lp[i] + lnz[i];
      for (let p = lp[i]; p < pEnd; p++) y[li[p]] -= lx[p] * yi;
      const lki = yi / d[i];
      dk -= lki * yi;
      li[pEnd] = k;
      lx[pEnd] = lki;
      lnz[i]++;
    }
    // A pivot lost to rounding (a singular matrix, e.g. a Laplacian with nothing pinned) is reported
    // as well as a negative one: 1e-13 relative to the column's own diagonal is far below the
    // pivots of any well-posed system the engine builds.
    if (!(dk > 1e-13 * akk) || !Number.isFinite(dk)) {
      throw new GeometryError(
        'NOT_POSITIVE_DEFINITE',
        `matrix is not positive definite: pivot ${dk.toExponential(3)} at column ${j} (elimination step ${k})`,
      );
    }
    d[k] = dk;
  }
  return new CholeskyFactor(n, perm, lp, li, lx, d, y);
}
