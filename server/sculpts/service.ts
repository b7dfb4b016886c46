/**
 * Sculpt rules: an upload becomes the build's next version (numbered under a lock on the build), is recorded
 * with an audit entry, stored under a key made from its id, and queued for processing; settings changes
 * queue it again. Rows are committed before their job is sent, so a worker never looks for a missing row.
 */
import { randomUUID } from 'node:crypto';
import type { Db } from '../../db/client';
import type { SculptReport, WearerMeasure } from '../../db/schema-sculpts';
import { DEFAULT_TARGET_TRIANGLES, sculptUploadFields, type SculptPatchBody } from '../../db/validation-sculpts';
import { insertAuditEntry } from '../audit/queries';
import { AppError, notFound, validationError } from '../errors';
import type { SessionUser } from '../http/define-route';
import type { JobSender } from '../jobs/job-sender';
import type { FileStore } from '../storage/file-store';
import { insertSculpt, lockBuild, markSculptFailed, requeueSculpt, selectMaxVersion, selectSculpt, selectSculpts, setSculptJobId, type SculptRow } from './queries';
import { SCULPT_JOB } from './sculpt-job';
import { sculptFilePrefix, sculptSourceKey } from './sculpt-files';
import type { UploadedModel } from './sculpt-upload';

export interface SculptView {
  id: string;
  buildId: string;
  version: number;
  fileName: string;
  format: string;
  sourceBytes: number;
  units: SculptRow['units'];
  scale: number;
  wearer: WearerMeasure | null;
  targetTriangles: number;
  status: SculptRow['status'];
  progress: number;
  stage: string | null;
  error: string | null;
  report: SculptReport | null;
  meshUrl: string | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  createdBy: string | null;
}

/** Returns the API view of a sculpt row; `meshUrl` only once the working mesh exists. */
export function toSculptView(row: SculptRow): SculptView {
  return {
    id: row.id,
    buildId: row.buildId,
    version: row.version,
    fileName: row.fileName,
    format: row.format,
    sourceBytes: row.sourceBytes,
    units: row.units,
    scale: row.scale,
    wearer: row.wearer ?? null,
    targetTriangles: row.targetTriangles,
    status: row.status,
    progress: row.progress,
    stage: row.stage,
    error: row.error,
    report: row.report ?? null,
    meshUrl: row.status === 'done' && row.meshKey ? `/api/shops/${row.shopId}/builds/${row.buildId}/sculpts/${row.id}/mesh` : null,
    createdAt: row.createdAt.toISOString(),
    startedAt: row.startedAt?.toISOString() ?? null,
    finishedAt: row.finishedAt?.toISOString() ?? null,
    createdBy: row.createdBy,
  };
}

const QUEUE_UNAVAILABLE = 'The job queue is not available, so the sculpt could not be processed; upload it again in a moment';

/** Sends the processing job of a committed row; on failure marks the row failed and throws 503 QUEUE_UNAVAILABLE. */
async function queueProcessing(db: Db, jobs: JobSender | null, row: SculptRow): Promise<void> {
  try {
    if (!jobs) throw new Error('no job queue');
    await setSculptJobId(db, row.id, await jobs.send(SCULPT_JOB, { sculptId: row.id }));
  } catch {
    await markSculptFailed(db, row.id, QUEUE_UNAVAILABLE);
    throw new AppError('QUEUE_UNAVAILABLE', 503, QUEUE_UNAVAILABLE);
  }
}

/**
 * Records `upload` as the build's next sculpt version and queues its processing; returns the queued view.
 * Throws 400 VALIDATION for bad form fields (per field), 404 NOT_FOUND for a build the shop does not have,
 * 503 QUEUE_UNAVAILABLE when the job cannot be queued (the row is then failed, not left queued).
 */
