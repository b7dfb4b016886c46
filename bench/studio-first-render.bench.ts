/**
 * Benchmark of the studio in a browser (issue 5, "Performance"): the first frame drawn with a 200k-triangle sculpt
 * in headless Chromium (SwiftShader WebGL, flags of shared/STACK.md), measured as the time from navigation start to
 * the page's performance mark "studio-first-mesh-frame" (set by the 3D view on its first frame with the mesh);
 * and the web bundle: the size of the code every route loads (entry chunk) against the studio's own chunks,
 * with a check that three.js is not in the entry chunk. Writes bench/results-studio.json.
 *
 * Needs dist/ (npm run web:build) and DATABASE_URL (a migrated database; the bench signs up a fresh user, as the
 * browser test does). The sculpt is the engine's helmet shell at 440 × 220 segments (200,200 triangles; the
 * upload's default working resolution of 200,000 reduces it slightly). The server and worker it starts use the
 * default file store, since any worker on the same database may take the sculpt's processing job.
 */
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { cpus } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { BenchRow } from './bench-row';
import { appProcesses, freePort, launchBrowser } from '../tests/e2e/browser-harness';
import { createStudioFixture } from './studio-api';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..');
const jsDir = join(root, 'dist', '_expo', 'static', 'js', 'web');
/** Loads of the studio page measured; the median is reported. */
const LOADS = 3;

interface BundleFigures {
  entryBytes: number;
  studioChunkBytes: number;
  seamWorkerBytes: number;
  threeInEntry: boolean;
}

function bundleFigures(): BundleFigures | null {
  if (!existsSync(jsDir)) return null;
  const files = readdirSync(jsDir).filter((f) => f.endsWith('.js'));
  const size = (prefix: string) => files.filter((f) => f.startsWith(prefix)).reduce((s, f) => s + statSync(join(jsDir, f)).size, 0);
  const entry = files.filter((f) => f.startsWith('entry-'));
  // WebGLRenderer is three.js's renderer class; its name survives minification as a string in the bundle.
  const threeInEntry = entry.some((f) => readFileSync(join(jsDir, f), 'utf8').includes('WebGLRenderer'));
  return { entryBytes: size('entry-'), studioChunkBytes: size('studio-workspace-'), seamWorkerBytes: size('seam-worker-'), threeInEntry };
}

async function firstRender(databaseUrl: string): Promise<{ medianMs: number; allMs: number[]; triangles: number }> {
  const port = await freePort();
  const env = { ...process.env, PORT: String(port), WEB_ROOT: 'dist', STORAGE: 'disk', SIGNUP_RATE_LIMIT: '1000', DATABASE_URL: databaseUrl, LOG_LEVEL: 'warn' };
  const app = appProcesses();
  app.start('server', 'server/index.ts', env);
  app.start('worker', 'server/worker.ts', env);
  const browser = await launchBrowser();
  try {
    const base = `http://127.0.0.1:${port}`;
    await app.waitForHealth(`${base}/api/health`, 60_000);
    const f = await createStudioFixture(base, { segments: 440, rings: 220, brimRings: 8 }, 300_000);
    const times: number[] = [];
    for (let i = 0; i < LOADS; i++) {
      const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
      const name = f.cookie.slice(0, f.cookie.indexOf('='));
      await context.addCookies([{ name, value: f.cookie.slice(name.length + 1).split(';')[0], url: base }]);
      const page = await context.newPage();
      await page.goto(`${base}/builds/${f.buildId}/studio?shop=${f.shopId}`);
      await page.waitForFunction(() => performance.getEntriesByName('studio-first-mesh-frame').length > 0, null, { timeout: 120_000 });
      times.push(await page.evaluate(() => performance.getEntriesByName('studio-first-mesh-frame')[0].startTime));
      await context.close();
    }
    const sorted = [...times].sort((a, b) => a - b);
    return { medianMs: sorted[Math.floor(sorted.length / 2)], allMs: times, triangles: f.triangles };
  } finally {
    await browser.close();
    await app.stop();
  }
}

const mb = (b: number) => `${(b / 1e6).toFixed(2)} MB`;

/** Runs the benchmark, writes bench/results-studio.json and returns its rows for bench/run.ts. */
export async function run(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const bundle = bundleFigures();
  if (!bundle) {
    rows.push({ group: 'studio', name: 'web bundle', value: 'no dist/ (run npm run web:build)', target: 'reported', ok: false });
  } else {
    rows.push(
      { group: 'studio', name: 'entry chunk (every route)', value: mb(bundle.entryBytes), target: 'reported', ok: true },
      { group: 'studio', name: 'studio 3D chunk (three, fiber, drei, bvh, seam engine)', value: mb(bundle.studioChunkBytes), target: 'reported', ok: true },
      { group: 'studio', name: 'seam worker chunk', value: mb(bundle.seamWorkerBytes), target: 'reported', ok: true },
      { group: 'studio', name: 'three.js kept out of the entry chunk', value: bundle.threeInEntry ? 'no' : 'yes', target: 'yes', ok: !bundle.threeInEntry },
    );
  }
  const databaseUrl = process.env.DATABASE_URL;
  let render: Awaited<ReturnType<typeof firstRender>> | null = null;
  if (!bundle || !databaseUrl) {
    rows.push({ group: 'studio', name: 'first render, 200k triangles', value: 'skipped: needs dist/ and DATABASE_URL', target: 'reported', ok: false });
  } else {
    render = await firstRender(databaseUrl);
    rows.push({
      group: 'studio',
      name: `first render in headless Chromium, ${render.triangles} triangles (median of ${LOADS})`,
      value: `${(render.medianMs / 1000).toFixed(2)} s (${render.allMs.map((t) => (t / 1000).toFixed(2)).join(', ')})`,
      target: 'reported',
      ok: true,
    });
  }
  writeFileSync(
    join(here, 'results-studio.json'),
    JSON.stringify(
      {
        ranAt: new Date().toISOString(),
        machine: { cpus: cpus().length, cpu: cpus()[0]?.model ?? 'unknown', node: process.version, webgl: 'SwiftShader (software)' },
        bundle,
        firstRender: render,
        rows,
      },
      null,
      2,
    ) + '\n',
  );
  return rows;
}
