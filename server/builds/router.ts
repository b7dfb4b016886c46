/** HTTP routes for a shop's builds. */
import type { Db } from '../../db/client';
import { buildCreateBody, buildRenameBody } from '../../db/validation';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { buildParams, shopParams } from '../http/params';
import type { FileStore } from '../storage/file-store';
import { getBuildOverview } from './build-overview';
import { createBuild, getBuild, listBuilds, removeBuild, renameBuild } from './service';

export interface BuildRouteDeps {
  db: Db;
  /** Where print-set files are kept; deleting a build removes its print sets' files from here. */
  files: FileStore;
}

/** Returns the build routes. */
export function buildRoutes({ db, files }: BuildRouteDeps): MountableRoute[] {
  return [
    defineRoute({
      method: 'GET',
      path: '/api/shops/:shopId/builds',
      access: { shopRole: 'viewer' },
      params: shopParams,
      handler: async ({ shop }) => ({ status: 200, json: { builds: await listBuilds(db, shop.id) } }),
    }),
    defineRoute({
      method: 'POST',
      path: '/api/shops/:shopId/builds',
      access: { shopRole: 'editor' },
      params: shopParams,
      body: buildCreateBody,
      handler: async ({ user, shop, body }) => ({ status: 201, json: { build: await createBuild(db, user, shop.id, body.name) } }),
    }),
    defineRoute({
      method: 'GET',
      path: '/api/shops/:shopId/builds/:buildId',
      access: { shopRole: 'viewer' },
      params: buildParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { build: await getBuild(db, shop.id, params.buildId) } }),
    }),
    defineRoute({
      method: 'GET',
      path: '/api/shops/:shopId/builds/:buildId/overview',
      access: { shopRole: 'viewer' },
      params: buildParams,
      handler: async ({ user, shop, params }) => ({ status: 200, json: { overview: await getBuildOverview(db, user, shop, params.buildId) } }),
    }),
    defineRoute({
      method: 'PATCH',
      path: '/api/shops/:shopId/builds/:buildId',
      access: { shopRole: 'editor' },
      params: buildParams,
      body: buildRenameBody,
      handler: async ({ user, shop, params, body }) => ({
        status: 200,
        json: { build: await renameBuild(db, user, shop.id, params.buildId, body.name) },
      }),
    }),
    defineRoute({
      method: 'DELETE',
      path: '/api/shops/:shopId/builds/:buildId',
      access: { shopRole: 'owner' },
      params: buildParams,
      handler: async ({ user, shop, params, req }) => {
        await removeBuild(db, files, req.log, user, shop.id, params.buildId);
        return { status: 204 };
      },
    }),
  ];
}
