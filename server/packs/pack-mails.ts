/**
 * What packs show and send besides the mail templates (server/mail/templates/): the price label and the
 * workshop cautions carried on every pack page and download page.
 */
import { formatAmount } from '../mail/templates/receipt-mail';

/** What packs need of a mailer: server/mail/send-mail.ts's Mailer has this shape. */
export type { Mailer as PackMailer } from '../mail/send-mail';

/** Returns "12.50 EUR" (ISO 4217 minor units), or "free" for 0. */
export function priceLabel(cents: number, currency: string): string {
  return cents === 0 ? 'free' : formatAmount(cents, currency);
}

/** The workshop cautions every pack carries (common practice; the adhesive maker's data sheet comes first). */
export const FOAM_CAUTIONS =
  'Working foam safely: use contact cement and heat guns only with good ventilation and a respirator rated for ' +
  'organic vapours, wear eye protection, keep hot tools on a heat-resistant surface, and cut away from your hand ' +
  'with a sharp blade. Follow the adhesive maker\u2019s safety data sheet and your local rules.';
