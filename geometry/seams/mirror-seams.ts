import { buildVertexGrid, type VertexGrid } from '../mesh/vertex-grid';
import { boundingBoxDiagonal, meanEdgeLength, triangleAreas } from '../mesh/mesh-measures';
import type { TriMesh } from '../mesh/tri-mesh';
import { buildEdgeGraph, findEdge } from './edge-graph';
import { addSeamEdge, type SeamMask } from './seam-mask';
import { seamPath } from './seam-path';

/** A plane n·p = offset with unit normal n, and how well the mesh matches its mirror image in it. */
export interface SymmetryPlane {
  normal: [number, number, number];
  /** Signed distance of the plane from the origin along `normal`, mm. */
  offset: number;
  /** Root-mean-square distance (mm) from each mirrored vertex to the nearest vertex of the mesh. */
  error: number;
}

/** A plane is accepted as a symmetry plane when its RMS error is under this share of the bounding-box diagonal. */
const ACCEPT_FRACTION = 0.01;
const SAMPLE = 3000;
const REFINE_STEPS = 6;

/** Eigenvectors of a symmetric 3×3 matrix by cyclic Jacobi rotations (Golub & Van Loan, §8.5). */
function eigenvectors3(a: number[]): number[][] {
  const m = [...a];
  const v = [1, 0, 0, 0, 1, 0, 0, 0, 1];
  for (let sweep = 0; sweep < 50; sweep++) {
    const off = Math.abs(m[1]) + Math.abs(m[2]) + Math.abs(m[5]);
    if (off < 1e-15 * (Math.abs(m[0]) + Math.abs(m[4]) + Math.abs(m[8]) + 1e-300)) break;
    for (const [p, q] of [[0, 1], [0, 2], [1, 2]]) {
      const apq = m[3 * p + q];
      if (Math.abs(apq) < 1e-300) continue;
      const theta = (m[3 * q + q] - m[3 * p + p]) / (2 * apq);
      const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
      const c = 1 / Math.sqrt(t * t + 1);
      const s = t * c;
      for (let k = 0; k < 3; k++) {
        const mkp = m[3 * k + p];
        const mkq = m[3 * k + q];
        m[3 * k + p] = c * mkp - s * mkq;
        m[3 * k + q] = s * mkp + c * mkq;
      }
      for (let k = 0; k < 3; k++) {
        const mpk = m[3 * p + k];
        const mqk = m[3 * q + k];
        m[3 * p + k] = c * mpk - s * mqk;
        m[3 * q + k] = s * mpk + c * mqk;
      }
      for (let k = 0; k < 3; k++) {
        const vkp = v[3 * k + p];
        const vkq = v[3 * k + q];
        v[3 * k + p] = c * vkp - s * vkq;
        v[3 * k + q] = s * vkp + c * vkq;
      }
    }
  }
  return [0, 1, 2].map((j) => [v[j], v[3 + j], v[6 + j]]);
}

function reflect(p: number[], n: number[], offset: number): [number, number, number] {
  const d = 2 * (p[0] * n[0] + p[1] * n[1] + p[2] * n[2] - offset);
  return [p[0] - d * n[0], p[1] - d * n[1], p[2] - d * n[2]];
}

/**
 * Finds the plane the mesh is most nearly mirror-symmetric in, or null when no plane fits within 1 % of the
 * bounding-box diagonal (RMS). Candidates pass through the area-weighted centroid with normals along the
 * principal axes of the area-weighted vertex spread and along x, y, z; each is scored by mirroring a
 * deterministic sample of vertices and measuring the distance to the nearest vertex, then the best is refined
 * by a few iterations that fit the plane to matched vertex pairs (in the manner of iterative closest point,
 * Besl & McKay 1992). `mesh` positions in mm.
 */
