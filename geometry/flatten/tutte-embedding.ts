import { GeometryError } from '../errors';
import { choleskyFactor } from '../sparse/cholesky';
import { fromTriplets } from '../sparse/sparse-symmetric-matrix';

/**
 * Returns a flattening (Float64Array 2V, mm) with the `outer` boundary loop (vertex list, counter-clockwise
 * in the piece's orientation) on a circle whose circumference equals the loop's 3D length, vertices spaced by
 * 3D arc length, and every other vertex at the average of its neighbours (uniform barycentric weights);
 * `twin` is per half-edge as from pieceTopology.
 * Tutte 1963 ("How to draw a graph", Proc. LMS 13) and Floater 1997 ("Parametrization and smooth
 * approximation of surface triangulations", CAGD 14): with a convex outer boundary and positive weights a
 * disk-shaped triangulation comes out without a single inverted triangle. The engine uses it as the
 * fallback start for ARAP when the conformal start leaves a triangle inverted. Throws GeometryError
 * FLATTEN_FAILED when the outer loop has fewer than 3 vertices or the system cannot be solved.
 */
export function tutteEmbedding(
  positions: Float64Array,
  triangles: Uint32Array,
  twin: Int32Array,
  outer: Int32Array,
): Float64Array {
  const nv = positions.length / 3;
  const nb = outer.length;
  if (nb < 3) throw new GeometryError('FLATTEN_FAILED', `outer boundary has ${nb} vertices, need at least 3`);
  const uv = new Float64Array(2 * nv);
  const onRim = new Uint8Array(nv);
  const cumulative = new Float64Array(nb + 1);
  for (let k = 0; k < nb; k++) {
    const a = outer[k];
    const b = outer[(k + 1) % nb];
    cumulative[k + 1] =
      cumulative[k] +
      Math.hypot(positions[3 * b] - positions[3 * a], positions[3 * b + 1] - positions[3 * a + 1], positions[3 * b + 2] - positions[3 * a + 2]);
  }
  const total = cumulative[nb];
  const radius = total / (2 * Math.PI);
  for (let k = 0; k < nb; k++) {
    const t = (2 * Math.PI * cumulative[k]) / total;
    uv[2 * outer[k]] = radius * Math.cos(t);
    uv[2 * outer[k] + 1] = radius * Math.sin(t);
    onRim[outer[k]] = 1;
  }
  const index = new Int32Array(nv).fill(-1);
  let m = 0;
  for (let v = 0; v < nv; v++) if (!onRim[v]) index[v] = m++;
  if (m === 0) return uv;

  // Graph Laplacian of the free vertices, each edge counted once: from its boundary half-edge, or from the
  // lower-numbered of its two half-edges.
  const nh = triangles.length;
  const rows = new Int32Array(3 * nh);
  const cols = new Int32Array(3 * nh);
  const vals = new Float64Array(3 * nh);
  const rhsU = new Float64Array(m);
  const rhsV = new Float64Array(m);
  let t = 0;
  for (let h = 0; h < nh; h++) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    if (twin[h] >= 0 && twin[h] < h) continue;
    for (const [p, q] of [
      [a, b],
      [b, a],
    ]) {
      const ip = index[p];
      if (ip < 0) continue;
      rows[t] = ip;
      cols[t] = ip;
      vals[t++] = 1;
      const iq = index[q];
      if (iq >= 0) {
        if (p === a) {
          rows[t] = ip;
          cols[t] = iq;
          vals[t++] = -1;
        }
      } else {
        rhsU[ip] += uv[2 * q];
        rhsV[ip] += uv[2 * q + 1];
      }
    }
  }
  let solveU: Float64Array;
  let solveV: Float64Array;
  try {
    const factor = choleskyFactor(fromTriplets(m, rows.subarray(0, t), cols.subarray(0, t), vals.subarray(0, t)));
    solveU = factor.solve(rhsU);
    solveV = factor.solve(rhsV);
  } catch (e) {
    throw new GeometryError('FLATTEN_FAILED', `barycentric embedding could not be solved: ${(e as Error).message}`);
  }
  for (let v = 0; v < nv; v++) {
    if (index[v] < 0) continue;
    uv[2 * v] = solveU[index[v]];
    uv[2 * v + 1] = solveV[index[v]];
  }
  return uv;
}
