/**
 * Replacing a wandering border between two charts by the cheapest edge path between its two ends inside the
 * two charts: the boundary-straightening step of D-Charts (Julius et al. 2005) done as a shortest path rather
 * than face by face, so a seam that meanders across a smooth region is laid straight in one move. The faces on
 * each side of the new path go to the chart that held most of them; the move is kept only when both charts
 * still fit the budget.
 */
import type { TriMesh } from '../mesh/tri-mesh';
import { MinHeap } from '../pattern/min-heap';
import type { FaceGraph } from './chart-face-graph';
import { buildEdgeGraph } from './edge-graph';

/** A new border must be at least this much cheaper (share of the old border's seam cost) to be tried. */
const MIN_SAVING = 0.02;

/**
 * Lays every border that is one open chain between two charts along the cheapest edge path (seam cost: length
 * times visibility, see seamVisibility) joining its ends through the interior of the two charts.
 *
 * @param mesh TriMesh in mm (the mesh `g` was built from).
 * @param g the face graph (its `twin` −1 on mesh boundaries and fixed crease borders: the path never runs
 *   along or touches those, nor the border with a third chart, except at its two ends); `chartOf` one chart
 *   index per face (−1 outside the search), changed in place.
 * @param stretches each chart's last measured stretch, percent (updated for the charts that change).
 * @param stretchOf stretch of a chart (global face ids), percent; Infinity when it cannot fit.
 * @param budget stretch budget, percent.
 * @returns the number of borders replaced. Each replacement splits the two charts' union into exactly two
 *   connected parts along the new path, so both charts stay connected.
 */
export function shortcutChartBorders(
  mesh: TriMesh,
  g: FaceGraph,
  chartOf: Int32Array,
  stretches: number[],
  stretchOf: (faces: Int32Array) => number,
  budget: number,
): number {
  const F = g.faceCount;
  const tri = mesh.triangles;
  const V = mesh.positions.length / 3;
  const edges = buildEdgeGraph(mesh, g.twin);
  const pairs = new Map<number, { a: number; b: number }>();
  const C = stretches.length;
  for (let h = 0; h < 3 * F; h++) {
    const t = g.twin[h];
    if (t < 0) continue;
    const a = chartOf[(h / 3) | 0];
    const b = chartOf[(t / 3) | 0];
    if (a >= 0 && b >= 0 && a < b) pairs.set(a * C + b, { a, b });
  }
  const blocked = new Uint8Array(V);
  const onPath = new Uint8Array(3 * F);
  let replaced = 0;
  for (const { a, b } of pairs.values()) {
    const inUnion = (f: number): boolean => chartOf[f] === a || chartOf[f] === b;
    // The old border: half-edges of a facing b, with each vertex's number of border edges.
    const degree = new Map<number, number>();
    let oldCost = 0;
    for (let h = 0; h < 3 * F; h++) {
      const t = g.twin[h];
      if (t < 0 || chartOf[(h / 3) | 0] !== a || chartOf[(t / 3) | 0] !== b) continue;
      oldCost += g.seamCost[h];
      for (const v of [tri[h], tri[h - (h % 3) + ((h % 3) + 1) % 3]]) degree.set(v, (degree.get(v) ?? 0) + 1);
    }
    const ends = [...degree].filter(([, d]) => d !== 2);
    if (ends.length !== 2 || ends.some(([, d]) => d !== 1)) continue;
    const [u, w] = [ends[0][0], ends[1][0]];
    // Vertices the new path may not touch: those on a face outside the union or on a boundary or crease edge.
    blocked.fill(0);
    for (let f = 0; f < F; f++) {
      for (let k = 0; k < 3; k++) {
        const h = 3 * f + k;
        if (!inUnion(f)) blocked[tri[h]] = 1;
        else if (g.twin[h] < 0) {
          blocked[tri[h]] = 1;
          blocked[tri[h - k + ((k + 1) % 3)]] = 1;
        }
      }
    }
    blocked[u] = 0;
    blocked[w] = 0;
    const path = cheapestPath(edges, g, u, w, blocked, inUnion);
    if (!path || path.cost > (1 - MIN_SAVING) * oldCost) continue;
    // Split the union along the path and give each side to the chart that held most of it.
    onPath.fill(0);
    for (const h of path.halfEdges) {
      onPath[h] = 1;
      if (g.twin[h] >= 0) onPath[g.twin[h]] = 1;
    }
    const side = new Int32Array(F).fill(-1);
    const parts: number[][] = [];
    for (let s = 0; s < F; s++) {
      if (!inUnion(s) || side[s] >= 0) continue;
      const list = [s];
      side[s] = parts.length;
      for (let i = 0; i < list.length; i++) {
        const f = list[i];
        for (let k = 0; k < 3; k++) {
          const t = g.twin[3 * f + k];
          if (t < 0 || onPath[3 * f + k]) continue;
          const n = (t / 3) | 0;
          if (inUnion(n) && side[n] < 0) {
            side[n] = parts.length;
            list.push(n);
          }
        }
      }
      parts.push(list);
    }
    if (parts.length !== 2) continue;
    const countA = parts.map((p) => p.filter((f) => chartOf[f] === a).length);
    const shareA = parts.map((p, i) => countA[i] / p.length);
    const [toA, toB] = shareA[0] >= shareA[1] ? [parts[0], parts[1]] : [parts[1], parts[0]];
    const sa = stretchOf(Int32Array.from(toA).sort());
    const sb = sa <= budget ? stretchOf(Int32Array.from(toB).sort()) : Infinity;
    if (!(sa <= budget && sb <= budget)) continue;
    for (const f of toA) chartOf[f] = a;
    for (const f of toB) chartOf[f] = b;
    stretches[a] = sa;
    stretches[b] = sb;
    replaced++;
  }
  return replaced;
}

/**
 * Dijkstra's algorithm (Dijkstra 1959) from u to w over edges with both faces in the union (`inUnion`), never
 * entering a blocked vertex, edge cost = seam cost. Returns the path's half-edges and cost, or null.
 */
function cheapestPath(
  edges: ReturnType<typeof buildEdgeGraph>,
  g: FaceGraph,
  u: number,
  w: number,
  blocked: Uint8Array,
  inUnion: (f: number) => boolean,
): { halfEdges: number[]; cost: number } | null {
  const V = edges.offset.length - 1;
  const dist = new Float64Array(V).fill(Infinity);
  const via = new Int32Array(V).fill(-1);
  const prev = new Int32Array(V).fill(-1);
  const heap = new MinHeap(V);
  dist[u] = 0;
  heap.push(u, 0);
  while (heap.size > 0) {
    const v = heap.pop();
    if (v === w) break;
    for (let k = edges.offset[v]; k < edges.offset[v + 1]; k++) {
      const n = edges.neighbor[k];
      const h = edges.halfEdge[k];
      const t = g.twin[h];
      if (blocked[n] || t < 0 || !inUnion((h / 3) | 0) || !inUnion((t / 3) | 0)) continue;
      const d = dist[v] + g.seamCost[h];
      if (d < dist[n]) {
        dist[n] = d;
        prev[n] = v;
        via[n] = h;
        heap.push(n, d);
      }
    }
  }
  if (!Number.isFinite(dist[w])) return null;
  const halfEdges: number[] = [];
  for (let v = w; v !== u; v = prev[v]) halfEdges.push(via[v]);
  return { halfEdges, cost: dist[w] };
}
