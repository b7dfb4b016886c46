import { GeometryError } from '../errors';
import { choleskyFactor2x2 } from '../sparse/block2-cholesky';
import type { SparseSymmetricMatrix } from '../sparse/sparse-symmetric-matrix';
import { preparePiece, restrictOrder, type PreparedPiece } from './prepared-piece';

/** Vertices held fixed in the plane: vertex[k] goes to (uv[2k], uv[2k+1]), millimetres. */
export interface LscmPins {
  vertex: ArrayLike<number>;
  uv: ArrayLike<number>;
}

/**
 * Returns a conformal flattening of a piece as per-vertex coordinates (Float64Array 2V, u at 2v, v at 2v+1).
 * Least Squares Conformal Maps (Lévy, Petitjean, Ray & Maillot 2002) in the equivalent symmetric form
 * E_C = E_Dirichlet − Area (Desbrun, Meyer & Alliez 2002, "Intrinsic parameterizations of surface meshes";
 * Mullen et al. 2008, "Spectral conformal parameterization"): the cotangent Dirichlet energy of u and v
 * minus the signed area enclosed by the boundary loops, minimised with at least two vertices pinned. The
 * system is symmetric positive definite once two vertices are pinned and is solved with the sparse LDLᵀ
 * in 2×2 blocks (u and v of a vertex together).
 * `positions` 3V (mm), `triangles` 3F counter-clockwise seen from the visible side; the result is
 * counter-clockwise in the plane too. Without `pins` the two boundary vertices farthest apart (by a
 * double sweep) are pinned at (0, 0) and (d, 0), d their 3D distance, so the scale is roughly right.
 * Throws GeometryError FLATTEN_FAILED for a piece that cannot be flattened (see pieceTopology) or bad pins.
 */
export function lscm(positions: Float64Array, triangles: Uint32Array, pins?: LscmPins): Float64Array {
  return lscmPrepared(preparePiece(positions, triangles), pins);
}

/** lscm on a piece already prepared by preparePiece (same result, shared precomputation). */
export function lscmPrepared(piece: PreparedPiece, pins?: LscmPins): Float64Array {
  const { positions, triangles, topo } = piece;
  const nv = positions.length / 3;
  const { pinVertex, pinUV } = pins ? checkPins(pins, nv) : farthestBoundaryPins(positions, triangles, topo.boundary);

  // Unknowns: u and v of every free vertex, interleaved (2k, 2k+1) so that the vertex ordering carries over.
  const vfree = new Int32Array(nv);
  const pinU = new Float64Array(nv);
  const pinV = new Float64Array(nv);
  for (let k = 0; k < pinVertex.length; k++) {
    vfree[pinVertex[k]] = -1;
    pinU[pinVertex[k]] = pinUV[2 * k];
    pinV[pinVertex[k]] = pinUV[2 * k + 1];
  }
  let m = 0;
  for (let v = 0; v < nv; v++) vfree[v] = vfree[v] < 0 ? -1 : m++;

  // Hessian of E_C in 2×2 blocks: block (i, j) = [[L_ij, −s_ij], [s_ij, L_ij]], L the cotangent Laplacian
  // (the Dirichlet part) and s_ij = ½ if i→j is a boundary half-edge, −½ if j→i is: the Hessian of the
  // enclosed area ½Σ(u_a v_b − u_b v_a) over boundary half-edges a→b, which E_C subtracts.
  const lap = piece.laplacian;
  const area = new Float64Array(lap.rowIdx.length);
  for (const h of topo.boundary) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    area[entryOf(lap, a, b)] += 0.5;
    area[entryOf(lap, b, a)] -= 0.5;
  }
  let nnz = 0;
  for (let j = 0; j < nv; j++) {
    if (vfree[j] < 0) continue;
    for (let p = lap.colPtr[j]; p < lap.colPtr[j + 1]; p++) {
      if (vfree[lap.rowIdx[p]] >= 0) nnz += area[p] === 0 ? 2 : 4;
    }
  }
  const colPtr = new Int32Array(2 * m + 1);
  const rowIdx = new Int32Array(nnz);
  const values = new Float64Array(nnz);
  const rhs = new Float64Array(2 * m);
  let q = 0;
  for (let j = 0; j < nv; j++) {
    const k = vfree[j];
    if (k < 0) continue;
    // Column u_j, then column v_j; rows ascend because free indices keep the vertex order.
    for (let c = 0; c < 2; c++) {
      colPtr[2 * k + c] = q;
      for (let p = lap.colPtr[j]; p < lap.colPtr[j + 1]; p++) {
        const ni = vfree[lap.rowIdx[p]];
        if (ni < 0) continue;
        const l = lap.values[p];
        const sij = area[p];
        if (c === 0) {
          rowIdx[q] = 2 * ni;
          values[q++] = l;
          if (sij !== 0) {
            rowIdx[q] = 2 * ni + 1;
            values[q++] = sij;
          }
        } else {
          if (sij !== 0) {
            rowIdx[q] = 2 * ni;
            values[q++] = -sij;
          }
          rowIdx[q] = 2 * ni + 1;
          values[q++] = l;
        }
      }
    }
    // Pinned neighbours move to the right-hand side: H(u_j, u_i) = L_ij, H(u_j, v_i) = s_ij,
    // H(v_j, u_i) = −s_ij, H(v_j, v_i) = L_ij.
    for (let p = lap.colPtr[j]; p < lap.colPtr[j + 1]; p++) {
      const i = lap.rowIdx[p];
      if (vfree[i] >= 0) continue;
      rhs[2 * k] -= lap.values[p] * pinU[i] + area[p] * pinV[i];
      rhs[2 * k + 1] -= -area[p] * pinU[i] + lap.values[p] * pinV[i];
    }
  }
  colPtr[2 * m] = q;
  const matrix = { n: 2 * m, colPtr, rowIdx, values };
  let solution: Float64Array;
  try {
    solution = choleskyFactor2x2(matrix, restrictOrder(piece.vertexOrder, vfree, m)).solve(rhs);
  } catch (e) {
    throw new GeometryError(
      'FLATTEN_FAILED',
      `conformal flattening has no unique solution (${(e as Error).message}); are the pins on one point?`,
    );
  }
  const uv = new Float64Array(2 * nv);
  for (let v = 0; v < nv; v++) {
    const k = vfree[v];
    uv[2 * v] = k < 0 ? pinU[v] : solution[2 * k];
    uv[2 * v + 1] = k < 0 ? pinV[v] : solution[2 * k + 1];
  }
  return uv;
}

