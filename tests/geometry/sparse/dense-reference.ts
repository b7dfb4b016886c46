import { fromTriplets, type SparseSymmetricMatrix } from '../../../geometry/sparse/sparse-symmetric-matrix';

/**
 * Test references for the sparse module: a seeded generator and a dense solver written straight from the
 * textbook, independent of the code under test.
 */

/** Park & Miller 1988 ("Random number generators: good ones are hard to find", CACM 31) minimal standard. */
export function parkMiller(seed: number): () => number {
  let s = seed % 2147483647;
  if (s <= 0) s += 2147483646;
  return () => {
    s = (s * 16807) % 2147483647;
    return (s - 1) / 2147483646;
  };
}

/**
 * Solves the dense n×n system M·x = b (M row-major, copied) by Gaussian elimination with partial pivoting
 * (Golub & Van Loan, "Matrix Computations", 4th ed., Algorithm 3.4.1 with back substitution 3.1.2).
 */
export function denseSolve(m: Float64Array, b: Float64Array, n: number): Float64Array {
  const a = Float64Array.from(m);
  const x = Float64Array.from(b);
  for (let k = 0; k < n; k++) {
    let piv = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(a[i * n + k]) > Math.abs(a[piv * n + k])) piv = i;
    if (piv !== k) {
      for (let j = 0; j < n; j++) {
        const t = a[k * n + j];
        a[k * n + j] = a[piv * n + j];
        a[piv * n + j] = t;
      }
      const t = x[k];
      x[k] = x[piv];
      x[piv] = t;
    }
    for (let i = k + 1; i < n; i++) {
      const l = a[i * n + k] / a[k * n + k];
      if (l === 0) continue;
      for (let j = k; j < n; j++) a[i * n + j] -= l * a[k * n + j];
      x[i] -= l * x[k];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    let s = x[i];
    for (let j = i + 1; j < n; j++) s -= a[i * n + j] * x[j];
    x[i] = s / a[i * n + i];
  }
  return x;
}

/** A random sparse symmetric positive definite matrix as triplets (one triangle) plus its dense copy. */
export function randomSpd(
  n: number,
  offDiagonal: number,
  seed: number,
): { rows: number[]; cols: number[]; vals: number[]; dense: Float64Array } {
  const rnd = parkMiller(seed);
  const rows: number[] = [];
  const cols: number[] = [];
  const vals: number[] = [];
  const dense = new Float64Array(n * n);
  const rowSum = new Float64Array(n);
  for (let k = 0; k < offDiagonal; k++) {
    const i = Math.floor(rnd() * n);
    const j = Math.floor(rnd() * n);
    if (i === j) continue;
    const v = rnd() * 2 - 1;
    rows.push(i);
    cols.push(j);
    vals.push(v);
    dense[i * n + j] += v;
    dense[j * n + i] += v;
    rowSum[i] += Math.abs(v);
    rowSum[j] += Math.abs(v);
  }
  // Strict diagonal dominance with a positive diagonal makes a symmetric matrix positive definite
  // (Gershgorin circle theorem; Golub & Van Loan, Theorem 7.2.1).
  for (let i = 0; i < n; i++) {
    const d = rowSum[i] + 0.05 + rnd();
    rows.push(i);
    cols.push(i);
    vals.push(d);
    dense[i * n + i] += d;
  }
  return { rows, cols, vals, dense };
}

/**
 * Triplets of the 2D grid graph Laplacian on a k×k grid (vertex (i, j) at index i·k + j, edges to the 4
 * neighbours) plus `shift`·I, one triangle. This is also the cotangent Laplacian of the grid split into
 * right isosceles triangles: each diagonal is opposite two right angles (cot 90° = 0) and each axis edge
 * is opposite two 45° angles (½(1 + 1) = 1) (Botsch et al. 2010, "Polygon Mesh Processing", §3.3).
 */
export function gridLaplacian(k: number, shift: number): { rows: number[]; cols: number[]; vals: number[] } {
  const rows: number[] = [];
  const cols: number[] = [];
  const vals: number[] = [];
  const deg = new Float64Array(k * k);
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      const v = i * k + j;
      if (j + 1 < k) {
        rows.push(v);
        cols.push(v + 1);
        vals.push(-1);
        deg[v]++;
        deg[v + 1]++;
      }
      if (i + 1 < k) {
        rows.push(v);
        cols.push(v + k);
        vals.push(-1);
        deg[v]++;
        deg[v + k]++;
      }
    }
  }
  for (let v = 0; v < k * k; v++) {
    rows.push(v);
    cols.push(v);
    vals.push(deg[v] + shift);
  }
  return { rows, cols, vals };
}

/** Graph Laplacian + I of an undirected graph given as an edge list. */
export function laplacianOf(n: number, edges: [number, number][]): SparseSymmetricMatrix {
  const rows: number[] = [];
  const cols: number[] = [];
  const vals: number[] = [];
  const deg = new Float64Array(n);
  for (const [a, b] of edges) {
    rows.push(a);
    cols.push(b);
    vals.push(-1);
    deg[a]++;
    deg[b]++;
  }
  for (let v = 0; v < n; v++) {
    rows.push(v);
    cols.push(v);
    vals.push(deg[v] + 1);
  }
  return fromTriplets(n, rows, cols, vals);
}

/** True when `p` holds each of 0…n−1 exactly once. */
export const isPermutation = (p: Int32Array, n: number): boolean =>
  p.length === n && new Set(p).size === n && p.every((v) => v >= 0 && v < n);
