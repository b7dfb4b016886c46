/**
 * Queues the making of a pattern: records a `patterns` row for the sculpt's current seam revision and the
 * build's piece settings, then sends the `pattern-build` job. Called by a seam save (server/sculpts), a piece
 * settings change and the "make the pattern again" route. A burst of saves queues one row each; a job that
 * starts and finds a newer row for its sculpt stops as superseded, so only the newest does the work.
 */
import type { DbExecutor } from '../../db/client';
import type { JobSender } from '../jobs/job-sender';
import { selectSeamSet } from '../sculpts/queries';
import { PATTERN_JOB } from './pattern-job-name';
import { patternSettingsFrom } from './pattern-settings';
import {
  insertPattern,
  markPatternFailed,
  selectPieceSettingRows,
  selectSculptForPattern,
  setPatternJobId,
  type PatternRow,
} from './queries';

/** Message stored on a pattern that could not be put on the job queue. */
export const PATTERN_QUEUE_UNAVAILABLE = 'the job queue is not available, so the pattern could not be started; make the pattern again in a moment';

/**
 * Records and queues a pattern of sculpt `sculptId` of the shop's build. Returns the new row: status `queued`,
 * or `failed` with PATTERN_QUEUE_UNAVAILABLE when `jobs` is null or refuses the job (the seam save that called
 * this has committed and stays valid). Returns null, queuing nothing, when the build has no such sculpt or its
 * working mesh is not ready yet (the sculpt's processing queues the first pattern when it finishes).
 */
export async function queuePattern(
  db: DbExecutor,
  jobs: JobSender | null,
  target: { shopId: string; buildId: string; sculptId: string },
): Promise<PatternRow | null> {
  const sculpt = await selectSculptForPattern(db, target.shopId, target.buildId, target.sculptId);
  if (!sculpt || sculpt.status !== 'done' || !sculpt.meshKey) return null;
  const seamSet = await selectSeamSet(db, target.sculptId);
  const settings = patternSettingsFrom(seamSet?.stretchBudgetPct ?? null, await selectPieceSettingRows(db, target.buildId));
  const row = await insertPattern(db, { ...target, seamRevision: seamSet?.revision ?? 0, settings });
  if (!jobs) {
    await markPatternFailed(db, row.id, PATTERN_QUEUE_UNAVAILABLE);
    return { ...row, status: 'failed', error: PATTERN_QUEUE_UNAVAILABLE };
  }
  try {
    await setPatternJobId(db, row.id, await jobs.send(PATTERN_JOB, { patternId: row.id }));
  } catch {
    await markPatternFailed(db, row.id, PATTERN_QUEUE_UNAVAILABLE);
    return { ...row, status: 'failed', error: PATTERN_QUEUE_UNAVAILABLE };
  }
  return row;
}
