/**
 * `npm run bench`: runs every bench/*.bench.ts one after another (each exports `run(): Promise<BenchRow[]>`),
 * prints one table and writes bench/results.json (committed: the last results, with the machine they came
 * from). `npm run bench -- <word>` runs only the bench files whose name contains <word> and leaves
 * results.json alone (it keeps one complete run). A benchmark that throws is reported as a failed row; the run
 * goes on with the next one.
 */
import { readdirSync, writeFileSync } from 'node:fs';
import { cpus, totalmem } from 'node:os';
import { dirname, join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { BenchRow } from './bench-row';


const here = dirname(fileURLToPath(import.meta.url));

function table(rows: BenchRow[]): string {
  const head = ['group', 'measure', 'value', 'target', 'met'];
  const body = rows.map((r) => [r.group, r.name, r.value, r.target, r.ok ? 'yes' : 'NO']);
  const widths = head.map((h, i) => Math.max(h.length, ...body.map((b) => b[i].length)));
  const line = (cells: string[]): string => cells.map((c, i) => c.padEnd(widths[i])).join(' | ');
  return [line(head), widths.map((w) => '-'.repeat(w)).join('-|-'), ...body.map(line)].join('\n');
}

async function main(): Promise<void> {
  const filter = process.argv[2];
  const files = readdirSync(here)
    .filter((f) => f.endsWith('.bench.ts') && (!filter || f.includes(filter)))
    .sort();
  const rows: BenchRow[] = [];
  const started = performance.now();
  for (const file of files) {
    const t0 = performance.now();
    process.stderr.write(`bench: ${file} …\n`);
    try {
      const mod = (await import(pathToFileURL(join(here, file)).href)) as { run?: () => Promise<BenchRow[]> };
      if (typeof mod.run !== 'function') throw new Error('it exports no run() function');
      rows.push(...(await mod.run()));
    } catch (e) {
      rows.push({ group: file, name: 'run', value: `failed: ${e instanceof Error ? e.message : String(e)}`, target: 'runs', ok: false });
    }
    process.stderr.write(`bench: ${file} took ${((performance.now() - t0) / 1000).toFixed(1)} s\n`);
  }
  process.stdout.write(table(rows) + '\n');
  const met = rows.filter((r) => r.ok).length;
  process.stdout.write(`${met} of ${rows.length} targets met in ${((performance.now() - started) / 1000).toFixed(0)} s\n`);
  if (filter) return;
  const machine = { cpus: cpus().length, cpu: cpus()[0]?.model ?? 'unknown', memoryGb: Math.round(totalmem() / 2 ** 30), node: process.version };
  writeFileSync(
    join(here, 'results.json'),
    JSON.stringify({ ranAt: new Date().toISOString(), machine, rows }, null, 2) + '\n',
  );
}

main().catch((e: unknown) => {
  process.stderr.write(`bench: ${e instanceof Error ? e.message : String(e)}\n`);
  process.exitCode = 1;
});
