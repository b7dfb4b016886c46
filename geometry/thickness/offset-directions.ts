/**
 * Where each vertex of the outer skin goes when the pattern follows a surface inside the foam. On a smooth
 * surface the unit vertex normal is right (a cylinder's inner face is the concentric cylinder). At a crease or a
 * corner it is not: the inner face of each flat panel lies a full thickness behind the panel, so the corner
 * point must be a thickness behind every face that meets there. A box of outside size a made of boards t thick
 * is a − 2t inside (elementary solid geometry); moving the corner along the averaged normal would give only
 * a − 2t/√3.
 */

import { cornerAngles } from '../mesh/corner-angles';
import { unitFaceNormals } from '../mesh/face-normals';

/** Face normals spread wider than this from the vertex normal make a vertex a crease vertex, degrees. */
export const CREASE_SPREAD_DEG = 10;

/**
 * Limit on how far a corner may move, as a multiple of the offset: a very sharp spike's true offset point runs
 * off far behind it. The default mitre limit of SVG strokes, 4 (SVG 1.1, §11.4 'stroke-miterlimit'), serves the
 * same purpose for joins of thick lines.
 */
export const MITRE_LIMIT = 4;

/**
 * Returns per-vertex offset directions, Float64Array(3V): the surface at depth d is `p − d·dir` for each vertex p.
 *
 * @param positions Float64Array(3V), mm, the outer skin.
 * @param triangles Uint32Array(3F), counter-clockwise seen from outside.
 * @param normals Float64Array(3V), unit outward vertex normals (angle-weighted, see mesh/vertex-normals.ts).
 * @returns for a vertex whose incident face normals all lie within CREASE_SPREAD_DEG of its normal, that unit
 *   normal; otherwise the vector x with n_f·x = 1 for every incident face f in the least-squares sense (corner
 *   angles as weights), so the moved point lies one unit behind each face plane: (1, 1, 1) at a cube corner,
 *   (1, 1, 0) along a cube edge. Directions along which the faces do not constrain the point (along a straight
 *   crease) get no component. The length is capped at MITRE_LIMIT. A vertex with no face gets (0, 0, 0).
 */
export function offsetDirections(positions: Float64Array, triangles: Uint32Array, normals: Float64Array): Float64Array {
  const V = positions.length / 3;
  // Per vertex: the weighted normal matrix M = Σ w·n·nᵀ (6 entries), b = Σ w·n, Σ w, and the smallest n·normal.
  const normalMatrix = new Float64Array(6 * V);
  const b = new Float64Array(3 * V);
  const minCos = new Float64Array(V).fill(1);
  const faceNormals = unitFaceNormals(positions, triangles);
  const angles = cornerAngles(positions, triangles);
  for (let c = 0; c < triangles.length; c++) {
    const n = c - (c % 3);
    const nx = faceNormals[n];
    const ny = faceNormals[n + 1];
    const nz = faceNormals[n + 2];
    if (nx === 0 && ny === 0 && nz === 0) continue;
    const p = 3 * triangles[c];
    const w = angles[c];
    const v = p / 3;
    const k = 6 * v;
    normalMatrix[k] += w * nx * nx;
    normalMatrix[k + 1] += w * nx * ny;
    normalMatrix[k + 2] += w * nx * nz;
    normalMatrix[k + 3] += w * ny * ny;
    normalMatrix[k + 4] += w * ny * nz;
    normalMatrix[k + 5] += w * nz * nz;
    b[p] += w * nx;
    b[p + 1] += w * ny;
    b[p + 2] += w * nz;
    const cos = nx * normals[p] + ny * normals[p + 1] + nz * normals[p + 2];
    if (cos < minCos[v]) minCos[v] = cos;
  }
  const out = new Float64Array(3 * V);
  const smooth = Math.cos((CREASE_SPREAD_DEG * Math.PI) / 180);
  for (let v = 0; v < V; v++) {
    const o = 3 * v;
    if (minCos[v] >= smooth) {
      out[o] = normals[o];
      out[o + 1] = normals[o + 1];
      out[o + 2] = normals[o + 2];
      continue;
    }
    const k = 6 * v;
    const nm = normalMatrix;
    const x = solveSymmetric3Pseudo(nm[k], nm[k + 1], nm[k + 2], nm[k + 3], nm[k + 4], nm[k + 5], b[o], b[o + 1], b[o + 2]);
    const len = Math.hypot(x[0], x[1], x[2]);
    const scale = len > MITRE_LIMIT ? MITRE_LIMIT / len : 1;
    out[o] = x[0] * scale;
    out[o + 1] = x[1] * scale;
    out[o + 2] = x[2] * scale;
  }
  return out;
}

/** Eigen-directions weaker than this share of the strongest are left unconstrained (no movement along them). */
const WEAK_DIRECTION_SHARE = 0.01;

/**
 * Least-squares solution of the symmetric positive semi-definite 3×3 system [a b c; b d e; c e f]·x = r by its
 * eigen-decomposition (cyclic Jacobi rotations), taking the pseudo-inverse: a direction whose eigenvalue is
 * below WEAK_DIRECTION_SHARE of the largest (along a straight or gently curving crease) gets no component, where
 * a plain inverse would send the point far along the crease.
 */
function solveSymmetric3Pseudo(
  a: number, b: number, c: number, d: number, e: number, f: number,
  r0: number, r1: number, r2: number,
): [number, number, number] {
  const A = [[a, b, c], [b, d, e], [c, e, f]];
  const Q = [[1, 0, 0], [0, 1, 0], [0, 0, 1]];
  for (let sweep = 0; sweep < 20; sweep++) {
    const off = A[0][1] * A[0][1] + A[0][2] * A[0][2] + A[1][2] * A[1][2];
    if (off <= 1e-30 * (A[0][0] * A[0][0] + A[1][1] * A[1][1] + A[2][2] * A[2][2]) || off === 0) break;
    for (const [p, q] of [[0, 1], [0, 2], [1, 2]]) {
      if (A[p][q] === 0) continue;
      // Jacobi rotation annihilating A[p][q] (Golub & Van Loan, Matrix Computations, §8.5).
      const theta = (A[q][q] - A[p][p]) / (2 * A[p][q]);
      const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
      const cs = 1 / Math.sqrt(t * t + 1);
      const sn = t * cs;
      for (let k = 0; k < 3; k++) {
        const akp = A[k][p];
        const akq = A[k][q];
        A[k][p] = cs * akp - sn * akq;
        A[k][q] = sn * akp + cs * akq;
      }
      for (let k = 0; k < 3; k++) {
        const apk = A[p][k];
        const aqk = A[q][k];
        A[p][k] = cs * apk - sn * aqk;
        A[q][k] = sn * apk + cs * aqk;
      }
      for (let k = 0; k < 3; k++) {
        const qkp = Q[k][p];
        const qkq = Q[k][q];
        Q[k][p] = cs * qkp - sn * qkq;
        Q[k][q] = sn * qkp + cs * qkq;
      }
    }
  }
  const lambda = [A[0][0], A[1][1], A[2][2]];
  const largest = Math.max(...lambda);
  const x: [number, number, number] = [0, 0, 0];
  if (!(largest > 0) || !Number.isFinite(largest)) return x;
  for (let j = 0; j < 3; j++) {
    if (lambda[j] < WEAK_DIRECTION_SHARE * largest) continue;
    const coef = (Q[0][j] * r0 + Q[1][j] * r1 + Q[2][j] * r2) / lambda[j];
    for (let k = 0; k < 3; k++) x[k] += coef * Q[k][j];
  }
  return x;
}
