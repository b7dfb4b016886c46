import { GeometryError } from '../errors';
import { interiorDihedralDeg } from '../mesh/dihedral-angles';
import type { SeamMask } from './seam-mask';

/**
 * Returns the SeamMask (Uint8Array(3F)) of every edge whose interior dihedral angle departs from flat (180°)
 * by at least `minDeviationDeg` degrees — outside corners below 180° − d and inside corners above 180° + d
 * alike (the `crease:<deg>` seam source of the pattern command). Boundary edges are not marked: they are
 * piece edges already. `positions` Float64Array(3V) mm, `triangles` Uint32Array(3F), `twin` Int32Array(3F).
 * Throws GeometryError('BAD_OPTION') unless 0 < minDeviationDeg ≤ 180.
 */
export function creaseSeams(positions: Float64Array, triangles: Uint32Array, twin: Int32Array, minDeviationDeg: number): SeamMask {
  if (!(minDeviationDeg > 0 && minDeviationDeg <= 180)) {
    throw new GeometryError('BAD_OPTION', `crease angle must be more than 0° and at most 180°, got ${String(minDeviationDeg)}`);
  }
  const dihedral = interiorDihedralDeg(positions, triangles, twin);
  const mask = new Uint8Array(triangles.length);
  // A hair of slack so that an edge exactly at the threshold (e.g. a cube's 90° at crease:90) counts.
  const threshold = minDeviationDeg - 1e-9;
  for (let h = 0; h < triangles.length; h++) {
    if (twin[h] >= 0 && Math.abs(dihedral[h] - 180) >= threshold) mask[h] = 1;
  }
  return mask;
}
