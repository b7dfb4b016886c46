import { GeometryError } from '../errors';
import { interiorDihedralDeg } from '../mesh/dihedral-angles';
import type { TriMesh } from '../mesh/tri-mesh';
import { MinHeap } from '../pattern/min-heap';
import { buildEdgeGraph, type EdgeGraph } from './edge-graph';

/** Options for seamPathFinder. */
export interface SeamPathFinderOptions {
  /** Make sharp edges cheaper so paths run along creases, with the same cost rule as seamPath's preferCreases. */
  preferCreases?: boolean;
}

/** Finds one seam path per call on the mesh a SeamPathFinder was built for. */
export type SeamPathFinder = (fromVertex: number, toVertex: number) => Uint32Array | null;

/** Same discount as seamPath's preferCreases: a 90°-or-sharper crease costs 10 % of its length. */
const CREASE_DISCOUNT = 0.9;

/**
 * Precomputes what repeated seam picks on one mesh share (the edge graph, per-edge costs, the search scratch)
 * and returns a finder that answers like seamPath: the vertex list of a least-cost path along mesh edges from
 * `fromVertex` to `toVertex` (both ends included), or null when they are not connected.
 *
 * The search is A* (Hart, Nilsson & Raphael 1968) with the straight-line distance to the target as its
 * estimate. An edge never costs less than its length (times 1 − 0.9 with preferCreases), so the estimate scaled
 * by that floor never overestimates and the path found is a least-cost one, as Dijkstra's search would find;
 * where two paths tie the two may pick different ones. Far-apart picks on a dense sculpt visit a small share of
 * the vertices instead of nearly all of them, which is what keeps a click on a 500k-triangle sculpt interactive.
 *
 * @param mesh positions Float64Array(3V) in mm, triangles Uint32Array(3F).
 * @param twin Int32Array(3F) from buildTwins.
 * @param graph the mesh's EdgeGraph when the caller already has one.
 * @returns the finder; it throws GeometryError('BAD_SEAM') for a vertex index out of range. Not re-entrant
 *   (its scratch is shared between calls), which suits one UI thread or one worker.
 */
export function seamPathFinder(mesh: TriMesh, twin: Int32Array, options: SeamPathFinderOptions = {}, graph?: EdgeGraph): SeamPathFinder {
  const P = mesh.positions;
  const V = P.length / 3;
  const g = graph ?? buildEdgeGraph(mesh, twin);
  const cost = Float64Array.from(g.length);
  let floor = 1;
  if (options.preferCreases) {
    const dihedral = interiorDihedralDeg(P, mesh.triangles, twin);
    for (let k = 0; k < cost.length; k++) cost[k] *= 1 - CREASE_DISCOUNT * Math.min(1, Math.abs(dihedral[g.halfEdge[k]] - 180) / 90);
    floor = 1 - CREASE_DISCOUNT;
  }
  const dist = new Float64Array(V);
  const prev = new Int32Array(V);
  // A vertex's dist/prev are valid only when its stamp equals the current search's, so no O(V) reset per call.
  const stamp = new Uint32Array(V);
  const closed = new Uint32Array(V);
  const heap = new MinHeap(1024);
  let search = 0;

  return (fromVertex: number, toVertex: number): Uint32Array | null => {
    for (const [name, v] of [['start', fromVertex], ['end', toVertex]] as const) {
      if (!Number.isInteger(v) || v < 0 || v >= V) {
        throw new GeometryError('BAD_SEAM', `seam ${name} vertex ${String(v)} is not in the mesh (0…${V - 1})`, { vertex: Number.isInteger(v) ? v : undefined });
      }
    }
    if (fromVertex === toVertex) return Uint32Array.of(fromVertex);
    search++;
    const tx = P[3 * toVertex];
    const ty = P[3 * toVertex + 1];
    const tz = P[3 * toVertex + 2];
    const estimate = (v: number) => floor * Math.hypot(P[3 * v] - tx, P[3 * v + 1] - ty, P[3 * v + 2] - tz);
    heap.size = 0;
    stamp[fromVertex] = search;
    dist[fromVertex] = 0;
    prev[fromVertex] = -1;
    heap.push(fromVertex, estimate(fromVertex));
    let found = false;
    while (heap.size > 0) {
      const v = heap.pop();
      if (closed[v] === search) continue;
      closed[v] = search;
      if (v === toVertex) {
        found = true;
        break;
      }
      const dv = dist[v];
      for (let k = g.offset[v]; k < g.offset[v + 1]; k++) {
        const w = g.neighbor[k];
        if (closed[w] === search) continue;
        const d = dv + cost[k];
        if (stamp[w] !== search || d < dist[w]) {
          stamp[w] = search;
          dist[w] = d;
          prev[w] = v;
          heap.push(w, d + estimate(w));
        }
      }
    }
    if (!found) return null;
    let n = 0;
    for (let v = toVertex; v >= 0; v = prev[v]) n++;
    const path = new Uint32Array(n);
    for (let v = toVertex, i = n - 1; v >= 0; v = prev[v], i--) path[i] = v;
    return path;
  };
}
