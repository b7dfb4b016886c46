/** Connects the job types in job-types.ts to a running queue. */
import type PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import { JOB_TYPES, type JobContext, type JobType } from './job-types';

/**
 * Creates each job type's queue, schedules the repeating ones when `schedule` is set, and starts polling
 * every `pollingIntervalSeconds` (pg-boss's minimum is 0.5). `expireInSeconds`, when given, replaces every
 * queue's job expiry (jobs sent afterwards carry it), so tests can see a killed worker's job retried within
 * seconds. Resolves once all workers are registered.
 */
export async function registerWorkers(
  boss: PgBoss,
  context: JobContext,
  logger: Logger,
  options: { schedule: boolean; pollingIntervalSeconds: number; jobTypes?: readonly JobType[]; expireInSeconds?: number },
): Promise<void> {
  for (const type of options.jobTypes ?? JOB_TYPES) {
    await boss.createQueue(type.name, { name: type.name, ...type.queue });
    if (options.expireInSeconds) await boss.updateQueue(type.name, { name: type.name, ...type.queue, expireInSeconds: options.expireInSeconds });
    if (options.schedule && type.cron) await boss.schedule(type.name, type.cron);
    await boss.work(type.name, { pollingIntervalSeconds: options.pollingIntervalSeconds }, async (jobs) => {
      const results = [];
      for (const job of jobs) {
        const started = Date.now();
        const result = await type.run(context, job.data);
        logger.info({ job: type.name, id: job.id, ms: Date.now() - started, result }, 'job done');
        results.push(result);
      }
      return results.length === 1 ? results[0] : results;
    });
  }
}
