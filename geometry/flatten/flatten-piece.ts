import { GeometryError } from '../errors';
import type { TriMesh } from '../mesh/tri-mesh';
import { arapFlattenPrepared } from './arap';
import { boundaryLoops } from './boundary-loops';
import { canonicalPose } from './canonical-pose';
import { lscmPrepared } from './lscm';
import { preparePiece } from './prepared-piece';
import { signedAreas } from './signed-area';
import { triangleStretch } from './triangle-stretch';
import { tutteEmbedding } from './tutte-embedding';
import { surfaceArea } from '../mesh/mesh-measures';

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

/** Measured cost of one ARAP round per triangle on the reference machine (bench/sparse.bench.ts: 1.8e-4 ms). */
export const ARAP_MS_PER_TRIANGLE_ROUND = 2e-4;

/**
 * Returns the least-stretch flattening of one piece (positions in mm): LSCM (Lévy et al. 2002) as the
 * start, scaled so its area equals the 3D area, then local/global ARAP (Liu et al. 2008), then the
 * canonical pose (see canonicalPose) with per-triangle stretch (Sander et al. 2001). Should the result
 * still hold an inverted triangle, the flattening is redone from the barycentric embedding (Tutte 1963,
 * Floater 1997; see tutteEmbedding) with twice the ARAP rounds, and the one with fewer inversions is kept.
 * The piece must be a connected, consistently wound surface with at least one boundary loop (a disk, or a
 * disk with holes).
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
  const prepared = preparePiece(positions, triangles);
  const area3d = surfaceArea(piece);
  let flat = arapFlattenPrepared(prepared, scaledToArea(lscmPrepared(prepared), triangles, area3d), {
    iterations: rounds,
  });
  let flips = countInverted(flat, triangles);
  if (flips > 0) {
    // Rare: the conformal start (two pins) folded somewhere and ARAP could not unfold it. Restart from the
    // barycentric embedding, which has no inverted triangle on a disk, so the flip-guarded ARAP keeps none.
    const { topo } = prepared;
    const outer = boundaryLoops(positions, triangles, topo.boundary)[0];
    const retry = arapFlattenPrepared(
      prepared,
      scaledToArea(tutteEmbedding(positions, triangles, topo.twin, outer), triangles, area3d),
      { iterations: 2 * rounds },
    );
    const retryFlips = countInverted(retry, triangles);
    if (retryFlips < flips) {
      flat = retry;
      flips = retryFlips;
    }
  }
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

/** `uv` scaled in place about the origin so its total area equals `area3d`. */
function scaledToArea(uv: Float64Array, triangles: Uint32Array, area3d: number): Float64Array {
  let area = 0;
  for (const a of signedAreas(uv, triangles)) area += a;
  if (!(Math.abs(area) > 0) || !Number.isFinite(area)) {
    throw new GeometryError('FLATTEN_FAILED', 'the starting flattening collapsed to zero area: the piece may be folded onto itself');
  }
  const k = Math.sqrt(area3d / Math.abs(area));
  for (let i = 0; i < uv.length; i++) uv[i] *= k;
  return uv;
}

function countInverted(uv: Float64Array, triangles: Uint32Array): number {
  let n = 0;
  for (const a of signedAreas(uv, triangles)) if (!(a > 0)) n++;
  return n;
}