export function findSymmetryPlane(mesh: TriMesh): SymmetryPlane | null {
  const P = mesh.positions;
  const V = P.length / 3;
  if (V < 3 || mesh.triangles.length === 0) return null;
  const areas = triangleAreas(P, mesh.triangles);
  const weight = new Float64Array(V);
  for (let f = 0; f < areas.length; f++) for (let k = 0; k < 3; k++) weight[mesh.triangles[3 * f + k]] += areas[f] / 3;
  let W = 0;
  const c = [0, 0, 0];
  for (let v = 0; v < V; v++) {
    W += weight[v];
    for (let k = 0; k < 3; k++) c[k] += weight[v] * P[3 * v + k];
  }
  if (!(W > 0)) return null;
  for (let k = 0; k < 3; k++) c[k] /= W;
  const cov = new Array<number>(9).fill(0);
  for (let v = 0; v < V; v++) {
    const d = [P[3 * v] - c[0], P[3 * v + 1] - c[1], P[3 * v + 2] - c[2]];
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) cov[3 * i + j] += weight[v] * d[i] * d[j];
  }
  const grid = buildVertexGrid(P);
  const diag = boundingBoxDiagonal(P);
  const reach = Math.max(diag * 0.05, 2 * meanEdgeLength(P, mesh.triangles));
  const step = Math.max(1, Math.floor(V / SAMPLE));
  const candidates = [...eigenvectors3(cov), [1, 0, 0], [0, 1, 0], [0, 0, 1]];
  let best: SymmetryPlane | null = null;
  for (const n0 of candidates) {
    const l = Math.hypot(n0[0], n0[1], n0[2]);
    let n = n0.map((x) => x / l);
    let offset = n[0] * c[0] + n[1] * c[1] + n[2] * c[2];
    let score = planeError(P, V, step, grid, n, offset, reach);
    for (let it = 0; it < REFINE_STEPS && score.error < Infinity; it++) {
      const refined = refinePlane(P, V, step, grid, n, offset, reach, score.error);
      if (!refined) break;
      const s2 = planeError(P, V, step, grid, refined.n, refined.offset, reach);
      if (!(s2.error < score.error)) break;
      n = refined.n;
      offset = refined.offset;
      score = s2;
    }
    if (!best || score.error < best.error) best = { normal: [n[0], n[1], n[2]], offset, error: score.error };
  }
  if (!best || !(best.error <= ACCEPT_FRACTION * diag)) return null;
  // Report the normal pointing into the positive half of its largest component, for a stable answer.
  const big = best.normal.reduce((bi, x, i, arr) => (Math.abs(x) > Math.abs(arr[bi]) ? i : bi), 0);
  if (best.normal[big] < 0) {
    best.normal = [-best.normal[0], -best.normal[1], -best.normal[2]];
    best.offset = -best.offset;
  }
  return best;
}

function planeError(P: Float64Array, V: number, step: number, grid: VertexGrid, n: number[], offset: number, reach: number): { error: number } {
  let sum = 0;
  let count = 0;
  for (let v = 0; v < V; v += step) {
    const r = reflect([P[3 * v], P[3 * v + 1], P[3 * v + 2]], n, offset);
    const w = grid.nearest(r[0], r[1], r[2], reach);
    const d2 = w < 0 ? reach * reach : (P[3 * w] - r[0]) ** 2 + (P[3 * w + 1] - r[1]) ** 2 + (P[3 * w + 2] - r[2]) ** 2;
    sum += d2;
    count++;
  }
  return { error: Math.sqrt(sum / count) };
}