/** Position of entry (row, col) in `a`'s storage (binary search in the column); the entry must exist. */
function entryOf(a: SparseSymmetricMatrix, row: number, col: number): number {
  let lo = a.colPtr[col];
  let hi = a.colPtr[col + 1] - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (a.rowIdx[mid] < row) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

function checkPins(pins: LscmPins, nv: number): { pinVertex: Int32Array; pinUV: Float64Array } {
  const k = pins.vertex.length;
  if (k < 2 || pins.uv.length !== 2 * k) {
    throw new GeometryError(
      'FLATTEN_FAILED',
      `pins need at least two vertices and two coordinates each (got ${k} vertices, ${pins.uv.length} coordinates)`,
    );
  }
  const seen = new Set<number>();
  for (let i = 0; i < k; i++) {
    const v = pins.vertex[i];
    if (!Number.isInteger(v) || v < 0 || v >= nv || seen.has(v)) {
      throw new GeometryError('FLATTEN_FAILED', `pin ${i}: vertex ${v} is out of range or pinned twice`, { vertex: v });
    }
    if (!Number.isFinite(pins.uv[2 * i]) || !Number.isFinite(pins.uv[2 * i + 1])) {
      throw new GeometryError('FLATTEN_FAILED', `pin ${i}: coordinates of vertex ${v} are not finite`, { vertex: v });
    }
    seen.add(v);
  }
  return { pinVertex: Int32Array.from(pins.vertex), pinUV: Float64Array.from(pins.uv) };
}

/** Two boundary vertices far apart: the farthest from the first boundary vertex, then the farthest from it. */
function farthestBoundaryPins(
  positions: Float64Array,
  triangles: Uint32Array,
  boundary: Int32Array,
): { pinVertex: Int32Array; pinUV: Float64Array } {
  const farthestFrom = (v: number): number => {
    let best = v;
    let bestD = -1;
    for (const h of boundary) {
      const w = triangles[h];
      const d = dist2(positions, v, w);
      if (d > bestD || (d === bestD && w < best)) {
        bestD = d;
        best = w;
      }
    }
    return best;
  };
  const a = farthestFrom(triangles[boundary[0]]);
  const b = farthestFrom(a);
  return { pinVertex: Int32Array.of(a, b), pinUV: Float64Array.of(0, 0, Math.sqrt(dist2(positions, a, b)), 0) };
}

function dist2(p: Float64Array, a: number, b: number): number {
  const dx = p[3 * a] - p[3 * b];
  const dy = p[3 * a + 1] - p[3 * b + 1];
  const dz = p[3 * a + 2] - p[3 * b + 2];
  return dx * dx + dy * dy + dz * dz;
}
