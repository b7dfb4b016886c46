/**
 * Fault test: a worker process is killed (SIGKILL, no chance to clean up) in the middle of a print-set job.
 * While the job is orphaned nothing half-made is served (the print set stays "running" with no files and its
 * downloads answer 409 NOT_READY); pg-boss's maintenance in a second worker expires the orphaned job
 * (JOB_EXPIRE_SECONDS, JOB_MAINTENANCE_SECONDS set short here), it is retried, finishes, and the files download
 * whole. The workers are real child processes running server/worker.ts. The test runs in a database of its
 * own (made next to the test database and dropped afterwards): its workers take every job type and shorten
 * the queue's expiry, which must not touch jobs that other test files queue at the same time.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type PgBoss from 'pg-boss';
import { Client } from 'pg';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, createPool } from '../../db/client';
import { runMigrations } from '../../db/migrate';
import { printSets } from '../../db/schema-core';
import { createApp } from '../../server/app';
import { parseEnv } from '../../server/env';
import { pgBossJobSender } from '../../server/jobs/job-sender';
import { startQueue, stopQueue } from '../../server/jobs/queue';
import { createLogger } from '../../server/logger';
import { sessionKey } from '../../server/auth/session';
import { PRINT_SET_JOB } from '../../server/print-sets/print-set-job';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { manyPieceDoc } from '../fixtures/pattern-docs/shape-docs';
import { insertBuild, makeShopFixture, TEST_DATABASE_URL, type ShopFixture, type TestContext } from './helpers';

/** Short enough to keep the test brief, long enough for the render to finish on a loaded 2-core machine. */
const EXPIRE_SECONDS = 12;

const dbName = `ss_faultw_${randomBytes(4).toString('hex')}_test`;
const DB_URL = TEST_DATABASE_URL.replace(/\/[^/]+$/, `/${dbName}`);
let ctx: TestContext;
let fx: ShopFixture;

/** Runs one statement on the cluster's maintenance database (CREATE/DROP DATABASE cannot run inside another). */
async function onCluster(sql: string): Promise<void> {
  const client = new Client({ connectionString: TEST_DATABASE_URL.replace(/\/[^/]+$/, '/postgres') });
  await client.connect();
  try {
    await client.query(sql);
  } finally {
    await client.end();
  }
}
let boss: PgBoss;
let filesDir: string;
const workers: ChildProcess[] = [];

/** Starts server/worker.ts as a child process and resolves once it logs "worker ready". */
function startWorker(): Promise<ChildProcess> {
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/worker.ts'], {
    env: {
      ...process.env,
      NODE_ENV: 'test',
      DATABASE_URL: DB_URL,
      FILES_DIR: filesDir,
      STORAGE: 'disk',
      LOG_LEVEL: 'info',
      JOB_EXPIRE_SECONDS: String(EXPIRE_SECONDS),
      JOB_MAINTENANCE_SECONDS: '1',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  workers.push(child);
  let output = '';
  return new Promise((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`worker did not get ready within 60 s; it said: ${output.slice(-2000)}`)), 60_000);
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      if (output.includes('worker ready')) {
        clearTimeout(timer);
        resolve(child);
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', onData);
    child.on('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`worker exited (${code}) before it was ready: ${output.slice(-2000)}`));
    });
  });
}

function killed(child: ChildProcess): Promise<void> {
  return new Promise((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    child.once('exit', () => resolve());
    child.kill('SIGKILL');
  });
}

beforeAll(async () => {
  filesDir = mkdtempSync(path.join(tmpdir(), 'sheetsmith-fault-worker-'));
  await onCluster(`CREATE DATABASE ${dbName}`);
  const pool = createPool(DB_URL, 5);
  await runMigrations(pool);
  const db = createDb(pool);
  boss = await startQueue(DB_URL, createLogger('silent', 'test'), { supervise: false, schedule: false });
  const secret = randomBytes(32).toString('base64url');
  const app = createApp({
    env: parseEnv({ NODE_ENV: 'test', DATABASE_URL: DB_URL, WEB_ROOT: '/nonexistent-web-root' }),
    pool,
    db,
    sessionSecret: secret,
    logger: createLogger('silent', 'test'),
    signUpLimit: null,
    payments: null,
    jobs: pgBossJobSender(boss),
    files: localDiskStore(filesDir),
  });
  ctx = { app, pool, db, secret, key: sessionKey(secret), close: () => pool.end() };
  fx = await makeShopFixture(ctx);
}, 120_000);

