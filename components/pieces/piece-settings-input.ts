/**
 * The per-piece settings a maker changes on the pieces page, and the rules for what they type: the common foam
 * thicknesses, the surface choice in plain words, and the checks on a custom thickness and a quantity (the same
 * limits the engine enforces in geometry/pattern/piece-settings.ts).
 */
import type { PatternPiece } from '../../geometry/pattern/pattern-doc';

/** Thicknesses offered as chips, mm: thin craft foam, mid rolls, the usual shell weight and floor-mat tiles (DESIGN.md, common practice). */
export const THICKNESS_CHOICES_MM = [2, 4, 6, 10] as const;
/** Same limits as the engine: MAX_PIECE_THICKNESS_MM and MAX_PIECE_QUANTITY (geometry/pattern/piece-settings.ts). */
export const MAX_THICKNESS_MM = 100;
export const MAX_QUANTITY = 999;

/** What each surface choice means to a maker. */
export const SURFACE_HELP: Readonly<Record<'outer' | 'mid' | 'inner', { label: string; help: string }>> = {
  outer: { label: 'Outer skin', help: 'The pattern follows the visible outside of the sculpt. Best when the outside must match the sculpt exactly.' },
  mid: { label: 'Middle', help: 'The pattern follows the middle of the foam sheet: a balance between the outside and the inside face.' },
  inner: { label: 'Inner face', help: 'The pattern follows the face against the wearer. Pieces come out a little smaller, so a thick shell still fits inside.' },
};

export type Parsed = { ok: true; value: number } | { ok: false; error: string };

/** Reads a custom thickness typed in millimetres ("5", "5.5", "5,5"). */
export function parseThickness(typed: string): Parsed {
  const t = typed.trim().replace(',', '.');
  if (!t) return { ok: false, error: 'Type a thickness in millimetres, e.g. 5.' };
  const v = Number(t);
  if (!Number.isFinite(v)) return { ok: false, error: `"${typed.trim()}" is not a number; type the thickness in millimetres, e.g. 5.` };
  if (v <= 0 || v > MAX_THICKNESS_MM) return { ok: false, error: `Thickness must be more than 0 and at most ${MAX_THICKNESS_MM} mm; ${v} mm is outside that.` };
  return { ok: true, value: v };
}

/** Reads a quantity: a whole number from 1 to MAX_QUANTITY. */
export function parseQuantity(typed: string): Parsed {
  const t = typed.trim();
  if (!/^\d+$/.test(t)) return { ok: false, error: `Quantity must be a whole number from 1 to ${MAX_QUANTITY}${t ? `; "${t}" is not` : ''}.` };
  const v = Number(t);
  if (v < 1 || v > MAX_QUANTITY) return { ok: false, error: `Quantity must be from 1 to ${MAX_QUANTITY}; ${v} is outside that.` };
  return { ok: true, value: v };
}

export interface StretchVerdict {
  over: boolean;
  /** One line for the maker: the figures against the budget and, when over, what to do. */
  message: string;
  /** The suggested dart's remaining stretch, percent, when the engine suggested one. */
  dartLeavesPct: number | null;
}

/**
 * Compares a piece's stretch with the budget (percent): within it, or over it with the suggested dart (the first
 * one, the engine's best) or, when there is none, the advice to add a seam through the stretched area.
 */
export function stretchVerdict(piece: Pick<PatternPiece, 'stretch' | 'darts'>, budgetPct: number): StretchVerdict {
  const { maxPct, rmsPct } = piece.stretch;
  const figures = `max ${maxPct.toFixed(1)} %, typical (rms) ${rmsPct.toFixed(1)} %`;
  if (maxPct <= budgetPct) return { over: false, message: `Stretch ${figures}: within the ${budgetPct} % budget.`, dartLeavesPct: null };
  const dart = piece.darts?.[0] ?? null;
  const advice = dart
    ? `Cut the suggested dart (dashed line ending in a V on the piece); it leaves ${dart.stretchAfterPct.toFixed(1)} % stretch.`
    : 'Add a seam through the most stretched area in the studio, or raise the budget if the foam can be heat-shaped that far.';
  return { over: true, message: `Stretch ${figures}: over the ${budgetPct} % budget. ${advice}`, dartLeavesPct: dart ? dart.stretchAfterPct : null };
}
