/**
 * End-to-end pattern pipeline (issue 3, "Performance"): a 200k-triangle sphere cut into 8 gores by `l` seam
 * lines, as OBJ text → import → clean → seams → split → LSCM → ARAP → bevels → pattern.json text. Target ≤ 5 s.
 * The OBJ text is generated before the clock starts. The gores are doubly curved, so ARAP has real work to do;
 * the budget is set above their stretch so the timing is the pipeline itself, not dart searches.
 */
import { performance } from 'node:perf_hooks';
import { importModel } from '../geometry/io/import-model';
import { buildPattern } from '../geometry/pattern/build-pattern';
import { uvSphere } from '../geometry/shapes';
import type { BenchRow } from './bench-row';


const GORES = 8;

/** OBJ text of a uvSphere(R, segments, rings) with one `l` line per gore meridian, pole to pole. */
function goredSphereObj(radius: number, segments: number, rings: number): { text: string; triangles: number } {
  const mesh = uvSphere(radius, segments, rings);
  const parts: string[] = [];
  const p = mesh.positions;
  for (let i = 0; i < p.length; i += 3) parts.push(`v ${p[i].toFixed(5)} ${p[i + 1].toFixed(5)} ${p[i + 2].toFixed(5)}`);
  const t = mesh.triangles;
  for (let i = 0; i < t.length; i += 3) parts.push(`f ${t[i] + 1} ${t[i + 1] + 1} ${t[i + 2] + 1}`);
  const parallels = rings - 1;
  const north = parallels * segments + 1; // 1-based
  const south = north + 1;
  for (let g = 0; g < GORES; g++) {
    const s = (g * segments) / GORES;
    const line = [north];
    for (let k = 0; k < parallels; k++) line.push(k * segments + s + 1);
    line.push(south);
    parts.push(`l ${line.join(' ')}`);
  }
  return { text: parts.join('\n') + '\n', triangles: t.length / 3 };
}

export async function run(): Promise<BenchRow[]> {
  const { text, triangles } = goredSphereObj(120, 400, 251);
  const bytes = new TextEncoder().encode(text);
  const t0 = performance.now();
  const model = importModel(bytes, 'gored-sphere.obj');
  const t1 = performance.now();
  const doc = buildPattern(model, { stretchBudgetPct: 50 });
  const t2 = performance.now();
  const json = JSON.stringify(doc);
  const t3 = performance.now();
  const total = (t3 - t0) / 1000;
  const pieces = doc.pieces.reduce((n, p) => n + p.quantity, 0);
  const maxStretch = Math.max(...doc.pieces.map((p) => p.stretch.maxPct));
  return [
    {
      group: 'pipeline',
      name: `${(triangles / 1000).toFixed(0)}k triangles, ${pieces} pieces, end to end`,
      value: `${total.toFixed(2)} s (import ${((t1 - t0) / 1000).toFixed(2)}, build ${((t2 - t1) / 1000).toFixed(2)}, JSON ${((t3 - t2) / 1000).toFixed(2)})`,
      target: '≤ 5 s',
      ok: total <= 5 && pieces === GORES,
    },
    {
      group: 'pipeline',
      name: 'gore max stretch / pattern.json size',
      value: `${maxStretch.toFixed(2)} % / ${(json.length / 1024).toFixed(0)} KB`,
      target: 'report',
      ok: Number.isFinite(maxStretch),
    },
  ];
}
