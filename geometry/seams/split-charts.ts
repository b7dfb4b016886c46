/**
 * Splitting charts until they fit: a chart over the stretch budget is cut in two by growing two charts from
 * its two geodesically farthest faces (a two-seed step of D-Charts' chart growing, Julius et al. 2005), the
 * growth held back by creases and by faces whose normal departs from the seed's (the planar proxy of
 * variational shape approximation, Cohen-Steiner et al. 2004).
 */
import { MinHeap } from '../pattern/min-heap';
import { centroidDistance, chartArea, enterChart, inCurrentChart, isClosed, normalDot, type FaceGraph } from './chart-face-graph';

/** How strongly a sharp edge resists being crossed by a growing chart (dimensionless, tuned on the test shapes). */
const CREASE_WEIGHT = 12;
/** How strongly a face whose normal departs from the seed's normal resists joining the seed's chart. */
const PROXY_WEIGHT = 2;

/**
 * Splits charts in two until each fits (or the piece cap is reached). `stretchOf` returns a chart's max stretch in
 * percent (Infinity when it cannot fit at all). A chart far over budget is split again without flattening its
 * halves first: stretch from curvature grows about in proportion to a chart's area (a spherical cap's distortion
 * grows with the square of its radius), so a half whose expected stretch — the parent's times the area ratio — is
 * still over twice the budget is split straight away. With `keepOrder`, charts are checked in the given order and
 * those that fit keep their place, so a final check changes as little as possible.
 * Returns the charts (global face lists) with the stretch each was measured at (Infinity when none was taken:
 * a single face or a chart kept whole at the piece cap).
 */
export function splitUntilFit(
  graph: FaceGraph,
  start: Int32Array[],
  stretchOf: (faces: Int32Array) => number,
  budget: number,
  maxPieces: number,
  keepOrder = false,
): { charts: Int32Array[]; stretches: number[] } {
  const areaOf = (faces: Int32Array): number => chartArea(graph, faces);
  const pending: Array<{ faces: Int32Array; expected: number | null }> = (keepOrder ? start.slice().reverse() : start).map(
    (faces) => ({ faces, expected: null }),
  );
  const accepted: Int32Array[] = [];
  const stretches: number[] = [];
  while (pending.length > 0) {
    const { faces, expected } = pending.pop()!;
    const room = accepted.length + pending.length + 1 < maxPieces;
    if (faces.length === 1 || !room) {
      accepted.push(faces);
      stretches.push(faces.length === 1 ? 0 : Infinity);
      continue;
    }
    let stretch: number | null = null;
    if (!isClosed(graph, faces) && !(expected !== null && expected > 2 * budget)) {
      stretch = stretchOf(faces);
      if (stretch <= budget) {
        accepted.push(faces);
        stretches.push(stretch);
        continue;
      }
    }
    const known = stretch !== null && Number.isFinite(stretch) ? stretch : expected;
    const total = areaOf(faces);
    const halves = splitChart(graph, faces);
    const guess = (half: Int32Array): number | null => (known === null || total <= 0 ? null : (known * areaOf(half)) / total);
    pending.push({ faces: halves[1], expected: guess(halves[1]) }, { faces: halves[0], expected: guess(halves[0]) });
  }
  return { charts: accepted, stretches };
}

/**
 * Multi-source Dijkstra over the faces of one chart. Returns per face (indexed by position in `faces`) the
 * distance and the seed it was reached from. `proxy` adds the planar-proxy and crease terms.
 */
function growFrom(g: FaceGraph, faces: Int32Array, seeds: number[], proxy: boolean): { dist: Float64Array; label: Int32Array } {
  enterChart(g, faces);
  const n = faces.length;
  const dist = new Float64Array(n).fill(Infinity);
  const label = new Int32Array(n).fill(-1);
  const heap = new MinHeap(n);
  seeds.forEach((s, k) => {
    const i = g.localIndex[s];
    dist[i] = 0;
    label[i] = k;
    heap.push(i, 0);
  });
  const done = new Uint8Array(n);
  while (heap.size > 0) {
    const i = heap.pop();
    if (done[i]) continue;
    done[i] = 1;
    const f = faces[i];
    const seed = seeds[label[i]];
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t < 0) continue;
      const nf = (t / 3) | 0;
      if (!inCurrentChart(g, nf)) continue;
      const j = g.localIndex[nf];
      if (done[j]) continue;
      let w = centroidDistance(g, f, nf);
      if (proxy) {
        w *= 1 + CREASE_WEIGHT * (1 - normalDot(g, f, nf)) + PROXY_WEIGHT * (1 - normalDot(g, seed, nf));
      }
      const d = dist[i] + w;
      if (d < dist[j]) {
        dist[j] = d;
        label[j] = label[i];
        heap.push(j, d);
      }
    }
  }
  return { dist, label };
}

/**
 * Splits a connected chart (global face ids) in two, grown from its two geodesically farthest faces with the
 * planar-proxy and crease terms, so the cut settles on a crease where there is one.
 */
export function splitChart(g: FaceGraph, faces: Int32Array): [Int32Array, Int32Array] {
  const farthest = (from: number): number => {
    const { dist } = growFrom(g, faces, [from], false);
    let best = 0;
    for (let i = 1; i < dist.length; i++) if (dist[i] > dist[best] && Number.isFinite(dist[i])) best = i;
    return faces[best];
  };
  const a = farthest(faces[0]);
  const b = farthest(a);
  const { label } = growFrom(g, faces, [a, b === a ? faces[faces.length - 1] : b], true);
  const first: number[] = [];
  const second: number[] = [];
  faces.forEach((f, i) => (label[i] === 0 ? first : second).push(f));
  return [Int32Array.from(first), Int32Array.from(second)];
}

