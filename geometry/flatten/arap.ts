import { GeometryError } from '../errors';
import { choleskyFactor } from '../sparse/cholesky';
import { principalSubmatrix } from '../sparse/sparse-symmetric-matrix';
import { preparePiece, restrictOrder, type PreparedPiece } from './prepared-piece';

export interface ArapOptions {
  /** Most local/global rounds (default 60). */
  iterations?: number;
  /** Stop when the energy changes by less than this fraction between rounds (default 1e-6). */
  tolerance?: number;
}

/**
 * Returns an as-rigid-as-possible flattening (Float64Array 2V, mm) starting from `initialUV` (2V, e.g. a
 * rescaled LSCM result). Local/global ARAP parameterization (Liu, Zhang, Xu, Gotsman & Gortler 2008,
 * "A Local/Global Approach to Mesh Parameterization", SGP): each round fits every triangle the rotation
 * closest to its current 2D map (closed form for 2×2 — the unit vector along (a+d, c−b) of the weighted
 * cross-covariance [[a, b], [c, d]] gives its cosine and sine, no trigonometry needed), then solves the cotangent Laplacian system for all vertices with the factor built
 * once before the first round (one vertex held to fix the translation). Rounds stop when the ARAP energy
 * changes by less than `tolerance` relative, or after `iterations`. Flip guard: a round that would invert
 * more triangles than the current iterate is shortened by halving the step toward it (up to 12 halvings);
 * if no shortened step keeps the count, the current iterate is returned. So the result never has more
 * inverted triangles than `initialUV`. `positions` 3V mm, `triangles` 3F as for lscm. Throws GeometryError
 * FLATTEN_FAILED for a piece pieceTopology refuses, bad sizes or options, or a failed solve.
 */
export function arapFlatten(
  positions: Float64Array,
  triangles: Uint32Array,
  initialUV: Float64Array,
  opts: ArapOptions = {},
): Float64Array {
  return arapFlattenPrepared(preparePiece(positions, triangles), initialUV, opts);
}

