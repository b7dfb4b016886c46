/**
 * For the access walk (tests/server/access.test.ts): a processed sculpt with a stored working mesh, and a
 * request that succeeds on each sculpt route for an allowed caller. The upload route needs a multipart body,
 * so `sculptWalkRequest` returns a function that completes a supertest request.
 */
import { randomUUID } from 'node:crypto';
import type { Test } from 'supertest';
import type { Db } from '../../db/client';
import { sculpts } from '../../db/schema-sculpts';
import { encodeWorkingMesh } from '../../geometry/io/working-mesh';
import { icoSphere } from '../../geometry/shapes';
import { sculptMeshKey, sculptSourceKey } from '../../server/sculpts/sculpt-files';
import type { FileStore } from '../../server/storage/file-store';
import { writeObj } from '../geometry/io/model-writers';

const walkMesh = icoSphere(40, 1);

/** Inserts a done sculpt (version `version`) of the build with its working mesh stored; returns its id. */
export async function insertDoneSculpt(db: Db, files: FileStore, shopId: string, buildId: string, version = 1): Promise<string> {
  const id = randomUUID();
  const source = new TextEncoder().encode(writeObj(walkMesh));
  await files.put(sculptSourceKey(id, 'obj'), source);
  await files.put(sculptMeshKey(id), encodeWorkingMesh(walkMesh.positions, walkMesh.triangles));
  await db.insert(sculpts).values({
    id,
    shopId,
    buildId,
    version,
    fileName: 'walk.obj',
    format: 'obj',
    sourceKey: sculptSourceKey(id, 'obj'),
    sourceBytes: source.length,
    units: 'mm',
    scale: 1,
    targetTriangles: 200_000,
    status: 'done',
    progress: 100,
    stage: 'done',
    meshKey: sculptMeshKey(id),
    finishedAt: new Date(),
  });
  return id;
}

/**
 * Returns how to finish a request to a sculpt route so an allowed caller gets 2xx: the upload attaches an OBJ,
 * PATCH changes the units, PUT seams saves one edge from revision 0 (`persona` keeps seam ids apart). Null for
 * routes outside the sculpt area.
 */
export function sculptWalkRequest(method: string, path: string): ((req: Test) => Test) | null {
  if (!path.includes('/sculpts')) return null;
  const [a, b] = [walkMesh.triangles[0], walkMesh.triangles[1]];
  if (method === 'POST') return (req) => req.field('units', 'mm').attach('file', Buffer.from(writeObj(walkMesh)), 'walk.obj');
  if (method === 'PATCH') return (req) => req.send({ units: 'cm' });
  if (method === 'PUT') return (req) => req.send({ baseRevision: 0, seams: [{ id: 'walk', picks: [a, b], path: [a, b], source: 'picked' }], symmetry: null, stretchBudgetPct: 3 });
  return (req) => req;
}
