/** Connects the job types in job-types.ts to a running queue. */
import type PgBoss from 'pg-boss';
import type { Logger } from 'pino';
import { JOB_TYPES, type JobContext, type JobType } from './job-types';

/**
 * Creates each job type's queue, schedules the repeating ones when `schedule` is set, and starts polling
 * every `pollingIntervalSeconds` (pg-boss's minimum is 0.5). Resolves once all workers are registered.
 */
export async function registerWorkers(
  boss: PgBoss,
  context: JobContext,
  logger: Logger,
  options: { schedule: boolean; pollingIntervalSeconds: number; jobTypes?: readonly JobType[] },
): Promise<void> {
  for (const type of options.jobTypes ?? JOB_TYPES) {
    await boss.createQueue(type.name, { name: type.name, ...type.queue });
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
