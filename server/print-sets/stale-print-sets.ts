/**
 * Gives up on print sets whose job died unseen. pg-boss expires a job that outlives its expiry, but the print
 * set's row would stay `queued` or `running` for ever; the worker runs this on start and every few minutes
 * (job `print-set-reconcile`) so the maker sees a failure they can act on instead of an endless spinner.
 */
import type { JobContext } from '../jobs/job-types';
import { printSetFilePrefix } from './print-set-files';
import { PRINT_SET_QUEUE } from './print-set-job';
import { failPrintSetsOlderThan } from './queries';

/** Queue name of the repeating job that runs failStalePrintSets. */
export const STALE_PRINT_SETS_JOB = 'print-set-reconcile';

/** Extra time past the queue's own limits before a print set counts as abandoned (for queue and clock slack). */
const MARGIN_MINUTES = 5;

/**
 * Minutes a print set may stay queued or running: every attempt the queue allows (the first plus the
 * retries) running to its expiry, the delays between them, and the margin. 25 with the current options.
 */
export const STALE_PRINT_SET_MINUTES = Math.ceil(
  ((PRINT_SET_QUEUE.retryLimit + 1) * PRINT_SET_QUEUE.expireInSeconds + PRINT_SET_QUEUE.retryLimit * PRINT_SET_QUEUE.retryDelay) / 60 + MARGIN_MINUTES,
);

/** The message a stale print set is failed with. */
export const STALE_PRINT_SET_ERROR = `the job did not finish within ${STALE_PRINT_SET_MINUTES} minutes; try again`;

/**
 * Marks failed every print set queued or running for longer than STALE_PRINT_SET_MINUTES and removes any files
 * a dead job left under it. Returns how many were failed and the ids whose files could not be removed (the
 * rows are failed regardless; the files only take space).
 */
export async function failStalePrintSets({ db, files }: JobContext): Promise<{ failed: number; filesLeft: string[] }> {
  const ids = await failPrintSetsOlderThan(db, STALE_PRINT_SET_MINUTES, STALE_PRINT_SET_ERROR);
  const filesLeft: string[] = [];
  for (const id of ids) {
    await files.removePrefix(printSetFilePrefix(id)).catch(() => filesLeft.push(id));
  }
  return { failed: ids.length, filesLeft };
}
