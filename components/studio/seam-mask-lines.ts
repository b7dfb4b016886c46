/**
 * Seam edges of a SeamMask (the engine's per-half-edge seam flags) as vertex polylines the studio can draw and
 * store as SeamLines: chains of seam edges broken wherever other than two seam edges meet at a vertex.
 */
import type { SeamMask } from '../../geometry/seams/seam-mask';

/**
 * Returns one vertex list per chain of seam edges in `mask` (Uint8Array(3F), both half-edges of a seam edge set;
 * `triangles` Uint32Array(3F); `twin` Int32Array(3F), −1 on a boundary). A chain runs between vertices where the
 * number of seam edges is not two (ends and branch points); a closed loop starts and ends at the same vertex.
 * The order is fixed by the mask (first appearance of each vertex by half-edge), so the same mask gives the same lines.
 */
export function seamMaskLines(mask: SeamMask, triangles: Uint32Array, twin: Int32Array): number[][] {
  const next = (h: number) => h - (h % 3) + ((h % 3) + 1) % 3;
  const adjacency = new Map<number, number[]>();
  const link = (a: number, b: number) => {
    const list = adjacency.get(a);
    if (list) list.push(b);
    else adjacency.set(a, [b]);
  };
  for (let h = 0; h < mask.length; h++) {
    if (!mask[h] || (twin[h] >= 0 && twin[h] < h && mask[twin[h]])) continue;
    const a = triangles[h];
    const b = triangles[next(h)];
    link(a, b);
    link(b, a);
  }
  const used = new Set<string>();
  const key = (a: number, b: number) => (a < b ? `${a}:${b}` : `${b}:${a}`);
  const lines: number[][] = [];
  const walk = (start: number, first: number) => {
    const line = [start, first];
    used.add(key(start, first));
    let cur = first;
    while (cur !== start && adjacency.get(cur)!.length === 2) {
      const [x, y] = adjacency.get(cur)!;
      const nxt = !used.has(key(cur, x)) ? x : !used.has(key(cur, y)) ? y : -1;
      if (nxt < 0) break;
      used.add(key(cur, nxt));
      line.push(nxt);
      cur = nxt;
    }
    lines.push(line);
  };
  // Open chains first, from every end or branch vertex; what is left are closed loops.
  for (const [v, nbrs] of adjacency) {
    if (nbrs.length === 2) continue;
    for (const w of nbrs) if (!used.has(key(v, w))) walk(v, w);
  }
  for (const [v, nbrs] of adjacency) for (const w of nbrs) if (!used.has(key(v, w))) walk(v, w);
  return lines;
}
