/** HTTP routes for a build's print sets: create (queued render), list, status, and file download. */
import type { Db } from '../../db/client';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { buildParams } from '../http/params';
import type { JobSender } from '../jobs/job-sender';
import type { FileStore } from '../storage/file-store';
import { printSetCreateBody, printSetFileParams, printSetParams } from './print-set-request';
import { createPrintSet, getPrintSet, listPrintSets, openPrintSetFile } from './service';

/** Path of a build's print sets; app.ts also gives it a larger JSON body limit (a pattern document). */
export const PRINT_SETS_PATH = '/api/shops/:shopId/builds/:buildId/print-sets';

/** Largest accepted create body; bigger ones answer 413 TOO_LARGE before any parsing. */
export const PRINT_SET_BODY_LIMIT = '8mb';

/** Returns the print-set routes. `jobs` is null when the API runs without a job queue (creation then answers 503). */
export function printSetRoutes(deps: { db: Db; files: FileStore; jobs: JobSender | null }): MountableRoute[] {
  const { db, files, jobs } = deps;
  return [
    defineRoute({
      method: 'POST',
      path: PRINT_SETS_PATH,
      access: { shopRole: 'editor' },
      params: buildParams,
      body: printSetCreateBody,
      handler: async ({ user, shop, params, body }) => ({
        status: 202,
        json: { printSet: await createPrintSet(db, jobs, user, shop.id, params.buildId, body) },
      }),
    }),
    defineRoute({
      method: 'GET',
      path: PRINT_SETS_PATH,
      access: { shopRole: 'viewer' },
      params: buildParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { printSets: await listPrintSets(db, shop.id, params.buildId) } }),
    }),
    defineRoute({
      method: 'GET',
      path: `${PRINT_SETS_PATH}/:printSetId`,
      access: { shopRole: 'viewer' },
      params: printSetParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { printSet: await getPrintSet(db, shop.id, params.buildId, params.printSetId) } }),
    }),
    defineRoute({
      method: 'GET',
      path: `${PRINT_SETS_PATH}/:printSetId/files/:fileName`,
      access: { shopRole: 'viewer' },
      params: printSetFileParams,
      handler: async ({ shop, params }) => {
        const { file, contentType, name } = await openPrintSetFile(db, files, shop.id, params.buildId, params.printSetId, params.fileName);
        return { status: 200, file: { stream: file.stream, sizeBytes: file.sizeBytes, contentType, fileName: name } };
      },
    }),
  ];
}
