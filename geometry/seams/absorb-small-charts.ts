/**
 * Dissolving charts into their neighbours: a chart that no single neighbour can swallow whole (the pair
 * merge of mergeCharts) can often be shared out among several, each taking the faces nearest to it. Small
 * charts go first, since they are the needless pieces a maker most dislikes (D-Charts, Julius et al. 2005,
 * likewise merges charts below a size into their neighbours).
 */
import { chartArea, type FaceGraph } from './chart-face-graph';

/** A neighbour whose expected stretch after taking its share exceeds this many budgets is not tried. */
const ABSORB_SKIP_FACTOR = 1.6;

/**
 * Shares out charts among their neighbours where every neighbour still fits afterwards.
 *
 * @param g the face graph; `chartOf` one chart index per face, −1 for faces outside the search (left alone and
 *   never given to a chart); changed in place.
 * @param stretches each chart's last measured stretch, percent (updated in place for the charts that grow).
 * @param stretchOf trial stretch of a chart (global face ids), percent; Infinity when it cannot fit.
 * @param budget stretch budget, percent.
 * @returns how many charts were dissolved. Chart indices stay as they were; a dissolved chart is left empty.
 *   Every face of a dissolved chart goes to the neighbour whose border reaches it first (breadth-first from the
 *   chart's border, ties to the neighbour with the longer shared border), so every share is connected to its
 *   new chart and every grown chart stays connected.
 */
export function absorbSmallCharts(
  g: FaceGraph,
  chartOf: Int32Array,
  stretches: number[],
  stretchOf: (faces: Int32Array) => number,
  budget: number,
): number {
  const members: number[][] = stretches.map(() => []);
  for (let f = 0; f < g.faceCount; f++) if (chartOf[f] >= 0) members[chartOf[f]].push(f);
  const area = members.map((m) => chartArea(g, m));
  const order = members.map((_, c) => c).sort((a, b) => area[a] - area[b] || a - b);
  let dissolved = 0;
  for (const c of order) {
    const faces = members[c];
    if (faces.length === 0) continue;
    const share = shareOut(g, chartOf, c, faces);
    if (!share) continue;
    // Every receiving chart must still fit, and none is tried when its stretch, grown with its area (see
    // splitUntilFit), is expected far over budget. All estimates are checked before any trial flattening, and
    // the receivers expected to stretch most are tried first: one failure settles the chart, so the likeliest
    // failure is best paid for first (the outcome does not depend on the order).
    const expected = new Map<number, number>();
    for (const [n, part] of share) expected.set(n, stretches[n] * ((area[n] + chartArea(g, part)) / area[n]));
    let ok = [...expected.values()].every((e) => !(e > ABSORB_SKIP_FACTOR * budget));
    const trial = new Map<number, { faces: Int32Array; stretch: number }>();
    const receivers = [...share.keys()].sort((a, b) => expected.get(b)! - expected.get(a)! || a - b);
    for (const n of receivers) {
      if (!ok) break;
      const union = Int32Array.from([...members[n], ...share.get(n)!]);
      const s = stretchOf(union);
      if (!(s <= budget)) ok = false;
      else trial.set(n, { faces: union, stretch: s });
    }
    if (!ok) continue;
    for (const [n, { faces: union, stretch }] of trial) {
      for (const f of share.get(n)!) chartOf[f] = n;
      members[n] = Array.from(union);
      area[n] = chartArea(g, union);
      stretches[n] = stretch;
    }
    members[c] = [];
    area[c] = 0;
    dissolved++;
  }
  return dissolved;
}

/**
 * Which neighbouring chart takes each face of chart c: breadth-first from c's border inward, each face taking
 * the chart of the face it was reached from. Null when c has no neighbouring chart.
 */
function shareOut(g: FaceGraph, chartOf: Int32Array, c: number, faces: number[]): Map<number, number[]> | null {
  const owner = new Map<number, number>();
  const border = new Map<number, number>();
  const queue: number[] = [];
  for (const f of faces) {
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t < 0) continue;
      const n = chartOf[(t / 3) | 0];
      if (n >= 0 && n !== c) border.set(n, (border.get(n) ?? 0) + g.edgeLengths[3 * f + k]);
    }
  }
  if (border.size === 0) return null;
  for (const f of faces) {
    let best = -1;
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t < 0) continue;
      const n = chartOf[(t / 3) | 0];
      if (n >= 0 && n !== c && (best < 0 || border.get(n)! > border.get(best)!)) best = n;
    }
    if (best >= 0) {
      owner.set(f, best);
      queue.push(f);
    }
  }
  for (let i = 0; i < queue.length; i++) {
    const f = queue[i];
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t < 0) continue;
      const n = (t / 3) | 0;
      if (chartOf[n] === c && !owner.has(n)) {
        owner.set(n, owner.get(f)!);
        queue.push(n);
      }
    }
  }
  const share = new Map<number, number[]>();
  for (const [f, n] of owner) {
    const list = share.get(n);
    if (list) list.push(f);
    else share.set(n, [f]);
  }
  return owner.size === faces.length ? share : null;
}
