/**
 * Seams as a maker counts them: a seam is a maximal chain of seam edges that joins the same two pieces,
 * broken wherever the seam graph branches or ends (a vertex where other than two seam edges meet).
 * Each chain is given a direction; "side 0" is the piece on the left of that direction (its half-edges
 * run along the chain), "side 1" the piece on the right (the twins, running against it).
 */

/** One seam: a chain of mesh edges between two pieces (or a piece and itself, for a tube cut open). */
export interface SeamChain {
  /** Piece index on side 0 (left of the chain direction) and on side 1. Equal for a self-seam. */
  pieces: [number, number];
  /** Global vertex ids along the chain, length n+1 for n edges (first = last for a closed loop). */
  vertices: Uint32Array;
  /** Side-0 half-edges in chain order; half-edge k runs from vertices[k] to vertices[k+1]. */
  halfEdges: Int32Array;
  /** True when the chain is a loop with no junction (first vertex repeated at the end). */
  closed: boolean;
}

/**
 * Groups the seam edges of a mesh into seams.
 *
 * @param triangles Uint32Array(3F), corners CCW seen from outside.
 * @param twin Int32Array(3F) half-edge twins (h = 3f+i runs corner i → (i+1)%3), −1 on a boundary.
 * @param seamMask Uint8Array(3F), both half-edges of a seam edge set; mask on a boundary half-edge is ignored
 *   (a seam needs two sides).
 * @param pieceOfFace Int32Array(F), the piece each face belongs to.
 * @returns chains sorted by (smaller piece, larger piece, smallest half-edge), so labels "1", "2", … are stable
 *   for the same mesh and seams. Two-piece chains are oriented so side 0 is the lower piece index.
 */
export function seamChains(
  triangles: Uint32Array,
  twin: Int32Array,
  seamMask: Uint8Array,
  pieceOfFace: Int32Array,
): SeamChain[] {
  const halfCount = triangles.length;
  const isSeam = (h: number): boolean => seamMask[h] !== 0 && twin[h] >= 0;
  const from = (h: number): number => triangles[h];
  const to = (h: number): number => triangles[h - (h % 3) + ((h % 3) + 1) % 3];

  // Seam degree per vertex (each seam edge counted once, through its lower half-edge).
  let maxVertex = 0;
  for (let i = 0; i < halfCount; i++) if (triangles[i] > maxVertex) maxVertex = triangles[i];
  const degree = new Int32Array(maxVertex + 1);
  // Outgoing seam half-edges per vertex (both directions stored), CSR layout.
  const outCount = new Int32Array(maxVertex + 2);
  for (let h = 0; h < halfCount; h++) {
    if (!isSeam(h)) continue;
    outCount[from(h) + 1]++;
    if (h < twin[h]) {
      degree[from(h)]++;
      degree[to(h)]++;
    }
  }
  for (let v = 0; v <= maxVertex; v++) outCount[v + 1] += outCount[v];
  const outStart = outCount.slice();
  const outList = new Int32Array(outCount[maxVertex + 1]);
  const fill = outStart.slice(0, maxVertex + 1);
  for (let h = 0; h < halfCount; h++) if (isSeam(h)) outList[fill[from(h)]++] = h;

  const pairKey = (h: number): string => {
    const a = pieceOfFace[(h / 3) | 0];
    const b = pieceOfFace[(twin[h] / 3) | 0];
    return a < b ? `${a}:${b}` : `${b}:${a}`;
  };
  const used = new Uint8Array(halfCount);
  const markUsed = (h: number): void => {
    used[h] = 1;
    used[twin[h]] = 1;
  };
  // The next half-edge continuing h through its end vertex, or −1 at a junction / end / change of pieces.
  const next = (h: number): number => {
    const v = to(h);
    if (degree[v] !== 2) return -1;
    const key = pairKey(h);
    for (let k = outStart[v]; k < outStart[v + 1]; k++) {
      const g = outList[k];
      if (g === twin[h] || used[g]) continue;
      if (pairKey(g) !== key) return -1;
      return g;
    }
    return -1;
  };
  const prev = (h: number): number => {
    const back = next(twin[h]);
    return back < 0 ? -1 : twin[back];
  };

  const chains: SeamChain[] = [];
  for (let h0 = 0; h0 < halfCount; h0++) {
    if (!isSeam(h0) || used[h0] || h0 > twin[h0]) continue;
    markUsed(h0);
    const forward: number[] = [h0];
    let closed = false;
    for (let h = next(h0); h >= 0; h = next(h)) {
      markUsed(h);
      forward.push(h);
    }
    if (forward.length > 1 && to(forward[forward.length - 1]) === from(h0) && degree[from(h0)] === 2) closed = true;
    const backward: number[] = [];
    if (!closed) {
      for (let h = prev(h0); h >= 0; h = prev(h)) {
        markUsed(h);
        backward.push(h);
      }
    }
    let edges = backward.reverse().concat(forward);
    const a = pieceOfFace[(edges[0] / 3) | 0];
    const b = pieceOfFace[(twin[edges[0]] / 3) | 0];
    if (a > b) {
      edges = edges.reverse().map((h) => twin[h]);
    }
    if (closed) edges = rotateToSmallestVertex(edges, from);
    const vertices = new Uint32Array(edges.length + 1);
    for (let k = 0; k < edges.length; k++) vertices[k] = from(edges[k]);
    vertices[edges.length] = to(edges[edges.length - 1]);
    const side0 = pieceOfFace[(edges[0] / 3) | 0];
    const side1 = pieceOfFace[(twin[edges[0]] / 3) | 0];
    chains.push({ pieces: [side0, side1], vertices, halfEdges: Int32Array.from(edges), closed });
  }
  const minEdge = (c: SeamChain): number => {
    let m = Infinity;
    for (const h of c.halfEdges) m = Math.min(m, h, twin[h]);
    return m;
  };
  const lo = (c: SeamChain): number => Math.min(c.pieces[0], c.pieces[1]);
  const hi = (c: SeamChain): number => Math.max(c.pieces[0], c.pieces[1]);
  return chains
    .map((c) => ({ c, key: [lo(c), hi(c), minEdge(c)] }))
    .sort((x, y) => x.key[0] - y.key[0] || x.key[1] - y.key[1] || x.key[2] - y.key[2])
    .map((x) => x.c);
}

// A loop has no natural start; starting at its smallest vertex keeps the station positions stable.
function rotateToSmallestVertex(edges: number[], from: (h: number) => number): number[] {
  let best = 0;
  for (let k = 1; k < edges.length; k++) if (from(edges[k]) < from(edges[best])) best = k;
  return edges.slice(best).concat(edges.slice(0, best));
}
