import type { SparseSymmetricMatrix } from './sparse-symmetric-matrix';

/** Subgraphs this small are not split further but ordered by minimum degree. */
const LEAF_SIZE = 12;

/**
 * Returns a fill-reducing elimination order for a symmetric matrix: perm[k] is the original index of
 * the k-th pivot (length n, a permutation of 0..n−1). Nested dissection on the matrix's adjacency graph
 * (George 1973, "Nested dissection of a regular finite element mesh", SIAM J. Numer. Anal. 10):
 * each connected part is split by a small vertex separator taken from a breadth-first level structure
 * rooted at a pseudo-peripheral vertex (George & Liu 1979, "An implementation of a pseudoperipheral node
 * finder", ACM TOMS 5), the separator is numbered last and both halves are dissected in turn. The level
 * chosen is the smallest one near the middle, trimmed to the vertices that actually touch the far side.
 * For 2D meshes this gives O(n log n) fill and O(n^1.5) factor work (George 1973). Deterministic.
 */
export function nestedDissectionOrdering(a: SparseSymmetricMatrix): Int32Array {
  const n = a.n;
  const { colPtr, rowIdx } = a;
  // `order` is rearranged in place: every segment [lo, hi) is a subgraph whose final positions are
  // exactly lo..hi−1, so when no segment is left to split, `order` is the permutation.
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  const stamp = new Int32Array(n).fill(-1);
  const level = new Int32Array(n);
  const queue = new Int32Array(n);
  const scratch = new Int32Array(n);
  const stackLo: number[] = [0];
  const stackHi: number[] = [n];
  let stampId = 0;

  // Breadth-first search from `root` over vertices stamped `id`; fills queue[0..count) and level[];
  // returns the number of vertices reached. Vertices reached get stamp id+1 so a second call can
  // tell them apart; callers restamp as needed.
  const bfs = (root: number, id: number, mark: number): number => {
    let head = 0;
    let tail = 0;
    queue[tail++] = root;
    stamp[root] = mark;
    level[root] = 0;
    while (head < tail) {
      const v = queue[head++];
      const lv = level[v] + 1;
      for (let p = colPtr[v]; p < colPtr[v + 1]; p++) {
        const w = rowIdx[p];
        if (stamp[w] === id) {
          stamp[w] = mark;
          level[w] = lv;
          queue[tail++] = w;
        }
      }
    }
    return tail;
  };

  // Minimum degree inside a small part (Tinney & Walker 1967; George & Liu 1989, "The evolution of the
  // minimum degree ordering algorithm", SIAM Review 31), on a dense copy of its graph: repeatedly take the
  // vertex with fewest neighbours — inside the part, plus its count of neighbours outside, which are all
  // numbered later — and join its remaining neighbours into a clique, as elimination does.
  const leafAdj = new Uint8Array(16 * LEAF_SIZE * LEAF_SIZE);
  const leafExt = new Int32Array(4 * LEAF_SIZE);
  const leafAlive = new Uint8Array(4 * LEAF_SIZE);
  const leafOut = new Int32Array(4 * LEAF_SIZE);
  const orderLeaf = (lo: number, hi: number): void => {
    const s = hi - lo;
    const id = (stampId += 2);
    for (let q = lo; q < hi; q++) {
      stamp[order[q]] = id;
      level[order[q]] = q - lo;
    }
    leafAdj.fill(0, 0, s * s);
    for (let i = 0; i < s; i++) {
      const v = order[lo + i];
      let ext = 0;
      for (let p = colPtr[v]; p < colPtr[v + 1]; p++) {
        const w = rowIdx[p];
        if (w === v) continue;
        if (stamp[w] === id) leafAdj[i * s + level[w]] = 1;
        else ext++;
      }
      leafExt[i] = ext;
      leafAlive[i] = 1;
    }
    for (let step = 0; step < s; step++) {
      let pick = -1;
      let pickDeg = Infinity;
      for (let i = 0; i < s; i++) {
        if (!leafAlive[i]) continue;
        let d = leafExt[i];
        for (let j = 0; j < s; j++) if (leafAlive[j] && leafAdj[i * s + j]) d++;
        if (d < pickDeg) {
          pickDeg = d;
          pick = i;
        }
      }
      leafAlive[pick] = 0;
      leafOut[step] = order[lo + pick];
      for (let i = 0; i < s; i++) {
        if (!leafAlive[i] || !leafAdj[pick * s + i]) continue;
        leafExt[i] = Math.max(leafExt[i], leafExt[pick]);
        for (let j = 0; j < s; j++) {
          if (j !== i && leafAlive[j] && leafAdj[pick * s + j]) leafAdj[i * s + j] = 1;
        }
      }
    }
    order.set(leafOut.subarray(0, s), lo);
  };

  while (stackLo.length > 0) {
    const lo = stackLo.pop() as number;
    const hi = stackHi.pop() as number;
    const size = hi - lo;
    if (size <= LEAF_SIZE) {
      orderLeaf(lo, hi);
      continue;
    }
    const id = (stampId += 2);
    for (let q = lo; q < hi; q++) stamp[order[q]] = id;

    // A disconnected segment is split into all its components in one pass (one at a time would cost
    // a search of the whole segment per component).
    const reached = bfs(order[lo], id, id + 1);
    if (reached < size) {
      let w = lo;
      scratch.set(queue.subarray(0, reached), w);
      stackLo.push(w);
      stackHi.push(w + reached);
      w += reached;
      for (let q = lo; q < hi; q++) {
        const v = order[q];
        if (stamp[v] !== id) continue;
        const got = bfs(v, id, id + 1);
        scratch.set(queue.subarray(0, got), w);
        stackLo.push(w);
        stackHi.push(w + got);
        w += got;
      }
      order.set(scratch.subarray(lo, hi), lo);
      continue;
    }

    // Pseudo-peripheral root: restart from a minimum-degree vertex of the last level while the
    // eccentricity grows (George & Liu 1979).
    let root = order[lo];
    let depth = level[queue[reached - 1]];
    for (let round = 0; round < 8; round++) {
      let best = -1;
      let bestDeg = Infinity;
      for (let q = reached - 1; q >= 0 && level[queue[q]] === depth; q--) {
        const v = queue[q];
        const dgr = colPtr[v + 1] - colPtr[v];
        if (dgr < bestDeg || (dgr === bestDeg && v < best)) {
          bestDeg = dgr;
          best = v;
        }
      }
      for (let q = lo; q < hi; q++) stamp[order[q]] = id;
      bfs(best, id, id + 1);
      const d = level[queue[reached - 1]];
      if (d <= depth) {
        for (let q = lo; q < hi; q++) stamp[order[q]] = id;
        bfs(root, id, id + 1);
        break;
      }
      root = best;
      depth = d;
    }
    if (depth < 2) {
      // Too dense to split by levels (every vertex within two steps of the root).
      if (size <= 4 * LEAF_SIZE) orderLeaf(lo, hi);
      continue;
    }

    // Level sizes, then the smallest level whose start lies in the middle 40 % of the vertices.
    const levelSize = new Int32Array(depth + 1);
    for (let q = 0; q < reached; q++) levelSize[level[queue[q]]]++;
    let cut = -1;
    let before = 0;
    let bestSize = Infinity;
    let bestOffCentre = Infinity;
    for (let l = 1; l < depth; l++) {
      before += levelSize[l - 1];
      const start = before / size;
      if (start > 0.7) break;
      const offCentre = Math.abs((before + levelSize[l] / 2) / size - 0.5);
      if (start >= 0.3 && (levelSize[l] < bestSize || (levelSize[l] === bestSize && offCentre < bestOffCentre))) {
        bestSize = levelSize[l];
        bestOffCentre = offCentre;
        cut = l;
      }
    }
    if (cut < 0) {
      // No level starts in the middle band (few, uneven levels): take the one holding the median vertex.
      cut = depth - 1;
      before = 0;
      for (let l = 1; l < depth; l++) {
        before += levelSize[l - 1];
        if (2 * (before + levelSize[l]) >= size) {
          cut = l;
          break;
        }
      }
    }
    // Partition: levels below `cut` | levels above | separator (cut-level vertices touching cut+1).
    let a0 = lo;
    let b0 = hi;
    for (let q = 0; q < reached; q++) {
      const v = queue[q];
      const lv = level[v];
      let isSep = false;
      if (lv === cut) {
        for (let p = colPtr[v]; p < colPtr[v + 1]; p++) {
          const w = rowIdx[p];
          if (stamp[w] === id + 1 && level[w] === cut + 1) {
            isSep = true;
            break;
          }
        }
      }
      if (isSep) scratch[--b0] = v;
      else if (lv <= cut) scratch[a0++] = v;
    }
    const sep = b0;
    let m0 = a0;
    for (let q = 0; q < reached; q++) {
      const v = queue[q];
      if (level[v] > cut) scratch[m0++] = v;
    }
    order.set(scratch.subarray(lo, hi), lo);
    stackLo.push(lo, a0);
    stackHi.push(a0, sep);
  }
  return order;
}