function refinePlane(P: Float64Array, V: number, step: number, grid: VertexGrid, n: number[], offset: number, reach: number, currentError: number): { n: number[]; offset: number } | null {
  // Each vertex v and the vertex w nearest its mirror image form a pair; the ideal plane bisects every pair.
  // Pairs that match poorly (residual over twice the current RMS error) are left out as mismatches.
  const limit2 = (2 * currentError) ** 2 + 1e-24;
  const pairs: number[] = [];
  for (let v = 0; v < V; v += step) {
    const r = reflect([P[3 * v], P[3 * v + 1], P[3 * v + 2]], n, offset);
    const w = grid.nearest(r[0], r[1], r[2], reach);
    if (w < 0 || w === v) continue;
    const res2 = (P[3 * w] - r[0]) ** 2 + (P[3 * w + 1] - r[1]) ** 2 + (P[3 * w + 2] - r[2]) ** 2;
    if (res2 <= limit2) pairs.push(v, w);
  }
  if (pairs.length < 6) return null;
  const acc = [0, 0, 0];
  for (let i = 0; i < pairs.length; i += 2) {
    const v = pairs[i];
    const w = pairs[i + 1];
    const d = [P[3 * v] - P[3 * w], P[3 * v + 1] - P[3 * w + 1], P[3 * v + 2] - P[3 * w + 2]];
    const dl = Math.hypot(d[0], d[1], d[2]);
    const sgn = d[0] * n[0] + d[1] * n[1] + d[2] * n[2] >= 0 ? 1 : -1;
    for (let k = 0; k < 3; k++) acc[k] += (sgn * d[k]) / dl;
  }
  const l = Math.hypot(acc[0], acc[1], acc[2]);
  if (l === 0) return null;
  const m = acc.map((x) => x / l);
  let mid = 0;
  for (let i = 0; i < pairs.length; i += 2) {
    const v = pairs[i];
    const w = pairs[i + 1];
    mid += (m[0] * (P[3 * v] + P[3 * w]) + m[1] * (P[3 * v + 1] + P[3 * w + 1]) + m[2] * (P[3 * v + 2] + P[3 * w + 2])) / 2;
  }
  return { n: m, offset: mid / (pairs.length / 2) };
}

/**
 * Returns a new SeamMask holding `mask`'s seams plus their mirror images in `plane`: each seam edge's end
 * vertices are mirrored and snapped to the nearest mesh vertex (within half the mean edge length, or the
 * plane's error if larger); when the two snapped vertices share an edge it is marked, otherwise the shortest
 * edge path between them (seamPath) is. Ends that find no vertex are skipped. `twin` from buildTwins.
 */
export function mirrorSeams(mesh: TriMesh, twin: Int32Array, mask: SeamMask, plane: Pick<SymmetryPlane, 'normal' | 'offset'> & { error?: number }): SeamMask {
  const P = mesh.positions;
  const T = mesh.triangles;
  const out = Uint8Array.from(mask);
  const grid = buildVertexGrid(P);
  const graph = buildEdgeGraph(mesh, twin);
  const l = Math.hypot(plane.normal[0], plane.normal[1], plane.normal[2]);
  const n = plane.normal.map((x) => x / l);
  const offset = plane.offset / l;
  const snap = Math.max(0.5 * meanEdgeLength(P, T), plane.error ?? 0);
  const image = new Map<number, number>();
  const mirrorOf = (v: number) => {
    let w = image.get(v);
    if (w === undefined) {
      const r = reflect([P[3 * v], P[3 * v + 1], P[3 * v + 2]], n, offset);
      w = grid.nearest(r[0], r[1], r[2], snap);
      image.set(v, w);
    }
    return w;
  };
  for (let h = 0; h < T.length; h++) {
    if (!mask[h] || (twin[h] >= 0 && twin[h] < h && mask[twin[h]])) continue;
    const a = mirrorOf(T[h]);
    const b = mirrorOf(T[h - (h % 3) + ((h % 3) + 1) % 3]);
    if (a < 0 || b < 0 || a === b) continue;
    const e = findEdge(graph, a, b);
    if (e >= 0) {
      addSeamEdge(out, twin, e);
      continue;
    }
    const path = seamPath(mesh, twin, a, b, { graph });
    if (path) for (let k = 0; k + 1 < path.length; k++) addSeamEdge(out, twin, findEdge(graph, path[k], path[k + 1]));
  }
  return out;
}
