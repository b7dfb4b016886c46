/**
 * The zod schema for a pattern document sent to the server (geometry/pattern/pattern-doc.ts is the type it
 * must produce). Besides shapes it enforces limits, so a huge or nonsensical document is refused at the door
 * with a message naming the path (e.g. `pattern.pieces.0.outline`) instead of tying up a worker:
 * finite coordinates within ±100 m, outlines of 3 to 20 000 points, at most 400 000 points in all, unique
 * piece labels, and seams that name pieces of the document.
 */
import { z } from 'zod';

export const PATTERN_LIMITS = {
  pieces: 1_000,
  seams: 5_000,
  pointsPerPath: 20_000,
  totalPoints: 400_000,
  /** Largest coordinate magnitude, mm (100 m: far beyond any foam sheet). */
  coordinateMm: 100_000,
  quantity: 1_000,
  thicknessMm: 100,
  labelChars: 40,
  textChars: 1_000,
  notes: 2_000,
} as const;

const coordinate = z
  .number({ error: 'must be a number of millimetres' })
  .min(-PATTERN_LIMITS.coordinateMm, `must be within ±${PATTERN_LIMITS.coordinateMm} mm`)
  .max(PATTERN_LIMITS.coordinateMm, `must be within ±${PATTERN_LIMITS.coordinateMm} mm`);

const point = z.tuple([coordinate, coordinate], { error: 'must be a point [x, y] in millimetres' });

const path = (minPoints: number, what: string) =>
  z
    .array(point, { error: `must be a list of [x, y] points (${what})` })
    .min(minPoints, `${what} needs at least ${minPoints} points`)
    .max(PATTERN_LIMITS.pointsPerPath, `${what} has more than ${PATTERN_LIMITS.pointsPerPath} points`);

const label = z
  .string({ error: 'must be a text label' })
  .trim()
  .min(1, 'must not be empty')
  .max(PATTERN_LIMITS.labelChars, `must be at most ${PATTERN_LIMITS.labelChars} characters`);

const nonNegative = z.number({ error: 'must be a number' }).min(0, 'must be 0 or more');
const angleDeg = z.number({ error: 'must be a number of degrees' }).min(-360, 'must be within ±360°').max(360, 'must be within ±360°');
const range = z.object({ min: angleDeg, mean: angleDeg, max: angleDeg });
const note = z.string().max(PATTERN_LIMITS.textChars, `must be at most ${PATTERN_LIMITS.textChars} characters`);
const notes = z.array(note).max(PATTERN_LIMITS.notes, `at most ${PATTERN_LIMITS.notes} entries`);

const bevelFace = z.enum(['outer', 'inner', 'none']);

const pieceSchema = z
  .object({
    label,
    faces: z.number().int('must be a whole number').min(0, 'must be 0 or more'),
    area3d: nonNegative,
    area2d: nonNegative,
    outline: path(3, 'an outline'),
    holes: z.array(path(3, 'a hole')).max(1_000, 'at most 1000 holes').default([]),
    stretch: z.object({ maxPct: nonNegative, rmsPct: nonNegative }),
    quantity: z
      .number({ error: 'must be a whole number' })
      .int('must be a whole number')
      .min(1, 'must be at least 1')
      .max(PATTERN_LIMITS.quantity, `must be at most ${PATTERN_LIMITS.quantity}`),
    mirrored: z.boolean(),
    mirroredCopies: z.number().int('must be a whole number').min(0, 'must be 0 or more').optional(),
    thickness: z
      .number({ error: 'must be a number of millimetres' })
      .positive('must be more than 0 mm')
      .max(PATTERN_LIMITS.thicknessMm, `must be at most ${PATTERN_LIMITS.thicknessMm} mm`),
    perimeterChangeMm: z.number().optional(),
    surface: z.enum(['outer', 'mid', 'inner']).optional(),
    seamEdges: z
      .array(
        z.object({
          seam: label,
          side: z.union([z.literal(0), z.literal(1)], { error: 'must be 0 or 1' }),
          path: path(2, 'a seam edge'),
          bevelDeg: z.number().min(0, 'must be 0° or more').max(90, 'must be at most 90°'),
          bevelFace,
          copy: z.number().int('must be a whole number').min(0, 'must be 0 or more').optional(),
        }),
      )
      .max(PATTERN_LIMITS.seams, `at most ${PATTERN_LIMITS.seams} seam edges`)
      .optional(),
    scoreLines: z
      .array(z.object({ path: path(2, 'a score line'), foldDeg: z.number().min(0, 'must be 0° or more').max(360, 'must be at most 360°') }))
      .max(1_000, 'at most 1000 score lines')
      .optional(),
    darts: z
      .array(z.object({ path: path(2, 'a dart'), stretchAfterPct: nonNegative }))
      .max(1_000, 'at most 1000 darts')
      .optional(),
    textureLine: z.array(point).length(2, 'a texture line is two points').nullable().optional(),
  })
  .superRefine((p, ctx) => {
    (p.seamEdges ?? []).forEach((e, j) => {
      if (e.copy !== undefined && e.copy >= p.quantity) {
        ctx.addIssue({ code: 'custom', path: ['seamEdges', j, 'copy'], message: `must be below the quantity (${p.quantity})` });
      }
    });
    if (p.mirroredCopies !== undefined && p.mirroredCopies > p.quantity) {
      ctx.addIssue({ code: 'custom', path: ['mirroredCopies'], message: `must be at most the quantity (${p.quantity})` });
    }
  });

