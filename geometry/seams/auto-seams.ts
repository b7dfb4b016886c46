/**
 * Automatic seams from a stretch budget: split the sculpt into as few pieces as it takes for every piece to
 * lie flat in foam within the budget, with seams that are short, smooth and out of sight where they can be.
 *
 * Sharp creases (departing from flat by CREASE_BORDER_DEG or more, crease-borders.ts) are fixed borders: no chart
 * is grown, merged or reshaped across one, so a box is cut along its edges and no seam mixes a sharp corner with
 * a flat run. A crease that fades out inside a smooth region can still have one chart on both sides (the chart
 * wraps round its end); the pattern then scores it as a fold inside the piece.
 *
 * The method follows D-Charts (Julius et al. 2005) and "Developability of triangle meshes" (Stein et al. 2018)
 * in spirit: charts are grown over the face graph and verified by really flattening them (LSCM then ARAP) and
 * measuring their stretch. Sheetsmith's own schedule, each step in its own module:
 * 1. every connected part starts as one chart; a chart over budget is split in two (split-charts.ts) until
 *    every chart fits — the growth is held back by creases, so cuts settle there;
 * 2. neighbouring charts are merged wherever the union fits (merge-charts.ts), then charts are shared out
 *    among several neighbours where no single one could take them whole (absorb-small-charts.ts), smallest
 *    first — fewer pieces;
 * 3. every border is straightened (straighten-chart-borders.ts): faces move across when that shortens the seam
 *    in seam cost (length times visibility: creases, valleys, the underside and the back are cheaper; see
 *    seamVisibility), kept only when both charts still fit;
 * 4. every chart is checked with the full flattening and split again where it does not fit;
 * 5. every border that is one chain between two charts is laid along the cheapest edge path between its ends
 *    (shortcut-chart-borders.ts), then faces that stick out of a chart's outline with two or three edges (teeth
 *    and notches of a saw-tooth seam) are handed to the chart they stick into (remove-border-teeth.ts); each
 *    change is kept only where both charts still pass the full flattening.
 *    On a mirror-symmetric model this step is left out, so the pieces stay exact mirror pairs.
 * Trial flattenings use few ARAP rounds, and a chart that cannot fit by the isoperimetric inequality is never
 * flattened at all. A mirror-symmetric model is cut on one side of its symmetry plane and the charts are
 * mirrored onto the other side, so its pieces come in mirror pairs; where the plane crosses a flat region the
 * two halves of a piece are joined again (joinAcrossFlatPlane).
 *
 * Viewpoint convention: the sculpt stands with +z up (the lowest z is its underside) and, when it is
 * mirror-symmetric, faces −y (so +y is its back); both can be overridden in the options.
 */
import { GeometryError } from '../errors';
import type { TriMesh } from '../mesh/tri-mesh';
import { absorbSmallCharts } from './absorb-small-charts';
import { components, faceGraph, type FaceGraph } from './chart-face-graph';
import { CREASE_BORDER_DEG, cutAtCreases } from './crease-borders';
import { chartStretchPct, isoperimetricallyPossible } from './chart-stretch';
import { mergeCharts } from './merge-charts';
import { defragment, joinAcrossFlatPlane, mirrorFaces } from './mirror-charts';
import { findSymmetryPlane } from './mirror-seams';
import { splitUntilFit } from './split-charts';
import { removeBorderTeeth } from './remove-border-teeth';
import { shortcutChartBorders } from './shortcut-chart-borders';
import { straightenChartBorders } from './straighten-chart-borders';

export interface AutoSeamOptions {
  /** Max stretch allowed per piece, percent (default 3). */
  stretchBudgetPct?: number;
  /** Stop splitting once this many pieces exist (the pieces left over budget are then reported by the caller). */
  maxPieces?: number;
  /** ARAP rounds of the quick trial flattenings while charts are split and merged (default 5). */
  trialArapIterations?: number;
  /**
   * When the model is mirror-symmetric (findSymmetryPlane), cut one half and mirror its pieces onto the other,
   * with a seam along the plane, so the pieces come in mirror pairs (one template, cut twice). Default false
   * (finding the plane costs about as much as cutting a small model); the pattern pipeline turns it on.
   */
  symmetric?: boolean;
  /** Unit vector pointing up on the sculpt; seams prefer its low side (default +z). */
  up?: [number, number, number];
  /**
   * Unit vector out of the sculpt's front; seams avoid it. Default −y when the model is mirror-symmetric
   * (and `symmetric` is on), else none.
   */
  front?: [number, number, number] | null;
  /**
   * Edges whose interior angle departs from flat (180°) by at least this many degrees are fixed chart borders
   * (default CREASE_BORDER_DEG = 40; null: none). Must be in (0, 180].
   */
  creaseBorderDeg?: number | null;
}

