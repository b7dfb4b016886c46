/**
 * The kinds of job the workers run, kept as data: queue name, optional cron schedule, queue options, and the
 * handler. Adding a job type means adding an entry here; server/worker.ts registers every entry.
 */
import type PgBoss from 'pg-boss';
import type { Db } from '../../db/client';
import { pruneRateLimitHits } from '../auth/rate-limit-store';
import { PRINT_SET_JOB, PRINT_SET_QUEUE, runPrintSetJob } from '../print-sets/print-set-job';
import { failStalePrintSets, STALE_PRINT_SETS_JOB } from '../print-sets/stale-print-sets';
import { failStaleSculpts, runSculptJob, SCULPT_JOB, SCULPT_QUEUE, STALE_SCULPTS_JOB } from '../sculpts/sculpt-job';
import { runPatternJob } from '../patterns/pattern-job';
import { PATTERN_JOB, PATTERN_QUEUE, SHEET_PLAN_JOB, SHEET_PLAN_QUEUE } from '../patterns/pattern-job-name';
import { runSheetPlanJob } from '../sheet-plans/sheet-plan-job';
import type { FileStore } from '../storage/file-store';
import type { JobSender } from './job-sender';

export interface JobContext {
  db: Db;
  files: FileStore;
  /** Lets a job queue follow-up work (the worker passes its queue; absent where nothing follows). */
  jobs?: JobSender;
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
    queue: PRINT_SET_QUEUE,
    run: (context, data) => runPrintSetJob(context, data),
  },
  {
    // A print-set job that died past its expiry would leave its print set queued or running for ever.
    name: STALE_PRINT_SETS_JOB,
    cron: '*/5 * * * *',
    run: async (context) => failStalePrintSets(context),
  },
  {
    name: SCULPT_JOB,
    queue: SCULPT_QUEUE,
    run: (context, data) => runSculptJob(context, data),
  },
  {
    name: PATTERN_JOB,
    queue: PATTERN_QUEUE,
    run: (context, data) => runPatternJob(context, data),
  },
  {
    name: SHEET_PLAN_JOB,
    queue: SHEET_PLAN_QUEUE,
    run: (context, data) => runSheetPlanJob(context, data),
  },
  {
    // A sculpt whose worker died past every retry would otherwise stay running for ever.
    name: STALE_SCULPTS_JOB,
    cron: '*/10 * * * *',
    run: async (context) => failStaleSculpts(context),
  },
];
