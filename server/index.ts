/**
 * Starts the API server: parses the environment, applies pending migrations, listens, and shuts down cleanly
 * on SIGINT/SIGTERM (stops taking connections, finishes open requests, closes the database pool).
 */
import path from 'node:path';
import { createDb, createPool } from '../db/client';
import { runMigrations } from '../db/migrate';
import { createApp } from './app';
import { loadOrCreateSessionSecret } from './auth/session-secret';
import { parseEnv } from './env';
import { pgBossJobAdmin } from './jobs/job-admin';
import { pgBossJobSender } from './jobs/job-sender';
import { startQueue, stopQueue } from './jobs/queue';
import { createLogger } from './logger';
import { createFileStore } from './storage/create-file-store';

async function main(): Promise<void> {
  const env = parseEnv(process.env);
  const logger = createLogger(env.LOG_LEVEL, 'api');
  const pool = createPool(env.DATABASE_URL);
  // An idle connection dropped by a database restart is reported here; without a listener it would end the process.
  pool.on('error', (err) => logger.warn({ err: err.message }, 'idle database connection lost'));
  await runMigrations(pool);
  const sessionSecret = loadOrCreateSessionSecret(env.SESSION_SECRET, path.join(process.cwd(), '.data', 'session-secret'));
  // The API only sends jobs: no maintenance or cron here (server/worker.ts does those).
  const boss = await startQueue(env.DATABASE_URL, logger, { supervise: false, schedule: false });
  const app = createApp({ env, pool, db: createDb(pool), sessionSecret, logger, jobs: pgBossJobSender(boss), files: createFileStore(env), jobAdmin: pgBossJobAdmin(boss) });

  const server = app.listen(env.PORT, env.HOST, () => {
    logger.info({ url: `http://${env.HOST}:${env.PORT}` }, 'Sheetsmith API listening');
  });
  server.on('error', (err: NodeJS.ErrnoException) => {
    logger.fatal({ err }, err.code === 'EADDRINUSE' ? `port ${env.PORT} is already in use` : 'server failed');
    process.exit(1);
  });

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'stopping');
    const force = setTimeout(() => process.exit(1), 10_000);
    server.close(() => {
      stopQueue(boss, 5_000)
        .catch((err: unknown) => logger.error({ err }, 'job queue did not stop cleanly'))
        .then(() => pool.end())
        .finally(() => {
          clearTimeout(force);
          process.exit(0);
        });
    });
    server.closeIdleConnections();
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main().catch((err: unknown) => {
  console.error(`server: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
