import { GeometryError } from '../errors';
import { amdOrdering } from './fill-ordering';
import { fromTriplets, type SparseSymmetricMatrix } from './sparse-symmetric-matrix';

/**
 * Block LDLᵀ factor of a symmetric positive definite matrix whose unknowns come in pairs (2b, 2b+1) —
 * the u and v of one vertex in a flattening system: P·A·Pᵀ = L·D·Lᵀ with 2×2 blocks, L unit block lower
 * triangular, D block diagonal. Same algorithm as CholeskyFactor on the graph of the blocks, so index work
 * is paid once per four numbers. Built by `choleskyFactor2x2`; `solve` may be called many times.
 */
export class Cholesky2x2Factor {
  /** Stored off-diagonal 2×2 blocks of L. */
  readonly nnzBlocks: number;

  constructor(
    /** Scalar size (twice the number of blocks). */
    readonly n: number,
    /** blockPerm[k] = original block of the k-th block pivot. */
    readonly blockPerm: Int32Array,
    private readonly lp: Int32Array,
    private readonly li: Int32Array,
    /** Four numbers per stored block, row-major. */
    private readonly lx: Float64Array,
    /** Inverse of each diagonal block, row-major (4 per block). */
    private readonly dinv: Float64Array,
    private readonly work: Float64Array,
  ) {
    this.nnzBlocks = lp[lp.length - 1];
  }

  /** Returns x with A·x = b (length n); `out` (length n) receives x when given and may be `b`. */
  solve(b: Float64Array, out?: Float64Array): Float64Array {
    const { n, blockPerm, lp, li, lx, dinv } = this;
    if (b.length !== n) {
      throw new GeometryError('BAD_OPTION', `right-hand side has length ${b.length}, the factor is ${n}×${n}`);
    }
    const nb = n >> 1;
    const y = this.work;
    for (let k = 0; k < nb; k++) {
      y[2 * k] = b[2 * blockPerm[k]];
      y[2 * k + 1] = b[2 * blockPerm[k] + 1];
    }
    for (let j = 0; j < nb; j++) {
      const y0 = y[2 * j];
      const y1 = y[2 * j + 1];
      if (y0 === 0 && y1 === 0) continue;
      for (let p = lp[j]; p < lp[j + 1]; p++) {
        const r = 2 * li[p];
        const q = 4 * p;
        y[r] -= lx[q] * y0 + lx[q + 1] * y1;
        y[r + 1] -= lx[q + 2] * y0 + lx[q + 3] * y1;
      }
    }
    for (let j = 0; j < nb; j++) {
      const y0 = y[2 * j];
      const y1 = y[2 * j + 1];
      y[2 * j] = dinv[4 * j] * y0 + dinv[4 * j + 1] * y1;
      y[2 * j + 1] = dinv[4 * j + 2] * y0 + dinv[4 * j + 3] * y1;
    }
    for (let j = nb - 1; j >= 0; j--) {
      let y0 = y[2 * j];
      let y1 = y[2 * j + 1];
      for (let p = lp[j]; p < lp[j + 1]; p++) {
        const r = 2 * li[p];
        const q = 4 * p;
        y0 -= lx[q] * y[r] + lx[q + 2] * y[r + 1];
        y1 -= lx[q + 1] * y[r] + lx[q + 3] * y[r + 1];
      }
      y[2 * j] = y0;
      y[2 * j + 1] = y1;
    }
    const x = out ?? new Float64Array(n);
    for (let k = 0; k < nb; k++) {
      x[2 * blockPerm[k]] = y[2 * k];
      x[2 * blockPerm[k] + 1] = y[2 * k + 1];
    }
    return x;
  }
}

/**
 * Returns the 2×2-block LDLᵀ factor of the symmetric positive definite `a` (even size n, unknowns paired as
 * (2b, 2b+1)). `blockOrdering` orders the n/2 blocks (default: amdOrdering of the block graph). Up-looking
 * block elimination over the block elimination tree (Davis 2006, "Direct Methods for Sparse Linear Systems",
 * §4.1, with scalars replaced by 2×2 blocks: row k solves L·Z = A(:,k), L_ki = Z_iᵀ·D_i⁻¹,
 * D_k = A_kk − Σ L_ki·Z_i). Throws GeometryError NOT_POSITIVE_DEFINITE naming the original block whose
 * pivot block is not positive definite, BAD_OPTION for an odd size or a malformed ordering.
 */
