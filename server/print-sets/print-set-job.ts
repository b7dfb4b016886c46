/**
 * The worker side of a print set: claim the row, render every file in memory, store them, record the result.
 * A pattern the engine refuses (a piece larger than every stock sheet, say) ends as status `failed` with the
 * engine's message and no files; the job itself completes, since running it again would fail the same way.
 */
import { z } from 'zod';
import { isGeometryError } from '../../geometry/errors';
import type { PrintMode } from '../../geometry/export/print-set-pdf';
import type { PrintSetFileEntry } from '../../db/schema';
import type { JobContext } from '../jobs/job-types';
import { claimPrintSet, markPrintSetDone, markPrintSetFailed } from './queries';
import type { PrintFormat } from './print-set-request';
import { stockForPlanning } from '../stock/service';
import { renderPrintSet } from './render-print-set';
import { printSetFileKey, printSetFilePrefix } from './print-set-files';

/** Queue name of the print-set job. */
export const PRINT_SET_JOB = 'print-set-render';

/**
 * The print-set job's queue options. A bad pattern fails the same way every time and is recorded on the print
 * set, so the job does not retry; a crashed worker's job is retried once. Ten minutes bounds a runaway render.
 */
export const PRINT_SET_QUEUE = { retryLimit: 1, retryDelay: 5, expireInSeconds: 600 } as const;

const jobData = z.object({ printSetId: z.string().uuid() });

/** Message stored on a print set that failed for a reason other than the pattern itself. */
export const INTERNAL_FAILURE = 'the print set could not be made because of a server error; it has been logged, try again later';

/**
 * Runs one print-set job for `data` = { printSetId }. Resolves to a short summary for the queue's record.
 * Throws (so the queue records the job as failed and may retry) only for failures outside the pattern,
 * such as the file store being unwritable; the print set is then marked failed with INTERNAL_FAILURE.
 */
export async function runPrintSetJob({ db, files }: JobContext, data: unknown): Promise<Record<string, unknown>> {
  const parsed = jobData.safeParse(data);
  if (!parsed.success) throw new Error(`print-set job data must be { printSetId: <uuid> }, got ${JSON.stringify(data)}`);
  const id = parsed.data.printSetId;
  const job = await claimPrintSet(db, id);
  if (!job) return { printSetId: id, skipped: 'gone or already finished' };

  let rendered;
  try {
    const { stock } = await stockForPlanning(db, job.shopId);
    rendered = await renderPrintSet(job.pattern, { formats: job.formats as PrintFormat[], page: job.page, mode: job.mode as PrintMode, name: job.name, stock });
  } catch (err) {
    if (isGeometryError(err)) {
      await markPrintSetFailed(db, id, err.message);
      return { printSetId: id, status: 'failed', code: err.code };
    }
    await markPrintSetFailed(db, id, INTERNAL_FAILURE);
    throw err;
  }

  try {
    for (const f of rendered) await files.put(printSetFileKey(id, f.name), f.bytes);
  } catch (err) {
    await files.removePrefix(printSetFilePrefix(id)).catch(() => undefined);
    await markPrintSetFailed(db, id, INTERNAL_FAILURE);
    throw err;
  }
  const entries: PrintSetFileEntry[] = rendered.map((f) => ({ name: f.name, sizeBytes: f.bytes.byteLength, contentType: f.contentType }));
  if (!(await markPrintSetDone(db, id, entries))) {
    await files.removePrefix(printSetFilePrefix(id));
    return { printSetId: id, skipped: 'deleted or given up on while rendering' };
  }
  return { printSetId: id, status: 'done', files: entries.length };
}
