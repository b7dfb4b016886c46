/**
 * Seam sets: read, and save with a revision check, after checking every seam against the sculpt's working
 * mesh (vertex ids in range, consecutive path vertices joined by a mesh edge, picks on the path in order).
 * The mesh's edge lookup is cached per sculpt and processing run in a small least-recently-used map, so a
 * studio saving every few seconds does not re-read the mesh file.
 */
import type { Db } from '../../db/client';
import type { SeamLine, SymmetryPlane } from '../../db/schema-sculpts';
import type { SeamSetPutBody } from '../../db/validation-sculpts';
import { decodeWorkingMesh } from '../../geometry/io/working-mesh';
import { AppError, type FieldErrors } from '../errors';
import type { SessionUser } from '../http/define-route';
import type { JobSender } from '../jobs/job-sender';
import { queuePattern } from '../patterns/queue-pattern';
import type { FileStore } from '../storage/file-store';
import { meshEdges, type MeshEdges } from './mesh-edges';
import { saveSeamSet, selectSeamSet, type SculptRow, type SeamSetRow } from './queries';
import { readStoredBytes } from '../storage/read-stored-bytes';
import { requireSculpt } from './service';

export interface SeamSetView {
  sculptId: string;
  revision: number;
  seams: SeamLine[];
  symmetry: SymmetryPlane | null;
  stretchBudgetPct: number;
  updatedAt: string | null;
  updatedBy: string | null;
}

/** Stretch budget of a sculpt nobody has saved seams for (DESIGN.md's `pattern` command default). */
export const DEFAULT_STRETCH_BUDGET_PCT = 3;

function toView(sculptId: string, row: SeamSetRow | null): SeamSetView {
  if (!row) return { sculptId, revision: 0, seams: [], symmetry: null, stretchBudgetPct: DEFAULT_STRETCH_BUDGET_PCT, updatedAt: null, updatedBy: null };
  return {
    sculptId,
    revision: row.revision,
    seams: row.seams,
    symmetry: row.symmetry ?? null,
    stretchBudgetPct: row.stretchBudgetPct,
    updatedAt: row.updatedAt.toISOString(),
    updatedBy: row.updatedBy,
  };
}

/** A least-recently-used map of mesh edge lookups, keyed by sculpt id and processing run. */
export class MeshEdgeCache {
  private readonly entries = new Map<string, MeshEdges>();
  constructor(private readonly capacity = 8) {}

  /** Returns the cached lookup for `key`, loading (and caching) it with `load` when absent. */
  async get(key: string, load: () => Promise<MeshEdges>): Promise<MeshEdges> {
    const hit = this.entries.get(key);
    if (hit) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    const loaded = await load();
    this.entries.set(key, loaded);
    while (this.entries.size > this.capacity) this.entries.delete(this.entries.keys().next().value as string);
    return loaded;
  }
}

/** Returns the seams of a sculpt (revision 0 and none when never saved); 404 NOT_FOUND for an unknown sculpt. */
export async function getSeamSet(db: Db, shopId: string, buildId: string, sculptId: string): Promise<SeamSetView> {
  await requireSculpt(db, shopId, buildId, sculptId);
  return toView(sculptId, await selectSeamSet(db, sculptId));
}

/**
 * Returns field errors for seams that do not lie on the mesh, keyed like "seams.2.path.15", each message
 * naming the seam and the bad vertex; an empty object when all are good.
 */
