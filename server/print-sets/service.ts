/**
 * Print-set rules: a print set belongs to a build of the shop; creating one records it (with an audit entry)
 * in one transaction and then queues the render job, so a worker never looks for a row that is not committed.
 * Files are served only when listed on a finished print set.
 */
import type { Db, DbExecutor } from '../../db/client';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { selectPattern } from '../patterns/queries';
import { recordAudit } from '../audit/service';
import { selectBuild } from '../builds/queries';
import { AppError, notFound } from '../errors';
import type { SessionUser } from '../http/define-route';
import type { JobSender } from '../jobs/job-sender';
import type { FileStore, StoredFile } from '../storage/file-store';
import { markPrintSetFailed, insertPrintSet, selectPrintSet, selectPrintSets, setPrintSetJobId, type PrintSetRow } from './queries';
import { PRINT_SET_JOB } from './print-set-job';
import { printSetFileKey } from './print-set-files';
import type { PrintSetCreateBody } from './print-set-request';

export interface PrintSetView {
  id: string;
  buildId: string;
  name: string;
  status: PrintSetRow['status'];
  formats: string[];
  page: string;
  mode: string;
  pieceCount: number;
  files: Array<{ name: string; sizeBytes: number; contentType: string; url: string }>;
  error: string | null;
  createdBy: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

function toView(row: PrintSetRow): PrintSetView {
  const base = `/api/shops/${row.shopId}/builds/${row.buildId}/print-sets/${row.id}/files`;
  return {
    id: row.id,
    buildId: row.buildId,
    name: row.name,
    status: row.status,
    formats: row.formats,
    page: row.page,
    mode: row.mode,
    pieceCount: row.pieceCount,
    files: row.files.map((f) => ({ ...f, url: `${base}/${f.name}` })),
    error: row.error,
    createdBy: row.createdBy,
    createdAt: row.createdAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
  };
}

/**
 * Records a print set of `body.pattern` (or of the build's finished pattern `body.patternId`) and queues its render. Returns the queued print set.
 * Throws 404 NOT_FOUND when the shop has no such build, 503 QUEUE_UNAVAILABLE when the job cannot be queued
 * (the print set is then marked failed, so it does not sit in `queued` for ever).
 */
export async function createPrintSet(db: Db, jobs: JobSender | null, user: SessionUser, shopId: string, buildId: string, body: PrintSetCreateBody): Promise<PrintSetView> {
  const row = await db.transaction(async (tx) => {
    const build = await selectBuild(tx, shopId, buildId);
    if (!build) throw notFound('Build');
    const pattern = body.pattern ?? (await storedPatternDoc(tx, shopId, buildId, body.patternId!));
    const inserted = await insertPrintSet(tx, {
      shopId,
      buildId,
      createdBy: user.id,
      name: pattern.name ?? build.name,
      formats: body.formats,
      page: body.page,
      mode: body.mode,
      pattern,
    });
    await recordAudit(tx, {
      shopId,
      userId: user.id,
      action: 'print-set.create',
      target: `print-set:${inserted.id}`,
      detail: { build: build.name, formats: body.formats, page: body.page, mode: body.mode, pieces: pattern.pieces.length, ...(body.patternId ? { patternId: body.patternId } : {}) },
    });
    return inserted;
  });
  const unavailable = 'The job queue is not available, so the print set could not be started; try again in a moment';
  if (!jobs) {
    await markPrintSetFailed(db, row.id, unavailable);
    throw new AppError('QUEUE_UNAVAILABLE', 503, unavailable);
  }
  try {
    await setPrintSetJobId(db, row.id, await jobs.send(PRINT_SET_JOB, { printSetId: row.id }));
  } catch {
    await markPrintSetFailed(db, row.id, unavailable);
    throw new AppError('QUEUE_UNAVAILABLE', 503, unavailable);
  }
  return toView(row);
}

/**
 * Returns the document of the build's pattern `patternId`. Throws 404 NOT_FOUND (field patternId) when the build
 * has no such pattern, 409 NOT_READY when it is not finished.
 */
async function storedPatternDoc(db: DbExecutor, shopId: string, buildId: string, patternId: string): Promise<PatternDoc> {
  const row = await selectPattern(db, shopId, buildId, patternId);
  if (!row) throw new AppError('NOT_FOUND', 404, 'Pattern was not found in this build', { patternId: 'must be the id of one of the build’s patterns' });
  if (row.status !== 'done' || !row.doc) {
    throw new AppError('NOT_READY', 409, `The pattern is ${row.status}; a print set can be made from a finished pattern`, { patternId: `the pattern is ${row.status}` });
  }
  return row.doc;
}

/** Returns the build's print sets, newest first; throws 404 NOT_FOUND when the shop has no such build. */
export async function listPrintSets(db: Db, shopId: string, buildId: string): Promise<PrintSetView[]> {
  if (!(await selectBuild(db, shopId, buildId))) throw notFound('Build');
  return (await selectPrintSets(db, shopId, buildId)).map(toView);
}

/** Returns one print set; throws 404 NOT_FOUND when the build has no such print set. */
export async function getPrintSet(db: Db, shopId: string, buildId: string, printSetId: string): Promise<PrintSetView> {
  const row = await selectPrintSet(db, shopId, buildId, printSetId);
  if (!row) throw notFound('Print set');
  return toView(row);
}

/**
 * Opens file `fileName` of a finished print set and returns it with its media type. Throws 404 NOT_FOUND
 * when the print set or the file does not exist, 409 NOT_READY while the print set is still queued or running.
 */
export async function openPrintSetFile(
  db: Db,
  files: FileStore,
  shopId: string,
  buildId: string,
  printSetId: string,
  fileName: string,
): Promise<{ file: StoredFile; contentType: string; name: string }> {
  const row = await selectPrintSet(db, shopId, buildId, printSetId);
  if (!row) throw notFound('Print set');
  if (row.status === 'queued' || row.status === 'running') {
    throw new AppError('NOT_READY', 409, `The print set is still ${row.status}; its files are ready when its status is done`);
  }
  const entry = row.files.find((f) => f.name === fileName);
  if (!entry) {
    const names = row.files.map((f) => f.name).join(', ');
    throw new AppError('NOT_FOUND', 404, `The print set has no file "${fileName}"${names ? ` (it has ${names})` : ' (it has no files)'}`);
  }
  const file = await files.open(printSetFileKey(row.id, entry.name));
  if (!file) throw new AppError('NOT_FOUND', 404, `File "${fileName}" of the print set is missing from the file store`);
  return { file, contentType: entry.contentType, name: entry.name };
}
