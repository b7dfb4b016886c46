/**
 * Request-body schemas for sculpts and their seams, shared by the server and the app's forms (upload page,
 * wearer settings, studio seam saves). No drivers here, so the web bundle can import it.
 */
import { z } from 'zod';

export const SCULPT_UNITS = ['mm', 'cm', 'm', 'in'] as const;

/** Plausible head circumference, mm: from a small child's (about 350) to a very large adult's, with room either side. */
export const HEAD_CIRCUMFERENCE_RANGE_MM = [300, 800] as const;
/** Plausible head height (crown to chin), mm. */
export const HEAD_HEIGHT_RANGE_MM = [120, 350] as const;
/** Working-mesh triangle counts a maker may ask for; the default keeps the studio quick on a phone. */
export const TARGET_TRIANGLES_RANGE = [1_000, 2_000_000] as const;
export const DEFAULT_TARGET_TRIANGLES = 200_000;

const unitsField = z.enum(SCULPT_UNITS, { error: 'must be one of mm, cm, m, in (the units the model was made in)' });
const scaleField = z
  .number({ error: 'must be a number' })
  .refine(Number.isFinite, 'must be a finite number')
  .refine((v) => v > 0, 'must be greater than 0')
  .refine((v) => v <= 1000, 'must be at most 1000');
const headCircumferenceField = z
  .number({ error: 'must be a number of millimetres' })
  .min(HEAD_CIRCUMFERENCE_RANGE_MM[0], `a head circumference is at least ${HEAD_CIRCUMFERENCE_RANGE_MM[0]} mm; measure round the brow in millimetres`)
  .max(HEAD_CIRCUMFERENCE_RANGE_MM[1], `a head circumference is at most ${HEAD_CIRCUMFERENCE_RANGE_MM[1]} mm; measure round the brow in millimetres`);
const headHeightField = z
  .number({ error: 'must be a number of millimetres' })
  .min(HEAD_HEIGHT_RANGE_MM[0], `a head height is at least ${HEAD_HEIGHT_RANGE_MM[0]} mm (crown to chin, in millimetres)`)
  .max(HEAD_HEIGHT_RANGE_MM[1], `a head height is at most ${HEAD_HEIGHT_RANGE_MM[1]} mm (crown to chin, in millimetres)`);
const targetTrianglesField = z
  .number({ error: 'must be a whole number' })
  .int('must be a whole number')
  .min(TARGET_TRIANGLES_RANGE[0], `must be at least ${TARGET_TRIANGLES_RANGE[0]}`)
  .max(TARGET_TRIANGLES_RANGE[1], `must be at most ${TARGET_TRIANGLES_RANGE[1]}`);

/** A multipart text field as a number ("" or absent → undefined), so the same rules read form fields and JSON. */
const formNumber = <T extends z.ZodType>(inner: T) =>
  z.preprocess((v) => (v === undefined || v === '' ? undefined : typeof v === 'string' ? Number(v.trim()) : v), inner.optional());

const noScaleWithMeasures = (b: { scale?: number; headCircumferenceMm?: number; headHeightMm?: number }) =>
  !(b.scale !== undefined && b.scale !== 1 && (b.headCircumferenceMm !== undefined || b.headHeightMm !== undefined));
const noScaleWithMeasuresMessage = {
  message: 'give either a scale or the head measures, not both: the head measures decide the scale',
  path: ['scale'],
};

/** Text fields of the upload form (multipart), after the file. */
export const sculptUploadFields = z
  .object({
    units: unitsField.default('mm'),
    scale: formNumber(scaleField),
    headCircumferenceMm: formNumber(headCircumferenceField),
    headHeightMm: formNumber(headHeightField),
    targetTriangles: formNumber(targetTrianglesField),
  })
  .refine(noScaleWithMeasures, noScaleWithMeasuresMessage);
export type SculptUploadFields = z.infer<typeof sculptUploadFields>;

/** Body of PATCH sculpt: new units, scale or wearer; `wearer: null` removes the measures. */
export const sculptPatchBody = z
  .object({
    units: unitsField.optional(),
    scale: scaleField.optional(),
    wearer: z
      .object({ headCircumferenceMm: headCircumferenceField.nullable().default(null), headHeightMm: headHeightField.nullable().default(null) })
      .nullable()
      .optional(),
  })
  .refine((b) => b.units !== undefined || b.scale !== undefined || b.wearer !== undefined, {
    message: 'change at least one of units, scale, wearer',
    path: ['_'],
  })
  .refine(
    (b) => noScaleWithMeasures({ scale: b.scale, headCircumferenceMm: b.wearer?.headCircumferenceMm ?? undefined, headHeightMm: b.wearer?.headHeightMm ?? undefined }),
    noScaleWithMeasuresMessage,
  );
export type SculptPatchBody = z.infer<typeof sculptPatchBody>;

/** Most seams in one set, vertices in one seam's path, and vertices over all paths (keeps a save small). */
export const SEAM_LIMITS = { seams: 2_000, picks: 5_000, pathVertices: 200_000, totalVertices: 1_000_000 } as const;

const vertexId = z.number({ error: 'must be a vertex number' }).int('must be a whole vertex number').min(0, 'must be 0 or more');

export const seamLineSchema = z.object({
  id: z.string().trim().min(1, 'give the seam an id').max(64, 'use at most 64 characters'),
  picks: z.array(vertexId).min(1, 'a seam has at least one picked point').max(SEAM_LIMITS.picks, `at most ${SEAM_LIMITS.picks} picked points`),
  path: z.array(vertexId).min(2, 'a seam path has at least two vertices').max(SEAM_LIMITS.pathVertices, `at most ${SEAM_LIMITS.pathVertices} vertices in one path`),
  source: z.enum(['picked', 'crease', 'auto', 'mirror', 'carried'], { error: 'must be picked, crease, auto, mirror or carried' }),
});

export const symmetryPlaneSchema = z
  .object({
    normal: z.tuple([z.number(), z.number(), z.number()], { error: 'must be three numbers [x, y, z]' }),
    offsetMm: z.number({ error: 'must be a number of millimetres' }).refine(Number.isFinite, 'must be finite'),
  })
  .refine((p) => p.normal.every(Number.isFinite) && Math.abs(Math.hypot(...p.normal) - 1) < 1e-6, {
    message: 'the normal must be a unit vector (length 1)',
    path: ['normal'],
  });

/** Body of PUT seams. */
export const seamSetPutBody = z
  .object({
    baseRevision: z.number({ error: 'must be the revision the edit started from' }).int().min(0),
    seams: z.array(seamLineSchema).max(SEAM_LIMITS.seams, `at most ${SEAM_LIMITS.seams} seams`),
    symmetry: symmetryPlaneSchema.nullable(),
    stretchBudgetPct: z.number({ error: 'must be a percentage' }).min(0.1, 'must be at least 0.1 %').max(50, 'must be at most 50 %'),
  })
  .superRefine((b, ctx) => {
    const ids = new Set<string>();
    let total = 0;
    b.seams.forEach((s, i) => {
      if (ids.has(s.id)) ctx.addIssue({ code: 'custom', path: ['seams', i, 'id'], message: `seam id "${s.id}" is used twice` });
      ids.add(s.id);
      total += s.path.length;
    });
    if (total > SEAM_LIMITS.totalVertices) {
      ctx.addIssue({ code: 'custom', path: ['seams'], message: `the seams hold ${total} path vertices in all; at most ${SEAM_LIMITS.totalVertices}` });
    }
  });
export type SeamSetPutBody = z.infer<typeof seamSetPutBody>;
