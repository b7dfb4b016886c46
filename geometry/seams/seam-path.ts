import { GeometryError } from '../errors';
import { interiorDihedralDeg } from '../mesh/dihedral-angles';
import type { TriMesh } from '../mesh/tri-mesh';
import { buildEdgeGraph, type EdgeGraph } from './edge-graph';

/** Options for seamPath. */
export interface SeamPathOptions {
  /** Make sharp edges cheaper so the path runs along creases (see seamPath). */
  preferCreases?: boolean;
  /** A prebuilt graph of the same mesh, to reuse across many picks. */
  graph?: EdgeGraph;
  /** Prebuilt interior dihedral angles (interiorDihedralDeg) of the same mesh, for preferCreases. */
  dihedralDeg?: Float64Array;
}

/** How much cheaper the sharpest edges get with preferCreases (ours: a 90°-or-sharper crease costs 10 %). */
const CREASE_DISCOUNT = 0.9;

/**
 * Returns the shortest path along mesh edges from vertex `fromVertex` to `toVertex` as a vertex list
 * (both ends included), or null when they are not connected. Dijkstra's algorithm (Dijkstra 1959) with a
 * binary heap over the edge graph, edge cost = length in mm. With `preferCreases`, an edge's cost is scaled by
 * 1 − 0.9·min(1, |θ − 180°| / 90°), θ its interior dihedral angle, so a seam picked on the model snaps to
 * nearby creases (our rule; any monotone discount gives the same behaviour). `twin` from buildTwins.
 * Throws GeometryError('BAD_SEAM') when a vertex index is out of range. Cheap enough to run per click.
 */
export function seamPath(mesh: TriMesh, twin: Int32Array, fromVertex: number, toVertex: number, opts: SeamPathOptions = {}): Uint32Array | null {
  const V = mesh.positions.length / 3;
  for (const [name, v] of [['start', fromVertex], ['end', toVertex]] as const) {
    if (!Number.isInteger(v) || v < 0 || v >= V) {
      throw new GeometryError('BAD_SEAM', `seam ${name} vertex ${String(v)} is not in the mesh (0…${V - 1})`, { vertex: Number.isInteger(v) ? v : undefined });
    }
  }
  if (fromVertex === toVertex) return Uint32Array.of(fromVertex);
  const graph = opts.graph ?? buildEdgeGraph(mesh, twin);
  const dihedral = opts.preferCreases ? (opts.dihedralDeg ?? interiorDihedralDeg(mesh.positions, mesh.triangles, twin)) : null;
  const dist = new Float64Array(V).fill(Infinity);
  const prev = new Int32Array(V).fill(-1);
  const done = new Uint8Array(V);
  const heap = new VertexHeap(V);
  dist[fromVertex] = 0;
  heap.push(fromVertex, 0);
  while (heap.size > 0) {
    const v = heap.pop();
    if (done[v]) continue;
    done[v] = 1;
    if (v === toVertex) break;
    for (let k = graph.offset[v]; k < graph.offset[v + 1]; k++) {
      const w = graph.neighbor[k];
      if (done[w]) continue;
      let cost = graph.length[k];
      if (dihedral) cost *= 1 - CREASE_DISCOUNT * Math.min(1, Math.abs(dihedral[graph.halfEdge[k]] - 180) / 90);
      const d = dist[v] + cost;
      if (d < dist[w]) {
        dist[w] = d;
        prev[w] = v;
        heap.push(w, d);
      }
    }
  }
  if (!done[toVertex]) return null;
  const path: number[] = [];
  for (let v = toVertex; v >= 0; v = prev[v]) path.push(v);
  return Uint32Array.from(path.reverse());
}

/** A binary min-heap of (vertex, key) pairs with lazy deletion (stale entries are skipped by the caller). */
class VertexHeap {
  private keys: Float64Array;
  private items: Uint32Array;
  size = 0;

  constructor(capacity: number) {
    this.keys = new Float64Array(Math.max(16, capacity));
    this.items = new Uint32Array(Math.max(16, capacity));
  }

  push(item: number, key: number): void {
    if (this.size === this.keys.length) {
      const k = new Float64Array(2 * this.size);
      k.set(this.keys);
      this.keys = k;
      const it = new Uint32Array(2 * this.size);
      it.set(this.items);
      this.items = it;
    }
    let i = this.size++;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (this.keys[parent] <= key) break;
      this.keys[i] = this.keys[parent];
      this.items[i] = this.items[parent];
      i = parent;
    }
    this.keys[i] = key;
    this.items[i] = item;
  }

  pop(): number {
    const top = this.items[0];
    const n = --this.size;
    const key = this.keys[n];
    const item = this.items[n];
    let i = 0;
    for (;;) {
      let c = 2 * i + 1;
      if (c >= n) break;
      if (c + 1 < n && this.keys[c + 1] < this.keys[c]) c++;
      if (this.keys[c] >= key) break;
      this.keys[i] = this.keys[c];
      this.items[i] = this.items[c];
      i = c;
    }
    this.keys[i] = key;
    this.items[i] = item;
    return top;
  }
}
