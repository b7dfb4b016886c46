import { nextHalfEdge } from './half-edges';

/**
 * Returns the interior dihedral angle in degrees at every half-edge, Float64Array(3F), both half-edges of an
 * edge holding the same value. Convention (Sheetsmith DESIGN.md): 180° = flat, < 180° an outside (convex)
 * corner, > 180° an inside (concave) corner, for a mesh whose triangles are counter-clockwise seen from outside.
 * Boundary half-edges (twin −1, see `isBoundaryHalfEdge`) get 180, and so does an edge next to a zero-area
 * triangle (no normal), so no NaN leaves this function.
 *
 * `positions` Float64Array(3V) in mm, `triangles` Uint32Array(3F), `twin` Int32Array(3F). The angle is
 * 180° − φ with φ the signed angle from face normal n₁ to n₂ about the edge direction, φ = atan2((n₁×n₂)·ê, n₁·n₂).
 */
export function interiorDihedralDeg(positions: Float64Array, triangles: Uint32Array, twin: Int32Array): Float64Array {
  const F = triangles.length / 3;
  const normals = new Float64Array(3 * F);
  const valid = new Uint8Array(F);
  for (let f = 0; f < F; f++) {
    const a = 3 * triangles[3 * f];
    const b = 3 * triangles[3 * f + 1];
    const c = 3 * triangles[3 * f + 2];
    const ux = positions[b] - positions[a];
    const uy = positions[b + 1] - positions[a + 1];
    const uz = positions[b + 2] - positions[a + 2];
    const vx = positions[c] - positions[a];
    const vy = positions[c + 1] - positions[a + 1];
    const vz = positions[c + 2] - positions[a + 2];
    const nx = uy * vz - uz * vy;
    const ny = uz * vx - ux * vz;
    const nz = ux * vy - uy * vx;
    const l = Math.hypot(nx, ny, nz);
    if (l > 0 && Number.isFinite(l)) {
      normals[3 * f] = nx / l;
      normals[3 * f + 1] = ny / l;
      normals[3 * f + 2] = nz / l;
      valid[f] = 1;
    }
  }
  const out = new Float64Array(triangles.length).fill(180);
  for (let h = 0; h < triangles.length; h++) {
    const t = twin[h];
    if (t < h) continue;
    const f = (h / 3) | 0;
    const g = (t / 3) | 0;
    if (!valid[f] || !valid[g]) continue;
    const a = 3 * triangles[h];
    const b = 3 * triangles[nextHalfEdge(h)];
    const ex = positions[b] - positions[a];
    const ey = positions[b + 1] - positions[a + 1];
    const ez = positions[b + 2] - positions[a + 2];
    const n1x = normals[3 * f], n1y = normals[3 * f + 1], n1z = normals[3 * f + 2];
    const n2x = normals[3 * g], n2y = normals[3 * g + 1], n2z = normals[3 * g + 2];
    const cx = n1y * n2z - n1z * n2y;
    const cy = n1z * n2x - n1x * n2z;
    const cz = n1x * n2y - n1y * n2x;
    const el = Math.hypot(ex, ey, ez);
    const sin = (cx * ex + cy * ey + cz * ez) / el;
    const cos = n1x * n2x + n1y * n2y + n1z * n2z;
    const angle = 180 - (Math.atan2(sin, cos) * 180) / Math.PI;
    out[h] = angle;
    out[t] = angle;
  }
  return out;
}
