/**
 * Score lines: where a piece must fold sharply inside itself, a V-groove or score cut on the inside face
 * lets the foam bend cleanly (DESIGN.md, "What the trade knows" — common practice).
 */
import type { PointMm, ScoreLine } from '../pattern/pattern-doc';

/** Folds sharper than this departure from flat get a score line (common practice; the CLI's default). */
export const SCORE_LINE_MIN_FOLD_DEG = 25;

/**
 * Finds the fold polylines inside one flattened piece.
 *
 * @param triangles the piece's local Uint32Array(3F).
 * @param twin the piece's local half-edge twins, Int32Array(3F), −1 on its boundary (seams are boundary).
 * @param dihedralDeg per local half-edge, the interior dihedral of that edge on the 3D model, degrees.
 * @param uv Float64Array(2V), the piece's flattened coordinates, mm.
 * @param minFoldDeg an edge scores when |180 − θ| exceeds this (default SCORE_LINE_MIN_FOLD_DEG).
 * @returns polylines in the piece's 2D coordinates, each with its length-weighted mean interior angle;
 *   a polyline breaks where folds branch. Empty when the piece has no sharp interior fold.
 */
export function scoreLines(
  triangles: Uint32Array,
  twin: Int32Array,
  dihedralDeg: Float64Array,
  uv: Float64Array,
  minFoldDeg = SCORE_LINE_MIN_FOLD_DEG,
): ScoreLine[] {
  const to = (h: number): number => triangles[h - (h % 3) + ((h % 3) + 1) % 3];
  const folds: number[] = [];
  for (let h = 0; h < triangles.length; h++) {
    if (twin[h] > h && Math.abs(180 - dihedralDeg[h]) > minFoldDeg) folds.push(h);
  }
  if (folds.length === 0) return [];
  const incident = new Map<number, number[]>();
  const link = (v: number, h: number): void => {
    const list = incident.get(v);
    if (list) list.push(h);
    else incident.set(v, [h]);
  };
  for (const h of folds) {
    link(triangles[h], h);
    link(to(h), h);
  }
  const used = new Set<number>();
  const other = (h: number, v: number): number => (triangles[h] === v ? to(h) : triangles[h]);
  const walk = (start: number, h0: number): number[] => {
    const path = [start];
    let v = start;
    let h = h0;
    for (;;) {
      used.add(h);
      v = other(h, v);
      path.push(v);
      const around = incident.get(v)!;
      if (around.length !== 2) break;
      const nextEdge = around[0] === h ? around[1] : around[0];
      if (used.has(nextEdge)) break;
      h = nextEdge;
    }
    return path;
  };
  const lines: ScoreLine[] = [];
  const emit = (path: number[]): void => {
    const pts: PointMm[] = path.map((v) => [uv[2 * v], uv[2 * v + 1]]);
    let wSum = 0;
    let aSum = 0;
    for (let k = 0; k + 1 < path.length; k++) {
      const h = edgeBetween(path[k], path[k + 1]);
      const len = Math.hypot(pts[k + 1][0] - pts[k][0], pts[k + 1][1] - pts[k][1]);
      wSum += len;
      aSum += len * dihedralDeg[h];
    }
    lines.push({ path: pts, foldDeg: wSum > 0 ? aSum / wSum : dihedralDeg[edgeBetween(path[0], path[1])] });
  };
  const edgeBetween = (a: number, b: number): number => {
    for (const h of incident.get(a)!) if (other(h, a) === b) return h;
    throw new RangeError(`scoreLines: no fold edge between vertices ${a} and ${b}`);
  };
  // Open chains start at ends and junctions; what is left afterwards are closed loops.
  for (const [v, around] of incident) {
    if (around.length === 2) continue;
    for (const h of around) if (!used.has(h)) emit(walk(v, h));
  }
  for (const h of folds) if (!used.has(h)) emit(walk(triangles[h], h));
  return lines;
}
