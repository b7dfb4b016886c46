import type { TriMesh } from '../mesh/tri-mesh';
import { nextHalfEdge } from '../mesh/half-edges';

/**
 * The mesh's edges as an undirected graph in compressed rows: the neighbours of vertex v are
 * `neighbor[offset[v] … offset[v+1])`, `halfEdge[k]` is a half-edge lying on that edge (either direction)
 * and `length[k]` its length in mm. Each edge appears once in each end's row.
 */
export interface EdgeGraph {
  offset: Uint32Array;
  neighbor: Uint32Array;
  halfEdge: Uint32Array;
  length: Float64Array;
}

/**
 * Builds the EdgeGraph of `mesh` (positions mm, triangles Uint32Array(3F)) with `twin` from buildTwins. An
 * edge is a paired half-edge couple or a lone half-edge (boundary or left unpaired). O(F).
 */
export function buildEdgeGraph(mesh: TriMesh, twin: Int32Array): EdgeGraph {
  const { positions, triangles } = mesh;
  const V = positions.length / 3;
  const degree = new Uint32Array(V + 1);
  for (let h = 0; h < triangles.length; h++) {
    if (twin[h] >= 0 && twin[h] < h) continue;
    degree[triangles[h] + 1]++;
    degree[triangles[nextHalfEdge(h)] + 1]++;
  }
  for (let v = 0; v < V; v++) degree[v + 1] += degree[v];
  const offset = degree;
  const fill = offset.slice(0, V);
  const total = offset[V];
  const neighbor = new Uint32Array(total);
  const halfEdge = new Uint32Array(total);
  const length = new Float64Array(total);
  for (let h = 0; h < triangles.length; h++) {
    if (twin[h] >= 0 && twin[h] < h) continue;
    const a = triangles[h];
    const b = triangles[nextHalfEdge(h)];
    const l = Math.hypot(positions[3 * b] - positions[3 * a], positions[3 * b + 1] - positions[3 * a + 1], positions[3 * b + 2] - positions[3 * a + 2]);
    let k = fill[a]++;
    neighbor[k] = b;
    halfEdge[k] = h;
    length[k] = l;
    k = fill[b]++;
    neighbor[k] = a;
    halfEdge[k] = h;
    length[k] = l;
  }
  return { offset, neighbor, halfEdge, length };
}

/** Returns a half-edge on the edge between vertices a and b, or −1 when they share no edge. */
export function findEdge(graph: EdgeGraph, a: number, b: number): number {
  for (let k = graph.offset[a]; k < graph.offset[a + 1]; k++) if (graph.neighbor[k] === b) return graph.halfEdge[k];
  return -1;
}
