/** HTTP routes for a build's sculpt versions: upload, list, read, change settings, working mesh, seams. */
import { z } from 'zod';
import type { Db } from '../../db/client';
import { sculptPatchBody, seamSetPutBody } from '../../db/validation-sculpts';
import { AppError } from '../errors';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { buildParams } from '../http/params';
import type { JobSender } from '../jobs/job-sender';
import type { FileStore } from '../storage/file-store';
import { getSeamSet, MeshEdgeCache, putSeamSet } from './seam-service';
import { listSculpts, patchSculpt, requireSculpt, toSculptView, uploadSculpt } from './service';
import { readModelUpload } from './sculpt-upload';

/** Path of a build's sculpts. */
export const SCULPTS_PATH = '/api/shops/:shopId/builds/:buildId/sculpts';
/** Path of a sculpt's seams; app.ts gives its PUT a larger JSON body limit (paths of many vertices). */
export const SEAMS_PATH = `${SCULPTS_PATH}/:sculptId/seams`;
/** Largest accepted seams body (1,000,000 vertex ids at up to 7 characters and a comma, with room). */
export const SEAMS_BODY_LIMIT = '16mb';

const sculptParams = buildParams.extend({ sculptId: z.string().uuid('must be an id (a UUID such as 3f1c0e52-8a4b-4c1e-9d2a-5b7e6f0a1c23)') });

/**
 * Returns the sculpt routes. `maxUploadBytes` bounds an uploaded model; `jobs` is null when the API runs
 * without a job queue (uploads and settings changes then answer 503).
 */
export function sculptRoutes(deps: { db: Db; files: FileStore; jobs: JobSender | null; maxUploadBytes: number }): MountableRoute[] {
  const { db, files, jobs, maxUploadBytes } = deps;
  const cache = new MeshEdgeCache(8);
  return [
    defineRoute({
      method: 'POST',
      path: SCULPTS_PATH,
      access: { shopRole: 'editor' },
      params: buildParams,
      // The multipart body is read only here, after the access check, so nobody unknown can make the server
      // buffer a large upload.
      handler: async ({ user, shop, params, req, res }) => {
        const upload = await readModelUpload(req, res, maxUploadBytes);
        return { status: 202, json: { sculpt: await uploadSculpt({ db, files, jobs }, user, shop.id, params.buildId, upload) } };
      },
    }),
    defineRoute({
      method: 'GET',
      path: SCULPTS_PATH,
      access: { shopRole: 'viewer' },
      params: buildParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { sculpts: await listSculpts(db, shop.id, params.buildId) } }),
    }),
    defineRoute({
      method: 'GET',
      path: `${SCULPTS_PATH}/:sculptId`,
      access: { shopRole: 'viewer' },
      params: sculptParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { sculpt: toSculptView(await requireSculpt(db, shop.id, params.buildId, params.sculptId)) } }),
    }),
    defineRoute({
      method: 'PATCH',
      path: `${SCULPTS_PATH}/:sculptId`,
      access: { shopRole: 'editor' },
      params: sculptParams,
      body: sculptPatchBody,
      handler: async ({ user, shop, params, body }) => ({
        status: 202,
        json: { sculpt: await patchSculpt({ db, jobs }, user, shop.id, params.buildId, params.sculptId, body) },
      }),
    }),
    defineRoute({
      method: 'GET',
      path: `${SCULPTS_PATH}/:sculptId/mesh`,
      access: { shopRole: 'viewer' },
      params: sculptParams,
      handler: async ({ shop, params, req, res }) => {
        const sculpt = await requireSculpt(db, shop.id, params.buildId, params.sculptId);
        if (sculpt.status !== 'done' || !sculpt.meshKey) {
          throw new AppError('NOT_READY', 409, `Sculpt version ${sculpt.version} is ${sculpt.status}; its working mesh is ready when processing is done`);
        }
        // The mesh changes only when the sculpt is processed again, so its finish time tags the bytes.
        const etag = `"${sculpt.id}-${sculpt.finishedAt?.getTime() ?? 0}"`;
        res.setHeader('ETag', etag);
        res.setHeader('Cache-Control', 'private, no-cache');
        if (req.headers['if-none-match'] === etag) return { status: 304 };
        const file = await files.open(sculpt.meshKey);
        if (!file) throw new AppError('NOT_FOUND', 404, `The working mesh of sculpt version ${sculpt.version} is missing from the file store`);
        return { status: 200, file: { stream: file.stream, sizeBytes: file.sizeBytes, contentType: 'application/octet-stream', fileName: `sculpt-v${sculpt.version}.sswm` } };
      },
    }),
    defineRoute({
      method: 'GET',
      path: SEAMS_PATH,
      access: { shopRole: 'viewer' },
      params: sculptParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { seams: await getSeamSet(db, shop.id, params.buildId, params.sculptId) } }),
    }),
    defineRoute({
      method: 'PUT',
      path: SEAMS_PATH,
      access: { shopRole: 'editor' },
      params: sculptParams,
      body: seamSetPutBody,
      handler: async ({ user, shop, params, body }) => {
        const result = await putSeamSet({ db, files, jobs, cache }, user, shop.id, params.buildId, params.sculptId, body);
        if ('conflict' in result) {
          return {
            status: 409,
            json: {
              error: { code: 'SEAMS_CHANGED', message: `Someone saved these seams in the meantime (now revision ${result.conflict.revision}, your edit started from ${body.baseRevision}); reload them and apply your change again` },
              current: result.conflict,
            },
          };
        }
        return { status: 200, json: result };
      },
    }),
  ];
}
