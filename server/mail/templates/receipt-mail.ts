/** The receipt for a pattern pack (bought or taken free): what, how much, and the download link with its limits. */
import type { MailContent } from '../send-mail';
import { layoutHtml, layoutText, type MailLayout } from './mail-layout';

export interface ReceiptMailInput {
  packTitle: string;
  /** Amount paid in the currency's minor unit (cents); 0 for a free pack. */
  amountCents: number;
  /** ISO 4217 code, any case (e.g. "eur"). */
  currency: string;
  downloadUrl: string;
  expiresAt: Date;
  /** How many times the link may be used. */
  maxUses: number;
  /** The order's id, quoted so the buyer can refer to it. */
  orderId: string;
}

/**
 * Returns the amount as "12.50 EUR" for a two-decimal currency. ISO 4217 gives most currencies two minor-unit
 * digits; the few without (JPY, KRW and others) are listed so they are not shown as hundredths.
 */
export function formatAmount(amountCents: number, currency: string): string {
  const code = currency.toUpperCase();
  const zeroDecimal = new Set(['BIF', 'CLP', 'DJF', 'GNF', 'ISK', 'JPY', 'KMF', 'KRW', 'PYG', 'RWF', 'UGX', 'VND', 'VUV', 'XAF', 'XOF', 'XPF']);
  return zeroDecimal.has(code) ? `${amountCents} ${code}` : `${(amountCents / 100).toFixed(2)} ${code}`;
}

/** Returns the subject and the text and HTML parts of a receipt with its download link. */
export function receiptMail(input: ReceiptMailInput): MailContent {
  const paid = input.amountCents === 0 ? 'This pack is free; nothing was charged.' : `Amount paid: ${formatAmount(input.amountCents, input.currency)}.`;
  const layout: MailLayout = {
    heading: `Your pattern pack: ${input.packTitle}`,
    paragraphs: [`Thank you. ${paid}`, `Order reference: ${input.orderId}.`],
    action: { label: 'Download the pattern files', url: input.downloadUrl },
    after: [
      `The link works ${input.maxUses} time${input.maxUses === 1 ? '' : 's'}, until ${input.expiresAt.toUTCString()}. Save the files once you have them.`,
      'Print the pages at 100 % (no "fit to page") and check the scale square with a ruler before you cut.',
      'Working foam: use blades with care, and with heat guns and contact cement follow the adhesive maker\'s safety data sheet and local rules (ventilation, a respirator for organic vapours, eye protection).',
    ],
  };
  return { subject: `Receipt and download: ${input.packTitle}`, text: layoutText(layout), html: layoutHtml(layout) };
}