export async function uploadSculpt(
  deps: { db: Db; files: FileStore; jobs: JobSender | null },
  user: SessionUser,
  shopId: string,
  buildId: string,
  upload: UploadedModel,
): Promise<SculptView> {
  const { db, files, jobs } = deps;
  const parsed = sculptUploadFields.safeParse(upload.fields);
  if (!parsed.success) throw validationError(parsed.error, 'body');
  const f = parsed.data;
  const id = randomUUID();
  const sourceKey = sculptSourceKey(id, upload.format);
  // The file goes in first: a row is never visible without its file. A failed insert removes it again.
  await files.put(sourceKey, upload.bytes);
  let row: SculptRow;
  try {
    row = await db.transaction(async (tx) => {
      if (!(await lockBuild(tx, shopId, buildId))) throw notFound('Build');
      const version = (await selectMaxVersion(tx, buildId)) + 1;
      const wearer = f.headCircumferenceMm !== undefined || f.headHeightMm !== undefined ? { headCircumferenceMm: f.headCircumferenceMm ?? null, headHeightMm: f.headHeightMm ?? null } : null;
      const inserted = await insertSculpt(tx, {
        id,
        shopId,
        buildId,
        version,
        fileName: upload.fileName,
        format: upload.format,
        sourceKey,
        sourceBytes: upload.bytes.length,
        units: f.units,
        scale: f.scale ?? 1,
        wearer,
        targetTriangles: f.targetTriangles ?? DEFAULT_TARGET_TRIANGLES,
        createdBy: user.id,
      });
      await insertAuditEntry(tx, {
        shopId,
        userId: user.id,
        action: 'sculpt.upload',
        target: `sculpt:${id}`,
        detail: { build: buildId, version, fileName: upload.fileName, format: upload.format, bytes: upload.bytes.length, units: f.units },
      });
      return inserted;
    });
  } catch (err) {
    await files.removePrefix(sculptFilePrefix(id)).catch(() => undefined);
    throw err;
  }
  await queueProcessing(db, jobs, row);
  return toSculptView(row);
}

/** Returns the build's sculpt versions, newest first; an unknown build of the shop simply has none. */
export async function listSculpts(db: Db, shopId: string, buildId: string): Promise<SculptView[]> {
  return (await selectSculpts(db, shopId, buildId)).map(toSculptView);
}

/** Returns one sculpt row; throws 404 NOT_FOUND when the shop's build has no such sculpt. */
export async function requireSculpt(db: Db, shopId: string, buildId: string, sculptId: string): Promise<SculptRow> {
  const row = await selectSculpt(db, shopId, buildId, sculptId);
  if (!row) throw notFound('Sculpt');
  return row;
}

/**
 * Applies new units, scale or wearer measures and queues the sculpt again (its seams are carried onto the
 * new working mesh when processing ends). Throws 404 NOT_FOUND, 409 BUSY while it is still queued or running,
 * 503 QUEUE_UNAVAILABLE.
 */
export async function patchSculpt(deps: { db: Db; jobs: JobSender | null }, user: SessionUser, shopId: string, buildId: string, sculptId: string, body: SculptPatchBody): Promise<SculptView> {
  const { db, jobs } = deps;
  const current = await requireSculpt(db, shopId, buildId, sculptId);
  const wearer = body.wearer === undefined ? (current.wearer ?? null) : body.wearer;
  const measured = !!wearer && (wearer.headCircumferenceMm !== null || wearer.headHeightMm !== null);
  // Head measures decide the scale; a typed-in scale replaces them.
  const settings = {
    units: body.units ?? current.units,
    scale: body.scale ?? (measured ? current.scale : body.wearer === null ? 1 : current.scale),
    wearer: body.scale !== undefined ? null : measured ? wearer : null,
  };
  const row = await db.transaction(async (tx) => {
    const updated = await requeueSculpt(tx, shopId, buildId, sculptId, settings);
    if (!updated) {
      throw new AppError('BUSY', 409, `Sculpt version ${current.version} is still ${current.status}; change its settings when processing has finished`);
    }
    await insertAuditEntry(tx, { shopId, userId: user.id, action: 'sculpt.settings', target: `sculpt:${sculptId}`, detail: { version: current.version, ...settings } });
    return updated;
  });
  await queueProcessing(db, jobs, row);
  return toSculptView(row);
}
