/** Request schemas for print sets: the create body and the path ids of one print set and one of its files. */
import { z } from 'zod';
import { buildParams } from '../http/params';
import { patternDocSchema } from './pattern-doc-schema';

export const PRINT_FORMATS = ['pdf', 'svg', 'dxf'] as const;
export type PrintFormat = (typeof PRINT_FORMATS)[number];
export const PRINT_PAGES = ['a4', 'letter', 'a3', 'tabloid'] as const;
export const PRINT_MODES = ['tiled', 'piece-per-page', 'stock-sheet'] as const;

export const printSetCreateBody = z.object({
  pattern: patternDocSchema,
  formats: z
    .array(z.enum(PRINT_FORMATS, { error: 'must be one of pdf, svg, dxf' }), { error: 'must be a list of formats such as ["pdf", "dxf"]' })
    .min(1, 'ask for at least one format: pdf, svg or dxf')
    .max(PRINT_FORMATS.length, 'list each format once')
    .refine((f) => new Set(f).size === f.length, 'list each format once'),
  page: z.enum(PRINT_PAGES, { error: 'must be one of a4, letter, a3, tabloid' }).default('a4'),
  mode: z.enum(PRINT_MODES, { error: 'must be one of tiled, piece-per-page, stock-sheet' }).default('tiled'),
});
export type PrintSetCreateBody = z.infer<typeof printSetCreateBody>;

const idParam = z.string().uuid('must be an id (a UUID such as 3f1c0e52-8a4b-4c1e-9d2a-5b7e6f0a1c23)');

export const printSetParams = buildParams.extend({ printSetId: idParam });
export type PrintSetParams = z.infer<typeof printSetParams>;

export const printSetFileParams = printSetParams.extend({
  fileName: z.string().regex(/^[a-z0-9][a-z0-9.-]{0,63}$/, 'must be a file name of the print set, such as print-set.pdf'),
});
export type PrintSetFileParams = z.infer<typeof printSetFileParams>;