/** arapFlatten on a piece already prepared by preparePiece (same result, shared precomputation). */
export function arapFlattenPrepared(piece: PreparedPiece, initialUV: Float64Array, opts: ArapOptions = {}): Float64Array {
  const { positions, triangles, cot } = piece;
  const nv = positions.length / 3;
  const nf = triangles.length / 3;
  const maxRounds = opts.iterations ?? 60;
  const tolerance = opts.tolerance ?? 1e-6;
  if (initialUV.length !== 2 * nv) {
    throw new GeometryError('FLATTEN_FAILED', `initial flattening has ${initialUV.length} values, need ${2 * nv} (2 per vertex)`);
  }
  if (!Number.isInteger(maxRounds) || maxRounds < 0) {
    throw new GeometryError('FLATTEN_FAILED', `ARAP iterations must be a non-negative integer, got ${maxRounds}`);
  }
  if (!(tolerance >= 0)) throw new GeometryError('FLATTEN_FAILED', `ARAP tolerance must be ≥ 0, got ${tolerance}`);
  for (let i = 0; i < initialUV.length; i++) {
    if (!Number.isFinite(initialUV[i])) {
      throw new GeometryError('FLATTEN_FAILED', `initial flattening of vertex ${i >> 1} is not finite`, { vertex: i >> 1 });
    }
  }

  const edge = isometricEdges(positions, triangles);
  // Global step: L·u = Σ ½cot_h·R_f(x_a − x_b) (per half-edge a→b, into a and minus into b), L the
  // cotangent Laplacian with vertex `held` removed to fix the translation.
  const held = triangles[0];
  const index = new Int32Array(nv);
  for (let v = 0, k = 0; v < nv; v++) index[v] = v === held ? -1 : k++;
  let factor;
  try {
    factor = choleskyFactor(principalSubmatrix(piece.laplacian, index, nv - 1), restrictOrder(piece.vertexOrder, index, nv - 1));
  } catch (e) {
    throw new GeometryError('FLATTEN_FAILED', `ARAP system could not be factored: ${(e as Error).message}`);
  }

  // Per half-edge a→b: the unknowns of a and b (−1 for the held vertex) and ½cot, read every round.
  const fromIndex = new Int32Array(3 * nf);
  const toIndex = new Int32Array(3 * nf);
  const halfCot = new Float64Array(3 * nf);
  for (let h = 0; h < 3 * nf; h++) {
    fromIndex[h] = index[triangles[h]];
    toIndex[h] = index[triangles[h % 3 === 2 ? h - 2 : h + 1]];
    halfCot[h] = 0.5 * cot[h];
  }

  // Two coordinate buffers swapped each accepted round, and one for the global step's target, so a round
  // allocates nothing (trial flattenings of small charts run thousands of these).
  let uv = Float64Array.from(initialUV);
  let spare = new Float64Array(2 * nv);
  const target = new Float64Array(2 * nv);
  let flips = invertedCount(uv, triangles);
  const rot = new Float64Array(2 * nf); // cos, sin per triangle
  const rhsU = new Float64Array(nv - 1);
  const rhsV = new Float64Array(nv - 1);
  const solU = new Float64Array(nv - 1);
  const solV = new Float64Array(nv - 1);
  let previousEnergy = Infinity;
  for (let round = 0; round < maxRounds; round++) {
    const energy = fitRotations(uv, triangles, cot, edge, rot);
    if (energy === 0) break;
    if (round > 0 && Math.abs(previousEnergy - energy) <= tolerance * previousEnergy) break;
    previousEnergy = energy;

    rhsU.fill(0);
    rhsV.fill(0);
    const hu = uv[2 * held];
    const hv = uv[2 * held + 1];
    for (let f = 0; f < nf; f++) {
      const c = rot[2 * f];
      const s = rot[2 * f + 1];
      for (let h = 3 * f; h < 3 * f + 3; h++) {
        const dx = edge[2 * h];
        const dy = edge[2 * h + 1];
        const w = halfCot[h];
        const gx = w * (c * dx - s * dy);
        const gy = w * (s * dx + c * dy);
        const ia = fromIndex[h];
        const ib = toIndex[h];
        if (ia >= 0) {
          rhsU[ia] += gx;
          rhsV[ia] += gy;
          if (ib < 0) {
            rhsU[ia] += w * hu;
            rhsV[ia] += w * hv;
          }
        }
        if (ib >= 0) {
          rhsU[ib] -= gx;
          rhsV[ib] -= gy;
          if (ia < 0) {
            rhsU[ib] += w * hu;
            rhsV[ib] += w * hv;
          }
        }
      }
    }
    factor.solvePair(rhsU, rhsV, solU, solV);
    for (let v = 0; v < nv; v++) {
      const k = index[v];
      target[2 * v] = k < 0 ? hu : solU[k];
      target[2 * v + 1] = k < 0 ? hv : solV[k];
    }
    const accepted = guardedStep(uv, target, spare, triangles, flips);
    if (accepted < 0) break;
    const previous = uv;
    uv = spare;
    spare = previous;
    flips = accepted;
  }
  for (let i = 0; i < uv.length; i++) {
    if (!Number.isFinite(uv[i])) {
      throw new GeometryError('FLATTEN_FAILED', `ARAP produced a non-finite coordinate at vertex ${i >> 1}`, { vertex: i >> 1 });
    }
  }
  return uv;
}

/**
 * The step toward `target`, halved until it inverts no more triangles than `flips`, written into `trial`;
 * returns the inverted count of the step taken, or −1 if no step keeps the count.
 */
function guardedStep(
  uv: Float64Array,
  target: Float64Array,
  trial: Float64Array,
  triangles: Uint32Array,
  flips: number,
): number {
  let step = 1;
  for (let halving = 0; halving <= 12; halving++) {
    for (let i = 0; i < uv.length; i++) trial[i] = uv[i] + step * (target[i] - uv[i]);
    const n = invertedCount(trial, triangles);
    if (n <= flips) return n;
    step *= 0.5;
  }
  return -1;
}

/** Triangles whose signed area in `uv` (the shoelace formula, as signedAreas) is not positive. */
function invertedCount(uv: Float64Array, triangles: Uint32Array): number {
  let n = 0;
  for (let t = 0; t < triangles.length; t += 3) {
    const a = 2 * triangles[t];
    const b = 2 * triangles[t + 1];
    const c = 2 * triangles[t + 2];
    const area = 0.5 * ((uv[b] - uv[a]) * (uv[c + 1] - uv[a + 1]) - (uv[c] - uv[a]) * (uv[b + 1] - uv[a + 1]));
    if (!(area > 0)) n++;
  }
  return n;
}

/**
 * Each triangle laid isometrically in its own plane (corner 0 at the origin, corner 1 on +x, corner 2
 * above the x axis), returned as its half-edge vectors: for h = 3f+i from corner i to corner (i+1) mod 3,
 * (x_i − x_(i+1), y_i − y_(i+1)) at 2h, 2h+1 — computed once, as every round reads them.
 */
