import { nextHalfEdge } from './half-edges';

/** Corners grouped into fans: the corners around one vertex that are joined across paired edges. */
export interface CornerFans {
  /** Per corner (3F), the fan it belongs to, 0…fanCount−1, numbered in corner order. */
  fanOfCorner: Uint32Array;
  /** Number of fans. */
  fanCount: number;
  /** Per fan, the vertex it surrounds. */
  fanVertex: Uint32Array;
}

function find(parent: Uint32Array, x: number): number {
  while (parent[x] !== x) {
    parent[x] = parent[parent[x]];
    x = parent[x];
  }
  return x;
}

/**
 * Groups the corners of every vertex into fans: two corners at the same vertex are in one fan when their
 * triangles meet across a paired edge at that vertex (twin ≥ 0 and not `blocked`), directly or through other
 * triangles around it. A manifold vertex has one fan; a vertex where sheets touch (a bow tie), the ends of a
 * non-manifold edge, or a vertex on a cut (`blocked` half-edges, e.g. seams) has several. Each fan becomes
 * one vertex when a mesh is split there. `triangles` Uint32Array(3F), `twin` Int32Array(3F), `blocked`
 * optional Uint8Array(3F). Union–find over corners, O(F α(F)).
 */
export function cornerFans(triangles: Uint32Array, twin: Int32Array, blocked?: Uint8Array): CornerFans {
  const C = triangles.length;
  const parent = new Uint32Array(C);
  for (let c = 0; c < C; c++) parent[c] = c;
  const union = (a: number, b: number) => {
    const ra = find(parent, a);
    const rb = find(parent, b);
    if (ra !== rb) parent[ra < rb ? rb : ra] = ra < rb ? ra : rb;
  };
  for (let h = 0; h < C; h++) {
    const t = twin[h];
    if (t <= h || (blocked && (blocked[h] || blocked[t]))) continue;
    // h runs a→b, t runs b→a: the corner where h starts matches the corner where t ends, and vice versa.
    union(h, nextHalfEdge(t));
    union(nextHalfEdge(h), t);
  }
  const fanOfCorner = new Uint32Array(C);
  const id = new Int32Array(C).fill(-1);
  const vertexOfFan: number[] = [];
  for (let c = 0; c < C; c++) {
    const r = find(parent, c);
    if (id[r] < 0) {
      id[r] = vertexOfFan.length;
      vertexOfFan.push(triangles[c]);
    }
    fanOfCorner[c] = id[r];
  }
  return { fanOfCorner, fanCount: vertexOfFan.length, fanVertex: Uint32Array.from(vertexOfFan) };
}
