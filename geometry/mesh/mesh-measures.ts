import type { TriMesh } from './tri-mesh';

/** Returns each triangle's area in mm², Float64Array(F) (half the cross product's length). */
export function triangleAreas(positions: Float64Array, triangles: Uint32Array): Float64Array {
  const out = new Float64Array(triangles.length / 3);
  for (let f = 0; f < out.length; f++) {
    const a = 3 * triangles[3 * f];
    const b = 3 * triangles[3 * f + 1];
    const c = 3 * triangles[3 * f + 2];
    const ux = positions[b] - positions[a], uy = positions[b + 1] - positions[a + 1], uz = positions[b + 2] - positions[a + 2];
    const vx = positions[c] - positions[a], vy = positions[c + 1] - positions[a + 1], vz = positions[c + 2] - positions[a + 2];
    out[f] = 0.5 * Math.hypot(uy * vz - uz * vy, uz * vx - ux * vz, ux * vy - uy * vx);
  }
  return out;
}

/** Returns the total surface area of `mesh` in mm². */
export function surfaceArea(mesh: TriMesh): number {
  const areas = triangleAreas(mesh.positions, mesh.triangles);
  let s = 0;
  for (let i = 0; i < areas.length; i++) s += areas[i];
  return s;
}

/**
 * Returns the signed volume enclosed by `mesh` in mm³: the sum of signed tetrahedra from a reference point to
 * each triangle (divergence theorem). The reference is the first vertex rather than the origin, so a small
 * part far from the origin loses no precision to cancellation; for a closed mesh the result does not depend on
 * the reference. Positive for a closed mesh whose triangles are counter-clockwise seen from outside.
 */
export function signedVolume(mesh: TriMesh): number {
  const P = mesh.positions;
  const T = mesh.triangles;
  if (T.length === 0) return 0;
  const ox = P[0], oy = P[1], oz = P[2];
  let v = 0;
  for (let f = 0; f < T.length; f += 3) {
    const a = 3 * T[f], b = 3 * T[f + 1], c = 3 * T[f + 2];
    const ax = P[a] - ox, ay = P[a + 1] - oy, az = P[a + 2] - oz;
    const bx = P[b] - ox, by = P[b + 1] - oy, bz = P[b + 2] - oz;
    const cx = P[c] - ox, cy = P[c + 1] - oy, cz = P[c + 2] - oz;
    v += ax * (by * cz - bz * cy) - ay * (bx * cz - bz * cx) + az * (bx * cy - by * cx);
  }
  return v / 6;
}

/** Axis-aligned bounding box in mm. */
export interface BoundingBox {
  min: [number, number, number];
  max: [number, number, number];
}

/** Returns the axis-aligned bounding box of `positions` (Float64Array(3V)); all zeros when V = 0. */
export function boundingBox(positions: Float64Array): BoundingBox {
  if (positions.length === 0) return { min: [0, 0, 0], max: [0, 0, 0] };
  const min: [number, number, number] = [Infinity, Infinity, Infinity];
  const max: [number, number, number] = [-Infinity, -Infinity, -Infinity];
  for (let i = 0; i < positions.length; i += 3) {
    for (let k = 0; k < 3; k++) {
      const x = positions[i + k];
      if (x < min[k]) min[k] = x;
      if (x > max[k]) max[k] = x;
    }
  }
  return { min, max };
}

/** Returns the length of the bounding box's diagonal in mm (the model's overall size). */
export function boundingBoxDiagonal(positions: Float64Array): number {
  const { min, max } = boundingBox(positions);
  return Math.hypot(max[0] - min[0], max[1] - min[1], max[2] - min[2]);
}

/** Returns the length of every half-edge in mm, Float64Array(3F), entry 3f+i for corner i → corner (i+1) mod 3. */
export function halfEdgeLengths(positions: Float64Array, triangles: Uint32Array): Float64Array {
  const out = new Float64Array(triangles.length);
  for (let h = 0; h < triangles.length; h++) {
    const a = 3 * triangles[h];
    const b = 3 * triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    out[h] = Math.hypot(positions[b] - positions[a], positions[b + 1] - positions[a + 1], positions[b + 2] - positions[a + 2]);
  }
  return out;
}

/** Returns the mean edge length in mm over all half-edges (each interior edge counted twice), 0 for no faces. */
export function meanEdgeLength(positions: Float64Array, triangles: Uint32Array): number {
  if (triangles.length === 0) return 0;
  const l = halfEdgeLengths(positions, triangles);
  let s = 0;
  for (let i = 0; i < l.length; i++) s += l[i];
  return s / l.length;
}