afterAll(async () => {
  for (const w of workers) {
    if (w.exitCode === null && w.signalCode === null) {
      w.kill('SIGTERM');
      await new Promise((r) => w.once('exit', r));
    }
  }
  await stopQueue(boss, 5_000).catch(() => undefined);
  await ctx?.close();
  await onCluster(`DROP DATABASE IF EXISTS ${dbName} WITH (FORCE)`);
});

describe('a worker killed during a job', () => {
  it('leaves nothing half-made to download, and the job is retried by another worker and finishes', async () => {
    const first = await startWorker();
    const buildId = await insertBuild(ctx.db, fx.shopId, 'Pauldron plates');
    const base = `/api/shops/${fx.shopId}/builds/${buildId}/print-sets`;
    const created = await request(ctx.app)
      .post(base)
      .set('Cookie', fx.people.editor.cookie)
      .send({ pattern: manyPieceDoc(24, 1, 4), formats: ['pdf', 'svg', 'dxf'] });
    expect(created.status).toBe(202);
    const id: string = created.body.printSet.id;

    // Kill the worker as soon as it has claimed the job.
    for (let i = 0; i < 1200; i++) {
      const [row] = await ctx.db.select({ status: printSets.status }).from(printSets).where(eq(printSets.id, id));
      if (row.status === 'running') break;
      expect(row.status, 'the job finished before the worker could be killed').toBe('queued');
      await new Promise((r) => setTimeout(r, 25));
    }
    await killed(first);

    const orphaned = await request(ctx.app).get(`${base}/${id}`).set('Cookie', fx.people.editor.cookie);
    expect(orphaned.body.printSet).toMatchObject({ status: 'running', files: [] });
    const early = await request(ctx.app).get(`${base}/${id}/files/print-set.pdf`).set('Cookie', fx.people.editor.cookie);
    expect(early.status).toBe(409);
    expect(early.body.error.code).toBe('NOT_READY');
    // Nothing complete sits in the store under the print set either (a killed write leaves only a temp file).
    const dir = path.join(filesDir, 'print-sets', id);
    const stored = (() => {
      try {
        return readdirSync(dir);
      } catch {
        return [];
      }
    })();
    expect(stored.filter((f) => !f.includes('.partial-'))).toEqual([]);

    await startWorker();
    let finished: { status: string; files: Array<{ name: string; sizeBytes: number }> } | null = null;
    for (let i = 0; i < 360 && !finished; i++) {
      const res = await request(ctx.app).get(`${base}/${id}`).set('Cookie', fx.people.editor.cookie);
      if (res.body.printSet.status === 'done' || res.body.printSet.status === 'failed') finished = res.body.printSet;
      else await new Promise((r) => setTimeout(r, 250));
    }
    expect(finished?.status).toBe('done');
    // The queue's own record: the second attempt is the one that completed.
    const job = await ctx.pool.query(`SELECT state::text AS state, retry_count FROM pgboss.job WHERE name = $1 AND data->>'printSetId' = $2`, [PRINT_SET_JOB, id]);
    expect(job.rows).toEqual([{ state: 'completed', retry_count: 1 }]);

    const pdf = await request(ctx.app)
      .get(`${base}/${id}/files/print-set.pdf`)
      .set('Cookie', fx.people.editor.cookie)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
    expect(pdf.status).toBe(200);
    const body = pdf.body as Buffer;
    const listed = finished!.files.find((f) => f.name === 'print-set.pdf');
    expect(body.length).toBe(listed?.sizeBytes);
    // ISO 32000-1 §7.5.2 and §7.5.5: a PDF starts with a %PDF- header and ends with %%EOF.
    expect(body.subarray(0, 5).toString('latin1')).toBe('%PDF-');
    expect(body.subarray(-8).toString('latin1')).toMatch(/%%EOF\s*$/);
  }, 150_000);
});
