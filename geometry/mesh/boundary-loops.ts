import { nextHalfEdge } from './half-edges';

/**
 * Returns the boundary loops of a mesh as vertex lists. `triangles` Uint32Array(3F), `twin` Int32Array(3F)
 * from `buildTwins`. Each loop lists its vertices in the direction of the boundary half-edges (so the mesh
 * lies to the left, counter-clockwise for a disc seen from outside); the first vertex is not repeated.
 * At a vertex where several boundary loops touch, the walk stays within the fan of triangles it arrived
 * through, so loops never jump between sheets. Loops are ordered by their first (lowest) half-edge.
 */
export function boundaryLoops(triangles: Uint32Array, twin: Int32Array): Uint32Array[] {
  const H = triangles.length;
  const used = new Uint8Array(H);
  const loops: Uint32Array[] = [];
  for (let h0 = 0; h0 < H; h0++) {
    if (twin[h0] >= 0 || used[h0]) continue;
    const loop: number[] = [];
    let h = h0;
    let guard = 0;
    while (!used[h] && guard++ <= H) {
      used[h] = 1;
      loop.push(triangles[h]);
      // Rotate around the end vertex through the fan until the next boundary half-edge leaving it.
      let n = nextHalfEdge(h);
      let spins = 0;
      while (twin[n] >= 0 && spins++ <= H) n = nextHalfEdge(twin[n]);
      h = n;
    }
    loops.push(Uint32Array.from(loop));
  }
  return loops;
}
