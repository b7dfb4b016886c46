/**
 * Benchmark of the sparse solver and the flattener (issue 3, "Performance"): factor the cotangent
 * Laplacian of a 100k-vertex piece (a sphere cap, one vertex pinned, tiny regularisation), solve with it,
 * and flatten 25k-triangle pieces with LSCM + ARAP. Exported `run()` returns rows for bench/run.ts.
 */
import { performance } from 'node:perf_hooks';
import { arapFlatten } from '../geometry/flatten/arap';
import { cotanLaplacian } from '../geometry/flatten/cotan-laplacian';
import { cotanWeights } from '../geometry/flatten/cotan-weights';
import { ARAP_MS_PER_TRIANGLE_ROUND, flattenPiece } from '../geometry/flatten/flatten-piece';
import { lscm } from '../geometry/flatten/lscm';
import type { TriMesh } from '../geometry/mesh/tri-mesh';
import { sphereGore } from '../geometry/shapes';
import { choleskyFactor } from '../geometry/sparse/cholesky';
import { amdOrdering } from '../geometry/sparse/fill-ordering';
import { nestedDissectionOrdering } from '../geometry/sparse/nested-dissection';
import { multiply, principalSubmatrix } from '../geometry/sparse/sparse-symmetric-matrix';
import type { BenchRow } from './bench-row';


/** A k×k-cell grid of `cell` mm squares laid on a sphere of radius R (z = √(R² − x² − y²)), centred. */
function sphereCap(k: number, cell: number, radius: number): TriMesh {
  const positions = new Float64Array(3 * (k + 1) * (k + 1));
  const half = (k * cell) / 2;
  for (let i = 0; i <= k; i++) {
    for (let j = 0; j <= k; j++) {
      const x = j * cell - half;
      const y = i * cell - half;
      const o = 3 * (i * (k + 1) + j);
      positions[o] = x;
      positions[o + 1] = y;
      positions[o + 2] = Math.sqrt(radius * radius - x * x - y * y);
    }
  }
  const triangles = new Uint32Array(6 * k * k);
  let w = 0;
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      const a = i * (k + 1) + j;
      triangles.set([a, a + 1, a + k + 2, a, a + k + 2, a + k + 1], w);
      w += 6;
    }
  }
  return { positions, triangles };
}

const ms = (t: number): string => `${t.toFixed(0)} ms`;

/**
 * Runs f `times` times; returns the last value, the best wall-clock time and the best CPU time of this
 * process. The team shares two cores, so wall time also counts waiting for a core; the CPU time is the
 * work this code did and is what the targets are judged on (both are printed).
 */
function best<T>(times: number, f: () => T): { value: T; ms: number; cpuMs: number } {
  let bestMs = Infinity;
  let bestCpu = Infinity;
  let value: T | undefined;
  for (let r = 0; r < times; r++) {
    const c0 = process.cpuUsage();
    const t0 = performance.now();
    value = f();
    bestMs = Math.min(bestMs, performance.now() - t0);
    const c = process.cpuUsage(c0);
    bestCpu = Math.min(bestCpu, (c.user + c.system) / 1000);
  }
  return { value: value as T, ms: bestMs, cpuMs: bestCpu };
}

const both = (r: { ms: number; cpuMs: number }): string => `${ms(r.cpuMs)} cpu (${ms(r.ms)} wall)`;

