import { GeometryError } from '../errors';
import type { TriMesh } from '../mesh/tri-mesh';

/** A rigid motion plus scale. Applied as p' = R·(s ∘ p) + t. */
export interface MeshTransform {
  /** Unit quaternion [x, y, z, w] (normalised here) or a 3×3 matrix as 9 numbers, row-major. */
  rotation?: readonly number[];
  /** Translation in mm. */
  translation?: readonly number[];
  /** Uniform scale, or per-axis [sx, sy, sz]; a negative determinant (a mirror) reverses winding. */
  scale?: number | readonly number[];
}

function rotationMatrix(rotation: readonly number[] | undefined): number[] {
  if (!rotation) return [1, 0, 0, 0, 1, 0, 0, 0, 1];
  if (rotation.length === 9) {
    if (!rotation.every(Number.isFinite)) throw new GeometryError('BAD_OPTION', 'rotation matrix has a non-finite entry');
    return [...rotation];
  }
  if (rotation.length !== 4) {
    throw new GeometryError('BAD_OPTION', `rotation must be a quaternion [x,y,z,w] or 9 matrix entries, got ${rotation.length} numbers`);
  }
  const n = Math.hypot(rotation[0], rotation[1], rotation[2], rotation[3]);
  if (!Number.isFinite(n) || n === 0) throw new GeometryError('BAD_OPTION', 'rotation quaternion has zero or non-finite length');
  const [x, y, z, w] = rotation.map((c) => c / n);
  // Standard unit-quaternion to rotation-matrix formula (Shoemake 1985).
  return [
    1 - 2 * (y * y + z * z), 2 * (x * y - z * w), 2 * (x * z + y * w),
    2 * (x * y + z * w), 1 - 2 * (x * x + z * z), 2 * (y * z - x * w),
    2 * (x * z - y * w), 2 * (y * z + x * w), 1 - 2 * (x * x + y * y),
  ];
}

/**
 * Returns a new TriMesh with every vertex moved by p' = R·(scale ∘ p) + translation. `rotation` is a
 * quaternion [x, y, z, w] or a row-major 3×3 matrix. When the combined linear map mirrors (negative
 * determinant), each triangle's corners are reordered so the triangles stay counter-clockwise from outside.
 * The input is not modified.
 */
export function transformMesh(mesh: TriMesh, transform: MeshTransform): TriMesh {
  const R = rotationMatrix(transform.rotation);
  const s = transform.scale ?? 1;
  const sv = typeof s === 'number' ? [s, s, s] : [...s];
  if (sv.length !== 3 || !sv.every((c) => Number.isFinite(c) && c !== 0)) {
    throw new GeometryError('BAD_OPTION', 'scale must be a non-zero finite number or three of them');
  }
  const t = transform.translation ?? [0, 0, 0];
  if (t.length !== 3 || !t.every(Number.isFinite)) {
    throw new GeometryError('BAD_OPTION', 'translation must be three finite numbers');
  }
  const lin = [0, 1, 2].flatMap((r) => [0, 1, 2].map((col) => R[3 * r + col] * sv[col]));
  const det =
    lin[0] * (lin[4] * lin[8] - lin[5] * lin[7]) - lin[1] * (lin[3] * lin[8] - lin[5] * lin[6]) + lin[2] * (lin[3] * lin[7] - lin[4] * lin[6]);
  const P = mesh.positions;
  const out = new Float64Array(P.length);
  for (let i = 0; i < P.length; i += 3) {
    const x = P[i];
    const y = P[i + 1];
    const z = P[i + 2];
    out[i] = lin[0] * x + lin[1] * y + lin[2] * z + t[0];
    out[i + 1] = lin[3] * x + lin[4] * y + lin[5] * z + t[1];
    out[i + 2] = lin[6] * x + lin[7] * y + lin[8] * z + t[2];
  }
  const triangles = Uint32Array.from(mesh.triangles);
  if (det < 0) {
    for (let f = 0; f < triangles.length; f += 3) {
      const tmp = triangles[f + 1];
      triangles[f + 1] = triangles[f + 2];
      triangles[f + 2] = tmp;
    }
  }
  return { positions: out, triangles };
}
