import { GeometryError } from '../errors';

/** What pairing the half-edges found, besides the twin array. */
export interface EdgeAnalysis {
  /** twin[h] for h = 3f + i, or −1 when the edge is a boundary, non-manifold, or both faces run it the same way. */
  twin: Int32Array;
  /** Non-manifold edges (three or more faces), as vertex pairs [a0, b0, a1, b1, …] with a < b. */
  nonManifoldEdges: Uint32Array;
  /** Edges shared by exactly two faces that both run it in the same direction (inconsistent winding), as vertex pairs. */
  misorientedEdges: Uint32Array;
  /**
   * partner[h]: the other face's half-edge on an edge used by exactly two faces, whichever way it runs
   * (equal to twin[h] when the winding agrees); −1 on boundary and non-manifold edges.
   */
  partner: Int32Array;
}

function checkTriangles(triangles: Uint32Array, vertexCount: number): void {
  if (triangles.length % 3 !== 0) {
    throw new GeometryError('BAD_OPTION', `triangle index array length ${triangles.length} is not a multiple of 3`);
  }
  for (let i = 0; i < triangles.length; i++) {
    if (triangles[i] >= vertexCount) {
      throw new GeometryError(
        'INDEX_OUT_OF_RANGE',
        `triangle ${Math.floor(i / 3)} uses vertex ${triangles[i]} but there are only ${vertexCount} vertices`,
        { face: Math.floor(i / 3) },
      );
    }
  }
}

/**
 * Pairs the half-edges of a triangle list. `triangles` is Uint32Array(3F) of vertex indices < `vertexCount`;
 * half-edge h = 3f + i runs from corner i to corner (i+1) mod 3. Two half-edges are twins when they join the
 * same two vertices in opposite directions and no other face uses that edge. Edges with three or more faces
 * (non-manifold) pair none of their half-edges; they are listed in `nonManifoldEdges`. O(F) time and memory:
 * half-edges are bucketed by their lower vertex (counting sort), then matched within each small bucket.
 */
export function analyzeEdges(triangles: Uint32Array, vertexCount: number): EdgeAnalysis {
  checkTriangles(triangles, vertexCount);
  const H = triangles.length;
  const start = new Uint32Array(vertexCount + 1);
  for (let h = 0; h < H; h++) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    start[(a < b ? a : b) + 1]++;
  }
  for (let v = 0; v < vertexCount; v++) start[v + 1] += start[v];
  const fill = start.slice(0, vertexCount);
  const bucket = new Uint32Array(H);
  const other = new Uint32Array(H);
  for (let h = 0; h < H; h++) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    other[h] = a < b ? b : a;
    bucket[fill[a < b ? a : b]++] = h;
  }
  const twin = new Int32Array(H).fill(-1);
  const partner = new Int32Array(H).fill(-1);
  const done = new Uint8Array(H);
  const nonManifold: number[] = [];
  const misoriented: number[] = [];
  for (let v = 0; v < vertexCount; v++) {
    const s = start[v];
    const e = start[v + 1];
    for (let i = s; i < e; i++) {
      const h = bucket[i];
      if (done[h]) continue;
      const hi = other[h];
      let count = 1;
      let mate = -1;
      for (let j = i + 1; j < e; j++) {
        const g = bucket[j];
        if (!done[g] && other[g] === hi) {
          count++;
          mate = g;
          done[g] = 1;
        }
      }
      done[h] = 1;
      if (count === 2) {
        partner[h] = mate;
        partner[mate] = h;
        if (triangles[h] !== triangles[mate]) {
          twin[h] = mate;
          twin[mate] = h;
        } else {
          misoriented.push(v, hi);
        }
      } else if (count > 2) {
        nonManifold.push(v, hi);
      }
    }
  }
  return { twin, nonManifoldEdges: Uint32Array.from(nonManifold), misorientedEdges: Uint32Array.from(misoriented), partner };
}

/**
 * Returns the twin array Int32Array(3F) of a triangle list (see `analyzeEdges` for the pairing rule):
 * twin[h] is the opposite half-edge, or −1 on a boundary, a non-manifold edge, or an edge whose two faces
 * disagree on winding. `vertexCount` bounds the indices.
 */
export function buildTwins(triangles: Uint32Array, vertexCount: number): Int32Array {
  return analyzeEdges(triangles, vertexCount).twin;
}

/**
 * Returns the non-manifold edges of a triangle list (edges used by three or more faces) as vertex pairs
 * [a0, b0, a1, b1, …] with a < b, in increasing order of a.
 */
export function nonManifoldEdges(triangles: Uint32Array, vertexCount: number): Uint32Array {
  return analyzeEdges(triangles, vertexCount).nonManifoldEdges;
}

/** Returns the half-edge after h in its triangle (h = 3f + i → 3f + (i+1) mod 3). */
export const nextHalfEdge = (h: number): number => h - (h % 3) + ((h % 3) + 1) % 3;
/** Returns the half-edge before h in its triangle. */
export const prevHalfEdge = (h: number): number => h - (h % 3) + ((h % 3) + 2) % 3;
/** Returns the vertex half-edge h starts at. */
export const halfEdgeStart = (triangles: Uint32Array, h: number): number => triangles[h];
/** Returns the vertex half-edge h ends at. */
export const halfEdgeEnd = (triangles: Uint32Array, h: number): number => triangles[nextHalfEdge(h)];
/** True when half-edge h has no twin (a boundary, or an edge left unpaired as non-manifold). */
export const isBoundaryHalfEdge = (twin: Int32Array, h: number): boolean => twin[h] < 0;
