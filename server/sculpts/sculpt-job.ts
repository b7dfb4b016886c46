/** The queue side of sculpt processing: job name, queue options and the handler around processSculpt. */
import { z } from 'zod';
import type { JobContext } from '../jobs/job-types';
import { processSculpt } from './process-sculpt';
import { selectSculptById } from './queries';

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
