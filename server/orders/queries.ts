/** Drizzle queries for orders, their download links and the payment events already handled. */
import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { downloadLinks, orders, packs, paymentEvents } from '../../db/schema-packs';

export type OrderRow = typeof orders.$inferSelect;

/** Inserts an order and returns it. */
export async function insertOrder(db: DbExecutor, row: typeof orders.$inferInsert): Promise<OrderRow> {
  const [inserted] = await db.insert(orders).values(row).returning();
  return inserted;
}

/** Records the checkout session opened for an order. */
export async function setOrderSession(db: DbExecutor, orderId: string, sessionId: string): Promise<void> {
  await db.update(orders).set({ checkoutSessionId: sessionId }).where(eq(orders.id, orderId));
}

/**
 * Records provider event `id` as handled; returns false when it was already recorded (a replay). Run inside
 * the transaction that acts on the event, so a failed action leaves the event free to be retried.
 */
export async function claimPaymentEvent(db: DbExecutor, id: string, type: string): Promise<boolean> {
  const rows = await db.insert(paymentEvents).values({ id, type }).onConflictDoNothing().returning({ id: paymentEvents.id });
  return rows.length > 0;
}

/**
 * Marks the pending order with checkout session `sessionId` paid and returns it. When no order has that session
 * (the server stopped between opening the session and recording it), the pending order `orderId` from the
 * session's metadata is taken if it has no session yet, and the session is recorded on it. Returns null when
 * there is no such order or it is no longer pending (already paid by an earlier event, or refunded).
 */
export async function markSessionOrderPaid(db: DbExecutor, sessionId: string, orderId: string | null, paymentIntentId: string | null): Promise<OrderRow | null> {
  const paid = { status: 'paid' as const, paidAt: sql`now()`, paymentIntentId, checkoutSessionId: sessionId };
  const rows = await db
    .update(orders)
    .set(paid)
    .where(and(eq(orders.checkoutSessionId, sessionId), eq(orders.status, 'pending')))
    .returning();
  if (rows[0]) return rows[0];
  if (!orderId || !UUID.test(orderId)) return null;
  const [bySession] = await db.select({ id: orders.id }).from(orders).where(eq(orders.checkoutSessionId, sessionId));
  if (bySession) return null;
  const fallback = await db
    .update(orders)
    .set(paid)
    .where(and(eq(orders.id, orderId), isNull(orders.checkoutSessionId), eq(orders.status, 'pending')))
    .returning();
  return fallback[0] ?? null;
}

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Marks a paid order refunded and returns it; null when it is not paid (pending, or refunded already). */
export async function markOrderRefunded(db: DbExecutor, orderId: string): Promise<OrderRow | null> {
  const rows = await db
    .update(orders)
    .set({ status: 'refunded', refundedAt: sql`now()` })
    .where(and(eq(orders.id, orderId), eq(orders.status, 'paid')))
    .returning();
  return rows[0] ?? null;
}

/** Returns the order paid through `paymentIntentId`, or null. */
export async function selectOrderByIntent(db: DbExecutor, paymentIntentId: string): Promise<OrderRow | null> {
  const rows = await db.select().from(orders).where(eq(orders.paymentIntentId, paymentIntentId));
  return rows[0] ?? null;
}

/** Returns one order of a pack of the shop, or null. */
export async function selectShopOrder(db: DbExecutor, shopId: string, orderId: string): Promise<OrderRow | null> {
  const rows = await db
    .select({ order: orders })
    .from(orders)
    .innerJoin(packs, eq(packs.id, orders.packId))
    .where(and(eq(packs.shopId, shopId), eq(orders.id, orderId)));
  return rows[0]?.order ?? null;
}

/** Returns the shop's orders, newest first, with the pack's title and slug (at most `limit`). */
export function selectShopOrders(db: DbExecutor, shopId: string, limit = 500) {
  return db
    .select({ order: orders, packTitle: packs.title, packSlug: packs.slug })
    .from(orders)
    .innerJoin(packs, eq(packs.id, orders.packId))
    .where(eq(packs.shopId, shopId))
    .orderBy(desc(orders.createdAt), desc(orders.id))
    .limit(limit);
}

/** Inserts a download link for an order. */
export async function insertDownloadLink(db: DbExecutor, row: typeof downloadLinks.$inferInsert): Promise<void> {
  await db.insert(downloadLinks).values(row);
}

/** Revokes every link of the order not revoked yet; returns how many. */
export async function revokeOrderLinks(db: DbExecutor, orderId: string): Promise<number> {
  const rows = await db
    .update(downloadLinks)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(downloadLinks.orderId, orderId), isNull(downloadLinks.revokedAt)))
    .returning({ id: downloadLinks.id });
  return rows.length;
}
