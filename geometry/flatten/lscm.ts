import { GeometryError } from '../errors';
import { choleskyFactor } from '../sparse/cholesky';
import { fromTriplets } from '../sparse/sparse-symmetric-matrix';
import { cotanWeights } from './cotan-weights';
import { pieceTopology } from './piece-topology';

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
 * system is symmetric positive definite once two vertices are pinned and is solved with the sparse LDLᵀ.
 * `positions` 3V (mm), `triangles` 3F counter-clockwise seen from the visible side; the result is
 * counter-clockwise in the plane too. Without `pins` the two boundary vertices farthest apart (by a
 * double sweep) are pinned at (0, 0) and (d, 0), d their 3D distance, so the scale is roughly right.
 * Throws GeometryError FLATTEN_FAILED for a piece that cannot be flattened (see pieceTopology) or bad pins.
 */
export function lscm(positions: Float64Array, triangles: Uint32Array, pins?: LscmPins): Float64Array {
  const topo = pieceTopology(positions, triangles);
  const nv = positions.length / 3;
  const { pinVertex, pinUV } = pins ? checkPins(pins, nv) : farthestBoundaryPins(positions, triangles, topo.boundary);

  // Variable 2v is u_v, 2v+1 is v_v; pinned variables are moved to the right-hand side.
  const free = new Int32Array(2 * nv);
  const fixedValue = new Float64Array(2 * nv);
  for (let k = 0; k < pinVertex.length; k++) {
    free[2 * pinVertex[k]] = -1;
    free[2 * pinVertex[k] + 1] = -1;
    fixedValue[2 * pinVertex[k]] = pinUV[2 * k];
    fixedValue[2 * pinVertex[k] + 1] = pinUV[2 * k + 1];
  }
  let nFree = 0;
  for (let x = 0; x < 2 * nv; x++) if (free[x] === 0) free[x] = nFree++;
  else free[x] = -1;

  const cot = cotanWeights(positions, triangles);
  const nf = triangles.length / 3;
  const cap = 18 * nf + 2 * topo.boundary.length;
  const rows = new Int32Array(cap);
  const cols = new Int32Array(cap);
  const vals = new Float64Array(cap);
  const rhs = new Float64Array(nFree);
  let t = 0;
  // One symmetric entry (a, b, w) of the Hessian of E_C, split between matrix and right-hand side.
  const add = (a: number, b: number, w: number): void => {
    const fa = free[a];
    const fb = free[b];
    if (fa >= 0 && fb >= 0) {
      rows[t] = fa;
      cols[t] = fb;
      vals[t++] = w;
    } else if (fa >= 0) {
      rhs[fa] -= w * fixedValue[b];
    } else if (fb >= 0) {
      rhs[fb] -= w * fixedValue[a];
    }
  };
  // Dirichlet part: half-edge a→b adds ¼·cot_h·(x_a − x_b)² to the energy of u and of v (Hessian ½·cot_h).
  for (let h = 0; h < 3 * nf; h++) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    const w = 0.5 * cot[h];
    for (let c = 0; c < 2; c++) {
      add(2 * a + c, 2 * a + c, w);
      add(2 * b + c, 2 * b + c, w);
      add(2 * a + c, 2 * b + c, -w);
    }
  }
  // Area part: the boundary half-edge a→b adds ½(u_a v_b − u_b v_a) to the enclosed area, whose Hessian
  // has +½ at (u_a, v_b) and −½ at (u_b, v_a); E_C subtracts it.
  for (const h of topo.boundary) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    add(2 * a, 2 * b + 1, -0.5);
    add(2 * b, 2 * a + 1, 0.5);
  }
  const matrix = fromTriplets(nFree, rows.subarray(0, t), cols.subarray(0, t), vals.subarray(0, t));
  let solution: Float64Array;
  try {
    solution = choleskyFactor(matrix).solve(rhs);
  } catch (e) {
    throw new GeometryError(
      'FLATTEN_FAILED',
      `conformal flattening has no unique solution (${(e as Error).message}); are the pins on one point?`,
    );
  }
  const uv = new Float64Array(2 * nv);
  for (let x = 0; x < 2 * nv; x++) uv[x] = free[x] >= 0 ? solution[free[x]] : fixedValue[x];
  return uv;
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
