/**
 * The bench view in one answer: what to cut per thickness (counts include mirrored copies and spares), the
 * shared checklist, every seam with the bevel to cut on each side and whether it is an outside or an inside
 * corner, and the shop cautions. Built from the newest finished pattern, the piece rows and the newest sheet
 * plan's spares rule.
 */
import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { sheetPlans } from '../../db/schema-bench';
import { spareCount, sparesRuleText, type SparesFor } from '../../geometry/layout/plan-sheets';
import { SHOP_CAUTIONS } from '../../geometry/pattern/build-pattern';
import type { PatternSeam, SeamStation } from '../../geometry/pattern/pattern-doc';
import { selectBuild } from '../builds/queries';
import { notFound } from '../errors';
import { selectNewestDonePattern } from '../patterns/queries';
import { listPieces } from '../pieces/service';

/** Spares rule when the build has no sheet plan yet: planSheets' own defaults (10 %, repeated parts). */
const DEFAULT_SPARES = { sparesPct: 10, sparesFor: 'repeated' as SparesFor };

export interface BenchPiece {
  label: string;
  quantity: number;
  mirroredCopies: number;
  spares: number;
  /** Copies to cut: quantity plus spares. */
  count: number;
  surface: string;
  cut: boolean;
  shaped: boolean;
  glued: boolean;
  notes: number;
}

export interface BenchSeam {
  label: string;
  pieces: string[];
  /** One entry per side, in the order of `pieces` (twice the same piece for a tube closed on itself). */
  sides: Array<{ piece: string; bevelDeg: number; bevelFace: 'outer' | 'inner' | 'none' }>;
  convex: boolean;
  /** 'outside' corner (convex), 'inside' corner, or 'flat' where the bevel is under half a degree. */
  corner: 'outside' | 'inside' | 'flat';
  lengthMm: number;
  dihedralDeg: { min: number; mean: number; max: number };
  bevelDeg: { min: number; mean: number; max: number };
  stations: SeamStation[];
}

export interface BenchView {
  pattern: { id: string; sculptId: string; seamRevision: number; pieces: number; seams: number; warnings: string[]; finishedAt: string | null } | null;
  sparesRule: string;
  thicknesses: Array<{ thicknessMm: number; pieces: BenchPiece[]; count: number }>;
  checklist: { pieces: number; cut: number; shaped: number; glued: number };
  seams: BenchSeam[];
  cautions: string[];
}

/** Returns the bench sides and corner of a seam; the joint is cut symmetric, so both sides take the mean bevel. */
function benchSeam(seam: PatternSeam): BenchSeam {
  const face = seam.bevelFace ?? (seam.convex ? 'inner' : 'outer');
  const sides = [0, 1].map((k) => ({ piece: seam.pieces[Math.min(k, seam.pieces.length - 1)], bevelDeg: seam.bevel.mean, bevelFace: face }));
  return {
    label: seam.label,
    pieces: seam.pieces,
    sides,
    convex: seam.convex,
    corner: Math.abs(seam.bevel.mean) < 0.5 ? 'flat' : seam.convex ? 'outside' : 'inside',
    lengthMm: seam.length3d,
    dihedralDeg: seam.dihedral,
    bevelDeg: seam.bevel,
    stations: seam.stations,
  };
}

/** Returns the bench view of the build; throws 404 NOT_FOUND for no such build. */
export async function getBench(db: Db, shopId: string, buildId: string): Promise<BenchView> {
  if (!(await selectBuild(db, shopId, buildId))) throw notFound('Build');
  const [pattern, pieces, plans] = await Promise.all([
    selectNewestDonePattern(db, shopId, buildId),
    listPieces(db, shopId, buildId),
    db
      .select({ options: sheetPlans.options })
      .from(sheetPlans)
      .where(and(eq(sheetPlans.buildId, buildId), eq(sheetPlans.shopId, shopId)))
      .orderBy(desc(sheetPlans.createdAt))
      .limit(1),
  ]);
  const planOptions = plans[0]?.options as { sparesPct?: number; sparesFor?: SparesFor } | undefined;
  const sparesPct = planOptions?.sparesPct ?? DEFAULT_SPARES.sparesPct;
  const sparesFor = planOptions?.sparesFor ?? DEFAULT_SPARES.sparesFor;
  const doc = pattern?.doc ?? null;

  const live = pieces.filter((p) => !p.stale);
  const byThickness = new Map<number, BenchPiece[]>();
  for (const p of live) {
    const spares = spareCount(p.quantity, sparesPct, sparesFor);
    const entry: BenchPiece = {
      label: p.label,
      quantity: p.quantity,
      mirroredCopies: p.mirrored ? Math.floor(p.quantity / 2) : 0,
      spares,
      count: p.quantity + spares,
      surface: p.surface,
      cut: p.cut,
      shaped: p.shaped,
      glued: p.glued,
      notes: p.notes,
    };
    byThickness.set(p.thicknessMm, [...(byThickness.get(p.thicknessMm) ?? []), entry]);
  }
  return {
    pattern: pattern && doc
      ? { id: pattern.id, sculptId: pattern.sculptId, seamRevision: pattern.seamRevision, pieces: doc.pieces.length, seams: doc.seams.length, warnings: doc.warnings, finishedAt: pattern.finishedAt?.toISOString() ?? null }
      : null,
    sparesRule: sparesRuleText(sparesPct, sparesFor),
    thicknesses: [...byThickness.entries()]
      .sort((a, b) => a[0] - b[0])
      .map(([thicknessMm, list]) => ({ thicknessMm, pieces: list, count: list.reduce((s, p) => s + p.count, 0) })),
    checklist: {
      pieces: live.length,
      cut: live.filter((p) => p.cut).length,
      shaped: live.filter((p) => p.shaped).length,
      glued: live.filter((p) => p.glued).length,
    },
    seams: (doc?.seams ?? []).map(benchSeam),
    cautions: [...(doc?.cautions ?? SHOP_CAUTIONS)],
  };
}
