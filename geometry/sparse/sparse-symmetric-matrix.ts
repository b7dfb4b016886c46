import { GeometryError } from '../errors';

/**
 * A real symmetric n×n matrix in compressed sparse column form (Davis 2006, "Direct Methods for Sparse
 * Linear Systems", §2.2), holding BOTH triangles so that a product, a column scan and the adjacency
 * graph need no special cases. Within each column the row indices are strictly increasing.
 */
export interface SparseSymmetricMatrix {
  readonly n: number;
  /** Length n+1: column j's entries are at [colPtr[j], colPtr[j+1]). */
  readonly colPtr: Int32Array;
  /** Row index of each stored entry, ascending within a column. */
  readonly rowIdx: Int32Array;
  readonly values: Float64Array;
}

/**
 * Builds a symmetric CSC matrix from triplets (i, j, v), summing duplicates (Davis 2006, cs_compress
 * and cs_dupl). The triplets describe ONE triangle of the matrix: an off-diagonal triplet (i, j, v) adds
 * v to both A[i][j] and A[j][i], whichever triangle it is written in, so a caller assembling element
 * matrices lists each off-diagonal pair once per element. Arguments are three arrays of equal length;
 * indices are integers in [0, n), values finite. Throws GeometryError INDEX_OUT_OF_RANGE / NON_FINITE /
 * BAD_OPTION naming the offending triplet.
 */
export function fromTriplets(
  n: number,
  rows: ArrayLike<number>,
  cols: ArrayLike<number>,
  vals: ArrayLike<number>,
): SparseSymmetricMatrix {
  if (!Number.isInteger(n) || n < 0) {
    throw new GeometryError('BAD_OPTION', `matrix size must be a non-negative integer, got ${n}`);
  }
  const t = rows.length;
  if (cols.length !== t || vals.length !== t) {
    throw new GeometryError(
      'BAD_OPTION',
      `triplet arrays differ in length: rows ${t}, cols ${cols.length}, values ${vals.length}`,
    );
  }
  // Expand to both triangles, counting entries per row for a first counting sort.
  let expanded = 0;
  for (let k = 0; k < t; k++) {
    const i = rows[k];
    const j = cols[k];
    if (!Number.isInteger(i) || !Number.isInteger(j) || i < 0 || j < 0 || i >= n || j >= n) {
      throw new GeometryError('INDEX_OUT_OF_RANGE', `triplet ${k}: index (${i}, ${j}) is outside a ${n}×${n} matrix`);
    }
    if (!Number.isFinite(vals[k])) {
      throw new GeometryError('NON_FINITE', `triplet ${k}: value ${vals[k]} at (${i}, ${j}) is not finite`);
    }
    expanded += i === j ? 1 : 2;
  }
  const er = new Int32Array(expanded);
  const ec = new Int32Array(expanded);
  const ev = new Float64Array(expanded);
  let e = 0;
  for (let k = 0; k < t; k++) {
    const i = rows[k];
    const j = cols[k];
    er[e] = i;
    ec[e] = j;
    ev[e++] = vals[k];
    if (i !== j) {
      er[e] = j;
      ec[e] = i;
      ev[e++] = vals[k];
    }
  }
  // Two stable counting sorts (by row, then by column) leave rows ascending inside each column.
  const byRow = countingSort(n, er, expanded);
  const colCount = new Int32Array(n + 1);
  for (let q = 0; q < expanded; q++) colCount[ec[q] + 1]++;
  for (let j = 0; j < n; j++) colCount[j + 1] += colCount[j];
  const next = colCount.slice(0, n);
  const sr = new Int32Array(expanded);
  const sv = new Float64Array(expanded);
  for (let q = 0; q < expanded; q++) {
    const src = byRow[q];
    const dst = next[ec[src]]++;
    sr[dst] = er[src];
    sv[dst] = ev[src];
  }
  // Merge duplicates, which are now adjacent within each column.
  const colPtr = new Int32Array(n + 1);
  let nnz = 0;
  for (let j = 0; j < n; j++) {
    colPtr[j] = nnz;
    let last = -1;
    for (let q = colCount[j]; q < colCount[j + 1]; q++) {
      if (sr[q] === last) {
        sv[nnz - 1] += sv[q];
      } else {
        sr[nnz] = sr[q];
        sv[nnz++] = sv[q];
        last = sr[q];
      }
    }
  }
  colPtr[n] = nnz;
  return { n, colPtr, rowIdx: sr.slice(0, nnz), values: sv.slice(0, nnz) };
}

function countingSort(n: number, key: Int32Array, count: number): Int32Array {
  const start = new Int32Array(n + 1);
  for (let q = 0; q < count; q++) start[key[q] + 1]++;
  for (let i = 0; i < n; i++) start[i + 1] += start[i];
  const order = new Int32Array(count);
  for (let q = 0; q < count; q++) order[start[key[q]]++] = q;
  return order;
}

/** Returns y = A·x (length n); `out` may be passed to avoid an allocation. */
export function multiply(a: SparseSymmetricMatrix, x: Float64Array, out?: Float64Array): Float64Array {
  const y = out ?? new Float64Array(a.n);
  y.fill(0);
  const { colPtr, rowIdx, values } = a;
  for (let j = 0; j < a.n; j++) {
    const xj = x[j];
    if (xj === 0) continue;
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) y[rowIdx[p]] += values[p] * xj;
  }
  return y;
}

/** Returns the diagonal of A (length n; zero where no diagonal entry is stored). */
export function diagonal(a: SparseSymmetricMatrix): Float64Array {
  const d = new Float64Array(a.n);
  for (let j = 0; j < a.n; j++) {
    for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) {
      if (a.rowIdx[p] === j) d[j] = a.values[p];
    }
  }
  return d;
}

/**
 * Returns the principal submatrix of `a` on the rows and columns kept by `index` (length n: the new index
 * of each kept row/column, −1 for a dropped one; kept indices must be 0..size−1 in increasing order).
 * Used to remove pinned unknowns from a system.
 */
export function principalSubmatrix(a: SparseSymmetricMatrix, index: Int32Array, size: number): SparseSymmetricMatrix {
  const colPtr = new Int32Array(size + 1);
  let nnz = 0;
  for (let j = 0; j < a.n; j++) {
    if (index[j] < 0) continue;
    for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) if (index[a.rowIdx[p]] >= 0) nnz++;
  }
  const rowIdx = new Int32Array(nnz);
  const values = new Float64Array(nnz);
  let q = 0;
  for (let j = 0; j < a.n; j++) {
    const nj = index[j];
    if (nj < 0) continue;
    colPtr[nj] = q;
    for (let p = a.colPtr[j]; p < a.colPtr[j + 1]; p++) {
      const ni = index[a.rowIdx[p]];
      if (ni < 0) continue;
      rowIdx[q] = ni;
      values[q++] = a.values[p];
    }
  }
  colPtr[size] = q;
  return { n: size, colPtr, rowIdx, values };
}
