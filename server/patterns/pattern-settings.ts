/**
 * What a pattern is made with besides the sculpt and its seams: the stretch budget and the maker's per-piece
 * settings by label. Stored on the pattern row (patterns.settings) so a finished pattern says how it was made.
 */
import type { PatternSurface } from '../../db/schema-bench';
import type { PieceSettings } from '../../geometry/pattern/piece-settings';

export interface PatternSettings {
  stretchBudgetPct: number;
  pieces: Record<string, PieceSettings>;
}

/**
 * Returns the settings of a pattern from the seam set's budget (percent; 3 when there is no seam set) and the
 * build's piece rows, keeping only the fields the maker set (null columns mean "the engine's default").
 */
export function patternSettingsFrom(
  stretchBudgetPct: number | null,
  rows: ReadonlyArray<{ label: string; thicknessMm: number | null; surface: PatternSurface | null; quantity: number | null; mirrored: boolean | null }>,
): PatternSettings {
  const pieces: Record<string, PieceSettings> = {};
  for (const r of rows) {
    const s: PieceSettings = {};
    if (r.thicknessMm !== null) s.thicknessMm = r.thicknessMm;
    if (r.surface !== null) s.surface = r.surface;
    if (r.quantity !== null) s.quantity = r.quantity;
    if (r.mirrored !== null) s.mirrored = r.mirrored;
    if (Object.keys(s).length > 0) pieces[r.label] = s;
  }
  return { stretchBudgetPct: stretchBudgetPct ?? 3, pieces };
}
