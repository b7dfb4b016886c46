/**
 * Tables for pattern packs: a published print set with its listing, the orders that buy (or take) it, the
 * expiring download links an order gets, and the payment provider's events already handled (so a replayed
 * webhook fulfils once). Link tokens are stored only as SHA-256 hashes. Re-exported by db/schema.ts.
 */
import { index, integer, pgEnum, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { printSets, shopIdColumn, users } from './schema-core';

export const packStatus = pgEnum('pack_status', ['draft', 'published', 'withdrawn']);
export const orderStatus = pgEnum('order_status', ['pending', 'paid', 'refunded']);

export const packs = pgTable(
  'packs',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: shopIdColumn(),
    printSetId: uuid('print_set_id')
      .notNull()
      .references(() => printSets.id, { onDelete: 'restrict' }),
    slug: text('slug').notNull().unique(),
    title: text('title').notNull(),
    description: text('description').notNull(),
    licence: text('licence').notNull(),
    /** Price in the currency's minor unit (cents); 0 = free. */
    priceCents: integer('price_cents').notNull(),
    currency: text('currency').notNull().default('eur'),
    coverKey: text('cover_key'),
    status: packStatus('status').notNull().default('draft'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    publishedAt: timestamp('published_at', { withTimezone: true }),
  },
  (t) => [index('packs_status_published_idx').on(t.status, t.publishedAt.desc())],
);

export const orders = pgTable(
  'orders',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    packId: uuid('pack_id')
      .notNull()
      .references(() => packs.id, { onDelete: 'restrict' }),
    email: text('email').notNull(),
    amountCents: integer('amount_cents').notNull(),
    currency: text('currency').notNull(),
    status: orderStatus('status').notNull().default('pending'),
    checkoutSessionId: text('checkout_session_id').unique(),
    paymentIntentId: text('payment_intent_id'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    paidAt: timestamp('paid_at', { withTimezone: true }),
    refundedAt: timestamp('refunded_at', { withTimezone: true }),
  },
  (t) => [index('orders_pack_idx').on(t.packId), index('orders_created_idx').on(t.createdAt.desc())],
);

export const downloadLinks = pgTable(
  'download_links',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    orderId: uuid('order_id')
      .notNull()
      .references(() => orders.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    maxUses: integer('max_uses').notNull(),
    uses: integer('uses').notNull().default(0),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('download_links_order_idx').on(t.orderId)],
);

/** Payment-provider events already handled, by the provider's event id. */
export const paymentEvents = pgTable('payment_events', {
  id: text('id').primaryKey(),
  type: text('type').notNull(),
  receivedAt: timestamp('received_at', { withTimezone: true }).notNull().defaultNow(),
});
