/**
 * Load bench (issue 6, `npm run bench:load`): the public pack catalogue `GET /api/packs` and a pack file
 * download `GET /api/downloads/:token/files/:name`, each at 200 requests per second for 20 s on loopback
 * with autocannon, bounded in count (rate × duration) and time. The target is zero errors and zero non-2xx
 * answers; p50/p99 latencies go to bench/results-load.json.
 *
 * It runs the real app in this process on a random loopback port against its own database
 * (BENCH_DATABASE_URL, default postgres://postgres@127.0.0.1:54329/sheetsmith_bench, created when missing, on
 * the cluster scripts/postgres.sh starts) and a temporary local-disk file store, and seeds 30 published packs
 * and one paid order whose download link allows more uses than the bench makes (a bench-only setting; real
 * links allow DOWNLOAD_LINK_MAX_USES).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { cpus, loadavg, tmpdir } from 'node:os';
import path from 'node:path';
import autocannon from 'autocannon';
import { Client } from 'pg';
import { createDb, createPool } from '../db/client';
import { runMigrations } from '../db/migrate';
import { builds, printSets, shops } from '../db/schema-core';
import { downloadLinks, orders, packs } from '../db/schema-packs';
import { createApp } from '../server/app';
import { newDownloadToken } from '../server/downloads/download-token';
import { parseEnv } from '../server/env';
import { createLogger } from '../server/logger';
import { printSetFileKey } from '../server/print-sets/print-set-files';
import { renderPrintSet } from '../server/print-sets/render-print-set';
import { localDiskStore } from '../server/storage/local-disk-store';
import { manyPieceDoc } from '../tests/fixtures/pattern-docs/shape-docs';

const RATE = Number(process.env.BENCH_RATE ?? 200);
const DURATION_S = Number(process.env.BENCH_DURATION_S ?? 20);
const DATABASE_URL = process.env.BENCH_DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/sheetsmith_bench';

/** Creates the bench database when it does not exist (its name must end in _bench, so no real data is touched). */
async function ensureDatabase(url: string): Promise<void> {
  const name = new URL(url).pathname.slice(1);
  if (!/^[a-z_][a-z0-9_]*_bench$/.test(name)) throw new Error(`BENCH_DATABASE_URL must name a database ending in _bench, got "${name}"`);
  const admin = new Client({ connectionString: url.replace(/\/[^/]*$/, '/postgres') });
  await admin.connect();
  try {
    const found = await admin.query('SELECT 1 FROM pg_database WHERE datname = $1', [name]);
    if (found.rowCount === 0) await admin.query(`CREATE DATABASE ${name}`);
  } finally {
    await admin.end();
  }
}

interface TargetResult {
  name: string;
  path: string;
  ratePerS: number;
  durationS: number;
  requests: number;
  errors: number;
  timeouts: number;
  non2xx: number;
  p50Ms: number;
  p99Ms: number;
  meanMs: number;
  maxMs: number;
  ok: boolean;
}

async function hit(baseUrl: string, name: string, urlPath: string): Promise<TargetResult> {
  const result = await autocannon({
    url: `${baseUrl}${urlPath}`,
    connections: 10,
    overallRate: RATE,
    duration: DURATION_S,
    amount: RATE * DURATION_S,
    timeout: 10,
  });
  const out = {
    name,
    path: urlPath.replace(/downloads\/[^/]+/, 'downloads/<token>'),
    ratePerS: RATE,
    durationS: DURATION_S,
    requests: result.requests.total,
    errors: result.errors,
    timeouts: result.timeouts,
    non2xx: result.non2xx,
    p50Ms: result.latency.p50,
    p99Ms: result.latency.p99,
    meanMs: Number(result.latency.average.toFixed(2)),
    maxMs: result.latency.max,
    ok: result.errors === 0 && result.timeouts === 0 && result.non2xx === 0 && result.requests.total > 0,
  };
  console.log(`${name}: ${out.requests} requests, ${out.errors} errors, ${out.non2xx} non-2xx, p50 ${out.p50Ms} ms, p99 ${out.p99Ms} ms`);
  return out;
}

