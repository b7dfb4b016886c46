/** HTTP route for the bench view of a build (one call for the phone at the bench). */
import type { Db } from '../../db/client';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { buildParams } from '../http/params';
import { getBench } from './service';

/** Returns the bench route. */
export function benchRoutes(db: Db): MountableRoute[] {
  return [
    defineRoute({
      method: 'GET',
      path: '/api/shops/:shopId/builds/:buildId/bench',
      access: { shopRole: 'viewer' },
      params: buildParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { bench: await getBench(db, shop.id, params.buildId) } }),
    }),
  ];
}