export async function run(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const group = 'sparse + flatten';

  // Warm the JIT on a small case so the timings below are of compiled code.
  flattenPiece(sphereGore(100, 8, 40, 8));

  // 1. 100k-vertex cotangent Laplacian, vertex 0 pinned, regularisation 1e-10 × mean diagonal.
  const cap = sphereCap(316, 1, 400);
  const nv = cap.positions.length / 3;
  const lap = cotanLaplacian(cap.triangles, cotanWeights(cap.positions, cap.triangles), nv);
  const keep = new Int32Array(nv);
  for (let v = 0; v < nv; v++) keep[v] = v - 1;
  const pinned = principalSubmatrix(lap, keep, nv - 1);
  let trace = 0;
  for (let j = 0; j < pinned.n; j++) {
    for (let p = pinned.colPtr[j]; p < pinned.colPtr[j + 1]; p++) if (pinned.rowIdx[p] === j) trace += pinned.values[p];
  }
  const eps = (1e-10 * trace) / pinned.n;
  for (let j = 0; j < pinned.n; j++) {
    for (let p = pinned.colPtr[j]; p < pinned.colPtr[j + 1]; p++) if (pinned.rowIdx[p] === j) pinned.values[p] += eps;
  }
  const order = best(2, () => amdOrdering(pinned));
  const numeric = best(2, () => choleskyFactor(pinned, order.value));
  const factorTotal = { ms: order.ms + numeric.ms, cpuMs: order.cpuMs + numeric.cpuMs };
  rows.push({
    group,
    name: `factor ${nv.toLocaleString('en')}-vertex cap Laplacian (ordering ${both(order)} + LDLᵀ ${both(numeric)}), nnz(L) ${numeric.value.nnzL.toLocaleString('en')}`,
    value: both(factorTotal),
    target: '≤ 1500 ms',
    ok: factorTotal.cpuMs <= 1500,
  });
  const ndOrder = best(1, () => nestedDissectionOrdering(pinned));
  const ndFactor = best(1, () => choleskyFactor(pinned, ndOrder.value));
  rows.push({
    group,
    name: `same with the nested-dissection ordering instead (ordering ${both(ndOrder)} + LDLᵀ ${both(ndFactor)}), nnz(L) ${ndFactor.value.nnzL.toLocaleString('en')}`,
    value: both({ ms: ndOrder.ms + ndFactor.ms, cpuMs: ndOrder.cpuMs + ndFactor.cpuMs }),
    target: 'comparison only',
    ok: true,
  });
  const b = new Float64Array(pinned.n).map((_, i) => Math.sin(i * 0.01));
  const x = new Float64Array(pinned.n);
  const solve = best(5, () => numeric.value.solve(b, x));
  const r = multiply(pinned, x);
  let res = 0;
  let bn = 0;
  for (let i = 0; i < pinned.n; i++) {
    res += (r[i] - b[i]) ** 2;
    bn += b[i] ** 2;
  }
  rows.push({
    group,
    name: `one solve with that factor (relative residual ${Math.sqrt(res / bn).toExponential(1)})`,
    value: both(solve),
    target: '≤ 60 ms',
    ok: solve.cpuMs <= 60,
  });

  // 2. LSCM + ARAP on 25k-triangle pieces: a 1/8 sphere gore and a sphere cap.
  const pieces: [string, TriMesh][] = [
    ['1/8 sphere gore', sphereGore(100, 8, 400, 32)],
    ['sphere cap', sphereCap(112, 1.5, 150)],
  ];
  for (const [label, piece] of pieces) {
    const nf = piece.triangles.length / 3;
    const start = best(2, () => lscm(piece.positions, piece.triangles));
    const flat = best(2, () => flattenPiece(piece));
    rows.push({
      group,
      name: `flattenPiece ${label}, ${nf.toLocaleString('en')} triangles (LSCM alone ${both(start)}; max ${flat.value.stretch.maxPct.toFixed(2)} %, rms ${flat.value.stretch.rmsPct.toFixed(2)} %, ${flat.value.flipped} flipped)`,
      value: both(flat),
      target: '≤ 500 ms (8 such pieces inside the 5 s end-to-end budget)',
      ok: flat.cpuMs <= 500 && flat.value.flipped === 0,
    });
  }

  // 3. Cost of one ARAP round, the constant behind flattenPiece's maxMillis.
  const [, gore] = pieces[0];
  const nf = gore.triangles.length / 3;
  const uv0 = lscm(gore.positions, gore.triangles);
  const zero = best(2, () => arapFlatten(gore.positions, gore.triangles, uv0, { iterations: 0 }));
  const twenty = best(2, () => arapFlatten(gore.positions, gore.triangles, uv0, { iterations: 20, tolerance: 0 }));
  const perTriangleRound = (twenty.cpuMs - zero.cpuMs) / 20 / nf;
  rows.push({
    group,
    name: `ARAP round cost per triangle, cpu (flatten-piece uses ${ARAP_MS_PER_TRIANGLE_ROUND.toExponential(1)})`,
    value: `${perTriangleRound.toExponential(2)} ms`,
    target: `within 2× of ${ARAP_MS_PER_TRIANGLE_ROUND.toExponential(1)} ms`,
    ok: perTriangleRound <= 2 * ARAP_MS_PER_TRIANGLE_ROUND && perTriangleRound >= ARAP_MS_PER_TRIANGLE_ROUND / 2,
  });
  return rows;
}

// Run directly: node --import tsx bench/sparse.bench.ts
if (import.meta.url === `file://${process.argv[1]}`) {
  void run().then((rows) => {
    for (const row of rows) console.log(`${row.ok ? 'ok  ' : 'SLOW'} ${row.value.padStart(26)}  ${row.target.padEnd(24)} ${row.name}`);
  });
}
