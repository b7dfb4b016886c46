/**
 * Returns the interior angle in radians at every triangle corner, Float64Array(3F) (corner i of triangle f at
 * 3f + i). Uses atan2(|u×v|, u·v), which stays accurate for angles near 0 and π; a zero-length side gives 0.
 * `positions` Float64Array(3V), `triangles` Uint32Array(3F).
 */
export function cornerAngles(positions: Float64Array, triangles: Uint32Array): Float64Array {
  const out = new Float64Array(triangles.length);
  for (let f = 0; f < triangles.length; f += 3) {
    for (let i = 0; i < 3; i++) {
      const p = 3 * triangles[f + i];
      const q = 3 * triangles[f + ((i + 1) % 3)];
      const r = 3 * triangles[f + ((i + 2) % 3)];
      const ux = positions[q] - positions[p];
      const uy = positions[q + 1] - positions[p + 1];
      const uz = positions[q + 2] - positions[p + 2];
      const vx = positions[r] - positions[p];
      const vy = positions[r + 1] - positions[p + 1];
      const vz = positions[r + 2] - positions[p + 2];
      const cr = Math.hypot(uy * vz - uz * vy, uz * vx - ux * vz, ux * vy - uy * vx);
      const angle = Math.atan2(cr, ux * vx + uy * vy + uz * vz);
      out[f + i] = Number.isFinite(angle) ? angle : 0;
    }
  }
  return out;
}
