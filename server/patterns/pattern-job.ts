/**
 * The worker side of a pattern: claim the row, stop if a newer save superseded it, load the working mesh and
 * seams, run the engine (preparePieces, then the pattern with the build's piece settings), store the document
 * and the faces file. Seams the engine cannot flatten end as status `failed` with the engine's message; the
 * job itself completes, since running it again would fail the same way.
 */
import { z } from 'zod';
import type { SeamLine } from '../../db/schema-sculpts';
import { isGeometryError } from '../../geometry/errors';
import { decodeWorkingMesh } from '../../geometry/io/working-mesh';
import type { ImportedModel } from '../../geometry/mesh/tri-mesh';
import { encodePatternFaces } from '../../geometry/pattern/pattern-faces-file';
import { patternWithPieceSettings } from '../../geometry/pattern/piece-settings';
import { preparePieces } from '../../geometry/pattern/prepare-pieces';
import type { JobContext } from '../jobs/job-types';
import { selectSeamSet } from '../sculpts/queries';
import type { PatternSettings } from './pattern-settings';
import {
  claimPattern,
  hasNewerPattern,
  markPatternDone,
  markPatternFailed,
  selectSculptForPattern,
  setPatternProgress,
} from './queries';
import { readStoredBytes } from '../storage/read-stored-bytes';

/** Message stored on a pattern a newer save made pointless before it ran. */
export const PATTERN_SUPERSEDED = 'superseded by a newer seam save';

/** Message stored on a pattern that failed for a reason other than the sculpt or its seams. */
export const PATTERN_INTERNAL_FAILURE = 'the pattern could not be made because of a server error; it has been logged, try again later';

/** Key of a pattern's faces file in the file store. */
export function patternFacesKey(patternId: string): string {
  return `patterns/${patternId}/faces.bin`;
}

const jobData = z.object({ patternId: z.string().uuid() });

/** The engine's words for a file without `l` lines, said in the app's terms (seams come from the studio here). */
const NO_SEAMS_NOTE = /^the file has no seam lines/;

/**
 * Returns the imported model of a working mesh (positions mm) with the seams' vertex paths as seam polylines,
 * as the engine reads an OBJ's `l` lines. Paths of fewer than two vertices mark nothing and are left out.
 */
export function modelWithSeams(mesh: { positions: Float32Array; triangles: Uint32Array }, seams: readonly SeamLine[]): ImportedModel {
  return {
    mesh: { positions: Float64Array.from(mesh.positions), triangles: mesh.triangles },
    faceTags: new Uint32Array(mesh.triangles.length / 3),
    tagNames: [''],
    seamPolylines: seams.filter((s) => s.path.length >= 2).map((s) => Uint32Array.from(s.path)),
    cornerUVs: null,
    notes: [],
  };
}

/**
 * Runs one pattern-build job for `data` = { patternId }. Resolves to a short summary for the queue's record.
 * Throws (so the queue records the job as failed and may retry) only for failures outside the engine, such as
 * an unreadable file store; the pattern is then marked failed with PATTERN_INTERNAL_FAILURE.
 */
export async function runPatternJob({ db, files }: JobContext, data: unknown): Promise<Record<string, unknown>> {
  const parsed = jobData.safeParse(data);
  if (!parsed.success) throw new Error(`pattern-build job data must be { patternId: <uuid> }, got ${JSON.stringify(data)}`);
  const id = parsed.data.patternId;
  const row = await claimPattern(db, id);
  if (!row) return { patternId: id, skipped: 'gone or already finished' };
  if (await hasNewerPattern(db, row)) {
    await markPatternFailed(db, id, PATTERN_SUPERSEDED);
    return { patternId: id, status: 'failed', superseded: true };
  }
  try {
    const sculpt = await selectSculptForPattern(db, row.shopId, row.buildId, row.sculptId);
    if (!sculpt?.meshKey) {
      await markPatternFailed(db, id, 'the sculpt has no working mesh yet; wait until its processing is done');
      return { patternId: id, status: 'failed', reason: 'no working mesh' };
    }
    const bytes = await readStoredBytes(files, sculpt.meshKey);
    if (!bytes) throw new Error(`working mesh ${sculpt.meshKey} of sculpt ${sculpt.id} is missing from the file store`);
    const seamSet = await selectSeamSet(db, row.sculptId);
    const settings = row.settings as unknown as PatternSettings;

    let result;
    try {
      const model = modelWithSeams(decodeWorkingMesh(bytes), seamSet?.seams ?? []);
      await setPatternProgress(db, id, 15, 'splitting');
      const prepared = preparePieces(model, { seams: 'obj', stretchBudgetPct: settings.stretchBudgetPct });
      prepared.warnings = prepared.warnings.map((w) => (NO_SEAMS_NOTE.test(w) ? "no seams are marked yet; the pieces follow the sculpt's open edges" : w));
      await setPatternProgress(db, id, 35, 'flattening');
      result = patternWithPieceSettings(prepared, { stretchBudgetPct: settings.stretchBudgetPct }, settings.pieces ?? {});
      if (result.faces.pieceIndex.length !== model.mesh.triangles.length / 3) {
        // Cleaning dropped faces of the working mesh, so face numbers no longer match the 3D view's.
        result.doc.warnings.push(
          `the stretch map is not available: cleaning changed the working mesh from ${model.mesh.triangles.length / 3} to ${result.faces.pieceIndex.length} faces`,
        );
        result = { doc: result.doc, faces: { pieceIndex: new Int32Array(model.mesh.triangles.length / 3).fill(-1), stretchPct: new Float32Array(model.mesh.triangles.length / 3) } };
      }
    } catch (err) {
      if (isGeometryError(err)) {
        await markPatternFailed(db, id, err.message);
        return { patternId: id, status: 'failed', code: err.code };
      }
      throw err;
    }
    await setPatternProgress(db, id, 90, 'saving');
    const facesKey = patternFacesKey(id);
    await files.put(facesKey, encodePatternFaces(result.faces));
    if (!(await markPatternDone(db, id, { doc: result.doc, facesKey, seamRevision: seamSet?.revision ?? row.seamRevision }))) {
      await files.removePrefix(`patterns/${id}`);
      return { patternId: id, skipped: 'deleted while it was made' };
    }
    return { patternId: id, status: 'done', pieces: result.doc.pieces.length, seams: result.doc.seams.length };
  } catch (err) {
    await markPatternFailed(db, id, PATTERN_INTERNAL_FAILURE);
    throw err;
  }
}
