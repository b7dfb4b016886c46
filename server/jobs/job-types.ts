/**
 * The kinds of job the workers run, kept as data: queue name, optional cron schedule, and the handler.
 * Adding a job type means adding an entry here; server/worker.ts registers every entry.
 */
import type { Db } from '../../db/client';
import { pruneRateLimitHits } from '../auth/rate-limit-store';

export interface JobContext {
  db: Db;
}

export interface JobType {
  name: string;
  /** Five-field cron expression (UTC) when the job repeats on its own; absent for jobs sent on demand. */
  cron?: string;
  /** Does the job and returns a small JSON-able summary stored with the completed job. */
  run(context: JobContext, data: unknown): Promise<Record<string, unknown>>;
}

export const JOB_TYPES: readonly JobType[] = [
  {
    // Failed sign-in counters are only needed during their window; old rows would otherwise pile up.
    name: 'rate-limit-prune',
    cron: '*/15 * * * *',
    run: async ({ db }) => ({ deleted: await pruneRateLimitHits(db) }),
  },
];
