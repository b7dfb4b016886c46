/**
 * The job queue: pg-boss on the application's own PostgreSQL database, in schema `pgboss`. Heavy work (later:
 * parsing sculpts, flattening, nesting, print sets) is sent here by the API and done by worker processes, so
 * it never runs on a request thread and any number of workers can share the load.
 */
import PgBoss from 'pg-boss';
import type { Logger } from 'pino';

export const QUEUE_SCHEMA = 'pgboss';

/**
 * Returns a started pg-boss instance on `databaseUrl` (creating or upgrading its schema on first start).
 * `supervise` turns on pg-boss's own maintenance (expiring jobs whose worker died, so they are retried, and
 * archiving old ones) every `maintenanceIntervalSeconds` (default 120); one per deployment is enough but more
 * are harmless.
 */
export async function startQueue(
  databaseUrl: string,
  logger: Logger,
  options: { supervise: boolean; schedule: boolean; maintenanceIntervalSeconds?: number },
): Promise<PgBoss> {
  const boss = new PgBoss({
    connectionString: databaseUrl,
    schema: QUEUE_SCHEMA,
    application_name: 'sheetsmith-queue',
    max: 4,
    supervise: options.supervise,
    schedule: options.schedule,
    ...(options.maintenanceIntervalSeconds ? { maintenanceIntervalSeconds: options.maintenanceIntervalSeconds } : {}),
  });
  boss.on('error', (err: unknown) => logger.error({ err }, 'job queue error'));
  await boss.start();
  return boss;
}

/**
 * Stops taking new jobs, waits up to `timeoutMs` for running ones to finish, then closes the queue's
 * connections.
 */
export async function stopQueue(boss: PgBoss, timeoutMs = 20_000): Promise<void> {
  await boss.stop({ graceful: true, wait: true, timeout: timeoutMs, close: true });
}
