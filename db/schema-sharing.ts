/**
 * Tables for bringing people in and getting them back in: invitations to a shop by e-mail, single-use
 * password-reset tokens, and a record of every e-mail the product sent. Tokens are stored only as SHA-256
 * hashes, so a copy of the database cannot be used to accept an invitation or reset a password.
 * Re-exported by db/schema.ts.
 */
import { index, jsonb, pgTable, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { shopIdColumn, shopRole, users } from './schema-core';

export const invitations = pgTable(
  'invitations',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: shopIdColumn(),
    email: text('email').notNull(),
    role: shopRole('role').notNull(),
    tokenHash: text('token_hash').notNull().unique(),
    invitedBy: uuid('invited_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    acceptedAt: timestamp('accepted_at', { withTimezone: true }),
    acceptedBy: uuid('accepted_by').references(() => users.id, { onDelete: 'set null' }),
    revokedAt: timestamp('revoked_at', { withTimezone: true }),
  },
  (t) => [index('invitations_shop_idx').on(t.shopId, t.createdAt.desc())],
);

export const passwordResets = pgTable(
  'password_resets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    tokenHash: text('token_hash').notNull().unique(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    expiresAt: timestamp('expires_at', { withTimezone: true }).notNull(),
    usedAt: timestamp('used_at', { withTimezone: true }),
  },
  (t) => [index('password_resets_user_idx').on(t.userId)],
);

/** Every e-mail handed to the mail server (or that failed to be): kind, recipient, subject, outcome. */
export const sentMail = pgTable(
  'sent_mail',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    kind: text('kind').notNull(),
    to: text('to_address').notNull(),
    subject: text('subject').notNull(),
    messageId: text('message_id'),
    error: text('error'),
    detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('sent_mail_created_idx').on(t.createdAt.desc())],
);
