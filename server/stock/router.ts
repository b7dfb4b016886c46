/** HTTP routes for a shop's stock sheets. */
import type { Db } from '../../db/client';
import { stockReplaceBody } from '../../db/validation-bench';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { shopParams } from '../http/params';
import { listStock, replaceStock } from './service';

const STOCK_PATH = '/api/shops/:shopId/stock';

/** Returns the stock routes. */
export function stockRoutes(db: Db): MountableRoute[] {
  return [
    defineRoute({
      method: 'GET',
      path: STOCK_PATH,
      access: { shopRole: 'viewer' },
      params: shopParams,
      handler: async ({ shop }) => ({ status: 200, json: { stock: await listStock(db, shop.id) } }),
    }),
    defineRoute({
      method: 'PUT',
      path: STOCK_PATH,
      access: { shopRole: 'editor' },
      params: shopParams,
      body: stockReplaceBody,
      handler: async ({ shop, body }) => ({ status: 200, json: { stock: await replaceStock(db, shop.id, body) } }),
    }),
  ];
}