export function checkSeamsOnMesh(seams: readonly SeamLine[], edges: MeshEdges): FieldErrors {
  const errors: FieldErrors = {};
  const V = edges.vertexCount;
  seams.forEach((seam, i) => {
    const name = `seam "${seam.id}" (number ${i + 1})`;
    const badPick = seam.picks.findIndex((v) => v >= V);
    if (badPick >= 0) {
      errors[`seams.${i}.picks.${badPick}`] = `${name}: picked vertex ${seam.picks[badPick]} is not a vertex of the working mesh, which has ${V} (0 to ${V - 1})`;
      return;
    }
    for (let k = 0; k < seam.path.length; k++) {
      if (seam.path[k] >= V) {
        errors[`seams.${i}.path.${k}`] = `${name}: path vertex ${seam.path[k]} (position ${k}) is not a vertex of the working mesh, which has ${V} (0 to ${V - 1})`;
        return;
      }
      if (k > 0 && !edges.hasEdge(seam.path[k - 1], seam.path[k])) {
        errors[`seams.${i}.path.${k}`] = `${name}: path vertices ${seam.path[k - 1]} and ${seam.path[k]} (positions ${k - 1} and ${k}) are not joined by a mesh edge`;
        return;
      }
    }
    if (seam.path[0] !== seam.picks[0] || seam.path[seam.path.length - 1] !== seam.picks[seam.picks.length - 1]) {
      errors[`seams.${i}.path`] = `${name}: the path must run from the first picked vertex (${seam.picks[0]}) to the last (${seam.picks[seam.picks.length - 1]})`;
      return;
    }
    let at = 0;
    for (let p = 0; p < seam.picks.length; p++) {
      while (at < seam.path.length && seam.path[at] !== seam.picks[p]) at++;
      if (at === seam.path.length) {
        errors[`seams.${i}.picks.${p}`] = `${name}: picked vertex ${seam.picks[p]} (pick ${p + 1}) is not on the path after the picks before it`;
        return;
      }
    }
  });
  return errors;
}

async function edgesOf(files: FileStore, cache: MeshEdgeCache, sculpt: SculptRow): Promise<MeshEdges> {
  const key = `${sculpt.id}@${sculpt.finishedAt?.getTime() ?? 0}`;
  return cache.get(key, async () => {
    const bytes = sculpt.meshKey ? await readStoredBytes(files, sculpt.meshKey) : null;
    if (!bytes) throw new AppError('NOT_READY', 409, `The working mesh of sculpt version ${sculpt.version} is missing; process the sculpt again`);
    const mesh = decodeWorkingMesh(bytes);
    return meshEdges(mesh.triangles, mesh.positions.length / 3);
  });
}

/**
 * Saves the seams as the next revision and queues a pattern from them. Throws 404 NOT_FOUND, 409 NOT_READY
 * while the sculpt is not processed, 400 VALIDATION (per seam) for seams off the mesh, 409 SEAMS_CHANGED with
 * the current set when `baseRevision` is not the stored revision.
 */
export async function putSeamSet(
  deps: { db: Db; files: FileStore; jobs: JobSender | null; cache: MeshEdgeCache },
  user: SessionUser,
  shopId: string,
  buildId: string,
  sculptId: string,
  body: SeamSetPutBody,
): Promise<{ seams: SeamSetView } | { conflict: SeamSetView }> {
  const { db, files, jobs, cache } = deps;
  const sculpt = await requireSculpt(db, shopId, buildId, sculptId);
  if (sculpt.status !== 'done') {
    throw new AppError('NOT_READY', 409, `Sculpt version ${sculpt.version} is ${sculpt.status}; seams can be saved once its processing is done`);
  }
  const edges = await edgesOf(files, cache, sculpt);
  const errors = checkSeamsOnMesh(body.seams, edges);
  const bad = Object.keys(errors);
  if (bad.length > 0) {
    throw new AppError('VALIDATION', 400, `${bad.length} seam${bad.length === 1 ? '' : 's'} do not follow the mesh: ${errors[bad[0]]}`, errors);
  }
  const saved = await saveSeamSet(db, shopId, sculptId, body.baseRevision, {
    seams: body.seams,
    symmetry: body.symmetry,
    stretchBudgetPct: body.stretchBudgetPct,
    updatedBy: user.id,
  });
  if (!saved) return { conflict: toView(sculptId, await selectSeamSet(db, sculptId)) };
  await queuePattern(db, jobs, { shopId, buildId, sculptId });
  return { seams: toView(sculptId, saved) };
}
