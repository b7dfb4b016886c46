/**
 * The kinds of job the workers run, kept as data: queue name, optional cron schedule, queue options, and the
 * handler. Adding a job type means adding an entry here; server/worker.ts registers every entry.
 */
import type PgBoss from 'pg-boss';
import type { Db } from '../../db/client';
import { pruneRateLimitHits } from '../auth/rate-limit-store';
import { PRINT_SET_JOB, runPrintSetJob } from '../print-sets/print-set-job';
import type { FileStore } from '../storage/file-store';

export interface JobContext {
  db: Db;
  files: FileStore;
}

export interface JobType {
  name: string;
  /** Five-field cron expression (UTC) when the job repeats on its own; absent for jobs sent on demand. */
  cron?: string;
  /** pg-boss queue options (retries, expiry) used when the queue is created. */
  queue?: Omit<PgBoss.Queue, 'name'>;
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
  {
    name: PRINT_SET_JOB,
    // A bad pattern fails the same way every time and is recorded on the print set, so the job does not
    // retry; a crashed worker's job is retried once. Ten minutes bounds a runaway render.
    queue: { retryLimit: 1, retryDelay: 5, expireInSeconds: 600 },
    run: (context, data) => runPrintSetJob(context, data),
  },
];
