/** Request schemas for print sets: the create body and the path ids of one print set and one of its files. */
import { z } from 'zod';
import { buildParams } from '../http/params';
import { patternDocSchema } from './pattern-doc-schema';

export const PRINT_FORMATS = ['pdf', 'svg', 'dxf'] as const;
export type PrintFormat = (typeof PRINT_FORMATS)[number];
export const PRINT_PAGES = ['a4', 'letter', 'a3', 'tabloid'] as const;
export const PRINT_MODES = ['tiled', 'piece-per-page', 'stock-sheet'] as const;

const idParam = z.string().uuid('must be an id (a UUID such as 3f1c0e52-8a4b-4c1e-9d2a-5b7e6f0a1c23)');

/**
 * A print set is made from a pattern document sent whole (`pattern`) or from a finished pattern of the build
 * named by `patternId`; exactly one of the two.
 */
export const printSetCreateBody = z
  .object({
    pattern: patternDocSchema.optional(),
    patternId: idParam.optional(),
    formats: z
      .array(z.enum(PRINT_FORMATS, { error: 'must be one of pdf, svg, dxf' }), { error: 'must be a list of formats such as ["pdf", "dxf"]' })
      .min(1, 'ask for at least one format: pdf, svg or dxf')
      .max(PRINT_FORMATS.length, 'list each format once')
      .refine((f) => new Set(f).size === f.length, 'list each format once'),
    page: z.enum(PRINT_PAGES, { error: 'must be one of a4, letter, a3, tabloid' }).default('a4'),
    mode: z.enum(PRINT_MODES, { error: 'must be one of tiled, piece-per-page, stock-sheet' }).default('tiled'),
  })
  .superRefine((body, ctx) => {
    if (body.pattern === undefined && body.patternId === undefined) {
      ctx.addIssue({ code: 'custom', path: ['pattern'], message: 'send a pattern document, or the patternId of one of the build’s finished patterns' });
    } else if (body.pattern !== undefined && body.patternId !== undefined) {
      ctx.addIssue({ code: 'custom', path: ['patternId'], message: 'send either a pattern document or a patternId, not both' });
    }
  });
export type PrintSetCreateBody = z.infer<typeof printSetCreateBody>;

export const printSetParams = buildParams.extend({ printSetId: idParam });
export type PrintSetParams = z.infer<typeof printSetParams>;

export const printSetFileParams = printSetParams.extend({
  fileName: z.string().regex(/^[a-z0-9][a-z0-9.-]{0,63}$/, 'must be a file name of the print set, such as print-set.pdf'),
});
export type PrintSetFileParams = z.infer<typeof printSetFileParams>;
