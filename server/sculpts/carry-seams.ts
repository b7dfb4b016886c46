/**
 * Carrying a sculpt's seams to a new version of the model: each old seam vertex is matched to the new mesh's
 * vertex at the same place, and a seam edge survives when both its ends match and the new mesh joins them by
 * an edge. Pure (arrays in, plain objects out).
 */
import type { SeamLine } from '../../db/schema-sculpts';
import { boundingBoxDiagonal } from '../../geometry/mesh/mesh-measures';
import { buildVertexGrid } from '../../geometry/mesh/vertex-grid';
import type { MeshEdges } from './mesh-edges';

/** Match distance as a fraction of the new mesh's bounding-box diagonal. */
export const CARRY_TOLERANCE = 1e-4;

/** What carrySeams kept. */
export interface CarriedSeams {
  seams: SeamLine[];
  seamsIn: number;
  /** Seams whose every edge survived. */
  seamsWhole: number;
  /** Seams that survived only in parts (each part is a seam of its own). */
  seamsSplit: number;
  /** Seams of which no edge survived. */
  seamsLost: number;
  edgesIn: number;
  edgesKept: number;
}

/**
 * Returns `oldSeams` moved onto the new mesh. `oldPositions` is (Float32|Float64)Array(3V_old) in mm, already in
 * the new version's frame (units and scale applied); `newPositions` Float64Array(3V_new) mm; `newEdges` the new
 * mesh's edges. Vertices match when within CARRY_TOLERANCE × the new bounding-box diagonal (nearest vertex, on a
 * uniform grid). A seam whose path survives whole keeps its id and its matched picks; a broken one becomes one
 * seam per surviving run of edges, ids "<id>.1", "<id>.2", …, picked at the run's ends. Every carried seam has
 * source "carried".
 */
export function carrySeams(oldPositions: Float32Array | Float64Array, oldSeams: readonly SeamLine[], newPositions: Float64Array, newEdges: MeshEdges): CarriedSeams {
  const grid = buildVertexGrid(newPositions);
  const tol = CARRY_TOLERANCE * boundingBoxDiagonal(newPositions);
  const oldV = oldPositions.length / 3;
  const memo = new Map<number, number>();
  const match = (v: number): number => {
    if (v >= oldV) return -1;
    let m = memo.get(v);
    if (m === undefined) {
      m = grid.nearest(oldPositions[3 * v], oldPositions[3 * v + 1], oldPositions[3 * v + 2], tol);
      memo.set(v, m);
    }
    return m;
  };
  const out: SeamLine[] = [];
  let seamsWhole = 0;
  let seamsSplit = 0;
  let seamsLost = 0;
  let edgesIn = 0;
  let edgesKept = 0;
  for (const seam of oldSeams) {
    const runs: number[][] = [];
    let run: number[] = [];
    for (let k = 0; k + 1 < seam.path.length; k++) {
      edgesIn++;
      const a = match(seam.path[k]);
      const b = match(seam.path[k + 1]);
      if (a >= 0 && b >= 0 && newEdges.hasEdge(a, b)) {
        edgesKept++;
        if (run.length === 0) run.push(a);
        run.push(b);
      } else if (run.length > 0) {
        runs.push(run);
        run = [];
      }
    }
    if (run.length > 0) runs.push(run);
    if (runs.length === 0) {
      seamsLost++;
      continue;
    }
    const whole = runs.length === 1 && runs[0].length === seam.path.length;
    if (whole) {
      seamsWhole++;
      const picks = seam.picks.map(match).filter((v) => v >= 0);
      out.push({ id: seam.id, picks: picks.length > 0 ? picks : [runs[0][0], runs[0][runs[0].length - 1]], path: runs[0], source: 'carried' });
    } else {
      seamsSplit++;
      runs.forEach((r, i) => out.push({ id: `${seam.id}.${i + 1}`, picks: [r[0], r[r.length - 1]], path: r, source: 'carried' }));
    }
  }
  return { seams: out, seamsIn: oldSeams.length, seamsWhole, seamsSplit, seamsLost, edgesIn, edgesKept };
}

/** Returns one sentence for the sculpt's report saying how many seams and seam edges came across. */
export function describeCarry(c: CarriedSeams, fromVersion: number): string {
  if (c.seamsIn === 0) return `version ${fromVersion} had no seams to carry over`;
  const parts = [`${c.seamsWhole} of ${c.seamsIn} seams from version ${fromVersion} carried over whole`];
  if (c.seamsSplit > 0) parts.push(`${c.seamsSplit} in parts`);
  if (c.seamsLost > 0) parts.push(`${c.seamsLost} lost`);
  return `${parts.join(', ')} (${c.edgesKept} of ${c.edgesIn} seam edges kept)`;
}
