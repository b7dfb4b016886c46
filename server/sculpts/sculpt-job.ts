/** The queue side of sculpt processing: job name, queue options and the handler around processSculpt. */
import { z } from 'zod';
import type { JobContext } from '../jobs/job-types';
import { processSculpt } from './process-sculpt';
import { failSculptsRunningLongerThan, selectSculptById } from './queries';

/** Queue name of the processing job. */
export const SCULPT_JOB = 'sculpt-process';

/**
 * Queue options: a bad model is recorded on the sculpt and never retried; a server failure (database, file
 * store, a crashed worker) is retried once. Thirty minutes bounds a 2-million-triangle file on a slow machine.
 */
export const SCULPT_QUEUE = { retryLimit: 1, retryDelay: 10, expireInSeconds: 1800 } as const;

const jobData = z.object({ sculptId: z.string().uuid() });

/** Runs one processing job for `data` = { sculptId } and returns the sculpt's resulting status for the queue's record. */
export async function runSculptJob(context: JobContext, data: unknown): Promise<Record<string, unknown>> {
  const parsed = jobData.safeParse(data);
  if (!parsed.success) throw new Error(`sculpt job data must be { sculptId: <uuid> }, got ${JSON.stringify(data)}`);
  await processSculpt(context, parsed.data.sculptId);
  const row = await selectSculptById(context.db, parsed.data.sculptId);
  return { sculptId: parsed.data.sculptId, status: row?.status ?? 'gone' };
}

/** Queue name of the check that fails sculpts whose processing died (a worker killed past every retry). */
export const STALE_SCULPTS_JOB = 'sculpt-reconcile';

/** Every attempt's expiry plus five minutes: no live attempt can still be running after this. */
export const STALE_SCULPT_MINUTES = ((SCULPT_QUEUE.retryLimit + 1) * SCULPT_QUEUE.expireInSeconds) / 60 + 5;

/** Message stored on a sculpt whose processing never finished. */
export const SCULPT_STALE_ERROR = `processing did not finish within ${STALE_SCULPT_MINUTES} minutes; change a setting or upload the model again to retry`;

/** Fails sculpts left running past STALE_SCULPT_MINUTES, so none stays "running" for ever; returns how many. */
export async function failStaleSculpts(context: JobContext): Promise<Record<string, unknown>> {
  const ids = await failSculptsRunningLongerThan(context.db, STALE_SCULPT_MINUTES, SCULPT_STALE_ERROR);
  return { failed: ids.length };
}
