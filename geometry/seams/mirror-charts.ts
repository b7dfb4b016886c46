/**
 * Mirror-symmetric sculpts: which faces form one half, which face of that half each other face mirrors onto,
 * and tidying the charts mirrored onto the other half so each is one connected piece.
 */
import type { SymmetryPlane } from './mirror-seams';
import type { FaceGraph } from './chart-face-graph';

/**
 * The half of a mirror-symmetric mesh on the positive side of `plane` (by face centroid) and, for each face of
 * the other half, the face of the first half it mirrors onto (nearest mirrored centroid, through a uniform grid).
 * Null unless the pairing is one to one — that is, unless the triangulation itself is mirror-symmetric with a
 * loop of edges in the plane, as a sculpt modelled with a mirror is; otherwise the mirrored pieces' edges would
 * zigzag differently from the originals, and the caller cuts the whole model instead.
 * `inHalf[f]` is 1 for faces of the kept half; `image[f]` is the kept face a face of the other half mirrors
 * onto (−1 on the kept half).
 */
export function mirrorFaces(g: FaceGraph, plane: SymmetryPlane): { inHalf: Uint8Array; image: Int32Array } | null {
  const F = g.faceCount;
  const [nx, ny, nz] = plane.normal;
  const c = g.centroids;
  const side = (f: number): number => c[3 * f] * nx + c[3 * f + 1] * ny + c[3 * f + 2] * nz - plane.offset;
  const inHalf = new Uint8Array(F);
  let meanEdge = 0;
  for (let f = 0; f < F; f++) {
    if (side(f) >= 0) inHalf[f] = 1;
    meanEdge += g.edgeLengths[3 * f] + g.edgeLengths[3 * f + 1] + g.edgeLengths[3 * f + 2];
  }
  meanEdge /= 3 * F;
  const cell = meanEdge > 0 ? meanEdge : 1;
  const key = (x: number, y: number, z: number): string => `${Math.floor(x / cell)},${Math.floor(y / cell)},${Math.floor(z / cell)}`;
  const grid = new Map<string, number[]>();
  for (let f = 0; f < F; f++) {
    if (!inHalf[f]) continue;
    const k = key(c[3 * f], c[3 * f + 1], c[3 * f + 2]);
    const list = grid.get(k);
    if (list) list.push(f);
    else grid.set(k, [f]);
  }
  const image = new Int32Array(F).fill(-1);
  const used = new Uint8Array(F);
  const limit = meanEdge / 2;
  for (let f = 0; f < F; f++) {
    if (inHalf[f]) continue;
    const d = 2 * side(f);
    const x = c[3 * f] - d * nx, y = c[3 * f + 1] - d * ny, z = c[3 * f + 2] - d * nz;
    let best = -1;
    let bestDist = limit;
    const ix = Math.floor(x / cell), iy = Math.floor(y / cell), iz = Math.floor(z / cell);
    for (let a = -1; a <= 1; a++) {
      for (let b = -1; b <= 1; b++) {
        for (let e = -1; e <= 1; e++) {
          for (const h of grid.get(`${ix + a},${iy + b},${iz + e}`) ?? []) {
            const dist = Math.hypot(c[3 * h] - x, c[3 * h + 1] - y, c[3 * h + 2] - z);
            if (dist < bestDist) {
              bestDist = dist;
              best = h;
            }
          }
        }
      }
    }
    if (best < 0 || used[best]) return null;
    used[best] = 1;
    image[f] = best;
  }
  for (let f = 0; f < F; f++) if (inHalf[f] && !used[f]) return null;
  return { inHalf, image };
}

/**
 * Makes each chart label on the faces outside `fixed` one connected region: every smaller fragment of a label
 * takes the label most common among its faces' neighbours outside the fragment. Repeats until nothing changes
 * (at most a few rounds; each round only merges fragments into neighbours). `chartOf` (one chart index per
 * face) is changed in place; faces with `fixed[f]` set keep their chart and are not looked at.
 */
