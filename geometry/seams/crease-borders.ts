/**
 * Sharp creases as fixed chart borders for automatic seams. Foam cannot take a sharp fold without a seam or a
 * score line, and a maker cuts a box along its edges, so a chart is never grown across a sharp crease line: the
 * face graph the charts grow on simply has no link there.
 */
import type { TriMesh } from '../mesh/tri-mesh';

/**
 * Default crease border, degrees from flat: an edge whose interior dihedral departs from 180° by at least this
 * much is sharp. 40° is common practice, not a published figure: a box's 90° edges and a bevelled panel's 45°
 * edges are well beyond it, while a subdivided icosphere's edges (under 15°) and a 16-sided tube's (22.5°)
 * stay below it.
 */
export const CREASE_BORDER_DEG = 40;

/**
 * A crease line (sharp edges joined end to end) becomes a border only when it is at least this share of the
 * model's bounding-box diagonal long. A scan's noise leaves scattered sharp edges a few millimetres long that
 * no maker would cut along (the bunny scan has about 170, in runs of one to a few edges); a designed crease
 * runs along a feature. 0.1 is tuned on the test shapes (common practice, not a published figure).
 */
export const CREASE_LINE_MIN_SHARE = 0.1;

/**
 * Returns a copy of `twin` in which both half-edges of every edge on a long sharp crease line are unpaired (−1),
 * so that every search over the copy (chart growth, merging, sharing out, border moves) treats it as a border.
 *
 * @param mesh TriMesh in mm.
 * @param twin Int32Array(3F) half-edge twins, −1 on a boundary.
 * @param dihedralDeg Float64Array(3F) interior dihedral per half-edge, degrees (180 flat).
 * @param minDeviationDeg an edge is sharp when |dihedral − 180| ≥ this, degrees; precondition 0 < it ≤ 180 (the
 *   caller checks it and names the option).
 * @returns the cut twin array and the number of edges cut (each edge once). Sharp edges are grouped into lines
 *   by shared vertices; a line shorter than CREASE_LINE_MIN_SHARE of the bounding-box diagonal is left linked.
 */
export function cutAtCreases(
  mesh: TriMesh,
  twin: Int32Array,
  dihedralDeg: Float64Array,
  minDeviationDeg: number,
): { twin: Int32Array; creaseEdges: number } {
  const { positions: p, triangles: t } = mesh;
  const V = p.length / 3;
  // A hair of slack so that an edge exactly at the threshold counts (as in creaseSeams).
  const threshold = minDeviationDeg - 1e-9;
  const sharp: number[] = [];
  for (let h = 0; h < twin.length; h++) {
    if (twin[h] > h && Math.abs(dihedralDeg[h] - 180) >= threshold) sharp.push(h);
  }
  const out = Int32Array.from(twin);
  if (sharp.length === 0) return { twin: out, creaseEdges: 0 };

  const parent = Int32Array.from({ length: V }, (_, i) => i);
  const root = (x: number): number => {
    while (parent[x] !== x) x = parent[x] = parent[parent[x]];
    return x;
  };
  const ends = (h: number): [number, number] => [t[h], t[h - (h % 3) + ((h % 3) + 1) % 3]];
  for (const h of sharp) {
    const [a, b] = ends(h);
    parent[root(a)] = root(b);
  }
  const lineLength = new Float64Array(V);
  for (const h of sharp) {
    const [a, b] = ends(h);
    lineLength[root(a)] += Math.hypot(p[3 * b] - p[3 * a], p[3 * b + 1] - p[3 * a + 1], p[3 * b + 2] - p[3 * a + 2]);
  }
  const lo = [Infinity, Infinity, Infinity];
  const hi = [-Infinity, -Infinity, -Infinity];
  for (let v = 0; v < V; v++) {
    for (let k = 0; k < 3; k++) {
      lo[k] = Math.min(lo[k], p[3 * v + k]);
      hi[k] = Math.max(hi[k], p[3 * v + k]);
    }
  }
  const minLength = CREASE_LINE_MIN_SHARE * Math.hypot(hi[0] - lo[0], hi[1] - lo[1], hi[2] - lo[2]);
  let creaseEdges = 0;
  for (const h of sharp) {
    if (lineLength[root(ends(h)[0])] < minLength) continue;
    out[h] = -1;
    out[twin[h]] = -1;
    creaseEdges++;
  }
  return { twin: out, creaseEdges };
}
