/**
 * Fulfilling and refunding orders: a paid order gets one download link (random token, SHA-256 stored, expiry
 * and use limit from the settings) and a receipt e-mail carrying the link; a refunded order loses its links.
 * Used by the webhook (paid packs), by checkout (free packs) and by the refund route.
 */
import type { Logger } from 'pino';
import type { DbExecutor } from '../../db/client';
import { newDownloadToken } from '../downloads/download-token';
import { receiptMail } from '../mail/templates/receipt-mail';
import type { PackMailer } from '../packs/pack-mails';
import { insertDownloadLink, markOrderRefunded, revokeOrderLinks, type OrderRow } from './queries';

export interface FulfilSettings {
  /** Origin of the web app, for the link in the e-mail (no trailing slash). */
  publicUrl: string;
  linkHours: number;
  linkMaxUses: number;
}

/** What the receipt needs once the transaction that paid the order has committed. */
export interface PendingReceipt {
  order: OrderRow;
  token: string;
  expiresAt: Date;
  maxUses: number;
}

/** Creates the download link of a just-paid order inside the caller's transaction; returns what the receipt needs. */
export async function issueDownloadLink(tx: DbExecutor, order: OrderRow, settings: FulfilSettings, now = new Date()): Promise<PendingReceipt> {
  const { token, hash } = newDownloadToken();
  const expiresAt = new Date(now.getTime() + settings.linkHours * 3_600_000);
  await insertDownloadLink(tx, { orderId: order.id, tokenHash: hash, expiresAt, maxUses: settings.linkMaxUses });
  return { order, token, expiresAt, maxUses: settings.linkMaxUses };
}

/** Returns the link a buyer follows for `token`. */
export function downloadPageUrl(publicUrl: string, token: string): string {
  return `${publicUrl}/downloads/${token}`;
}

/**
 * Sends the receipt for `receipt`. A mail failure is logged, not thrown: the order is paid either way, the
 * failure is on record in sent_mail, and the payment provider must not be told to retry a payment that
 * went through.
 */
export async function sendReceipt(
  mailer: PackMailer | null,
  logger: Logger,
  settings: FulfilSettings,
  receipt: PendingReceipt,
  pack: { title: string },
): Promise<boolean> {
  if (!mailer) {
    logger.error({ orderId: receipt.order.id }, 'no mailer configured: the receipt e-mail was not sent');
    return false;
  }
  const content = receiptMail({
    packTitle: pack.title,
    amountCents: receipt.order.amountCents,
    currency: receipt.order.currency,
    downloadUrl: downloadPageUrl(settings.publicUrl, receipt.token),
    expiresAt: receipt.expiresAt,
    maxUses: receipt.maxUses,
    orderId: receipt.order.id,
  });
  try {
    await mailer.send({ kind: 'receipt', to: receipt.order.email, ...content, detail: { orderId: receipt.order.id } });
    return true;
  } catch (err) {
    logger.error({ err, orderId: receipt.order.id }, 'the receipt e-mail could not be sent');
    return false;
  }
}

/** Marks a paid order refunded and revokes its links, in the caller's transaction; null when it was not paid. */
export async function refundOrderRecord(tx: DbExecutor, orderId: string): Promise<{ order: OrderRow; revoked: number } | null> {
  const order = await markOrderRefunded(tx, orderId);
  if (!order) return null;
  return { order, revoked: await revokeOrderLinks(tx, orderId) };
}
