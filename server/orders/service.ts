/** Order rules for the shop: list the shop's orders, and refund one (through the payment service when paid for). */
import type { Db } from '../../db/client';
import { AppError, notFound } from '../errors';
import type { PaymentGateway } from '../pay/payment-gateway';
import { refundOrderRecord } from './fulfil-order';
import { selectShopOrder, selectShopOrders, type OrderRow } from './queries';

export interface OrderView {
  id: string;
  packTitle?: string;
  packSlug?: string;
  email: string;
  amountCents: number;
  currency: string;
  status: OrderRow['status'];
  createdAt: string;
  paidAt: string | null;
  refundedAt: string | null;
}

function toView(order: OrderRow, pack?: { packTitle: string; packSlug: string }): OrderView {
  return {
    id: order.id,
    ...(pack ?? {}),
    email: order.email,
    amountCents: order.amountCents,
    currency: order.currency,
    status: order.status,
    createdAt: order.createdAt.toISOString(),
    paidAt: order.paidAt?.toISOString() ?? null,
    refundedAt: order.refundedAt?.toISOString() ?? null,
  };
}

/** Returns the shop's orders, newest first. */
export async function listShopOrders(db: Db, shopId: string): Promise<OrderView[]> {
  return (await selectShopOrders(db, shopId)).map((r) => toView(r.order, { packTitle: r.packTitle, packSlug: r.packSlug }));
}

/**
 * Refunds a paid order of the shop: the payment service refunds the payment (free orders have none), then the
 * order is marked refunded and its download links revoked. Throws 404 NOT_FOUND for an unknown order,
 * 409 NOT_PAID when the order is pending or refunded already, 502 when the payment service refuses.
 */
export async function refundShopOrder(db: Db, payments: PaymentGateway | null, shopId: string, orderId: string): Promise<OrderView> {
  const order = await selectShopOrder(db, shopId, orderId);
  if (!order) throw notFound('Order');
  if (order.status !== 'paid') throw new AppError('NOT_PAID', 409, `Order ${orderId} is ${order.status}; only a paid order can be refunded`);
  if (order.amountCents > 0) {
    if (!order.paymentIntentId) throw new AppError('NOT_PAID', 409, `Order ${orderId} has no recorded payment to refund`);
    if (!payments) throw new AppError('PAYMENT_UNAVAILABLE', 503, 'Payments are not set up on this server, so the refund cannot be made');
    await payments.refund(order.paymentIntentId);
  }
  // The provider's charge.refunded event may have done this already; then the order is read as it stands.
  const done = await db.transaction((tx) => refundOrderRecord(tx, orderId));
  return toView(done?.order ?? (await selectShopOrder(db, shopId, orderId))!);
}
