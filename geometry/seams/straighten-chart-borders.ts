/**
 * Straightening the borders between charts: the charts that growing leaves follow the triangles' own
 * zigzag, and a saw-tooth seam is longer, harder to cut and harder to glue. A face is handed across a
 * border whenever that shortens the border (measured as seam cost: length times visibility, see
 * seamVisibility), the boundary-length term of D-Charts (Julius et al. 2005) applied after growing; both
 * charts are then flattened again and the moves are kept only when both still fit.
 */
import type { FaceGraph } from './chart-face-graph';

/** Moves per border at most, as a multiple of the faces along it (each move strictly shortens the border). */
const MOVES_PER_BORDER_FACE = 4;

/**
 * Straightens every border between two charts in turn, longest border first.
 *
 * @param g the face graph; `chartOf` one chart index per face (−1 outside the search: never moved, never a
 *   target), changed in place.
 * @param stretches each chart's last measured stretch, percent (updated for the charts that change).
 * @param stretchOf trial stretch of a chart (global face ids), percent; Infinity when it cannot fit.
 * @param budget stretch budget, percent.
 * @returns the number of borders that were straightened. Only a face with at most one neighbour in its own
 *   chart moves (a leaf of the chart's face graph), so both charts stay connected; a border's moves are undone
 *   together when either chart no longer fits.
 */
export function straightenChartBorders(
  g: FaceGraph,
  chartOf: Int32Array,
  stretches: number[],
  stretchOf: (faces: Int32Array) => number,
  budget: number,
): number {
  const sizes = new Int32Array(stretches.length);
  for (let f = 0; f < g.faceCount; f++) if (chartOf[f] >= 0) sizes[chartOf[f]]++;
  const borders = new Map<string, { a: number; b: number; cost: number }>();
  for (let h = 0; h < 3 * g.faceCount; h++) {
    const t = g.twin[h];
    if (t < 0) continue;
    const a = chartOf[(h / 3) | 0];
    const b = chartOf[(t / 3) | 0];
    if (a < 0 || b < 0 || a >= b) continue;
    const key = `${a}:${b}`;
    const entry = borders.get(key) ?? { a, b, cost: 0 };
    entry.cost += g.seamCost[h];
    borders.set(key, entry);
  }
  const order = [...borders.values()].sort((x, y) => y.cost - x.cost || x.a - y.a || x.b - y.b);
  let straightened = 0;
  for (const { a, b } of order) {
    const moved = straightenBorder(g, chartOf, sizes, a, b);
    if (moved.length === 0) continue;
    const membersOf = (c: number): Int32Array => {
      const out: number[] = [];
      for (let f = 0; f < g.faceCount; f++) if (chartOf[f] === c) out.push(f);
      return Int32Array.from(out);
    };
    // The chart that gained faces is the likelier to fail, so it is flattened first: a failure settles the
    // move without flattening the other (the outcome does not depend on the order).
    let gainOfA = 0;
    for (const { from } of moved) gainOfA += from === b ? 1 : -1;
    const [first, second] = gainOfA >= 0 ? [a, b] : [b, a];
    const s1 = stretchOf(membersOf(first));
    const s2 = s1 <= budget ? stretchOf(membersOf(second)) : Infinity;
    if (s1 <= budget && s2 <= budget) {
      stretches[first] = s1;
      stretches[second] = s2;
      straightened++;
      continue;
    }
    for (let i = moved.length - 1; i >= 0; i--) {
      const { face, from } = moved[i];
      sizes[chartOf[face]]--;
      sizes[from]++;
      chartOf[face] = from;
    }
  }
  return straightened;
}

/**
 * Greedy moves across the border of charts a and b, each strictly lowering the border's seam cost. Returns the
 * moves made, in order.
 */
function straightenBorder(
  g: FaceGraph,
  chartOf: Int32Array,
  sizes: Int32Array,
  a: number,
  b: number,
): Array<{ face: number; from: number }> {
  const moved: Array<{ face: number; from: number }> = [];
  const queue: number[] = [];
  const queued = new Set<number>();
  const push = (f: number): void => {
    if ((chartOf[f] === a || chartOf[f] === b) && !queued.has(f)) {
      queued.add(f);
      queue.push(f);
    }
  };
  for (let f = 0; f < g.faceCount; f++) {
    if (chartOf[f] !== a && chartOf[f] !== b) continue;
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      const other = chartOf[f] === a ? b : a;
      if (t >= 0 && chartOf[(t / 3) | 0] === other) push(f);
    }
  }
  const limit = MOVES_PER_BORDER_FACE * queue.length;
  while (queue.length > 0 && moved.length < limit) {
    const f = queue.shift()!;
    queued.delete(f);
    const own = chartOf[f];
    const other = own === a ? b : a;
    if (sizes[own] <= 1) continue;
    let ownNeighbours = 0;
    let gain = 0;
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t < 0) continue;
      const n = chartOf[(t / 3) | 0];
      if (n === own) {
        ownNeighbours++;
        gain -= g.seamCost[3 * f + k];
      } else if (n === other) {
        gain += g.seamCost[3 * f + k];
      }
    }
    // Relative threshold: a move must save more than rounding, so equal-cost faces do not trade places forever.
    if (ownNeighbours > 1 || gain <= 1e-9 * (g.edgeLengths[3 * f] + g.edgeLengths[3 * f + 1] + g.edgeLengths[3 * f + 2])) continue;
    chartOf[f] = other;
    sizes[own]--;
    sizes[other]++;
    moved.push({ face: f, from: own });
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t >= 0) push((t / 3) | 0);
    }
  }
  return moved;
}