export function defragment(g: FaceGraph, chartOf: Int32Array, fixed: Uint8Array): void {
  const F = g.faceCount;
  for (let round = 0; round < 8; round++) {
    const comp = new Int32Array(F).fill(-1);
    const sizes: number[] = [];
    const labelOfComp: number[] = [];
    for (let s = 0; s < F; s++) {
      if (fixed[s] || comp[s] >= 0) continue;
      const id = sizes.length;
      const stack = [s];
      comp[s] = id;
      let size = 0;
      while (stack.length > 0) {
        const f = stack.pop()!;
        size++;
        for (let k = 0; k < 3; k++) {
          const t = g.twin[3 * f + k];
          if (t < 0) continue;
          const n = (t / 3) | 0;
          if (!fixed[n] && comp[n] < 0 && chartOf[n] === chartOf[s]) {
            comp[n] = id;
            stack.push(n);
          }
        }
      }
      sizes.push(size);
      labelOfComp.push(chartOf[s]);
    }
    const largest = new Map<number, number>();
    sizes.forEach((size, id) => {
      const best = largest.get(labelOfComp[id]);
      if (best === undefined || size > sizes[best]) largest.set(labelOfComp[id], id);
    });
    let changed = false;
    const votes = new Map<number, Map<number, number>>();
    for (let f = 0; f < F; f++) {
      if (fixed[f] || largest.get(chartOf[f]) === comp[f]) continue;
      for (let k = 0; k < 3; k++) {
        const t = g.twin[3 * f + k];
        if (t < 0) continue;
        const n = (t / 3) | 0;
        if (fixed[n] || comp[n] === comp[f]) continue;
        const tally = votes.get(comp[f]) ?? new Map<number, number>();
        tally.set(chartOf[n], (tally.get(chartOf[n]) ?? 0) + 1);
        votes.set(comp[f], tally);
      }
    }
    const newLabel = new Map<number, number>();
    for (const [id, tally] of votes) {
      let best = -1;
      let bestCount = 0;
      for (const [label, count] of tally) if (count > bestCount || (count === bestCount && label < best)) [best, bestCount] = [label, count];
      if (best >= 0) newLabel.set(id, best);
    }
    for (let f = 0; f < F; f++) {
      const l = newLabel.get(comp[f]);
      if (!fixed[f] && l !== undefined && l !== chartOf[f]) {
        chartOf[f] = l;
        changed = true;
      }
    }
    if (!changed) return;
  }
}


/**
 * A border is flat when each of its edges departs from 180° by less than this, degrees: the same half degree
 * below which a joint is cut square (SQUARE_BEVEL_DEG in bevel/seam-bevel.ts, common practice).
 */
const FLAT_BORDER_DEG = 0.5;

/**
 * Joins a chart of the kept half with a chart of the other half where the symmetry plane runs across a flat
 * region between them (a box's side cut down its middle): a seam there buys no mirror pair a maker needs, only
 * one more joint. Two charts are joined when every edge they share is flat (FLAT_BORDER_DEG) and the union still
 * fits the budget by `stretchOf`; smaller unions are tried first and a chart joins at most once.
 *
 * @param g the face graph (its twins: creases already unpaired, so a crease is never a shared edge).
 * @param chartOf one chart index per face, changed in place (the joined chart takes the kept half's index).
 * @param inHalf 1 for faces of the kept half (mirrorFaces).
 * @param stretchOf stretch of a chart (global face ids), percent; Infinity when it cannot fit.
 * @param budget stretch budget, percent.
 * @returns the number of joins made.
 */
export function joinAcrossFlatPlane(
  g: FaceGraph,
  chartOf: Int32Array,
  inHalf: Uint8Array,
  stretchOf: (faces: Int32Array) => number,
  budget: number,
): number {
  const pairs = new Map<string, { a: number; b: number; flat: boolean }>();
  for (let h = 0; h < 3 * g.faceCount; h++) {
    const t = g.twin[h];
    if (t < 0) continue;
    const f = (h / 3) | 0;
    const n = (t / 3) | 0;
    if (!inHalf[f] || inHalf[n] || chartOf[f] === chartOf[n]) continue;
    const key = `${chartOf[f]}:${chartOf[n]}`;
    const pair = pairs.get(key) ?? { a: chartOf[f], b: chartOf[n], flat: true };
    if (Math.abs(g.dihedralDeg[h] - 180) >= FLAT_BORDER_DEG) pair.flat = false;
    pairs.set(key, pair);
  }
  const members = new Map<number, number[]>();
  for (let f = 0; f < g.faceCount; f++) {
    const list = members.get(chartOf[f]);
    if (list) list.push(f);
    else members.set(chartOf[f], [f]);
  }
  const size = (c: number): number => members.get(c)?.length ?? 0;
  const order = [...pairs.values()].filter((p) => p.flat).sort((x, y) => size(x.a) + size(x.b) - size(y.a) - size(y.b) || x.a - y.a || x.b - y.b);
  const joined = new Set<number>();
  let count = 0;
  for (const { a, b } of order) {
    if (joined.has(a) || joined.has(b)) continue;
    const union = Int32Array.from([...members.get(a)!, ...members.get(b)!]);
    if (!(stretchOf(union) <= budget)) continue;
    for (const f of members.get(b)!) chartOf[f] = a;
    joined.add(a);
    joined.add(b);
    count++;
  }
  return count;
}
