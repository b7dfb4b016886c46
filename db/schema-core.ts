/**
 * The core tables: people, shops and their members, builds, the audit log, sign-in counters and print sets.
 * Re-exported by db/schema.ts.
 */
import { sql } from 'drizzle-orm';
import {
  bigserial,
  boolean,
  check,
  index,
  integer,
  jsonb,
  pgEnum,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uuid,
} from 'drizzle-orm/pg-core';
import type { PatternDoc } from '../geometry/pattern/pattern-doc';
import { ROLES } from './validation';

/** Role of a person inside one shop: owner (runs it), editor (crew at the bench), viewer (commission client). */
export const shopRole = pgEnum('shop_role', ROLES);

/**
 * The `shop_id` column of a row the shop owns, deleted with the shop. Shop-owned rows carry it even when a
 * parent row would say the same, so every query can check the shop straight from the row.
 */
export function shopIdColumn() {
  return uuid('shop_id')
    .notNull()
    .references(() => shops.id, { onDelete: 'cascade' });
}

/** The `build_id` column of a row belonging to a build, deleted with the build. */
export function buildIdColumn() {
  return uuid('build_id')
    .notNull()
    .references(() => builds.id, { onDelete: 'cascade' });
}

export const users = pgTable(
  'users',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    email: text('email').notNull().unique(),
    name: text('name').notNull(),
    passwordHash: text('password_hash').notNull(),
    isAdmin: boolean('is_admin').notNull().default(false),
    // Copied into every session token; raising it (on sign-out) makes every earlier token of this person invalid.
    sessionGeneration: integer('session_generation').notNull().default(0),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  // E-mail addresses are compared case-insensitively by people; storing them lower-case keeps the unique
  // index meaningful without a functional index.
  (t) => [check('users_email_lower_case', sql`${t.email} = lower(${t.email})`)],
);

export const shops = pgTable('shops', {
  id: uuid('id').primaryKey().defaultRandom(),
  name: text('name').notNull(),
  createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
});

export const memberships = pgTable(
  'memberships',
  {
    userId: uuid('user_id')
      .notNull()
      .references(() => users.id, { onDelete: 'cascade' }),
    shopId: shopIdColumn(),
    role: shopRole('role').notNull(),
    // A commission client (viewer) sees print sets only when the owner grants it.
    canSeePrintSets: boolean('can_see_print_sets').notNull().default(false),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.userId, t.shopId] }), index('memberships_shop_idx').on(t.shopId)],
);

/** A build is one project of a shop (a helmet, a pair of pauldrons); later issues hang sculpts and patterns off it. */
export const builds = pgTable(
  'builds',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: shopIdColumn(),
    name: text('name').notNull(),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('builds_shop_created_idx').on(t.shopId, t.createdAt.desc())],
);

/**
 * Who did what, kept after the thing itself is gone: deleting a shop or a user keeps their entries with the
 * reference set to null, and `detail` records names as they were.
 */
export const auditLog = pgTable(
  'audit_log',
  {
    id: bigserial('id', { mode: 'number' }).primaryKey(),
    shopId: uuid('shop_id').references(() => shops.id, { onDelete: 'set null' }),
    userId: uuid('user_id').references(() => users.id, { onDelete: 'set null' }),
    action: text('action').notNull(),
    target: text('target').notNull(),
    detail: jsonb('detail').$type<Record<string, unknown>>().notNull().default({}),
    at: timestamp('at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('audit_log_shop_at_idx').on(t.shopId, t.at.desc())],
);

/**
 * Failed sign-in counters shared by every API server (the servers keep no state of their own), one row per
 * client key and window.
 */
export const rateLimitHits = pgTable('rate_limit_hits', {
  key: text('key').primaryKey(),
  hits: integer('hits').notNull(),
  resetAt: timestamp('reset_at', { withTimezone: true }).notNull(),
});

/** Where a print set is in its life: queued for a worker, being rendered, done (files stored) or failed. */
export const printSetStatus = pgEnum('print_set_status', ['queued', 'running', 'done', 'failed']);

/** One stored file of a print set: its name (also the last part of its storage key), size and media type. */
export interface PrintSetFileEntry {
  name: string;
  sizeBytes: number;
  contentType: string;
}

/**
 * A print set: the PDF/SVG/DXF files made from one pattern document for a build, rendered by a worker. The
 * pattern is kept as sent so the job (and a re-run) reads exactly what was asked for; the files live in the
 * file store under `print-sets/<id>/`.
 */
export const printSets = pgTable(
  'print_sets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: shopIdColumn(),
    buildId: buildIdColumn(),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    name: text('name').notNull(),
    status: printSetStatus('status').notNull().default('queued'),
    formats: text('formats').array().notNull(),
    page: text('page').notNull(),
    mode: text('mode').notNull(),
    pieceCount: integer('piece_count').notNull(),
    pattern: jsonb('pattern').$type<PatternDoc>().notNull(),
    files: jsonb('files').$type<PrintSetFileEntry[]>().notNull().default([]),
    error: text('error'),
    jobId: text('job_id'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [index('print_sets_build_created_idx').on(t.buildId, t.createdAt.desc())],
);
