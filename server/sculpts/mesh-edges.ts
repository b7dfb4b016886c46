/**
 * Which vertex pairs of a triangle mesh are joined by an edge, for checking seam paths and carrying seams to a
 * new version. Pure; kept beside the sculpt service because only it asks.
 */

/** The edges of a mesh as a compressed neighbour list. */
export interface MeshEdges {
  vertexCount: number;
  /** True when vertices a and b (both < vertexCount) are the two ends of some triangle's side. */
  hasEdge(a: number, b: number): boolean;
}

/**
 * Returns the edge lookup of `triangles` (Uint32Array(3F), indices < `vertexCount`). Every half-edge
 * h = 3f + i (corner i to corner (i+1) mod 3) adds its two ends as neighbours of each other, so boundary,
 * interior and non-manifold edges all count. O(F) memory; a query scans one vertex's neighbours (about six).
 */
export function meshEdges(triangles: Uint32Array, vertexCount: number): MeshEdges {
  const start = new Uint32Array(vertexCount + 1);
  for (let h = 0; h < triangles.length; h++) {
    start[triangles[h] + 1]++;
    start[triangles[h - (h % 3) + ((h % 3) + 1) % 3] + 1]++;
  }
  for (let v = 0; v < vertexCount; v++) start[v + 1] += start[v];
  const fill = start.slice(0, vertexCount);
  const neighbours = new Uint32Array(2 * triangles.length);
  for (let h = 0; h < triangles.length; h++) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    neighbours[fill[a]++] = b;
    neighbours[fill[b]++] = a;
  }
  return {
    vertexCount,
    hasEdge(a, b) {
      if (a >= vertexCount || b >= vertexCount || a === b) return false;
      for (let k = start[a]; k < start[a + 1]; k++) if (neighbours[k] === b) return true;
      return false;
    },
  };
}
