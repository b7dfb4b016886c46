/**
 * Child process for bench/parse.bench.ts: parses one OBJ file with either our parser or three's OBJLoader and
 * prints one JSON line with the parse time and the process's peak resident memory, so each parser's peak is
 * measured alone. Usage: node --expose-gc --import tsx bench/parse-worker.ts ours|three <file.obj>
 */
import { readFileSync } from 'node:fs';
import { performance } from 'node:perf_hooks';
import { OBJLoader } from 'three/examples/jsm/loaders/OBJLoader.js';
import type { BufferGeometry, Mesh } from 'three';
import { parseObj } from '../geometry/io/parse-obj';

const [which, file] = process.argv.slice(2);
if ((which !== 'ours' && which !== 'three') || !file) {
  process.stderr.write('usage: parse-worker.ts ours|three <file.obj>\n');
  process.exit(2);
}
const gc = (globalThis as { gc?: () => void }).gc;
let triangles: number;
let ms: number;
let baseRss: number;
if (which === 'ours') {
  // A view on the file buffer, not a copy: both parsers start from one copy of the file in memory.
  const buffer = readFileSync(file);
  const bytes = new Uint8Array(buffer.buffer, buffer.byteOffset, buffer.byteLength);
  gc?.();
  baseRss = process.memoryUsage().rss;
  const t = performance.now();
  const model = parseObj(bytes);
  ms = performance.now() - t;
  triangles = model.mesh.triangles.length / 3;
} else {
  const text = readFileSync(file, 'utf8');
  gc?.();
  baseRss = process.memoryUsage().rss;
  const t = performance.now();
  const group = new OBJLoader().parse(text);
  ms = performance.now() - t;
  triangles = group.children.reduce((n, c) => n + ((c as Mesh).geometry as BufferGeometry).getAttribute('position').count / 3, 0);
}
// maxRSS is in kilobytes (Node docs, process.resourceUsage()).
const maxRssMb = process.resourceUsage().maxRSS / 1024;
process.stdout.write(JSON.stringify({ which, ms, triangles, maxRssMb, baseRssMb: baseRss / (1024 * 1024) }) + '\n');
