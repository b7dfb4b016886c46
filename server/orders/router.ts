/** HTTP routes for a shop's pack orders: the list and the refund. */
import { z } from 'zod';
import type { Db } from '../../db/client';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { shopParams } from '../http/params';
import type { PaymentGateway } from '../pay/payment-gateway';
import { listShopOrders, refundShopOrder } from './service';

const orderParams = z.object({ shopId: shopParams.shape.shopId, orderId: z.string().uuid('must be an order id (a UUID)') });

/** Returns the order routes; `payments` null means refunds of paid orders answer 503. */
export function orderRoutes(deps: { db: Db; payments: PaymentGateway | null }): MountableRoute[] {
  return [
    defineRoute({
      method: 'GET',
      path: '/api/shops/:shopId/orders',
      access: { shopRole: 'owner' },
      params: shopParams,
      handler: async ({ shop }) => ({ status: 200, json: { orders: await listShopOrders(deps.db, shop.id) } }),
    }),
    defineRoute({
      method: 'POST',
      path: '/api/shops/:shopId/orders/:orderId/refund',
      access: { shopRole: 'owner' },
      params: orderParams,
      handler: async ({ shop, params }) => ({ status: 200, json: { order: await refundShopOrder(deps.db, deps.payments, shop.id, params.orderId) } }),
    }),
  ];
}
