/** Small builders shared by the pattern-pipeline tests. */
import type { ImportedModel, TriMesh } from '../../../geometry/mesh/tri-mesh';

/** Wraps a generated mesh as an imported model, optionally with seam polylines (as an OBJ's `l` lines). */
export function modelOf(mesh: TriMesh, seamPolylines: number[][] = []): ImportedModel {
  return {
    mesh,
    faceTags: new Uint32Array(mesh.triangles.length / 3),
    tagNames: [''],
    seamPolylines: seamPolylines.map((p) => Uint32Array.from(p)),
    cornerUVs: null,
    notes: [],
  };
}

/** Joins meshes into one (separate parts), vertex indices offset. */
export function joinMeshes(meshes: TriMesh[]): TriMesh {
  const positions = new Float64Array(meshes.reduce((n, m) => n + m.positions.length, 0));
  const triangles = new Uint32Array(meshes.reduce((n, m) => n + m.triangles.length, 0));
  let pv = 0;
  let pt = 0;
  for (const m of meshes) {
    positions.set(m.positions, pv);
    for (let i = 0; i < m.triangles.length; i++) triangles[pt + i] = m.triangles[i] + pv / 3;
    pv += m.positions.length;
    pt += m.triangles.length;
  }
  return { positions, triangles };
}

/** A flat polygon plate in the z = 0 plane, fanned from its first vertex (the polygon must be star-shaped from it). */
export function fanPlate(points: [number, number][]): TriMesh {
  const positions = new Float64Array(points.flatMap(([x, y]) => [x, y, 0]));
  const tri: number[] = [];
  for (let i = 1; i + 1 < points.length; i++) tri.push(0, i, i + 1);
  return { positions, triangles: Uint32Array.from(tri) };
}

/** Width of a 2D point list's bounding box along x and along y. */
export function extent(points: [number, number][]): { w: number; h: number } {
  const xs = points.map((p) => p[0]);
  const ys = points.map((p) => p[1]);
  return { w: Math.max(...xs) - Math.min(...xs), h: Math.max(...ys) - Math.min(...ys) };
}

export function polylineLength(points: [number, number][]): number {
  let s = 0;
  for (let i = 0; i + 1 < points.length; i++) s += Math.hypot(points[i + 1][0] - points[i][0], points[i + 1][1] - points[i][1]);
  return s;
}

/**
 * A hinge of two strips along the x axis, length L: strip A flat (z = 0, y < 0, outward normal +z), strip B
 * leaving the axis tilted down by tiltDeg(x). The angle between two half-planes that share an edge is 180° − φ
 * (elementary solid geometry), so the interior dihedral along the axis is 180° − tiltDeg(x) — an outside corner.
 * Returns the mesh, the axis polyline (vertex ids from x = 0 to x = L) and each face's strip (0 = A, 1 = B).
 */
export function hinge(
  L: number,
  width: number,
  steps: number,
  tiltDeg: (x: number) => number,
): { mesh: TriMesh; axis: number[]; strip: Int32Array } {
  const pos: number[] = [];
  const tri: number[] = [];
  const strip: number[] = [];
  for (let i = 0; i <= steps; i++) {
    const x = (L * i) / steps;
    const phi = (tiltDeg(x) * Math.PI) / 180;
    pos.push(x, 0, 0, x, -width, 0, x, width * Math.cos(phi), -width * Math.sin(phi));
  }
  for (let i = 0; i < steps; i++) {
    const a0 = 3 * i;
    const a1 = 3 * (i + 1);
    tri.push(a0 + 1, a1 + 1, a1, a0 + 1, a1, a0);
    tri.push(a0, a1, a1 + 2, a0, a1 + 2, a0 + 2);
    strip.push(0, 0, 1, 1);
  }
  return {
    mesh: { positions: Float64Array.from(pos), triangles: Uint32Array.from(tri) },
    axis: Array.from({ length: steps + 1 }, (_, i) => 3 * i),
    strip: Int32Array.from(strip),
  };
}
