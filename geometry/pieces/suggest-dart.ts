/**
 * A dart for a piece that cannot lie flat within the stretch budget: a cut from the piece's edge into the
 * region that stretches most, so the foam can open there instead of stretching (the dressmaker's and the
 * prop maker's dart; DESIGN.md step 4).
 */
import { flattenPiece, type FlatPiece } from '../flatten/flatten-piece';
import { isGeometryError } from '../errors';
import { buildTwins, nextHalfEdge as next } from '../mesh/half-edges';
import type { TriMesh } from '../mesh/tri-mesh';
import type { DartSuggestion, PointMm } from '../pattern/pattern-doc';
import { MinHeap } from '../pattern/min-heap';
import { splitPieces } from './split-pieces';

/**
 * Suggests one dart for a flattened piece.
 *
 * @param piece the piece's local TriMesh (mm), a disk or a disk with holes.
 * @param flat its flattening (uv in mm, per-triangle stretch percent).
 * @returns the dart's path in the piece's 2D coordinates, from the boundary to the worst-stretched vertex
 *   (the shortest edge path in 3D, Dijkstra 1959, from the nearest boundary vertex) or to the vertex deepest inside
 *   the piece, whichever leaves less stretch, and the max stretch the piece has once flattened again with the cut
 *   open; null when no interior vertex exists or the cut piece cannot be flattened.
 */
export function suggestDart(piece: TriMesh, flat: FlatPiece): DartSuggestion | null {
  const { positions, triangles } = piece;
  const V = positions.length / 3;
  const F = triangles.length / 3;
  if (F === 0) return null;
  const twin = buildTwins(triangles, V);
  let worst = 0;
  for (let f = 1; f < F; f++) if (flat.trianglePct[f] > flat.trianglePct[worst]) worst = f;

  // Vertex adjacency (CSR) and distances from the boundary.
  const degree = new Int32Array(V + 1);
  for (let h = 0; h < 3 * F; h++) {
    if (twin[h] >= 0 && twin[h] < h) continue;
    degree[triangles[h] + 1]++;
    degree[triangles[next(h)] + 1]++;
  }
  for (let v = 0; v < V; v++) degree[v + 1] += degree[v];
  const adj = new Int32Array(degree[V]);
  const fill = degree.slice(0, V);
  const onBoundary = new Uint8Array(V);
  for (let h = 0; h < 3 * F; h++) {
    const a = triangles[h];
    const b = triangles[next(h)];
    if (twin[h] < 0) onBoundary[a] = onBoundary[b] = 1;
    if (twin[h] >= 0 && twin[h] < h) continue;
    adj[fill[a]++] = b;
    adj[fill[b]++] = a;
  }
  const dist = new Float64Array(V).fill(Infinity);
  const from = new Int32Array(V).fill(-1);
  const heap = new MinHeap(V);
  for (let v = 0; v < V; v++) {
    if (onBoundary[v]) {
      dist[v] = 0;
      heap.push(v, 0);
    }
  }
  const done = new Uint8Array(V);
  while (heap.size > 0) {
    const v = heap.pop();
    if (done[v]) continue;
    done[v] = 1;
    for (let k = degree[v]; k < degree[v + 1]; k++) {
      const w = adj[k];
      const d =
        dist[v] +
        Math.hypot(positions[3 * w] - positions[3 * v], positions[3 * w + 1] - positions[3 * v + 1], positions[3 * w + 2] - positions[3 * v + 2]);
      if (d < dist[w]) {
        dist[w] = d;
        from[w] = v;
        heap.push(w, d);
      }
    }
  }
  // Two candidate tips: the corner of the worst triangle deepest inside the piece, and the vertex deepest
  // inside the piece overall (on a cap the stretch sits at the rim, but it is the closed-up centre that a dart
  // relieves). The one that leaves less stretch wins.
  let tip = triangles[3 * worst];
  for (let k = 1; k < 3; k++) if (dist[triangles[3 * worst + k]] > dist[tip]) tip = triangles[3 * worst + k];
  let deepest = 0;
  for (let v = 1; v < V; v++) if (Number.isFinite(dist[v]) && dist[v] > dist[deepest]) deepest = v;
  let best: DartSuggestion | null = null;
  for (const candidate of tip === deepest ? [tip] : [tip, deepest]) {
    const dart = dartTo(candidate, piece, twin, from, dist, flat);
    if (dart && (!best || dart.stretchAfterPct < best.stretchAfterPct)) best = dart;
  }
  return best;
}

/** The dart from the nearest boundary vertex to `tip` along the Dijkstra tree `from`, re-flattened. */
function dartTo(
  tip: number,
  piece: TriMesh,
  twin: Int32Array,
  from: Int32Array,
  dist: Float64Array,
  flat: FlatPiece,
): DartSuggestion | null {
  const triangles = piece.triangles;
  const F = triangles.length / 3;
  if (!(dist[tip] > 0) || !Number.isFinite(dist[tip])) return null;
  const path: number[] = [];
  for (let v = tip; v >= 0; v = from[v]) path.push(v);
  path.reverse();

  const mask = new Uint8Array(3 * F);
  const onPath = new Map<number, number>();
  path.forEach((v, i) => onPath.set(v, i));
  for (let h = 0; h < 3 * F; h++) {
    const i = onPath.get(triangles[h]);
    const j = onPath.get(triangles[next(h)]);
    if (i !== undefined && j !== undefined && Math.abs(i - j) === 1 && twin[h] >= 0) mask[h] = 1;
  }
  const cut = splitPieces(piece, twin, mask);
  if (cut.length !== 1) return null;
  let stretchAfterPct: number;
  try {
    stretchAfterPct = flattenPiece({ positions: cut[0].positions, triangles: cut[0].triangles }).stretch.maxPct;
  } catch (e) {
    if (isGeometryError(e)) return null;
    throw e;
  }
  const path2d = path.map((v): PointMm => [flat.uv[2 * v], flat.uv[2 * v + 1]]);
  return { path: path2d, stretchAfterPct };
}

