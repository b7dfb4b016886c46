/**
 * Request-body schemas for piece settings, the bench checklist, notes, stock sheets and sheet plans, shared by
 * the server (validation) and the app (react-hook-form resolvers). Free of database drivers so the web bundle
 * can import it. Ranges are the engine's (geometry/pattern/piece-settings.ts) restated without importing it.
 */
import { z } from 'zod';

export const PIECE_SURFACES = ['outer', 'mid', 'inner'] as const;

/** A piece label as the engine makes them (A … Z, AA …), letters and digits only. */
export const pieceLabelField = z.string().regex(/^[A-Za-z0-9]{1,8}$/, 'must be a piece label such as A or AB');

const thicknessField = z
  .number({ error: 'must be a number of millimetres' })
  .positive('must be more than 0 mm')
  .max(100, 'must be at most 100 mm');

/** PATCH …/pieces/:label: each field optional; null puts the engine's default back. */
export const pieceSettingsBody = z
  .object({
    thicknessMm: thicknessField.nullable().optional(),
    surface: z.enum(PIECE_SURFACES, { error: 'must be outer, mid or inner' }).nullable().optional(),
    quantity: z
      .number({ error: 'must be a whole number' })
      .int('must be a whole number')
      .min(1, 'must be at least 1')
      .max(999, 'must be at most 999')
      .nullable()
      .optional(),
    mirrored: z.boolean({ error: 'must be true or false' }).nullable().optional(),
  })
  .strict()
  .refine((b) => Object.keys(b).length > 0, 'send at least one of thicknessMm, surface, quantity, mirrored');
export type PieceSettingsBody = z.infer<typeof pieceSettingsBody>;

/** PATCH …/pieces/:label/progress: the crew's checklist ticks. */
export const pieceProgressBody = z
  .object({
    cut: z.boolean({ error: 'must be true or false' }).optional(),
    shaped: z.boolean({ error: 'must be true or false' }).optional(),
    glued: z.boolean({ error: 'must be true or false' }).optional(),
  })
  .strict()
  .refine((b) => Object.keys(b).length > 0, 'send at least one of cut, shaped, glued');
export type PieceProgressBody = z.infer<typeof pieceProgressBody>;

/** POST …/pieces/:label/notes. */
export const pieceNoteBody = z.object({
  body: z.string({ error: 'write the note as text' }).trim().min(1, 'write something in the note').max(2000, 'keep the note to 2000 characters'),
});
export type PieceNoteBody = z.infer<typeof pieceNoteBody>;

export const stockSheetField = z.object({
  thicknessMm: thicknessField,
  name: z.string({ error: 'give the sheet a name' }).trim().min(1, 'give the sheet a name').max(80, 'use at most 80 characters'),
  widthMm: z.number({ error: 'must be a number of millimetres' }).positive('must be more than 0 mm').max(5000, 'must be at most 5000 mm'),
  heightMm: z.number({ error: 'must be a number of millimetres' }).positive('must be more than 0 mm').max(5000, 'must be at most 5000 mm'),
  price: z.number({ error: 'must be a number' }).min(0, 'must be 0 or more').max(100_000, 'must be at most 100000'),
  currency: z
    .string({ error: 'must be a three-letter currency code such as EUR' })
    .regex(/^[A-Z]{3}$/, 'must be a three-letter currency code such as EUR'),
});

/** PUT /shops/:shopId/stock: the whole list, replacing the shop's. */
export const stockReplaceBody = z.object({
  sheets: z.array(stockSheetField, { error: 'must be a list of sheets' }).max(50, 'list at most 50 sheets'),
});
export type StockReplaceBody = z.infer<typeof stockReplaceBody>;

/** POST …/sheet-plans. */
export const sheetPlanCreateBody = z.object({
  patternId: z.string().uuid('must be the id of one of the build’s patterns'),
  gapMm: z.number({ error: 'must be a number of millimetres' }).min(0, 'must be 0 mm or more').max(50, 'must be at most 50 mm').default(3),
  /** Spare copies, percent of each repeated piece's quantity (rounded up per piece). */
  spares: z.number({ error: 'must be a percentage' }).min(0, 'must be 0 % or more').max(100, 'must be at most 100 %').default(10),
  sparesFor: z.enum(['repeated', 'all'], { error: 'must be repeated or all' }).default('repeated'),
});
export type SheetPlanCreateBody = z.infer<typeof sheetPlanCreateBody>;
