import { GeometryError } from '../errors';
import type { TriMesh } from '../mesh/tri-mesh';
import { arapFlatten } from './arap';
import { canonicalPose } from './canonical-pose';
import { lscm } from './lscm';
import { signedAreas } from './signed-area';
import { triangleStretch } from './triangle-stretch';

/** A piece laid flat. */
export interface FlatPiece {
  /** Per-vertex 2D coordinates, mm (2V): counter-clockwise, principal axis along x, bounding box from (0, 0). */
  uv: Float64Array;
  stretch: { maxPct: number; rmsPct: number };
  /** Per triangle, max(|σ1−1|, |σ2−1|)·100 (see triangleStretch). */
  trianglePct: Float64Array;
  /** Inverted triangles in `uv` (0 on every valid result the tests know of). */
  flipped: number;
  /** Area of the flat piece, mm² (sum of signed triangle areas). */
  area2d: number;
  /** Area of the piece in 3D, mm². */
  area3d: number;
}

export interface FlattenOptions {
  /** Most ARAP rounds (default 60). */
  arapIterations?: number;
  /**
   * Work budget in milliseconds of the reference 2-core machine. geometry/ reads no clock (results must
   * not depend on machine load), so the budget is turned into a cap on ARAP rounds with a cost model
   * measured by bench/sparse.bench.ts: about ARAP_MS_PER_TRIANGLE_ROUND ms per triangle per round.
   */
  maxMillis?: number;
}

/** Measured cost of one ARAP round per triangle on the reference machine (bench/sparse.bench.ts). */
export const ARAP_MS_PER_TRIANGLE_ROUND = 4e-4;

/**
 * Returns the least-stretch flattening of one piece (positions in mm): LSCM (Lévy et al. 2002) as the
 * start, scaled so its area equals the 3D area, then local/global ARAP (Liu et al. 2008), then the
 * canonical pose (see canonicalPose) with per-triangle stretch (Sander et al. 2001). The piece must be a
 * connected, consistently wound surface with at least one boundary loop (a disk, or a disk with holes).
 * Deterministic: the same piece gives the same numbers. Never returns NaN: throws GeometryError
 * FLATTEN_FAILED saying why (no boundary, separate parts, zero-area triangle, non-manifold edge, …).
 */
export function flattenPiece(piece: TriMesh, opts: FlattenOptions = {}): FlatPiece {
  const { positions, triangles } = piece;
  let rounds = opts.arapIterations ?? 60;
  if (!Number.isInteger(rounds) || rounds < 0) {
    throw new GeometryError('FLATTEN_FAILED', `arapIterations must be a non-negative integer, got ${opts.arapIterations}`);
  }
  if (opts.maxMillis !== undefined) {
    if (!(opts.maxMillis > 0)) {
      throw new GeometryError('FLATTEN_FAILED', `maxMillis must be a positive number, got ${opts.maxMillis}`);
    }
    const perRound = ARAP_MS_PER_TRIANGLE_ROUND * (triangles.length / 3);
    rounds = Math.min(rounds, Math.max(1, Math.floor(opts.maxMillis / perRound)));
  }
  const start = lscm(positions, triangles);

  const area3d = surfaceArea(positions, triangles);
  let startArea = 0;
  for (const a of signedAreas(start, triangles)) startArea += a;
  if (!(Math.abs(startArea) > 0) || !Number.isFinite(startArea)) {
    throw new GeometryError('FLATTEN_FAILED', 'conformal start collapsed to zero area: the piece may be folded onto itself');
  }
  const k = Math.sqrt(area3d / Math.abs(startArea));
  for (let i = 0; i < start.length; i++) start[i] *= k;

  const flat = arapFlatten(positions, triangles, start, { iterations: rounds });
  const uv = canonicalPose(flat, triangles);
  for (let i = 0; i < uv.length; i++) {
    if (!Number.isFinite(uv[i])) {
      throw new GeometryError('FLATTEN_FAILED', `flattening produced a non-finite coordinate at vertex ${i >> 1}`, {
        vertex: i >> 1,
      });
    }
  }
  const st = triangleStretch(positions, triangles, uv);
  let area2d = 0;
  for (const a of signedAreas(uv, triangles)) area2d += a;
  return {
    uv,
    stretch: { maxPct: st.summary.maxPct, rmsPct: st.summary.rmsPct },
    trianglePct: st.pct,
    flipped: st.summary.flipped,
    area2d,
    area3d,
  };
}

function surfaceArea(positions: Float64Array, triangles: Uint32Array): number {
  let total = 0;
  for (let f = 0; f < triangles.length; f += 3) {
    const a = 3 * triangles[f];
    const b = 3 * triangles[f + 1];
    const c = 3 * triangles[f + 2];
    const ux = positions[b] - positions[a];
    const uy = positions[b + 1] - positions[a + 1];
    const uz = positions[b + 2] - positions[a + 2];
    const vx = positions[c] - positions[a];
    const vy = positions[c + 1] - positions[a + 1];
    const vz = positions[c + 2] - positions[a + 2];
    total += 0.5 * Math.hypot(uy * vz - uz * vy, uz * vx - ux * vz, ux * vy - uy * vx);
  }
  return total;
}
