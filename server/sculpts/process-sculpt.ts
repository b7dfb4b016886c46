/**
 * Processing one sculpt version on a worker: read the uploaded file, parse it, clean it, reduce a dense scan
 * to the working resolution, scale it to the wearer, store the working mesh, and carry the seams of the
 * previous version (or of this version's previous processing) across. Progress is written to the row as it
 * goes; the row always ends done or failed.
 */
import type { Db } from '../../db/client';
import type { SculptReport, SeamLine, SymmetryPlane } from '../../db/schema-sculpts';
import { GeometryError, isGeometryError } from '../../geometry/errors';
import { importModel } from '../../geometry/io/import-model';
import { decodeWorkingMesh, encodeWorkingMesh } from '../../geometry/io/working-mesh';
import { cleanMesh } from '../../geometry/mesh/clean-mesh';
import { boundingBox, boundingBoxDiagonal } from '../../geometry/mesh/mesh-measures';
import { simplifyMesh } from '../../geometry/mesh/simplify-mesh';
import { headSection, wearerScale } from '../../geometry/mesh/wearer-scale';
import type { JobSender } from '../jobs/job-sender';
import { queuePattern } from '../patterns/queue-pattern';
import type { FileStore } from '../storage/file-store';
import { carrySeams, describeCarry } from './carry-seams';
import { meshEdges } from './mesh-edges';
import { claimSculpt, markSculptDone, markSculptFailed, replaceSeamSet, selectPreviousDoneSculpt, selectSeamSet, setSculptProgress, type SculptRow } from './queries';
import { readStoredBytes } from '../storage/read-stored-bytes';
import { sculptMeshKey } from './sculpt-files';

/** Error stored when processing stopped for a reason other than the model (the queue then retries once). */
export const SCULPT_INTERNAL_FAILURE = 'the sculpt could not be processed because of a server error; it has been logged and will be tried again';

/** Height of the head section as a fraction of the sculpt's height: about brow level on a helmet (common practice guess). */
export const HEAD_SECTION_FRACTION = 0.5;

/** What the job needs: the database, the file store, and optionally the queue to start the first pattern. */
export interface ProcessSculptContext {
  db: Db;
  files: FileStore;
  jobs?: JobSender;
}

/** The mesh and seams a previous processing left, to carry seams from. */
interface SeamSource {
  version: number;
  /** True when the seams are this sculpt's own (a settings change), false for an earlier version's. */
  sameSculpt: boolean;
  positions: Float32Array;
  triangles: Uint32Array;
  seams: SeamLine[];
  symmetry: SymmetryPlane | null;
  stretchBudgetPct: number;
  updatedBy: string | null;
}

/**
 * Processes sculpt `sculptId` (a row already inserted, status queued). Resolves when the row is done or failed:
 * a bad model (GeometryError) is recorded as failed with the engine's message, including the file's line number
 * for text formats. When `ctx.jobs` is given, a finished sculpt gets its first pattern queued (queuePattern).
 * Rejects only for failures outside the model (database, file store), after marking the row
 * failed with SCULPT_INTERNAL_FAILURE, so a queue retry can claim it again. A sculpt that is gone or already
 * done is left alone.
 */
export async function processSculpt(ctx: ProcessSculptContext, sculptId: string): Promise<void> {
  const { db } = ctx;
  const row = await claimSculpt(db, sculptId, SCULPT_INTERNAL_FAILURE);
  if (!row) return;
  try {
    await runStages(ctx, row);
  } catch (err) {
    if (isGeometryError(err)) {
      await markSculptFailed(db, row.id, `${row.fileName}: ${err.message}`);
      return;
    }
    await markSculptFailed(db, row.id, SCULPT_INTERNAL_FAILURE);
    throw err;
  }
}