/** ARAP rounds of a trial flattening: enough to rank charts; the final check uses flattenPiece's default. */
const TRIAL_ARAP_ITERATIONS = 5;
/**
 * Shares of the budget the trial flattening must meet when charts are merged, and when they are shared out or
 * their borders straightened. The quick trial reads up to about a fifth lower than the full flattening on
 * charts near the budget (measured on the bunny scan), and a chart that fails the final check is split, which
 * costs more pieces than the margin saves; the values were tuned on the bunny, sphere, torus and helmet shell.
 */
const MERGE_MARGIN = 0.95;
const RESHAPE_MARGIN = 0.93;
/**
 * Share of the budget a chart must stay within when teeth are removed from the final charts: the pieces are later
 * flattened again with their vertices in another order, which can read a few hundredths of a percent higher.
 */
const TEETH_MARGIN = 0.99;
/** Share of the budget the cut half of a symmetric model is held to (see autoSeams). */
const MIRROR_MARGIN = 0.98;
/** Front of a mirror-symmetric sculpt when none is given (the viewpoint convention above). */
const DEFAULT_FRONT: [number, number, number] = [0, -1, 0];

/**
 * Seams that cut the mesh into pieces within the stretch budget.
 *
 * @param mesh TriMesh in mm, consistently oriented.
 * @param twin Int32Array(3F) half-edge twins, −1 on a boundary (non-manifold edges unpaired).
 * @param options stretch budget (percent, > 0), optional piece cap, trial rounds, symmetry, viewpoint and crease
 *   border angle.
 * @returns SeamMask: Uint8Array(3F), both half-edges of every seam edge set. Every sharp crease (see
 *   `creaseBorderDeg`) that separates two charts is a seam and no chart crosses one. Every piece the mask cuts out is
 *   connected and, unless `maxPieces` stopped the splitting, flattens within the budget with flattenPiece's
 *   default settings (each final piece is checked that way; quicker trial flattenings only steer the search).
 * @throws GeometryError BAD_OPTION for a budget that is not a positive number, a piece cap below 1, or an up or
 *   front vector that is not a finite non-zero 3-vector, or a crease border angle outside (0, 180].
 */
