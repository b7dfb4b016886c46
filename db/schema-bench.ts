/**
 * Tables of the foam and the bench: per-piece settings and the crew's shared checklist, notes on pieces,
 * the shop's stock sheets per thickness, and sheet plans (nesting results). Re-exported by db/schema.ts.
 */
import { boolean, doublePrecision, index, integer, jsonb, pgTable, primaryKey, text, timestamp, uuid } from 'drizzle-orm/pg-core';
import { buildIdColumn, shopIdColumn, users } from './schema-core';
import { patterns, workStatus } from './schema-sculpts';

/** Which surface of the sheet a piece's pattern follows (DESIGN.md step 6). */
export const PATTERN_SURFACES = ['outer', 'mid', 'inner'] as const;
export type PatternSurface = (typeof PATTERN_SURFACES)[number];

/**
 * A piece of a build, by its label: the maker's settings (thickness, surface, quantity, mirrored) and the
 * crew's checklist. Labels come from the newest pattern; a row for a label the pattern no longer has is kept
 * (and shown as stale) so nobody's ticks are lost by a re-seam.
 */
export const buildPieces = pgTable(
  'build_pieces',
  {
    buildId: buildIdColumn(),
    label: text('label').notNull(),
    shopId: shopIdColumn(),
    thicknessMm: doublePrecision('thickness_mm'),
    surface: text('surface').$type<PatternSurface>(),
    quantity: integer('quantity'),
    mirrored: boolean('mirrored'),
    cut: boolean('cut').notNull().default(false),
    shaped: boolean('shaped').notNull().default(false),
    glued: boolean('glued').notNull().default(false),
    updatedBy: uuid('updated_by').references(() => users.id, { onDelete: 'set null' }),
    updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.buildId, t.label] })],
);

/** A note a member leaves on a piece at the bench. */
export const pieceNotes = pgTable(
  'piece_notes',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    buildId: buildIdColumn(),
    shopId: shopIdColumn(),
    label: text('label').notNull(),
    body: text('body').notNull(),
    authorId: uuid('author_id').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('piece_notes_build_idx').on(t.buildId, t.label, t.createdAt)],
);

/** A stock sheet the shop buys, per thickness: size in millimetres and price per sheet (in the shop's money). */
export const stockSheets = pgTable(
  'stock_sheets',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: shopIdColumn(),
    thicknessMm: doublePrecision('thickness_mm').notNull(),
    name: text('name').notNull(),
    widthMm: doublePrecision('width_mm').notNull(),
    heightMm: doublePrecision('height_mm').notNull(),
    price: doublePrecision('price').notNull().default(0),
    currency: text('currency').notNull().default('EUR'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
  },
  (t) => [index('stock_sheets_shop_idx').on(t.shopId, t.thicknessMm)],
);

/** A sheet plan: the nesting of one pattern's pieces onto the shop's stock, made by a worker. */
export const sheetPlans = pgTable(
  'sheet_plans',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: shopIdColumn(),
    buildId: buildIdColumn(),
    patternId: uuid('pattern_id')
      .notNull()
      .references(() => patterns.id, { onDelete: 'cascade' }),
    /** Options as asked (gap, spares, stock used), so a re-run makes the same plan. */
    options: jsonb('options').$type<Record<string, unknown>>().notNull().default({}),
    status: workStatus('status').notNull().default('queued'),
    error: text('error'),
    /** The plan as made by geometry/layout (sheets, placements, usage, cost). */
    plan: jsonb('plan').$type<Record<string, unknown>>(),
    jobId: text('job_id'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [index('sheet_plans_build_idx').on(t.buildId, t.createdAt.desc())],
);
