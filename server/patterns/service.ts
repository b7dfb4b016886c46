/**
 * Pattern rules: a build's pattern is the newest one of its newest sculpt version; it can be made again from
 * the current seams and piece settings; its faces file is served once it is done.
 */
import type { Db } from '../../db/client';
import { selectBuild } from '../builds/queries';
import { AppError, notFound } from '../errors';
import type { JobSender } from '../jobs/job-sender';
import type { FileStore, StoredFile } from '../storage/file-store';
import { PATTERN_QUEUE_UNAVAILABLE, queuePattern } from './queue-pattern';
import { selectNewestPatternOfSculpt, selectNewestSculpt, selectPattern, type PatternRow } from './queries';

export interface PatternView {
  id: string;
  sculptId: string;
  seamRevision: number;
  status: PatternRow['status'];
  progress: number;
  stage: string | null;
  error: string | null;
  doc: PatternRow['doc'];
  facesUrl: string | null;
  createdAt: string;
  finishedAt: string | null;
}

/** Returns the API view of a pattern row (facesUrl only once the faces file exists). */
export function patternView(row: PatternRow): PatternView {
  return {
    id: row.id,
    sculptId: row.sculptId,
    seamRevision: row.seamRevision,
    status: row.status,
    progress: row.progress,
    stage: row.stage,
    error: row.error,
    doc: row.doc,
    facesUrl: row.status === 'done' && row.facesKey ? `/api/shops/${row.shopId}/builds/${row.buildId}/patterns/${row.id}/faces` : null,
    createdAt: row.createdAt.toISOString(),
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}

/** Returns the newest pattern of the build's newest sculpt, or null; throws 404 NOT_FOUND for no such build. */
export async function getBuildPattern(db: Db, shopId: string, buildId: string): Promise<PatternView | null> {
  if (!(await selectBuild(db, shopId, buildId))) throw notFound('Build');
  const sculpt = await selectNewestSculpt(db, shopId, buildId);
  if (!sculpt) return null;
  const row = await selectNewestPatternOfSculpt(db, sculpt.id);
  return row ? patternView(row) : null;
}

/**
 * Queues a new pattern of the build's newest sculpt from its current seams and piece settings and returns it.
 * Throws 404 NOT_FOUND for no such build, 409 NO_SCULPT when nothing was uploaded, 409 NOT_READY while the
 * sculpt is still being processed (or failed), 503 QUEUE_UNAVAILABLE when the job could not be queued.
 */
export async function remakeBuildPattern(db: Db, jobs: JobSender | null, shopId: string, buildId: string): Promise<PatternView> {
  if (!(await selectBuild(db, shopId, buildId))) throw notFound('Build');
  const sculpt = await selectNewestSculpt(db, shopId, buildId);
  if (!sculpt) throw new AppError('NO_SCULPT', 409, 'The build has no sculpt yet; upload one before making a pattern');
  const row = await queuePattern(db, jobs, { shopId, buildId, sculptId: sculpt.id });
  if (!row) {
    throw new AppError('NOT_READY', 409, `Sculpt version ${sculpt.version} is ${sculpt.status === 'failed' ? 'failed' : `still ${sculpt.status}`}; a pattern can be made once its processing is done`);
  }
  if (row.status === 'failed' && row.error === PATTERN_QUEUE_UNAVAILABLE) throw new AppError('QUEUE_UNAVAILABLE', 503, 'The job queue is not available, so the pattern could not be started; try again in a moment');
  return patternView(row);
}

/**
 * Opens the faces file of a finished pattern of the build. Throws 404 NOT_FOUND for no such pattern (or a file
 * missing from the store), 409 NOT_READY while it is queued or running, 409 PATTERN_FAILED when it failed.
 */
export async function openPatternFaces(db: Db, files: FileStore, shopId: string, buildId: string, patternId: string): Promise<StoredFile> {
  const row = await selectPattern(db, shopId, buildId, patternId);
  if (!row) throw notFound('Pattern');
  if (row.status === 'queued' || row.status === 'running') {
    throw new AppError('NOT_READY', 409, `The pattern is still ${row.status}; its faces file is ready when its status is done`);
  }
  if (row.status === 'failed' || !row.facesKey) throw new AppError('PATTERN_FAILED', 409, `The pattern failed, so it has no faces file: ${row.error ?? 'no reason recorded'}`);
  const file = await files.open(row.facesKey);
  if (!file) throw new AppError('NOT_FOUND', 404, 'The faces file of the pattern is missing from the file store');
  return file;
}
