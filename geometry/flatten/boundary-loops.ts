/**
 * Returns the boundary loops of a piece as ordered vertex lists, longest (in 3D) first. Each loop follows
 * its boundary half-edges a→b, so the piece lies on the left (the outer loop runs counter-clockwise when
 * the triangles do, hole loops clockwise). `boundary` lists the half-edges without twin (as from
 * pieceTopology); a vertex where two loops touch is followed along the half-edge that comes first.
 */
export function boundaryLoops(positions: Float64Array, triangles: Uint32Array, boundary: Int32Array): Int32Array[] {
  const nv = positions.length / 3;
  const headOf = (h: number): number => triangles[h - (h % 3) + ((h % 3) + 1) % 3];
  // Boundary half-edges leaving each vertex, grouped by tail vertex (counting sort).
  const start = new Int32Array(nv + 1);
  for (const h of boundary) start[triangles[h] + 1]++;
  for (let v = 0; v < nv; v++) start[v + 1] += start[v];
  const fill = start.slice(0, nv);
  const out = new Int32Array(boundary.length);
  for (const h of boundary) out[fill[triangles[h]]++] = h;
  const used = new Uint8Array(boundary.length);
  const loops: { verts: Int32Array; length: number }[] = [];
  for (let e = 0; e < boundary.length; e++) {
    if (used[e]) continue;
    const verts: number[] = [];
    let length = 0;
    let cur = e;
    while (!used[cur]) {
      used[cur] = 1;
      const h = out[cur];
      const a = triangles[h];
      const b = headOf(h);
      verts.push(a);
      length += Math.hypot(
        positions[3 * b] - positions[3 * a],
        positions[3 * b + 1] - positions[3 * a + 1],
        positions[3 * b + 2] - positions[3 * a + 2],
      );
      let next = -1;
      for (let q = start[b]; q < start[b + 1]; q++) {
        if (!used[q]) {
          next = q;
          break;
        }
      }
      if (next < 0) break;
      cur = next;
    }
    loops.push({ verts: Int32Array.from(verts), length });
  }
  loops.sort((x, y) => y.length - x.length);
  return loops.map((l) => l.verts);
}