function isometricEdges(positions: Float64Array, triangles: Uint32Array): Float64Array {
  const nf = triangles.length / 3;
  const out = new Float64Array(6 * nf);
  for (let f = 0; f < nf; f++) {
    const i0 = 3 * triangles[3 * f];
    const i1 = 3 * triangles[3 * f + 1];
    const i2 = 3 * triangles[3 * f + 2];
    const ax = positions[i1] - positions[i0];
    const ay = positions[i1 + 1] - positions[i0 + 1];
    const az = positions[i1 + 2] - positions[i0 + 2];
    const bx = positions[i2] - positions[i0];
    const by = positions[i2 + 1] - positions[i0 + 1];
    const bz = positions[i2 + 2] - positions[i0 + 2];
    const la = Math.sqrt(ax * ax + ay * ay + az * az);
    const cx = ay * bz - az * by;
    const cy = az * bx - ax * bz;
    const cz = ax * by - ay * bx;
    const x2 = (ax * bx + ay * by + az * bz) / la;
    const y2 = Math.sqrt(cx * cx + cy * cy + cz * cz) / la;
    out[6 * f] = -la;
    out[6 * f + 2] = la - x2;
    out[6 * f + 3] = -y2;
    out[6 * f + 4] = x2;
    out[6 * f + 5] = y2;
  }
  return out;
}

/**
 * Local step: for each triangle the rotation R maximising Σ cot·(du·R dx) over its half-edges, written
 * to rot as (cos, sin); returns the ARAP energy ½ Σ cot ‖du − R dx‖² of `uv` with those rotations.
 */
function fitRotations(
  uv: Float64Array,
  triangles: Uint32Array,
  cot: Float64Array,
  edge: Float64Array,
  rot: Float64Array,
): number {
  const nf = triangles.length / 3;
  let energy = 0;
  for (let f = 0; f < nf; f++) {
    // The three half-edges' 2D differences, read once for both the fit and the energy.
    const a = 2 * triangles[3 * f];
    const b = 2 * triangles[3 * f + 1];
    const c2 = 2 * triangles[3 * f + 2];
    const du0 = uv[a] - uv[b];
    const dv0 = uv[a + 1] - uv[b + 1];
    const du1 = uv[b] - uv[c2];
    const dv1 = uv[b + 1] - uv[c2 + 1];
    const du2 = uv[c2] - uv[a];
    const dv2 = uv[c2 + 1] - uv[a + 1];
    const w0 = cot[3 * f];
    const w1 = cot[3 * f + 1];
    const w2 = cot[3 * f + 2];
    const e = 6 * f;
    const dx0 = edge[e];
    const dy0 = edge[e + 1];
    const dx1 = edge[e + 2];
    const dy1 = edge[e + 3];
    const dx2 = edge[e + 4];
    const dy2 = edge[e + 5];
    // Sums in half-edge order from zero, as a loop over the three would.
    let s00 = 0;
    let s01 = 0;
    let s10 = 0;
    let s11 = 0;
    s00 += w0 * du0 * dx0;
    s01 += w0 * du0 * dy0;
    s10 += w0 * dv0 * dx0;
    s11 += w0 * dv0 * dy0;
    s00 += w1 * du1 * dx1;
    s01 += w1 * du1 * dy1;
    s10 += w1 * dv1 * dx1;
    s11 += w1 * dv1 * dy1;
    s00 += w2 * du2 * dx2;
    s01 += w2 * du2 * dy2;
    s10 += w2 * dv2 * dx2;
    s11 += w2 * dv2 * dy2;
    // (cos, sin) of atan2(ry, rx) by normalising (rx, ry); the identity when the covariance vanishes.
    const ry = s10 - s01;
    const rx = s00 + s11;
    const r = Math.sqrt(rx * rx + ry * ry);
    const c = r > 0 ? rx / r : 1;
    const s = r > 0 ? ry / r : 0;
    rot[2 * f] = c;
    rot[2 * f + 1] = s;
    const ex0 = du0 - (c * dx0 - s * dy0);
    const ey0 = dv0 - (s * dx0 + c * dy0);
    energy += 0.5 * w0 * (ex0 * ex0 + ey0 * ey0);
    const ex1 = du1 - (c * dx1 - s * dy1);
    const ey1 = dv1 - (s * dx1 + c * dy1);
    energy += 0.5 * w1 * (ex1 * ex1 + ey1 * ey1);
    const ex2 = du2 - (c * dx2 - s * dy2);
    const ey2 = dv2 - (s * dx2 + c * dy2);
    energy += 0.5 * w2 * (ex2 * ex2 + ey2 * ey2);
  }
  return energy;
}
