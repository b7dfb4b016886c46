/**
 * The face graph that automatic seams work on: per-face normals, centroids and areas, per-half-edge lengths and
 * the cost of a seam along each edge, with scratch arrays for examining one chart (a set of faces) at a time.
 */
import { interiorDihedralDeg } from '../mesh/dihedral-angles';
import type { TriMesh } from '../mesh/tri-mesh';

export interface FaceGraph {
  faceCount: number;
  twin: Int32Array;
  normals: Float64Array;
  centroids: Float64Array;
  areas: Float64Array;
  /** Length of each half-edge's edge, mm. */
  edgeLengths: Float64Array;
  /** Interior dihedral angle of each half-edge's edge, degrees (180 flat, > 180 a concave valley). */
  dihedralDeg: Float64Array;
  /**
   * What a seam along each half-edge's edge costs, mm: its length times how visible a seam there would be
   * (see seamVisibility). Chart borders are shortened in this measure.
   */
  seamCost: Float64Array;
  /**
   * Scratch: position of each face in the chart being examined, valid where `stampOf[f] === stamp`. Replaces a
   * Set/Map per chart (the searches run hundreds of times on small charts).
   */
  localIndex: Int32Array;
  stampOf: Int32Array;
  stamp: number;
}

/** Where seams are wanted: the sculpt's up axis, and its front when it has a symmetry plane. */
export interface SeamViewpoint {
  /** Unit vector pointing up on the sculpt (default +z). */
  up?: [number, number, number];
  /** Unit vector pointing out of the sculpt's front, or null when no side is the front (default null). */
  front?: [number, number, number] | null;
}

/**
 * How visible a seam is at an edge, a factor in (0, 1] that scales its length into a cost. Common practice in
 * prop making, not a published rule: seams go along creases (a sharp edge hides the joint), into concave valleys
 * (the glue line sits in shadow), underneath and at the back. Each preference takes off a share: up to 0.55 for
 * a crease (full at 60° from flat), 0.15 more when the crease is a valley, up to 0.2 for the lowest points along
 * `up`, and up to 0.15 for the back when a front is known.
 */
export function seamVisibility(dihedralDeg: number, height01: number, frontness01: number | null): number {
  const sharp = Math.min(1, Math.abs(180 - dihedralDeg) / 60);
  let factor = 1 - 0.55 * sharp;
  if (dihedralDeg > 180) factor -= 0.15 * sharp;
  factor -= 0.2 * (1 - height01);
  if (frontness01 !== null) factor -= 0.15 * (1 - frontness01);
  return Math.max(0.05, factor);
}

/**
 * Builds the face graph of a mesh.
 *
 * @param mesh TriMesh in mm, consistently oriented; `twin` its half-edge twins (−1 on a boundary).
 * @param view the sculpt's up direction and front (see SeamViewpoint); heights and front-to-back positions are
 *   taken relative to the mesh's extent along them, so the costs do not depend on size or placement.
 */
