/** The note to a shop owner that one of their pattern packs is now public in the catalogue. */
import type { MailContent } from '../send-mail';
import { formatAmount } from './receipt-mail';
import { layoutHtml, layoutText, type MailLayout } from './mail-layout';

export interface PackPublishedMailInput {
  packTitle: string;
  shopName: string;
  /** Price in the currency's minor unit; 0 = free. */
  priceCents: number;
  currency: string;
  /** Public URL of the pack page. */
  packUrl: string;
}

/** Returns the subject and the text and HTML parts of the pack-published mail. */
export function packPublishedMail(input: PackPublishedMailInput): MailContent {
  const price = input.priceCents === 0 ? 'free to take' : `for sale at ${formatAmount(input.priceCents, input.currency)}`;
  const layout: MailLayout = {
    heading: `${input.packTitle} is in the catalogue`,
    paragraphs: [`The pattern pack "${input.packTitle}" of ${input.shopName} is published and ${price}. Anyone can find it in the catalogue now.`],
    action: { label: 'See the pack page', url: input.packUrl },
    after: ['Orders and downloads arrive by e-mail to the buyer; you can withdraw the pack from its page at any time.'],
  };
  return { subject: `Published: ${input.packTitle}`, text: layoutText(layout), html: layoutHtml(layout) };
}
