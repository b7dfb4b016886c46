import type { TriMesh } from '../../../geometry/mesh/tri-mesh';

/**
 * Test meshes of our own: a (k+1)×(k+1) vertex grid of `cell`-mm squares split into two triangles each,
 * counter-clockwise seen from +z, with height z = bump(x, y) (0 → a flat square).
 */
export function gridPiece(k: number, cell: number, bump: (x: number, y: number) => number = () => 0): TriMesh {
  const positions = new Float64Array(3 * (k + 1) * (k + 1));
  for (let i = 0; i <= k; i++) {
    for (let j = 0; j <= k; j++) {
      const o = 3 * (i * (k + 1) + j);
      positions[o] = j * cell;
      positions[o + 1] = i * cell;
      positions[o + 2] = bump(j * cell, i * cell);
    }
  }
  const triangles = new Uint32Array(6 * k * k);
  let w = 0;
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      const a = i * (k + 1) + j;
      triangles.set([a, a + 1, a + k + 2, a, a + k + 2, a + k + 1], w);
      w += 6;
    }
  }
  return { positions, triangles };
}

/** A flat annulus (a disk with one hole) in z = 0: radii r0 < r1, `around` segments, `bands` rings of quads. */
export function annulusPiece(r0: number, r1: number, around: number, bands: number): TriMesh {
  const positions = new Float64Array(3 * around * (bands + 1));
  for (let b = 0; b <= bands; b++) {
    const r = r0 + ((r1 - r0) * b) / bands;
    for (let s = 0; s < around; s++) {
      const t = (2 * Math.PI * (s + 0.5 * (b % 2))) / around;
      const o = 3 * (b * around + s);
      positions[o] = r * Math.cos(t);
      positions[o + 1] = r * Math.sin(t);
    }
  }
  const triangles = new Uint32Array(6 * around * bands);
  let w = 0;
  for (let b = 0; b < bands; b++) {
    for (let s = 0; s < around; s++) {
      const a = b * around + s;
      const c = b * around + ((s + 1) % around);
      triangles.set([a, c + around, c, a, a + around, c + around], w);
      w += 6;
    }
  }
  return { positions, triangles };
}

/** Euclidean length of edge a–b in 3D (`positions` 3V). */
export function length3(positions: Float64Array, a: number, b: number): number {
  return Math.hypot(
    positions[3 * a] - positions[3 * b],
    positions[3 * a + 1] - positions[3 * b + 1],
    positions[3 * a + 2] - positions[3 * b + 2],
  );
}

/** Euclidean length of edge a–b in the plane (`uv` 2V). */
export function length2(uv: Float64Array, a: number, b: number): number {
  return Math.hypot(uv[2 * a] - uv[2 * b], uv[2 * a + 1] - uv[2 * b + 1]);
}

/** Largest |2D/3D − 1| over all edges of the mesh. */
export function worstEdgeRatio(mesh: TriMesh, uv: Float64Array): number {
  let worst = 0;
  for (let h = 0; h < mesh.triangles.length; h++) {
    const a = mesh.triangles[h];
    const b = mesh.triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    worst = Math.max(worst, Math.abs(length2(uv, a, b) / length3(mesh.positions, a, b) - 1));
  }
  return worst;
}
