/**
 * The space a printed text takes, as a turned rectangle in drawing mm, and overlap tests between such
 * rectangles and line segments by the separating axis theorem (two convex shapes are disjoint exactly
 * when their projections on some edge normal do not overlap; Gottschalk et al. 1996).
 */
import type { PointMm } from '../pattern/pattern-doc';
import type { DrawText } from './piece-drawing';

/**
 * Mean advance width per character as a share of the font size, measured with pdfkit on the shipped
 * fonts over a typical bevel note (Archivo regular 0.42, Archivo extra-bold 0.47 for text and up to
 * 0.75 for capitals, DM Mono 0.6); rounded up so the boxes err on the roomy side.
 */
const ADVANCE: Readonly<Record<DrawText['weight'], number>> = { regular: 0.48, bold: 0.75, mono: 0.62 };

/**
 * Corners (counter-clockwise, drawing mm) of the box `t` takes when printed: its string's estimated
 * width by the font's mean advance, one font size high, turned by its angle about its anchor, grown
 * by `t.padMm` on every side.
 */
export function textBox(t: Pick<DrawText, 'text' | 'at' | 'angleDeg' | 'sizeMm' | 'weight' | 'padMm'>): PointMm[] {
  const pad = t.padMm ?? 0;
  const hw = (t.text.length * ADVANCE[t.weight] * t.sizeMm) / 2 + pad;
  const hh = t.sizeMm / 2 + pad;
  const a = (t.angleDeg * Math.PI) / 180;
  const c = Math.cos(a);
  const s = Math.sin(a);
  return [[-hw, -hh], [hw, -hh], [hw, hh], [-hw, hh]].map(([x, y]) => [t.at[0] + c * x - s * y, t.at[1] + s * x + c * y] as PointMm);
}

function separated(a: readonly PointMm[], b: readonly PointMm[], from: readonly PointMm[]): boolean {
  for (let i = 0; i < from.length; i++) {
    const p = from[i];
    const q = from[(i + 1) % from.length];
    const nx = -(q[1] - p[1]);
    const ny = q[0] - p[0];
    if (nx === 0 && ny === 0) continue;
    let aMin = Infinity, aMax = -Infinity, bMin = Infinity, bMax = -Infinity;
    for (const v of a) {
      const d = v[0] * nx + v[1] * ny;
      aMin = Math.min(aMin, d);
      aMax = Math.max(aMax, d);
    }
    for (const v of b) {
      const d = v[0] * nx + v[1] * ny;
      bMin = Math.min(bMin, d);
      bMax = Math.max(bMax, d);
    }
    if (aMax <= bMin || bMax <= aMin) return true;
  }
  return false;
}

/**
 * True when two convex shapes (corner lists, any winding; a two-point list is a segment) share
 * interior or cross. Touching along an edge counts as apart.
 */
export function convexOverlap(a: readonly PointMm[], b: readonly PointMm[]): boolean {
  return !separated(a, b, a) && !separated(a, b, b);
}
