import type { SparseSymmetricMatrix } from '../sparse/sparse-symmetric-matrix';

/**
 * Returns the cotangent Laplacian of a triangle mesh as a V×V symmetric matrix: L_ab = −½(cot α + cot β)
 * for each edge a–b (α, β the angles opposite it; one of them on a boundary edge), L_aa = −Σ_b L_ab.
 * uᵀLu/2 is the Dirichlet energy ½∫|∇u|² of the piecewise-linear function u (Pinkall & Polthier 1993).
 * `cot` is per half-edge as from cotanWeights; `triangles` 3F with indices < V; V = number of vertices.
 * Assembled straight into compressed columns (rows ascending) rather than through fromTriplets, since
 * trial flattenings of small charts build thousands of these; every entry sums its half-edges' terms in
 * half-edge order, exactly as fromTriplets would, so the numbers are the same to the last bit.
 */
export function cotanLaplacian(triangles: Uint32Array, cot: Float64Array, nv: number): SparseSymmetricMatrix {
  const nh = triangles.length;
  // Each half-edge a→b puts −½cot into column a at row b and into column b at row a: bucket those
  // incidences by column in half-edge order, and sum the diagonal in the same order.
  const diag = new Float64Array(nv);
  const start = new Int32Array(nv + 1);
  for (let h = 0; h < nh; h++) {
    start[triangles[h] + 1]++;
    start[triangles[h - (h % 3) + ((h % 3) + 1) % 3] + 1]++;
  }
  for (let v = 0; v < nv; v++) start[v + 1] += start[v];
  const fill = start.slice(0, nv);
  const rowOf = new Int32Array(2 * nh);
  const valOf = new Float64Array(2 * nh);
  for (let h = 0; h < nh; h++) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    const w = 0.5 * cot[h];
    diag[a] += w;
    diag[b] += w;
    let q = fill[a]++;
    rowOf[q] = b;
    valOf[q] = -w;
    q = fill[b]++;
    rowOf[q] = a;
    valOf[q] = -w;
  }
  // Per column: stable insertion sort by row (columns hold a vertex's few neighbours), merge repeats in
  // order, and place the diagonal where its row falls.
  const colPtr = new Int32Array(nv + 1);
  const rowIdx = new Int32Array(2 * nh + nv);
  const values = new Float64Array(2 * nh + nv);
  let nnz = 0;
  for (let c = 0; c < nv; c++) {
    const lo = start[c];
    const hi = start[c + 1];
    for (let q = lo + 1; q < hi; q++) {
      const r = rowOf[q];
      const x = valOf[q];
      let p = q - 1;
      while (p >= lo && rowOf[p] > r) {
        rowOf[p + 1] = rowOf[p];
        valOf[p + 1] = valOf[p];
        p--;
      }
      rowOf[p + 1] = r;
      valOf[p + 1] = x;
    }
    colPtr[c] = nnz;
    let diagDone = hi === lo;
    for (let q = lo; q < hi; q++) {
      const r = rowOf[q];
      if (!diagDone && r > c) {
        rowIdx[nnz] = c;
        values[nnz++] = diag[c];
        diagDone = true;
      }
      if (nnz > colPtr[c] && rowIdx[nnz - 1] === r) values[nnz - 1] += valOf[q];
      else {
        rowIdx[nnz] = r;
        values[nnz++] = valOf[q];
      }
    }
    if (!diagDone) {
      rowIdx[nnz] = c;
      values[nnz++] = diag[c];
    }
  }
  colPtr[nv] = nnz;
  return { n: nv, colPtr, rowIdx: rowIdx.slice(0, nnz), values: values.slice(0, nnz) };
}