const seamSchema = z.object({
  label,
  pieces: z.array(label).min(1, 'a seam joins one or two pieces').max(2, 'a seam joins one or two pieces'),
  length3d: nonNegative,
  length3dOuter: nonNegative.optional(),
  lengths: z.array(nonNegative).max(2, 'one length per side'),
  dihedral: range,
  bevel: range,
  convex: z.boolean(),
  bevelFace: bevelFace.optional(),
  stations: z
    .array(z.object({ at: nonNegative, bevel: angleDeg, dihedral: angleDeg.optional() }))
    .max(PATTERN_LIMITS.pointsPerPath, `at most ${PATTERN_LIMITS.pointsPerPath} stations`),
});

function pointCount(p: z.infer<typeof pieceSchema>): number {
  const paths = [p.outline, ...p.holes, ...(p.seamEdges ?? []).map((e) => e.path), ...(p.scoreLines ?? []).map((s) => s.path), ...(p.darts ?? []).map((d) => d.path)];
  return paths.reduce((n, q) => n + q.length, 0);
}

/** Schema of a whole pattern document (pattern.json), producing a geometry PatternDoc. */
export const patternDocSchema = z
  .object({
    units: z.literal('mm', { error: 'lengths must be in millimetres: units must be "mm"' }),
    name: z.string().trim().min(1, 'must not be empty').max(120, 'must be at most 120 characters').optional(),
    pieces: z.array(pieceSchema).min(1, 'the pattern has no pieces').max(PATTERN_LIMITS.pieces, `at most ${PATTERN_LIMITS.pieces} pieces`),
    seams: z.array(seamSchema).max(PATTERN_LIMITS.seams, `at most ${PATTERN_LIMITS.seams} seams`).default([]),
    warnings: notes.default([]),
    cautions: notes.optional(),
  })
  .superRefine((doc, ctx) => {
    const pieceLabels = new Map<string, number>();
    doc.pieces.forEach((p, i) => {
      const first = pieceLabels.get(p.label);
      if (first !== undefined) ctx.addIssue({ code: 'custom', path: ['pieces', i, 'label'], message: `piece label "${p.label}" is already used by piece ${first}` });
      else pieceLabels.set(p.label, i);
    });
    const seamLabels = new Set(doc.seams.map((s) => s.label));
    doc.seams.forEach((s, i) => {
      s.pieces.forEach((l, j) => {
        if (!pieceLabels.has(l)) ctx.addIssue({ code: 'custom', path: ['seams', i, 'pieces', j], message: `names piece "${l}", which the pattern does not have` });
      });
    });
    doc.pieces.forEach((p, i) => {
      (p.seamEdges ?? []).forEach((e, j) => {
        if (!seamLabels.has(e.seam)) ctx.addIssue({ code: 'custom', path: ['pieces', i, 'seamEdges', j, 'seam'], message: `names seam "${e.seam}", which the pattern does not have` });
      });
    });
    const total = doc.pieces.reduce((n, p) => n + pointCount(p), 0);
    if (total > PATTERN_LIMITS.totalPoints) {
      ctx.addIssue({ code: 'custom', path: ['pieces'], message: `the pattern has ${total} points in all; at most ${PATTERN_LIMITS.totalPoints} are accepted` });
    }
  });
