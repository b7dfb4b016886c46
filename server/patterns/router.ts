/** HTTP routes for a build's pattern: the newest one, making it again, and its per-face file for the 3D view. */
import { z } from 'zod';
import type { Db } from '../../db/client';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { buildParams } from '../http/params';
import type { JobSender } from '../jobs/job-sender';
import type { FileStore } from '../storage/file-store';
import { getBuildPattern, openPatternFaces, remakeBuildPattern } from './service';

const BUILD_PATH = '/api/shops/:shopId/builds/:buildId';

const patternParams = buildParams.extend({ patternId: z.string().uuid('must be an id (a UUID such as 3f1c0e52-8a4b-4c1e-9d2a-5b7e6f0a1c23)') });

/** Returns the pattern routes. `jobs` is null when the API runs without a job queue (making one then answers 503). */
export function patternRoutes(deps: { db: Db; files: FileStore; jobs: JobSender | null }): MountableRoute[] {
  const { db, files, jobs } = deps;
  return [
    defineRoute({
      method: 'GET',
      path: `${BUILD_PATH}/pattern`,
      access: { shopRole: 'viewer' },
      params: buildParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { pattern: await getBuildPattern(db, shop.id, params.buildId) } }),
    }),
    defineRoute({
      method: 'POST',
      path: `${BUILD_PATH}/pattern`,
      access: { shopRole: 'editor' },
      params: buildParams,
      handler: async ({ shop, params }) => ({ status: 202, json: { pattern: await remakeBuildPattern(db, jobs, shop.id, params.buildId) } }),
    }),
    defineRoute({
      method: 'GET',
      path: `${BUILD_PATH}/patterns/:patternId/faces`,
      access: { shopRole: 'viewer' },
      params: patternParams,
      handler: async ({ shop, params }) => {
        const file = await openPatternFaces(db, files, shop.id, params.buildId, params.patternId);
        return { status: 200, file: { stream: file.stream, sizeBytes: file.sizeBytes, contentType: 'application/octet-stream', fileName: 'faces.bin' } };
      },
    }),
  ];
}
