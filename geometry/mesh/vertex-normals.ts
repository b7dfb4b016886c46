/**
 * Returns unit vertex normals, Float64Array(3V): the sum of the incident face normals weighted by the corner
 * angle at the vertex (Thürmer & Wüthrich 1998, "Computing vertex normals from polygonal facets"), which does
 * not depend on how a surface is triangulated. `positions` Float64Array(3V), `triangles` Uint32Array(3F),
 * counter-clockwise from outside so normals point outward. A vertex with no (non-degenerate) face gets (0,0,0).
 */
export function vertexNormals(positions: Float64Array, triangles: Uint32Array): Float64Array {
  const out = new Float64Array(positions.length);
  for (let f = 0; f < triangles.length; f += 3) {
    const a = 3 * triangles[f];
    const b = 3 * triangles[f + 1];
    const c = 3 * triangles[f + 2];
    const ux = positions[b] - positions[a], uy = positions[b + 1] - positions[a + 1], uz = positions[b + 2] - positions[a + 2];
    const vx = positions[c] - positions[a], vy = positions[c + 1] - positions[a + 1], vz = positions[c + 2] - positions[a + 2];
    let nx = uy * vz - uz * vy;
    let ny = uz * vx - ux * vz;
    let nz = ux * vy - uy * vx;
    const l = Math.hypot(nx, ny, nz);
    if (!(l > 0) || !Number.isFinite(l)) continue;
    nx /= l;
    ny /= l;
    nz /= l;
    const corners = [a, b, c];
    for (let i = 0; i < 3; i++) {
      const p = corners[i];
      const q = corners[(i + 1) % 3];
      const r = corners[(i + 2) % 3];
      const ex = positions[q] - positions[p], ey = positions[q + 1] - positions[p + 1], ez = positions[q + 2] - positions[p + 2];
      const gx = positions[r] - positions[p], gy = positions[r + 1] - positions[p + 1], gz = positions[r + 2] - positions[p + 2];
      const w = Math.atan2(Math.hypot(ey * gz - ez * gy, ez * gx - ex * gz, ex * gy - ey * gx), ex * gx + ey * gy + ez * gz);
      out[p] += w * nx;
      out[p + 1] += w * ny;
      out[p + 2] += w * nz;
    }
  }
  for (let i = 0; i < out.length; i += 3) {
    const l = Math.hypot(out[i], out[i + 1], out[i + 2]);
    if (l > 0) {
      out[i] /= l;
      out[i + 1] /= l;
      out[i + 2] /= l;
    }
  }
  return out;
}
