/**
 * Fault test: PostgreSQL stops while the API is serving. Runs on a throwaway cluster of its own (initdb into a
 * temporary directory on a free port through scripts/postgres.sh), never the shared one. While the database is
 * down every answer is a clean 503 with code DATABASE_UNAVAILABLE (no 500, no hang, no crash); once it is back
 * the same app answers normally again without a restart.
 */
import { execFile } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { promisify } from 'node:util';
import type { Express } from 'express';
import type { Pool } from 'pg';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, createPool } from '../../db/client';
import { runMigrations } from '../../db/migrate';
import { users } from '../../db/schema-core';
import { createApp } from '../../server/app';
import { hashPassword } from '../../server/auth/passwords';
import { sessionCookieValue } from './faults-session';
import { parseEnv } from '../../server/env';
import { createLogger } from '../../server/logger';

const run = promisify(execFile);
const dataDir = `/var/tmp/sheetsmith-ops-fault-${randomBytes(4).toString('hex')}`;
let port = 0;
let pool: Pool;
let app: Express;
let cookie: string;

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.listen(0, '127.0.0.1', () => {
      const { port: p } = server.address() as { port: number };
      server.close(() => resolve(p));
    });
    server.on('error', reject);
  });
}

const clusterEnv = () => ({ ...process.env, SHEETSMITH_PGDATA: dataDir, SHEETSMITH_PGPORT: String(port) });

/** Starts (or restarts) the throwaway cluster and makes sure database `ss_fault_test` exists. */
async function startCluster(): Promise<void> {
  // fds 8 and 9 are closed first: npm test holds its run lock on fd 8, and a postmaster that inherited it would
  // keep the lock after this test (see scripts/test.sh).
  await run('bash', ['-c', 'exec 8>&- 9>&-; exec bash scripts/postgres.sh ss_fault_test'], { env: clusterEnv(), timeout: 90_000 });
}

/** Stops the throwaway cluster the way a crash would (immediate mode: no clean shutdown of sessions). */
async function stopCluster(): Promise<void> {
  const bin = (await run('bash', ['-c', 'ls -d /usr/lib/postgresql/*/bin | sort -V | tail -n 1'])).stdout.trim();
  const asOwner = process.getuid?.() === 0 ? ['runuser', '-u', 'postgres', '--'] : [];
  const cmd = [...asOwner, `${bin}/pg_ctl`, '-D', dataDir, '-m', 'immediate', '-w', 'stop'];
  await run(cmd[0], cmd.slice(1), { timeout: 60_000 });
}

beforeAll(async () => {
  port = await freePort();
  await startCluster();
  const url = `postgres://postgres@127.0.0.1:${port}/ss_fault_test`;
  pool = createPool(url, 4);
  // As in server/index.ts: a dropped idle connection is reported, not fatal.
  pool.on('error', () => undefined);
  await runMigrations(pool);
  const db = createDb(pool);
  const secret = randomBytes(32).toString('base64url');
  app = createApp({ env: parseEnv({ NODE_ENV: 'test', DATABASE_URL: url, WEB_ROOT: '/nonexistent-web-root' }), pool, db, sessionSecret: secret, logger: createLogger('silent', 'test'), signUpLimit: null, payments: null });
  const [person] = await db.insert(users).values({ email: 'fault@test.example.com', name: 'Fault test', passwordHash: await hashPassword('fault-test-pass-1') }).returning({ id: users.id });
  cookie = await sessionCookieValue(secret, person.id);
}, 120_000);

afterAll(async () => {
  await pool?.end().catch(() => undefined);
  await stopCluster().catch(() => undefined);
  rmSync(dataDir, { recursive: true, force: true });
  rmSync(`${dataDir}.initdb.log`, { force: true });
});

describe('PostgreSQL stops during requests', () => {
  it('answers 200 or a clean 503 DATABASE_UNAVAILABLE while it goes down, 503 while it is down, and recovers when it returns', async () => {
    expect((await request(app).get('/api/me').set('Cookie', cookie)).status).toBe(200);

    // Requests in flight while the server is killed: each ends, as a success or as the one 503 shape.
    const inFlight = Array.from({ length: 20 }, (_, i) =>
      new Promise((r) => setTimeout(r, i * 15)).then(() => request(app).get('/api/me').set('Cookie', cookie).timeout(15_000)),
    );
    await stopCluster();
    for (const res of await Promise.all(inFlight)) {
      expect([200, 503], JSON.stringify(res.body)).toContain(res.status);
      if (res.status === 503) expect(res.body.error.code).toBe('DATABASE_UNAVAILABLE');
    }

    const down = await request(app).get('/api/me').set('Cookie', cookie).timeout(15_000);
    expect(down.status).toBe(503);
    expect(down.body).toEqual({ error: { code: 'DATABASE_UNAVAILABLE', message: 'The database cannot be reached right now; try again in a moment' } });
    expect(down.headers['retry-after']).toBe('5');
    const health = await request(app).get('/api/health').timeout(15_000);
    expect(health.status).toBe(503);
    expect(health.body).toEqual({ status: 'degraded', db: 'down' });
    // A write fails the same way, not as a 500.
    const write = await request(app).post('/api/shops').set('Cookie', cookie).send({ name: 'Offline shop' }).timeout(15_000);
    expect(write.status).toBe(503);

    await startCluster();
    let back = 0;
    for (let i = 0; i < 40 && back !== 200; i++) {
      back = (await request(app).get('/api/me').set('Cookie', cookie)).status;
      if (back !== 200) await new Promise((r) => setTimeout(r, 250));
    }
    expect(back).toBe(200);
    expect((await request(app).get('/api/health')).body).toEqual({ status: 'ok', db: 'up' });
    expect((await request(app).post('/api/shops').set('Cookie', cookie).send({ name: 'Back online' })).status).toBe(201);
  }, 120_000);
});