export function autoSeams(mesh: TriMesh, twin: Int32Array, options: AutoSeamOptions = {}): Uint8Array {
  const budget = options.stretchBudgetPct ?? 3;
  if (!(budget > 0) || !Number.isFinite(budget)) {
    throw new GeometryError('BAD_OPTION', `stretch budget must be a positive percentage, got ${budget}`);
  }
  const maxPieces = options.maxPieces ?? Infinity;
  if (!(maxPieces >= 1)) throw new GeometryError('BAD_OPTION', `maxPieces must be at least 1, got ${maxPieces}`);
  for (const [name, v] of [['up', options.up], ['front', options.front]] as const) {
    if (v && !(v.length === 3 && v.every(Number.isFinite) && Math.hypot(...v) > 0)) {
      throw new GeometryError('BAD_OPTION', `${name} must be a non-zero vector of three finite numbers, got [${v.join(', ')}]`);
    }
  }
  const creaseDeg = options.creaseBorderDeg === undefined ? CREASE_BORDER_DEG : options.creaseBorderDeg;
  if (creaseDeg !== null && !(creaseDeg > 0 && creaseDeg <= 180)) {
    throw new GeometryError('BAD_OPTION', `crease border angle must be more than 0° and at most 180°, got ${String(creaseDeg)}`);
  }
  const plane = options.symmetric ? findSymmetryPlane(mesh) : null;
  const unit = (v: [number, number, number]): [number, number, number] => {
    const n = Math.hypot(...v);
    return [v[0] / n, v[1] / n, v[2] / n];
  };
  const front = options.front !== undefined ? options.front : plane ? DEFAULT_FRONT : null;
  const fullGraph = faceGraph(mesh, twin, { up: unit(options.up ?? [0, 0, 1]), front: front ? unit(front) : null });
  // Every pass below walks the graph's twins, so unpairing the sharp creases makes them borders everywhere.
  const graph: FaceGraph =
    creaseDeg === null ? fullGraph : { ...fullGraph, twin: cutAtCreases(mesh, twin, fullGraph.dihedralDeg, creaseDeg).twin };
  const F = graph.faceCount;
  const trialIterations = options.trialArapIterations ?? TRIAL_ARAP_ITERATIONS;
  const possible = (faces: ArrayLike<number>): boolean => isoperimetricallyPossible(graph, faces, budget);
  const trialStretch = (faces: Int32Array): number =>
    possible(faces) ? chartStretchPct(mesh, faces, trialIterations) : Infinity;
  const finalStretch = (faces: Int32Array): number => (possible(faces) ? chartStretchPct(mesh, faces) : Infinity);

  // Connected parts first: each is a chart to start from. Split until the trial flattening fits, make fewer
  // and cleaner charts, then hold every chart to the real flattening and split again where it does not fit. On
  // a symmetric model only one half is cut this way and its charts are mirrored onto the other half before the
  // final check.
  const mirror = plane ? mirrorFaces(graph, plane) : null;
  const chartOf = new Int32Array(F).fill(-1);
  const start = mirror ? components(graph, mirror.inHalf) : components(graph);
  const merged = fewerCharts(graph, splitUntilFit(graph, start, trialStretch, budget, maxPieces), trialStretch, budget);
  let charts: Int32Array[];
  if (!mirror) {
    charts = splitUntilFit(graph, merged, finalStretch, budget, maxPieces, true).charts;
  } else {
    // The half is held to a slightly tighter budget so the mirrored copies, whose flattening differs from the
    // originals only by rounding, pass the real one too; any copy that still fails is split on its own.
    const half = splitUntilFit(graph, merged, finalStretch, budget * MIRROR_MARGIN, maxPieces, true).charts;
    half.forEach((faces, c) => faces.forEach((f) => (chartOf[f] = c)));
    for (let f = 0; f < F; f++) if (!mirror.inHalf[f]) chartOf[f] = half.length + chartOf[mirror.image[f]];
    // A face whose mirror partner was matched only approximately can land in the neighbouring chart; it is
    // handed back so every copy is one piece.
    defragment(graph, chartOf, mirror.inHalf);
    const copies: number[][] = Array.from({ length: half.length }, () => []);
    for (let f = 0; f < F; f++) if (!mirror.inHalf[f]) copies[chartOf[f] - half.length].push(f);
    const checked = splitUntilFit(
      graph,
      copies.filter((c) => c.length > 0).map((c) => Int32Array.from(c)),
      finalStretch,
      budget,
      maxPieces,
      true,
    ).charts;
    charts = half.concat(checked);
  }
  charts.forEach((faces, c) => faces.forEach((f) => (chartOf[f] = c)));
  // Where the symmetry plane crosses a flat region (a box's side), the plane's seam is joined up again.
  if (mirror) joinAcrossFlatPlane(graph, chartOf, mirror.inHalf, finalStretch, budget);
  else {
    const stretches = charts.map(() => 0);
    shortcutChartBorders(mesh, graph, chartOf, stretches, finalStretch, budget * TEETH_MARGIN);
    removeBorderTeeth(graph, chartOf, stretches, finalStretch, budget * TEETH_MARGIN);
  }

  const mask = new Uint8Array(3 * F);
  for (let h = 0; h < 3 * F; h++) {
    const t = twin[h];
    if (t >= 0 && chartOf[(h / 3) | 0] !== chartOf[(t / 3) | 0]) mask[h] = 1;
  }
  return mask;
}

/**
 * Steps 2 and 3 of autoSeams on charts that each fit the trial measure: merge pairs, share out charts among
 * neighbours, straighten the borders. Returns the charts left (global face lists).
 */
function fewerCharts(
  g: FaceGraph,
  split: { charts: Int32Array[]; stretches: number[] },
  trialStretch: (faces: Int32Array) => number,
  budget: number,
): Int32Array[] {
  const chartOf = new Int32Array(g.faceCount).fill(-1);
  split.charts.forEach((faces, c) => faces.forEach((f) => (chartOf[f] = c)));
  const merged = mergeCharts(g, chartOf, split.stretches, trialStretch, budget * MERGE_MARGIN);
  chartOf.fill(-1);
  merged.charts.forEach((faces, c) => faces.forEach((f) => (chartOf[f] = c)));
  const stretches = merged.stretches.slice();
  absorbSmallCharts(g, chartOf, stretches, trialStretch, budget * RESHAPE_MARGIN);
  straightenChartBorders(g, chartOf, stretches, trialStretch, budget * RESHAPE_MARGIN);
  const members: number[][] = stretches.map(() => []);
  for (let f = 0; f < g.faceCount; f++) if (chartOf[f] >= 0) members[chartOf[f]].push(f);
  return members.filter((m) => m.length > 0).map((m) => Int32Array.from(m));
}

