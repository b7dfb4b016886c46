/** HTTP route for reading a shop's audit trail. */
import type { Db } from '../../db/client';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { shopParams } from '../http/params';
import { listShopAudit } from './service';

/** Returns the audit routes. */
export function auditRoutes(db: Db): MountableRoute[] {
  return [
    defineRoute({
      method: 'GET',
      path: '/api/shops/:shopId/audit',
      access: { shopRole: 'owner' },
      params: shopParams,
      handler: async ({ shop }) => ({ status: 200, json: { entries: await listShopAudit(db, shop.id) } }),
    }),
  ];
}
