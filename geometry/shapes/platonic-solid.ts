import { GeometryError } from '../errors';
import type { TriMesh } from '../mesh/tri-mesh';
import { meshFromLists, requirePositive } from './mesh-builder';

export type PlatonicKind = 'tetrahedron' | 'cube' | 'octahedron' | 'dodecahedron' | 'icosahedron';

const PHI = (1 + Math.sqrt(5)) / 2;

/** Vertex sets centred on the origin (Coxeter, Regular Polytopes, §3.7 coordinates). */
function platonicVertices(kind: PlatonicKind): number[][] {
  switch (kind) {
    case 'tetrahedron':
      return [[1, 1, 1], [1, -1, -1], [-1, 1, -1], [-1, -1, 1]];
    case 'cube': {
      const v: number[][] = [];
      for (const x of [-1, 1]) for (const y of [-1, 1]) for (const z of [-1, 1]) v.push([x, y, z]);
      return v;
    }
    case 'octahedron':
      return [[1, 0, 0], [-1, 0, 0], [0, 1, 0], [0, -1, 0], [0, 0, 1], [0, 0, -1]];
    case 'icosahedron': {
      const v: number[][] = [];
      for (const a of [-1, 1]) for (const b of [-PHI, PHI]) v.push([0, a, b], [a, b, 0], [b, 0, a]);
      return v;
    }
    case 'dodecahedron': {
      const v: number[][] = [];
      for (const x of [-1, 1]) for (const y of [-1, 1]) for (const z of [-1, 1]) v.push([x, y, z]);
      for (const a of [-1 / PHI, 1 / PHI]) for (const b of [-PHI, PHI]) v.push([0, a, b], [a, b, 0], [b, 0, a]);
      return v;
    }
    default:
      throw new GeometryError('BAD_OPTION', `unknown Platonic solid "${String(kind)}"`);
  }
}

const sub = (a: number[], b: number[]) => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];
const dot = (a: number[], b: number[]) => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const cross = (a: number[], b: number[]) => [
  a[1] * b[2] - a[2] * b[1],
  a[2] * b[0] - a[0] * b[2],
  a[0] * b[1] - a[1] * b[0],
];

/**
 * Returns a Platonic solid with every edge `edgeMm` long, centred on the origin, as a closed TriMesh with
 * outward counter-clockwise triangles. Faces that are not triangles (square, pentagon) are fanned from their
 * first corner, so those fan diagonals are flat (180°) edges.
 *
 * Faces are found as the supporting planes of the convex vertex set: a plane through three vertices with
 * every vertex on one side is a face; its vertices are ordered by angle around the face centre.
 */
export function platonicSolid(kind: PlatonicKind, edgeMm: number): TriMesh {
  requirePositive('edgeMm', edgeMm);
  const verts = platonicVertices(kind);
  let minD = Infinity;
  for (let i = 0; i < verts.length; i++)
    for (let j = i + 1; j < verts.length; j++) minD = Math.min(minD, Math.hypot(...sub(verts[i], verts[j])));
  const scale = edgeMm / minD;
  const pts = verts.map((p) => p.map((c) => c * scale));
  const eps = 1e-9 * edgeMm;
  const seen = new Set<string>();
  const triangles: number[] = [];
  for (let i = 0; i < pts.length; i++)
    for (let j = i + 1; j < pts.length; j++)
      for (let k = j + 1; k < pts.length; k++) {
        let n = cross(sub(pts[j], pts[i]), sub(pts[k], pts[i]));
        const len = Math.hypot(...n);
        if (len < eps) continue;
        n = n.map((c) => c / len);
        // Outward normal: the origin (the centre) is on the inner side.
        if (dot(n, pts[i]) < 0) n = n.map((c) => -c);
        const d = dot(n, pts[i]);
        if (pts.some((p) => dot(n, p) > d + eps)) continue;
        const onFace = pts.map((_, idx) => idx).filter((idx) => Math.abs(dot(n, pts[idx]) - d) <= eps);
        const key = onFace.join(',');
        if (seen.has(key)) continue;
        seen.add(key);
        const c = [0, 0, 0];
        for (const idx of onFace) for (let a = 0; a < 3; a++) c[a] += pts[idx][a] / onFace.length;
        const u = sub(pts[onFace[0]], c);
        const w = cross(n, u);
        const ordered = onFace
          .map((idx) => ({ idx, ang: Math.atan2(dot(sub(pts[idx], c), w), dot(sub(pts[idx], c), u)) }))
          .sort((a, b) => a.ang - b.ang)
          .map((e) => e.idx);
        for (let m = 1; m + 1 < ordered.length; m++) triangles.push(ordered[0], ordered[m], ordered[m + 1]);
      }
  return meshFromLists(pts.flat(), triangles);
}
