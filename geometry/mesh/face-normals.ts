/**
 * Returns unit face normals, Float64Array(3F): (b − a) × (c − a) normalised, so they point outward for
 * triangles counter-clockwise from outside. A degenerate (zero-area or non-finite) triangle gets (0, 0, 0),
 * which callers treat as "no direction". `positions` Float64Array(3V), `triangles` Uint32Array(3F).
 */
export function unitFaceNormals(positions: Float64Array, triangles: Uint32Array): Float64Array {
  const out = new Float64Array(triangles.length);
  for (let f = 0; f < triangles.length; f += 3) {
    const a = 3 * triangles[f];
    const b = 3 * triangles[f + 1];
    const c = 3 * triangles[f + 2];
    const ux = positions[b] - positions[a], uy = positions[b + 1] - positions[a + 1], uz = positions[b + 2] - positions[a + 2];
    const vx = positions[c] - positions[a], vy = positions[c + 1] - positions[a + 1], vz = positions[c + 2] - positions[a + 2];
    const nx = uy * vz - uz * vy;
    const ny = uz * vx - ux * vz;
    const nz = ux * vy - uy * vx;
    const l = Math.hypot(nx, ny, nz);
    if (!(l > 0) || !Number.isFinite(l)) continue;
    out[f] = nx / l;
    out[f + 1] = ny / l;
    out[f + 2] = nz / l;
  }
  return out;
}