async function runStages({ db, files, jobs }: ProcessSculptContext, row: SculptRow): Promise<void> {
  const seamSource = await findSeamSource(db, files, row);

  await setSculptProgress(db, row.id, 10, 'parsing');
  let bytes: Uint8Array | null = await readStoredBytes(files, row.sourceKey);
  if (!bytes) throw new Error(`the uploaded file of sculpt ${row.id} is missing from the file store (${row.sourceKey})`);
  const imported = importModel(bytes, row.fileName, { unit: row.units, maxBytes: Math.max(bytes.length, 1) });
  // The source bytes are not needed past parsing; let a 200 MB file go before the next copies are made.
  bytes = null;
  const warnings = [...imported.notes];
  const sourceVertices = imported.mesh.positions.length / 3;
  const sourceTriangles = imported.mesh.triangles.length / 3;

  await setSculptProgress(db, row.id, 40, 'cleaning');
  const cleaned = cleanMesh(imported);
  warnings.push(...cleaned.report.notes);

  await setSculptProgress(db, row.id, 70, 'reducing');
  let model = cleaned.model;
  if (model.mesh.triangles.length / 3 > row.targetTriangles) {
    const reduced = await simplifyMesh(model, row.targetTriangles, null);
    model = reduced.model;
    warnings.push(`reduced from ${cleaned.report.facesOut} to ${model.mesh.triangles.length / 3} triangles for the working mesh`);
  }
  const { positions, triangles } = model.mesh;

  let scale = row.scale;
  const wearer = row.wearer;
  if (wearer && (wearer.headCircumferenceMm !== null || wearer.headHeightMm !== null)) {
    const section = headSection(positions, triangles, { upAxis: 1, heightFraction: HEAD_SECTION_FRACTION });
    if (!section) throw new GeometryError('BAD_OPTION', 'the sculpt has no height along y, so it cannot be scaled to a head');
    const box = boundingBox(positions);
    const fit = wearerScale(section, [box.max[0] - box.min[0], box.max[1] - box.min[1], box.max[2] - box.min[2]], wearer);
    scale = fit.factor;
    warnings.push(
      `scaled by ${fit.factor.toFixed(4)} to the wearer: section at half height ${fit.before.circumferenceMm.toFixed(1)} → ${fit.after.circumferenceMm.toFixed(1)} mm round, height ${fit.before.heightMm.toFixed(1)} → ${fit.after.heightMm.toFixed(1)} mm`,
    );
    if (fit.disagreement) warnings.push(fit.disagreement);
  }
  if (scale !== 1) for (let i = 0; i < positions.length; i++) positions[i] *= scale;

  await setSculptProgress(db, row.id, 90, 'saving');
  const meshKey = sculptMeshKey(row.id);
  await files.put(meshKey, encodeWorkingMesh(positions, triangles));

  const V = positions.length / 3;
  if (seamSource && seamSource.seams.length > 0) {
    const carried = carryFrom(seamSource, positions, triangles);
    await replaceSeamSet(db, row.shopId, row.id, {
      seams: carried.seams,
      symmetry: seamSource.symmetry,
      stretchBudgetPct: seamSource.stretchBudgetPct,
      updatedBy: seamSource.updatedBy,
    });
    warnings.push(carried.note);
  }

  const box = boundingBox(positions);
  const report: SculptReport = {
    sourceTriangles,
    sourceVertices,
    weldedVertices: cleaned.report.weldedVertices,
    droppedFaces: cleaned.report.degenerateFaces + cleaned.report.duplicateFaces,
    flippedFaces: cleaned.report.flippedFaces,
    nonManifoldEdges: cleaned.report.nonManifoldEdges.length,
    nonManifoldVertices: cleaned.report.nonManifoldVertices.length,
    workingTriangles: triangles.length / 3,
    workingVertices: V,
    sizeMm: [box.max[0] - box.min[0], box.max[1] - box.min[1], box.max[2] - box.min[2]],
    warnings,
  };
  if ((await markSculptDone(db, row.id, { report, meshKey, scale })) && jobs) {
    // The new mesh (with any carried seams) needs its first pattern; a refused queue is recorded on the pattern.
    await queuePattern(db, jobs, { shopId: row.shopId, buildId: row.buildId, sculptId: row.id });
  }
}

/**
 * The seams to carry into this run: this sculpt's own seams when it was processed before (a settings change),
 * else the newest earlier finished version's. Null when there are none.
 */
async function findSeamSource(db: Db, files: FileStore, row: SculptRow): Promise<SeamSource | null> {
  const ownSet = row.meshKey ? await selectSeamSet(db, row.id) : null;
  const sameSculpt = !!ownSet && ownSet.seams.length > 0;
  const from = sameSculpt ? row : await selectPreviousDoneSculpt(db, row.buildId, row.version);
  if (!from?.meshKey) return null;
  const set = sameSculpt ? ownSet : await selectSeamSet(db, from.id);
  if (!set || set.seams.length === 0) return null;
  const bytes = await readStoredBytes(files, from.meshKey);
  if (!bytes) return null;
  const old = decodeWorkingMesh(bytes);
  return {
    version: from.version,
    sameSculpt,
    positions: old.positions,
    triangles: old.triangles,
    seams: set.seams,
    symmetry: set.symmetry ?? null,
    stretchBudgetPct: set.stretchBudgetPct,
    updatedBy: set.updatedBy,
  };
}

function sameTriangles(a: Uint32Array, b: Uint32Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}

/** Box centre of (Float32|Float64)Array(3V) positions. */
function centre(p: Float32Array | Float64Array): [number, number, number] {
  const box = boundingBox(p instanceof Float64Array ? p : Float64Array.from(p));
  return [(box.min[0] + box.max[0]) / 2, (box.min[1] + box.max[1]) / 2, (box.min[2] + box.max[2]) / 2];
}

/**
 * Returns the seams of `source` on the new working mesh and a sentence for the report. The same sculpt
 * reprocessed with other units or scale keeps its seams as they are when the triangles did not change, and
 * is otherwise matched after scaling the old mesh by the ratio of the box diagonals (a uniform scale about
 * the origin is all a settings change does). An earlier version is matched as it lies and also with its box
 * centre moved onto the new one (a re-exported model often moves); the placement that keeps more edges wins.
 */
function carryFrom(source: SeamSource, positions: Float64Array, triangles: Uint32Array): { seams: SeamLine[]; note: string } {
  const edges = meshEdges(triangles, positions.length / 3);
  if (source.sameSculpt) {
    if (sameTriangles(source.triangles, triangles)) {
      return { seams: source.seams, note: `all ${source.seams.length} seams kept (the mesh's triangles did not change)` };
    }
    const k = boundingBoxDiagonal(positions) / boundingBoxDiagonal(Float64Array.from(source.positions));
    const carried = carrySeams(Float32Array.from(source.positions, (p) => p * k), source.seams, positions, edges);
    return { seams: carried.seams, note: describeCarry(carried, source.version) };
  }
  const asIs = carrySeams(source.positions, source.seams, positions, edges);
  const [a, b] = [centre(source.positions), centre(positions)];
  const moved = Float32Array.from(source.positions, (p, i) => p + b[i % 3] - a[i % 3]);
  const centred = carrySeams(moved, source.seams, positions, edges);
  const best = centred.edgesKept > asIs.edgesKept ? centred : asIs;
  return { seams: best.seams, note: describeCarry(best, source.version) };
}
