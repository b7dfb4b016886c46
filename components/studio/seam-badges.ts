/**
 * Where the studio pins each seam's badge (its number and bevel) on the 3D model. The pattern document names
 * the two pieces a seam joins, and the faces file says which piece each face belongs to, so a seam's edges are
 * the mesh edges between faces of those two pieces; the badge sits on the middle one of them.
 */
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';

/**
 * One badge: the seam's number, its mean bevel (degrees from square), outside or inside corner, a point in mm and
 * the surface's unit normal there (so the view can hide badges on the far side of the model).
 */
export interface SeamBadge {
  label: string;
  bevelDeg: number;
  convex: boolean;
  at: [number, number, number];
  normal: [number, number, number];
}

/**
 * Returns a badge for every seam of `doc` whose pieces meet along at least one edge of the mesh. `positions`
 * (3V, mm), `triangles` (Uint32Array(3F)), `twin` (Int32Array(3F)), `pieceIndex` (Int32Array(F), index into
 * doc.pieces). Where several seams join the same two pieces, they share that border's edges in turn (edges
 * ordered along the border's longest axis), so their badges do not sit on top of each other. A seam closing a
 * piece onto itself gets no badge: the faces file does not say which edges inside a piece are cut.
 */
export function seamBadges(
  doc: PatternDoc,
  positions: ArrayLike<number>,
  triangles: Uint32Array,
  twin: Int32Array,
  pieceIndex: Int32Array,
): SeamBadge[] {
  const indexOf = new Map(doc.pieces.map((p, i) => [p.label, i]));
  const borders = new Map<string, number[]>();
  for (let h = 0; h < triangles.length; h++) {
    const t = twin[h];
    if (t < 0 || t < h) continue;
    const a = pieceIndex[Math.floor(h / 3)];
    const b = pieceIndex[Math.floor(t / 3)];
    if (a < 0 || b < 0 || a === b) continue;
    const key = a < b ? `${a}:${b}` : `${b}:${a}`;
    const list = borders.get(key);
    if (list) list.push(h);
    else borders.set(key, [h]);
  }
  const mid = (h: number): { at: [number, number, number]; normal: [number, number, number] } => {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    const at = [0, 1, 2].map((k) => (positions[3 * a + k] + positions[3 * b + k]) / 2) as [number, number, number];
    const n = [0, 0, 0];
    for (const f of [Math.floor(h / 3), Math.floor(twin[h] / 3)]) {
      const [p, q, r] = [triangles[3 * f], triangles[3 * f + 1], triangles[3 * f + 2]];
      const u = [0, 1, 2].map((k) => positions[3 * q + k] - positions[3 * p + k]);
      const w = [0, 1, 2].map((k) => positions[3 * r + k] - positions[3 * p + k]);
      n[0] += u[1] * w[2] - u[2] * w[1];
      n[1] += u[2] * w[0] - u[0] * w[2];
      n[2] += u[0] * w[1] - u[1] * w[0];
    }
    const l = Math.hypot(n[0], n[1], n[2]) || 1;
    return { at, normal: [n[0] / l, n[1] / l, n[2] / l] };
  };
  const borderOf = (labels: readonly string[]): string | null => {
    const [x, y] = labels.map((l) => indexOf.get(l) ?? -1);
    if (labels.length !== 2 || x < 0 || y < 0 || x === y) return null;
    return x < y ? `${x}:${y}` : `${y}:${x}`;
  };
  const seamsOnBorder = new Map<string, number>();
  const badges: SeamBadge[] = [];
  for (const seam of doc.seams) {
    const key = borderOf(seam.pieces);
    const edges = key ? borders.get(key) : undefined;
    if (!key || !edges) continue;
    const total = doc.seams.filter((s) => borderOf(s.pieces) === key).length;
    const nth = seamsOnBorder.get(key) ?? 0;
    seamsOnBorder.set(key, nth + 1);
    const points = edges.map(mid);
    const spread = [0, 1, 2].map((k) => Math.max(...points.map((p) => p.at[k])) - Math.min(...points.map((p) => p.at[k])));
    const axis = spread.indexOf(Math.max(...spread));
    points.sort((p, q) => p.at[axis] - q.at[axis]);
    const { at, normal } = points[Math.min(points.length - 1, Math.floor(((nth + 0.5) / total) * points.length))];
    badges.push({ label: seam.label, bevelDeg: seam.bevel.mean, convex: seam.convex, at, normal });
  }
  return badges;
}
