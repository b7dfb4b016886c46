/**
 * Benchmark of model import (issue 3, "Performance"): a generated 1M-triangle OBJ (~40 MB) parsed by our
 * typed-array parser and by three's OBJLoader (the reference library), each in its own child process
 * (bench/parse-worker.ts) so that time and peak memory (max RSS) are measured alone. Targets: ≥ 8× faster
 * and under ¼ of OBJLoader's peak memory. Also times cleanMesh on the parsed model. Exported `run()` returns
 * rows for bench/run.ts.
 */
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath } from 'node:url';
import { parseObj } from '../geometry/io/parse-obj';
import { cleanMesh } from '../geometry/mesh/clean-mesh';
import type { BenchRow } from './bench-row';


interface WorkerResult {
  which: string;
  ms: number;
  triangles: number;
  maxRssMb: number;
  baseRssMb: number;
}

/** A wavy n×n-cell height field as OBJ text: (n+1)² vertices with 6 decimals, 2n² triangles. */
export function wavyGridObj(n: number): string {
  const parts: string[] = ['# generated wavy grid for the Sheetsmith parse benchmark\n'];
  for (let i = 0; i <= n; i++) {
    for (let j = 0; j <= n; j++) {
      const z = 5 * Math.sin(i * 0.05) * Math.cos(j * 0.07);
      parts.push(`v ${(i * 0.5).toFixed(6)} ${(j * 0.5).toFixed(6)} ${z.toFixed(6)}\n`);
    }
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const a = i * (n + 1) + j + 1;
      parts.push(`f ${a} ${a + 1} ${a + n + 2}\nf ${a} ${a + n + 2} ${a + n + 1}\n`);
    }
  }
  return parts.join('');
}

function runWorker(which: 'ours' | 'three', file: string): WorkerResult {
  const worker = join(dirname(fileURLToPath(import.meta.url)), 'parse-worker.ts');
  const r = spawnSync(process.execPath, ['--expose-gc', '--no-deprecation', '--import', 'tsx', worker, which, file], {
    encoding: 'utf8',
    maxBuffer: 1 << 20,
  });
  if (r.status !== 0) throw new Error(`parse worker (${which}) failed: ${r.stderr.trim().split('\n').pop()}`);
  return JSON.parse(r.stdout.trim().split('\n').pop()!) as WorkerResult;
}

/** Runs the parse benchmark and returns its table rows. */
export async function run(): Promise<BenchRow[]> {
  const dir = mkdtempSync(join(tmpdir(), 'sheetsmith-parse-'));
  const file = join(dir, 'wavy-1m.obj');
  try {
    const text = wavyGridObj(708);
    writeFileSync(file, text);
    const sizeMb = Buffer.byteLength(text) / 1e6;
    const ours = runWorker('ours', file);
    const three = runWorker('three', file);
    const speedup = three.ms / ours.ms;
    const memRatio = ours.maxRssMb / three.maxRssMb;
    const bytes = new TextEncoder().encode(text);
    const model = parseObj(bytes);
    const t = performance.now();
    const { report } = cleanMesh(model);
    const cleanMs = performance.now() - t;
    const g = 'parse 1M-triangle OBJ';
    return [
      { group: g, name: 'file', value: `${sizeMb.toFixed(1)} MB, ${ours.triangles} triangles`, target: '~40 MB, 1M', ok: ours.triangles === three.triangles && ours.triangles >= 1_000_000 },
      { group: g, name: 'ours: parse time', value: `${(ours.ms / 1000).toFixed(2)} s`, target: '≈ 0.3 s', ok: true },
      { group: g, name: 'OBJLoader: parse time', value: `${(three.ms / 1000).toFixed(2)} s`, target: 'reference', ok: true },
      { group: g, name: 'speed-up vs OBJLoader', value: `${speedup.toFixed(1)}×`, target: '≥ 8×', ok: speedup >= 8 },
      { group: g, name: 'ours: peak RSS', value: `${ours.maxRssMb.toFixed(0)} MB`, target: 'reference', ok: true },
      { group: g, name: 'OBJLoader: peak RSS', value: `${three.maxRssMb.toFixed(0)} MB`, target: 'reference', ok: true },
      { group: g, name: 'peak memory ratio', value: `${(memRatio * 100).toFixed(0)} %`, target: '< 25 %', ok: memRatio < 0.25 },
      { group: g, name: 'clean (weld, orient, manifold)', value: `${(cleanMs / 1000).toFixed(2)} s, ${report.verticesOut} vertices`, target: 'reference', ok: report.facesOut === ours.triangles },
    ];
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
