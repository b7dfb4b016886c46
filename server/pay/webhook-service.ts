/**
 * Acting on the payment provider's events. Each event id is recorded in payment_events in the same
 * transaction as its effect, so a replayed event fulfils once; a second, different event for a session whose
 * order is already paid changes nothing either (the order is no longer pending).
 */
import { eq } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import { packs } from '../../db/schema-packs';
import { issueDownloadLink, refundOrderRecord, sendReceipt, type FulfilSettings, type PendingReceipt } from '../orders/fulfil-order';
import { claimPaymentEvent, markSessionOrderPaid, selectOrderByIntent } from '../orders/queries';
import type { PackMailer } from '../packs/pack-mails';
import type { PaymentEvent } from './payment-gateway';

/** What an event did, for the answer to the provider and for tests. */
export type EventOutcome = 'replayed' | 'fulfilled' | 'no-pending-order' | 'refunded' | 'not-paid' | 'no-order' | 'ignored';

/** Applies a verified event and returns what it did. Receipts are mailed after the transaction commits. */
export async function handlePaymentEvent(
  deps: { db: Db; mailer: PackMailer | null; settings: FulfilSettings; logger: Logger },
  event: PaymentEvent,
): Promise<EventOutcome> {
  const typeName = event.type === 'other' ? event.eventType : event.type;
  let receipt: PendingReceipt | null = null;
  const outcome = await deps.db.transaction(async (tx): Promise<EventOutcome> => {
    if (!(await claimPaymentEvent(tx, event.id, typeName))) return 'replayed';
    if (event.type === 'checkout.session.completed') {
      if (!event.paid) return 'not-paid';
      const order = await markSessionOrderPaid(tx, event.sessionId, event.orderId, event.paymentIntentId);
      if (!order) return 'no-pending-order';
      receipt = await issueDownloadLink(tx, order, deps.settings);
      return 'fulfilled';
    }
    if (event.type === 'charge.refunded') {
      const order = event.paymentIntentId ? await selectOrderByIntent(tx, event.paymentIntentId) : null;
      if (!order) return 'no-order';
      await refundOrderRecord(tx, order.id);
      return 'refunded';
    }
    return 'ignored';
  });
  const paid = receipt as PendingReceipt | null;
  if (paid) {
    const [pack] = await deps.db
      .select({ title: packs.title })
      .from(packs)
      .where(eq(packs.id, paid.order.packId));
    await sendReceipt(deps.mailer, deps.logger, deps.settings, paid, pack);
  }
  deps.logger.info({ eventId: event.id, type: typeName, outcome }, 'payment event');
  return outcome;
}
