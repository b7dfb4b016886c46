/** HTTP routes for creating and reading shops. */
import type { Db } from '../../db/client';
import { shopCreateBody } from '../../db/validation';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { shopParams } from '../http/params';
import { createShop, describeShop } from './service';

/** Returns the shop routes. */
export function shopRoutes(db: Db): MountableRoute[] {
  return [
    defineRoute({
      method: 'POST',
      path: '/api/shops',
      access: 'signedIn',
      body: shopCreateBody,
      handler: async ({ user, body }) => ({ status: 201, json: await createShop(db, user, body) }),
    }),
    defineRoute({
      method: 'GET',
      path: '/api/shops/:shopId',
      access: { shopRole: 'viewer' },
      params: shopParams,
      handler: async ({ user, shop }) => ({ status: 200, json: await describeShop(db, user, shop) }),
    }),
  ];
}
