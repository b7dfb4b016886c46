import { fromTriplets, type SparseSymmetricMatrix } from '../sparse/sparse-symmetric-matrix';

/**
 * Returns the cotangent Laplacian of a triangle mesh as a V×V symmetric matrix: L_ab = −½(cot α + cot β)
 * for each edge a–b (α, β the angles opposite it; one of them on a boundary edge), L_aa = −Σ_b L_ab.
 * uᵀLu/2 is the Dirichlet energy ½∫|∇u|² of the piecewise-linear function u (Pinkall & Polthier 1993).
 * `cot` is per half-edge as from cotanWeights; `triangles` 3F; V = number of vertices.
 */
export function cotanLaplacian(triangles: Uint32Array, cot: Float64Array, nv: number): SparseSymmetricMatrix {
  const nh = triangles.length;
  const rows = new Int32Array(3 * nh);
  const cols = new Int32Array(3 * nh);
  const vals = new Float64Array(3 * nh);
  let t = 0;
  for (let h = 0; h < nh; h++) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    const w = 0.5 * cot[h];
    rows[t] = a;
    cols[t] = a;
    vals[t++] = w;
    rows[t] = b;
    cols[t] = b;
    vals[t++] = w;
    rows[t] = a;
    cols[t] = b;
    vals[t++] = -w;
  }
  return fromTriplets(nv, rows, cols, vals);
}