export function faceGraph(mesh: TriMesh, twin: Int32Array, view: SeamViewpoint = {}): FaceGraph {
  const { positions: p, triangles: t } = mesh;
  const F = t.length / 3;
  const normals = new Float64Array(3 * F);
  const centroids = new Float64Array(3 * F);
  const areas = new Float64Array(F);
  const edgeLengths = new Float64Array(3 * F);
  for (let f = 0; f < F; f++) {
    const a = 3 * t[3 * f];
    const b = 3 * t[3 * f + 1];
    const c = 3 * t[3 * f + 2];
    const ux = p[b] - p[a], uy = p[b + 1] - p[a + 1], uz = p[b + 2] - p[a + 2];
    const vx = p[c] - p[a], vy = p[c + 1] - p[a + 1], vz = p[c + 2] - p[a + 2];
    const nx = uy * vz - uz * vy, ny = uz * vx - ux * vz, nz = ux * vy - uy * vx;
    const len = Math.hypot(nx, ny, nz) || 1;
    areas[f] = len / 2;
    const corner = [a, b, c];
    for (let k = 0; k < 3; k++) {
      const i = corner[k];
      const j = corner[(k + 1) % 3];
      edgeLengths[3 * f + k] = Math.hypot(p[j] - p[i], p[j + 1] - p[i + 1], p[j + 2] - p[i + 2]);
    }
    normals[3 * f] = nx / len;
    normals[3 * f + 1] = ny / len;
    normals[3 * f + 2] = nz / len;
    for (let k = 0; k < 3; k++) centroids[3 * f + k] = (p[a + k] + p[b + k] + p[c + k]) / 3;
  }
  const dihedralDeg = interiorDihedralDeg(p, t, twin);
  const seamCost = new Float64Array(3 * F);
  const up = view.up ?? [0, 0, 1];
  const front = view.front ?? null;
  const along = (d: [number, number, number]): ((x: number, y: number, z: number) => number) => {
    let lo = Infinity;
    let hi = -Infinity;
    for (let v = 0; v < p.length; v += 3) {
      const s = p[v] * d[0] + p[v + 1] * d[1] + p[v + 2] * d[2];
      lo = Math.min(lo, s);
      hi = Math.max(hi, s);
    }
    const span = hi - lo || 1;
    return (x, y, z) => (x * d[0] + y * d[1] + z * d[2] - lo) / span;
  };
  const height = along(up);
  const frontness = front ? along(front) : null;
  for (let h = 0; h < 3 * F; h++) {
    const i = 3 * t[h];
    const j = 3 * t[h - (h % 3) + ((h % 3) + 1) % 3];
    const mx = (p[i] + p[j]) / 2, my = (p[i + 1] + p[j + 1]) / 2, mz = (p[i + 2] + p[j + 2]) / 2;
    seamCost[h] = edgeLengths[h] * seamVisibility(dihedralDeg[h], height(mx, my, mz), frontness ? frontness(mx, my, mz) : null);
  }
  return {
    faceCount: F,
    twin,
    normals,
    centroids,
    areas,
    edgeLengths,
    dihedralDeg,
    seamCost,
    localIndex: new Int32Array(F),
    stampOf: new Int32Array(F),
    stamp: 0,
  };
}

/** Marks `faces` as the current chart in the graph's scratch arrays (see FaceGraph.localIndex). */
export function enterChart(g: FaceGraph, faces: ArrayLike<number>): void {
  g.stamp++;
  for (let i = 0; i < faces.length; i++) {
    g.stampOf[faces[i]] = g.stamp;
    g.localIndex[faces[i]] = i;
  }
}

/** Whether face f belongs to the chart last passed to enterChart. */
export const inCurrentChart = (g: FaceGraph, f: number): boolean => g.stampOf[f] === g.stamp;

/** Dot product of the unit normals of faces f and h. */
export const normalDot = (g: FaceGraph, f: number, h: number): number =>
  g.normals[3 * f] * g.normals[3 * h] + g.normals[3 * f + 1] * g.normals[3 * h + 1] + g.normals[3 * f + 2] * g.normals[3 * h + 2];

/** Distance between the centroids of faces f and h, mm. */
export function centroidDistance(g: FaceGraph, f: number, h: number): number {
  const c = g.centroids;
  return Math.hypot(c[3 * f] - c[3 * h], c[3 * f + 1] - c[3 * h + 1], c[3 * f + 2] - c[3 * h + 2]);
}

/** Total area of a chart, mm². */
export function chartArea(g: FaceGraph, faces: ArrayLike<number>): number {
  let a = 0;
  for (let i = 0; i < faces.length; i++) a += g.areas[faces[i]];
  return a;
}

/** Connected parts of the face graph (restricted to faces with `only[f]` set when given), as face lists. */
export function components(g: FaceGraph, only?: Uint8Array): Int32Array[] {
  const seen = new Uint8Array(g.faceCount);
  if (only) for (let f = 0; f < g.faceCount; f++) if (!only[f]) seen[f] = 1;
  const out: Int32Array[] = [];
  for (let s = 0; s < g.faceCount; s++) {
    if (seen[s]) continue;
    const list = [s];
    seen[s] = 1;
    for (let i = 0; i < list.length; i++) {
      const f = list[i];
      for (let k = 0; k < 3; k++) {
        const t = g.twin[3 * f + k];
        if (t < 0) continue;
        const n = (t / 3) | 0;
        if (!seen[n]) {
          seen[n] = 1;
          list.push(n);
        }
      }
    }
    out.push(Int32Array.from(list));
  }
  return out.reverse();
}

/** True when the chart has no boundary edge (a closed shell, which cannot lie flat). */
export function isClosed(g: FaceGraph, faces: Int32Array): boolean {
  enterChart(g, faces);
  for (const f of faces) {
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t < 0 || !inCurrentChart(g, (t / 3) | 0)) return false;
    }
  }
  return true;
}
