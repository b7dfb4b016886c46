/**
 * Merging neighbouring charts back together wherever the union still lies flat within the budget: bisection
 * leaves needless cuts, and every seam removed is one the maker does not glue.
 */
import type { FaceGraph } from './chart-face-graph';

/**
 * A merge whose expected stretch exceeds this many budgets is skipped without a trial flattening. The area
 * rule behind the estimate is pessimistic for a long thin union (a strip bends one way and stays near
 * developable), so the cut-off is generous; 5 was tuned on the bunny scan (2 missed a sixth of the merges).
 */
const MERGE_SKIP_FACTOR = 5;

/**
 * Greedy merge of neighbouring charts, in rounds: each round tries every pair of neighbouring charts once, the
 * pairs with the fewest faces together first (a small union is cheap to flatten and most likely to fit), and a
 * chart takes part in at most one merge per round. A merge is kept when the union fits. A pair whose union was
 * flattened and did not fit is never tried again: later it could only be tried grown, and a larger union
 * stretches at least as much in practice (on the bunny scan, skipping those retries leaves every seam unchanged
 * and saves about a tenth of the time). A pair skipped on the estimate alone is
 * reconsidered once one of the two has grown. Rounds repeat until none merges. Returns the merged charts
 * in order of their smallest face, each with its last measured stretch. `chartOf` one chart index per face (−1: not part of the search),
 * `initialStretch` each chart's measured stretch (percent), `stretchOf` the trial measure, `only` optionally
 * limits merging to faces of one half of a mirror-symmetric model.
 */
export function mergeCharts(
  g: FaceGraph,
  chartOf: Int32Array,
  initialStretch: number[],
  stretchOf: (faces: Int32Array) => number,
  budget: number,
  only?: Uint8Array,
): { charts: Int32Array[]; stretches: number[] } {
  const chartCount = initialStretch.length;
  const stretch = initialStretch.slice();
  const area = new Float64Array(chartCount);
  for (let f = 0; f < g.faceCount; f++) if (chartOf[f] >= 0) area[chartOf[f]] += g.areas[f];
  const members: number[][] = Array.from({ length: chartCount }, () => []);
  for (let f = 0; f < g.faceCount; f++) if (chartOf[f] >= 0) members[chartOf[f]].push(f);
  const label = Int32Array.from(chartOf);
  // Pairs are numbered a·chartCount + b (a < b). A pair skipped on the estimate is remembered with the two
  // charts' face count then, since charts only grow, an unchanged count means unchanged charts.
  const skippedAt = new Map<number, number>();
  const failed = new Set<number>();
  for (let merged = true; merged; ) {
    merged = false;
    const pairs = new Map<number, [number, number]>();
    for (let f = 0; f < g.faceCount; f++) {
      for (let k = 0; k < 3; k++) {
        const t = g.twin[3 * f + k];
        if (t < 0) continue;
        const a = label[f];
        const b = label[(t / 3) | 0];
        if (a < 0 || (only && (!only[f] || !only[(t / 3) | 0]))) continue;
        if (a < b) pairs.set(a * chartCount + b, [a, b]);
      }
    }
    const order = [...pairs.values()].sort(
      ([a1, b1], [a2, b2]) =>
        members[a1].length + members[b1].length - members[a2].length - members[b2].length || a1 - a2 || b1 - b2,
    );
    const touched = new Uint8Array(chartCount);
    for (const [a, b] of order) {
      const pair = a * chartCount + b;
      const size = members[a].length + members[b].length;
      if (touched[a] || touched[b] || skippedAt.get(pair) === size || failed.has(pair)) continue;
      // Expected stretch of the union: each part's stretch grown with the area it would become (see
      // splitUntilFit); a union expected well over budget is not worth a trial flattening.
      const unionArea = area[a] + area[b];
      const expected = Math.max(stretch[a] * (unionArea / area[a]), stretch[b] * (unionArea / area[b]));
      if (expected > MERGE_SKIP_FACTOR * budget) {
        skippedAt.set(pair, size);
        continue;
      }
      const union = Int32Array.from([...members[a], ...members[b]]);
      const unionStretch = stretchOf(union);
      if (!(unionStretch <= budget)) {
        failed.add(pair);
        continue;
      }
      stretch[a] = unionStretch;
      area[a] = unionArea;
      for (const f of members[b]) label[f] = a;
      members[a] = Array.from(union);
      members[b] = [];
      touched[a] = touched[b] = 1;
      merged = true;
    }
  }
  const charts: Int32Array[] = [];
  const stretches: number[] = [];
  const seen = new Uint8Array(chartCount);
  for (let f = 0; f < g.faceCount; f++) {
    const c = label[f];
    if (c < 0) continue;
    if (!seen[c]) {
      seen[c] = 1;
      charts.push(Int32Array.from(members[c]));
      stretches.push(stretch[c]);
    }
  }
  return { charts, stretches };
}

