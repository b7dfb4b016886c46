/**
 * Removing teeth and notches from the borders between charts. Charts grown over a triangle mesh follow its
 * zigzag: a face with two of its edges on the border with one neighbouring chart sticks out into that chart (a
 * tooth of its own chart, a notch of the other), and a row of them gives a saw-tooth outline that a maker can
 * neither cut cleanly nor glue. Handing such a face to the chart it sticks into replaces two border edges by one
 * (shorter by the triangle inequality) — the boundary-straightening step of D-Charts (Julius et al. 2005),
 * applied to single faces. Moves are checked in batches per pair of charts with the trial flattening and a
 * failing batch is halved until the moves that break the budget are isolated.
 */
import type { FaceGraph } from './chart-face-graph';

/** Rounds of tooth removal at most (a removed tooth can expose a new one behind it). */
const MAX_ROUNDS = 8;

/**
 * Moves every tooth face (two or three of its edges on the border with the same neighbouring chart) into that
 * chart, as long as both charts still fit the budget; repeats until no tooth can move.
 *
 * @param g the face graph (its `twin` is −1 on mesh boundaries and fixed crease borders, which never count as a
 *   chart border here); `chartOf` one chart index per face (−1 outside the search: never moved, never a target),
 *   changed in place.
 * @param stretches each chart's last measured stretch, percent (updated for the charts that change).
 * @param stretchOf trial stretch of a chart (global face ids), percent; Infinity when it cannot fit.
 * @param budget stretch budget, percent.
 * @returns the number of faces moved. Each moving face has at most one neighbour in its own chart and no two
 *   moving faces of a round touch, so the giving chart stays connected; the receiving chart gains faces that
 *   share edges with it. No chart is emptied.
 */
export function removeBorderTeeth(
  g: FaceGraph,
  chartOf: Int32Array,
  stretches: number[],
  stretchOf: (faces: Int32Array) => number,
  budget: number,
): number {
  const F = g.faceCount;
  const sizes = new Int32Array(stretches.length);
  for (let f = 0; f < F; f++) if (chartOf[f] >= 0) sizes[chartOf[f]]++;
  // A face that failed a check is not tried again until one of its charts changes.
  const failedAt = new Map<number, string>();
  const version = new Int32Array(stretches.length);
  let movedTotal = 0;
  for (let round = 0; round < MAX_ROUNDS; round++) {
    const batches = new Map<number, Array<{ face: number; to: number }>>();
    const taken = new Uint8Array(F);
    const planned = new Int32Array(stretches.length);
    for (let f = 0; f < F; f++) {
      const own = chartOf[f];
      if (own < 0 || taken[f]) continue;
      const to = toothTarget(g, chartOf, f);
      if (to < 0 || sizes[own] - planned[own] <= 1) continue;
      if (failedAt.get(f) === `${version[own]}:${version[to]}`) continue;
      let touches = false;
      for (let k = 0; k < 3; k++) {
        const t = g.twin[3 * f + k];
        if (t >= 0 && taken[(t / 3) | 0]) touches = true;
      }
      if (touches) continue;
      taken[f] = 1;
      planned[own]++;
      const key = Math.min(own, to) * stretches.length + Math.max(own, to);
      const batch = batches.get(key) ?? [];
      batch.push({ face: f, to });
      batches.set(key, batch);
    }
    if (batches.size === 0) break;
    let movedThisRound = 0;
    for (const batch of batches.values()) {
      movedThisRound += tryMoves(g, chartOf, sizes, stretches, stretchOf, budget, batch, {
        failed: ({ face, to }) => failedAt.set(face, `${version[chartOf[face]]}:${version[to]}`),
        changed: (c) => version[c]++,
      });
    }
    movedTotal += movedThisRound;
    if (movedThisRound === 0) break;
  }
  return movedTotal;
}

/** The chart that face f sticks into with two or three of its edges, or −1 when f is not a tooth. */
function toothTarget(g: FaceGraph, chartOf: Int32Array, f: number): number {
  const own = chartOf[f];
  const across = [-1, -1, -1];
  for (let k = 0; k < 3; k++) {
    const t = g.twin[3 * f + k];
    if (t >= 0) across[k] = chartOf[(t / 3) | 0];
  }
  for (let k = 0; k < 3; k++) {
    const c = across[k];
    if (c < 0 || c === own) continue;
    if (across[(k + 1) % 3] === c || across[(k + 2) % 3] === c) return c;
  }
  return -1;
}

/**
 * Applies a batch of moves between one pair of charts and keeps it when both charts fit; otherwise undoes it and
 * tries each half on its own. Returns the number of moves kept.
 */
function tryMoves(
  g: FaceGraph,
  chartOf: Int32Array,
  sizes: Int32Array,
  stretches: number[],
  stretchOf: (faces: Int32Array) => number,
  budget: number,
  moves: Array<{ face: number; to: number }>,
  notify: { failed: (move: { face: number; to: number }) => void; changed: (chart: number) => void },
): number {
  const from = moves.map(({ face }) => chartOf[face]);
  moves.forEach(({ face, to }, i) => {
    chartOf[face] = to;
    sizes[from[i]]--;
    sizes[to]++;
  });
  const touched = [...new Set([...moves.map((m) => m.to), ...from])];
  // Charts that gained faces are the likelier to fail, so they are flattened first.
  touched.sort((x, y) => Number(moves.some((m) => m.to === y)) - Number(moves.some((m) => m.to === x)));
  const measured: number[] = [];
  for (const c of touched) {
    const s = stretchOf(membersOf(g, chartOf, c));
    if (!(s <= budget)) break;
    measured.push(s);
  }
  if (measured.length === touched.length) {
    touched.forEach((c, i) => {
      stretches[c] = measured[i];
      notify.changed(c);
    });
    return moves.length;
  }
  moves.forEach(({ face, to }, i) => {
    chartOf[face] = from[i];
    sizes[from[i]]++;
    sizes[to]--;
  });
  if (moves.length === 1) {
    notify.failed(moves[0]);
    return 0;
  }
  const mid = moves.length >> 1;
  return (
    tryMoves(g, chartOf, sizes, stretches, stretchOf, budget, moves.slice(0, mid), notify) +
    tryMoves(g, chartOf, sizes, stretches, stretchOf, budget, moves.slice(mid), notify)
  );
}

/** The faces of chart c, in face order. */
function membersOf(g: FaceGraph, chartOf: Int32Array, c: number): Int32Array {
  const out: number[] = [];
  for (let f = 0; f < g.faceCount; f++) if (chartOf[f] === c) out.push(f);
  return Int32Array.from(out);
}
