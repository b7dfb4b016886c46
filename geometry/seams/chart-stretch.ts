/**
 * Whether a chart (a set of faces of the sculpt) lies flat within a stretch budget: a cheap necessary test from
 * the isoperimetric inequality, and the real test, flattening it (LSCM then ARAP) and measuring its stretch.
 */
import { isGeometryError } from '../errors';
import { flattenPiece } from '../flatten/flatten-piece';
import type { TriMesh } from '../mesh/tri-mesh';
import { enterChart, inCurrentChart, type FaceGraph } from './chart-face-graph';

/**
 * A necessary condition for a chart to flatten within ε = budget/100: the planar isoperimetric inequality
 * L² ≥ 4πA must hold for the flat piece, whose boundary is at most (1+ε) times as long and whose area is at
 * least (1−ε)² times as large as in 3D (every length scales by at most σmax ≤ 1+ε, every area by at least
 * σmin² ≥ (1−ε)²). So a chart with (1+ε)²·L² < 4π·(1−ε)²·A cannot fit and is split without trying; a cap of a
 * sphere or a closed-up region fails this long before a flattening would be worth its cost.
 * `faces` global face ids; `budget` percent. Returns false when the chart certainly cannot fit.
 */
export function isoperimetricallyPossible(g: FaceGraph, faces: ArrayLike<number>, budget: number): boolean {
  enterChart(g, faces);
  let area = 0;
  let boundary = 0;
  for (let i = 0; i < faces.length; i++) {
    const f = faces[i];
    area += g.areas[f];
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t < 0 || !inCurrentChart(g, (t / 3) | 0)) boundary += g.edgeLengths[3 * f + k];
    }
  }
  const e = budget / 100;
  return (1 + e) ** 2 * boundary * boundary >= 4 * Math.PI * (1 - e) ** 2 * area;
}

/**
 * Max stretch of a chart after flattening (flattenPiece: LSCM, Lévy et al. 2002, then ARAP, Liu et al. 2008),
 * percent; Infinity when it cannot be flattened or folds over. `faces` global face ids of `mesh` (mm);
 * `arapIterations` caps the ARAP rounds (default flattenPiece's).
 */
export function chartStretchPct(mesh: TriMesh, faces: Int32Array, arapIterations?: number): number {
  const { positions, triangles } = chartPiece(mesh, faces);
  try {
    const flat = flattenPiece(
      { positions, triangles },
      arapIterations === undefined ? undefined : { arapIterations },
    );
    return flat.flipped > 0 ? Infinity : flat.stretch.maxPct;
  } catch (e) {
    if (isGeometryError(e)) return Infinity;
    throw e;
  }
}

/**
 * Per mesh, a vertex-indexed scratch for renumbering (local number, and the call that wrote it), so a trial
 * costs time in its own size rather than the whole mesh's; held weakly, so it goes with the mesh.
 */
const scratchOf = new WeakMap<TriMesh, { local: Int32Array; stampOf: Int32Array; stamp: number }>();

/** The chart's faces as a piece of their own (mm): vertices renumbered in order of first use. */
function chartPiece(mesh: TriMesh, faces: Int32Array): TriMesh {
  let scratch = scratchOf.get(mesh);
  if (!scratch) {
    const V = mesh.positions.length / 3;
    scratch = { local: new Int32Array(V), stampOf: new Int32Array(V), stamp: 0 };
    scratchOf.set(mesh, scratch);
  }
  const stamp = ++scratch.stamp;
  const { local, stampOf } = scratch;
  const triangles = new Uint32Array(3 * faces.length);
  const order: number[] = [];
  for (let i = 0; i < faces.length; i++) {
    for (let k = 0; k < 3; k++) {
      const v = mesh.triangles[3 * faces[i] + k];
      if (stampOf[v] !== stamp) {
        stampOf[v] = stamp;
        local[v] = order.length;
        order.push(v);
      }
      triangles[3 * i + k] = local[v];
    }
  }
  const positions = new Float64Array(3 * order.length);
  for (let i = 0; i < order.length; i++) positions.set(mesh.positions.subarray(3 * order[i], 3 * order[i] + 3), 3 * i);
  return { positions, triangles };
}