export function choleskyFactor2x2(a: SparseSymmetricMatrix, blockOrdering?: Int32Array): Cholesky2x2Factor {
  const n = a.n;
  if (n % 2 !== 0) throw new GeometryError('BAD_OPTION', `a 2×2-block factor needs an even size, got ${n}`);
  const nb = n / 2;
  const { colPtr, rowIdx, values } = a;
  const perm = blockOrdering ?? amdOrdering(blockGraph(a));
  if (perm.length !== nb) {
    throw new GeometryError('BAD_OPTION', `block ordering has length ${perm.length}, the matrix has ${nb} blocks`);
  }
  const pinv = new Int32Array(nb).fill(-1);
  for (let k = 0; k < nb; k++) {
    const j = perm[k];
    if (j < 0 || j >= nb || pinv[j] !== -1) {
      throw new GeometryError('BAD_OPTION', `block ordering is not a permutation: entry ${k} is ${j}`);
    }
    pinv[j] = k;
  }

  // Symbolic: block elimination tree and block counts per column of L.
  const parent = new Int32Array(nb);
  const flag = new Int32Array(nb);
  const lnz = new Int32Array(nb);
  for (let k = 0; k < nb; k++) {
    parent[k] = -1;
    flag[k] = k;
    const j = perm[k];
    for (let c = 2 * j; c <= 2 * j + 1; c++) {
      for (let p = colPtr[c]; p < colPtr[c + 1]; p++) {
        let i = pinv[rowIdx[p] >> 1];
        if (i >= k) continue;
        for (; flag[i] !== k; i = parent[i]) {
          if (parent[i] === -1) parent[i] = k;
          lnz[i]++;
          flag[i] = k;
        }
      }
    }
  }
  const lp = new Int32Array(nb + 1);
  for (let k = 0; k < nb; k++) lp[k + 1] = lp[k] + lnz[k];
  const li = new Int32Array(lp[nb]);
  const lx = new Float64Array(4 * lp[nb]);
  const dinv = new Float64Array(4 * nb);
  const y = new Float64Array(4 * nb);
  const pattern = new Int32Array(nb);

  lnz.fill(0);
  for (let k = 0; k < nb; k++) {
    let top = nb;
    flag[k] = k;
    const j = perm[k];
    // Scatter block column k of P·A·Pᵀ (rows ≤ k) into Y, 2×2 per block, and collect its row pattern.
    for (let c = 0; c < 2; c++) {
      const col = 2 * j + c;
      for (let p = colPtr[col]; p < colPtr[col + 1]; p++) {
        const r = rowIdx[p];
        let i = pinv[r >> 1];
        if (i > k) continue;
        y[4 * i + 2 * (r & 1) + c] += values[p];
        let len = 0;
        for (; flag[i] !== k; i = parent[i]) {
          pattern[len++] = i;
          flag[i] = k;
        }
        while (len > 0) pattern[--top] = pattern[--len];
      }
    }
    let d00 = y[4 * k];
    let d01 = y[4 * k + 1];
    let d10 = y[4 * k + 2];
    let d11 = y[4 * k + 3];
    const scale = Math.max(Math.abs(d00), Math.abs(d11));
    y[4 * k] = y[4 * k + 1] = y[4 * k + 2] = y[4 * k + 3] = 0;
    for (; top < nb; top++) {
      const i = pattern[top];
      // Z_i = Y_i (final now that all earlier blocks of the pattern are done).
      const z00 = y[4 * i];
      const z01 = y[4 * i + 1];
      const z10 = y[4 * i + 2];
      const z11 = y[4 * i + 3];
      y[4 * i] = y[4 * i + 1] = y[4 * i + 2] = y[4 * i + 3] = 0;
      const pEnd = lp[i] + lnz[i];
      for (let p = lp[i]; p < pEnd; p++) {
        const r = 4 * li[p];
        const q = 4 * p;
        const l00 = lx[q];
        const l01 = lx[q + 1];
        const l10 = lx[q + 2];
        const l11 = lx[q + 3];
        y[r] -= l00 * z00 + l01 * z10;
        y[r + 1] -= l00 * z01 + l01 * z11;
        y[r + 2] -= l10 * z00 + l11 * z10;
        y[r + 3] -= l10 * z01 + l11 * z11;
      }
      // L_ki = Z_iᵀ·D_i⁻¹, then D_k −= L_ki·Z_i.
      const q = 4 * pEnd;
      const e00 = dinv[4 * i];
      const e01 = dinv[4 * i + 1];
      const e10 = dinv[4 * i + 2];
      const e11 = dinv[4 * i + 3];
      const l00 = z00 * e00 + z10 * e10;
      const l01 = z00 * e01 + z10 * e11;
      const l10 = z01 * e00 + z11 * e10;
      const l11 = z01 * e01 + z11 * e11;
      li[pEnd] = k;
      lx[q] = l00;
      lx[q + 1] = l01;
      lx[q + 2] = l10;
      lx[q + 3] = l11;
      lnz[i]++;
      d00 -= l00 * z00 + l01 * z10;
      d01 -= l00 * z01 + l01 * z11;
      d10 -= l10 * z00 + l11 * z10;
      d11 -= l10 * z01 + l11 * z11;
    }
    // Symmetrise against rounding, then require a positive definite 2×2 pivot (Sylvester's criterion: d00 > 0
    // and det > 0, i.e. both scalar pivots d00 and det/d00 positive), each above the scalar factor's 1e-13
    // relative floor.
    const off = 0.5 * (d01 + d10);
    const det = d00 * d11 - off * off;
    if (!(d00 > 1e-13 * scale) || !(det > 1e-13 * scale * d00) || !Number.isFinite(det)) {
      throw new GeometryError(
        'NOT_POSITIVE_DEFINITE',
        `matrix is not positive definite: 2×2 pivot [[${d00.toExponential(3)}, ${off.toExponential(3)}], [${off.toExponential(3)}, ${d11.toExponential(3)}]] at columns ${2 * j}–${2 * j + 1} (block step ${k})`,
      );
    }
    dinv[4 * k] = d11 / det;
    dinv[4 * k + 1] = dinv[4 * k + 2] = -off / det;
    dinv[4 * k + 3] = d00 / det;
  }
  return new Cholesky2x2Factor(n, perm, lp, li, lx, dinv, new Float64Array(n));
}

/** The pattern of the blocks of `a` as an (n/2)×(n/2) symmetric matrix (values 1), for ordering. */
function blockGraph(a: SparseSymmetricMatrix): SparseSymmetricMatrix {
  const rows: number[] = [];
  const cols: number[] = [];
  for (let c = 0; c < a.n; c += 2) {
    for (let cc = c; cc <= c + 1; cc++) {
      for (let p = a.colPtr[cc]; p < a.colPtr[cc + 1]; p++) {
        const r = a.rowIdx[p] >> 1;
        if (r <= c >> 1) {
          rows.push(r);
          cols.push(c >> 1);
        }
      }
    }
  }
  return fromTriplets(a.n >> 1, rows, cols, new Float64Array(rows.length).fill(1));
}