async function main(): Promise<void> {
  await ensureDatabase(DATABASE_URL);
  const pool = createPool(DATABASE_URL, 10);
  await runMigrations(pool);
  const db = createDb(pool);
  const files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-load-')));

  const [shop] = await db.insert(shops).values({ name: 'Load bench shop' }).returning({ id: shops.id });
  const [build] = await db.insert(builds).values({ shopId: shop.id, name: 'Load bench helm' }).returning({ id: builds.id });
  const doc = manyPieceDoc(8, 1, 4);
  const rendered = await renderPrintSet(doc, { formats: ['pdf'], page: 'a4', mode: 'tiled', name: 'Load bench helm' });
  const [printSet] = await db
    .insert(printSets)
    .values({
      shopId: shop.id,
      buildId: build.id,
      name: 'Load bench helm',
      status: 'done',
      formats: ['pdf'],
      page: 'a4',
      mode: 'tiled',
      pieceCount: doc.pieces.length,
      pattern: doc,
      files: rendered.map((f) => ({ name: f.name, sizeBytes: f.bytes.byteLength, contentType: f.contentType })),
    })
    .returning({ id: printSets.id });
  for (const f of rendered) await files.put(printSetFileKey(printSet.id, f.name), f.bytes);
  const stamp = Date.now().toString(36);
  const packRows = await db
    .insert(packs)
    .values(
      Array.from({ length: 30 }, (_, i) => ({
        shopId: shop.id,
        printSetId: printSet.id,
        slug: `load-bench-${stamp}-${i}`,
        title: `Load bench pack ${i}`,
        description: 'A pattern pack made by the load bench.',
        licence: 'Personal use',
        priceCents: i % 3 === 0 ? 0 : 900,
        status: 'published' as const,
        publishedAt: new Date(Date.now() - i * 60_000),
      })),
    )
    .returning({ id: packs.id });
  const [order] = await db
    .insert(orders)
    .values({ packId: packRows[0].id, email: 'load-bench@bench.example.com', amountCents: 0, currency: 'eur', status: 'paid', paidAt: new Date() })
    .returning({ id: orders.id });
  const { token, hash } = newDownloadToken();
  await db.insert(downloadLinks).values({ orderId: order.id, tokenHash: hash, expiresAt: new Date(Date.now() + 86_400_000), maxUses: RATE * DURATION_S * 2 });

  const app = createApp({
    env: parseEnv({
      NODE_ENV: 'production',
      SESSION_SECRET: 'load-bench-session-secret-0123456789abcdef',
      // Production refuses the local payment defaults; the bench never pays, so any non-default values do.
      PAY_API_KEY: 'load-bench-pay-key',
      PAY_WEBHOOK_SECRET: 'load-bench-webhook-secret-0123',
      DATABASE_URL,
      WEB_ROOT: '/nonexistent-web-root',
      LOG_LEVEL: 'silent',
    }),
    pool,
    db,
    sessionSecret: 'load-bench-session-secret-0123456789abcdef',
    logger: createLogger('silent', 'bench'),
    files,
    payments: null,
  });
  const server = app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  const { port } = server.address() as { port: number };
  const baseUrl = `http://127.0.0.1:${port}`;
  const pdfName = rendered.find((f) => f.name.endsWith('.pdf'))!.name;

  const targets = [await hit(baseUrl, 'pack catalogue', '/api/packs'), await hit(baseUrl, 'pack file download', `/api/downloads/${token}/files/${pdfName}`)];
  server.close();
  await pool.end();

  const report = {
    date: new Date().toISOString(),
    machine: { cpus: cpus().length, loadAverage1m: Number(loadavg()[0].toFixed(2)), node: process.version },
    pdfBytes: rendered.find((f) => f.name === pdfName)!.bytes.byteLength,
    targets,
    ok: targets.every((t) => t.ok),
  };
  writeFileSync(path.join(__dirname, 'results-load.json'), `${JSON.stringify(report, null, 2)}\n`);
  console.log(report.ok ? 'load bench: zero errors on every target' : 'load bench: FAILED (errors or non-2xx answers, see bench/results-load.json)');
  process.exit(report.ok ? 0 : 1);
}

main().catch((err: unknown) => {
  console.error(`bench:load: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
