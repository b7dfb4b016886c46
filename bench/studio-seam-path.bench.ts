/**
 * Benchmark of seam picking in the studio (issue 5, "Performance"): the seam path between two picked points on a
 * 500k-triangle sculpt, target ≤ 50 ms. The sculpt is the torus of geometry/shapes refined to 1000 × 250
 * segments (500,000 triangles, 250,000 vertices); 20 pairs of vertices drawn with a seeded generator, kept only
 * when they lie at least half the bounding-box diagonal apart (the slow case for a search). Reports the median
 * and the worst of the precomputed A* finder the studio's worker uses (seamPathFinder), the one-off set-up it
 * needs per mesh, and the plain Dijkstra seamPath on the same pairs for comparison. Both must give paths of the
 * same length (both are least-cost searches).
 */
import { performance } from 'node:perf_hooks';
import { buildTwins } from '../geometry/mesh/half-edges';
import { torus } from '../geometry/shapes/torus';
import { buildEdgeGraph } from '../geometry/seams/edge-graph';
import { seamPath } from '../geometry/seams/seam-path';
import { seamPathFinder } from '../geometry/seams/seam-path-fast';
import type { BenchRow } from './bench-row';

const TARGET_MS = 50;

function pathLength(P: Float64Array, path: Uint32Array): number {
  let s = 0;
  for (let i = 1; i < path.length; i++) {
    const a = 3 * path[i - 1];
    const b = 3 * path[i];
    s += Math.hypot(P[b] - P[a], P[b + 1] - P[a + 1], P[b + 2] - P[a + 2]);
  }
  return s;
}

const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)];

/** Runs the benchmark and returns its rows for bench/run.ts. */
export async function run(): Promise<BenchRow[]> {
  const mesh = torus(300, 100, 1000, 250);
  const P = mesh.positions;
  const V = P.length / 3;
  const F = mesh.triangles.length / 3;
  let seed = 20240611;
  const random = () => {
    seed = (Math.imul(seed, 1103515245) + 12345) >>> 0;
    return seed / 2 ** 32;
  };
  // Torus outer radius 400 mm, height 200 mm: bounding-box diagonal √(800² + 800² + 200²) ≈ 1149 mm.
  const minApart = 0.5 * Math.hypot(800, 800, 200);
  const pairs: [number, number][] = [];
  while (pairs.length < 20) {
    const a = Math.floor(random() * V);
    const b = Math.floor(random() * V);
    if (Math.hypot(P[3 * a] - P[3 * b], P[3 * a + 1] - P[3 * b + 1], P[3 * a + 2] - P[3 * b + 2]) >= minApart) pairs.push([a, b]);
  }
  const t0 = performance.now();
  const twin = buildTwins(mesh.triangles, V);
  const graph = buildEdgeGraph(mesh, twin);
  const find = seamPathFinder(mesh, twin, {}, graph);
  const setupMs = performance.now() - t0;
  const fast: number[] = [];
  const plain: number[] = [];
  let worstMismatch = 0;
  for (const [a, b] of pairs) {
    let t = performance.now();
    const p1 = find(a, b);
    fast.push(performance.now() - t);
    t = performance.now();
    const p2 = seamPath(mesh, twin, a, b, { graph });
    plain.push(performance.now() - t);
    if (!p1 || !p2) throw new Error(`no path between vertices ${a} and ${b} on a closed torus`);
    worstMismatch = Math.max(worstMismatch, Math.abs(pathLength(P, p1) - pathLength(P, p2)));
  }
  const fastMedian = median(fast);
  return [
    {
      group: 'studio',
      name: `seam path, ${F} triangles, median of 20 far pairs (A* finder)`,
      value: `${fastMedian.toFixed(1)} ms (worst ${Math.max(...fast).toFixed(1)} ms)`,
      target: `≤ ${TARGET_MS} ms`,
      ok: fastMedian <= TARGET_MS,
    },
    {
      group: 'studio',
      name: 'seam path finder set-up per mesh (twins, edge graph, scratch)',
      value: `${setupMs.toFixed(0)} ms`,
      target: 'reported',
      ok: true,
    },
    {
      group: 'studio',
      name: 'seam path, same pairs, plain Dijkstra seamPath',
      value: `${median(plain).toFixed(1)} ms median (worst ${Math.max(...plain).toFixed(1)} ms)`,
      target: 'reported',
      ok: true,
    },
    {
      group: 'studio',
      name: 'seam path length, A* vs Dijkstra, largest difference',
      value: `${worstMismatch.toExponential(2)} mm`,
      target: '≤ 1e-6 mm',
      ok: worstMismatch <= 1e-6,
    },
  ];
}
