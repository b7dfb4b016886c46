/**
 * Bridges millimetre rings and clipper2-js integer paths (1 µm per unit), and measures the area two
 * outlines share by clipper's boolean intersection (Vatti clipping, Vatti 1992).
 */
import { Clipper, FillRule, Path64, Paths64, Point64 } from 'clipper2-js';
import type { PointMm } from '../pattern/pattern-doc';

/** Integer units per millimetre handed to clipper (1 µm resolution). */
export const CLIPPER_SCALE = 1000;

/** Converts a ring in mm to a clipper path in integer micrometres. */
export function ringToPath64(ring: readonly PointMm[]): Path64 {
  const p = new Path64();
  for (const [x, y] of ring) p.push(new Point64(Math.round(x * CLIPPER_SCALE), Math.round(y * CLIPPER_SCALE)));
  return p;
}

/** Area (mm²) shared by the interiors of two simple rings (any winding), by non-zero fill. */
export function sharedAreaMm2(a: readonly PointMm[], b: readonly PointMm[]): number {
  const s = new Paths64();
  s.push(ringToPath64(a));
  const c = new Paths64();
  c.push(ringToPath64(b));
  return Math.abs(Clipper.areaPaths(Clipper.Intersect(s, c, FillRule.NonZero))) / CLIPPER_SCALE ** 2;
}
