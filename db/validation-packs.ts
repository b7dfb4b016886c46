/**
 * Request-body schemas for pattern packs, shared by the server and the app's forms. No database drivers here,
 * so the web bundle can import it.
 */
import { z } from 'zod';
import { emailField } from './validation';

/** Largest price accepted, in minor units (cents): 10 000.00 in the pack's currency. */
export const MAX_PRICE_CENTS = 1_000_000;

export const packTitleField = z.string().trim().min(1, 'Give the pack a title').max(120, 'Use at most 120 characters');
export const packDescriptionField = z.string().trim().min(1, 'Describe what the pack holds').max(4000, 'Use at most 4000 characters');
export const packLicenceField = z.string().trim().min(1, 'Say what buyers may do with the pattern').max(2000, 'Use at most 2000 characters');
export const priceCentsField = z
  .number({ error: 'Enter the price in cents as a whole number (0 for free)' })
  .int('Enter the price in cents as a whole number (0 for free)')
  .min(0, 'The price cannot be negative')
  .max(MAX_PRICE_CENTS, `The price can be at most ${MAX_PRICE_CENTS} cents`);
/** ISO 4217 alphabetic code, kept lower-case as the payment API expects. */
export const currencyField = z
  .string()
  .trim()
  .toLowerCase()
  .regex(/^[a-z]{3}$/, 'Use a three-letter currency code such as eur or usd');

export const packCreateBody = z.object({
  printSetId: z.string().uuid('Choose a finished print set of this build'),
  title: packTitleField,
  description: packDescriptionField,
  licence: packLicenceField,
  priceCents: priceCentsField,
  currency: currencyField.default('eur'),
});
export type PackCreateBody = z.infer<typeof packCreateBody>;

export const PACK_STATUSES = ['draft', 'published', 'withdrawn'] as const;

export const packUpdateBody = z
  .object({
    title: packTitleField.optional(),
    description: packDescriptionField.optional(),
    licence: packLicenceField.optional(),
    priceCents: priceCentsField.optional(),
    currency: currencyField.optional(),
    status: z.enum(PACK_STATUSES, { error: 'Status must be draft, published or withdrawn' }).optional(),
  })
  .refine((b) => Object.values(b).some((v) => v !== undefined), { message: 'Send at least one field to change' });
export type PackUpdateBody = z.infer<typeof packUpdateBody>;

export const coverDataUrlBody = z.object({
  dataUrl: z.string().startsWith('data:image/', 'Send the cover as a data:image/png or data:image/jpeg URL'),
});

export const checkoutBody = z.object({ email: emailField });
export type CheckoutBody = z.infer<typeof checkoutBody>;
