/**
 * The worker process: takes jobs from the PostgreSQL queue and runs them, off the API's request threads.
 * Started by scripts/start.sh next to the API server; run more of them to share the load. Stops gracefully on
 * SIGINT/SIGTERM (finishes running jobs, then closes its connections).
 */
import { createDb, createPool } from '../db/client';
import { runMigrations } from '../db/migrate';
import { parseEnv } from './env';
import { pgBossJobSender } from './jobs/job-sender';
import { registerWorkers } from './jobs/register-workers';
import { startQueue, stopQueue } from './jobs/queue';
import { JOB_TYPES } from './jobs/job-types';
import { createLogger } from './logger';
import { failStalePrintSets } from './print-sets/stale-print-sets';
import { createFileStore } from './storage/create-file-store';

async function main(): Promise<void> {
  const env = parseEnv(process.env);
  const logger = createLogger(env.LOG_LEVEL, 'worker');
  const pool = createPool(env.DATABASE_URL, 4);
  // An idle connection dropped by a database restart is reported here; without a listener it would end the process.
  pool.on('error', (err) => logger.warn({ err: err.message }, 'idle database connection lost'));
  await runMigrations(pool);
  const boss = await startQueue(env.DATABASE_URL, logger, { supervise: true, schedule: true, maintenanceIntervalSeconds: env.JOB_MAINTENANCE_SECONDS });
  // Jobs may queue follow-up work (a processed sculpt queues its first pattern).
  const context = { db: createDb(pool), files: createFileStore(env), jobs: pgBossJobSender(boss) };
  await registerWorkers(boss, context, logger, { schedule: true, pollingIntervalSeconds: 2, expireInSeconds: env.JOB_EXPIRE_SECONDS });
  // Print sets abandoned while no worker ran are failed now rather than at the first scheduled check.
  logger.info({ result: await failStalePrintSets(context) }, 'stale print sets checked');
  logger.info({ jobTypes: JOB_TYPES.map((t) => t.name) }, 'worker ready');

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    logger.info({ signal }, 'worker stopping');
    stopQueue(boss)
      .then(() => pool.end())
      .then(
        () => process.exit(0),
        (err: unknown) => {
          logger.error({ err }, 'worker did not stop cleanly');
          process.exit(1);
        },
      );
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main().catch((err: unknown) => {
  console.error(`worker: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
});
