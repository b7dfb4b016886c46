/**
 * Outward offset of a piece outline by clipper-lib's ClipperOffset (Clipper 1, Vatti clipping with
 * round joins; Vatti 1992), in integer micrometres. Used to keep the cutting gap: two outlines each
 * grown by half the gap whose offsets share no area are at least the gap apart.
 */
import ClipperLib from 'clipper-lib';
import type { PointMm } from '../pattern/pattern-doc';

/** Integer units per millimetre handed to clipper-lib (1 µm resolution). */
export const OFFSET_SCALE = 1000;

/**
 * Arc tolerance (µm) handed to ClipperOffset: the nominal largest distance between a round join's chords
 * and its true arc. Clipper 1 puts the arc's vertices on the circle, so the chords cut inside it, and it
 * rounds each join's step count to a whole number, so the join's last chord may span up to 1.5 nominal
 * steps and cut in up to 1.5² times the tolerance (measured: 10 µm at a 5 µm tolerance on a star's
 * corners). offsetRingUm grows the distance by that shortfall plus 2 µm for rounding the input to whole
 * µm, so the offset never falls short of the asked distance.
 */
const ARC_TOLERANCE_UM = 5;
const ARC_SHORTFALL_UM = Math.ceil(2.25 * ARC_TOLERANCE_UM);
const ROUNDING_MARGIN_UM = 2;

export interface OffsetRing {
  /** The offset region as clipper paths in µm: the outer ring (CCW) and any enclosed pockets (CW). */
  paths: ClipperLib.Paths;
  /** The outer ring in mm, for rasterizing. */
  outerMm: PointMm[];
  /** Bounds of the outer ring, µm. */
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** Converts a ring in mm to a clipper-lib path in whole micrometres. */
export function ringToIntPath(ring: readonly PointMm[]): ClipperLib.Path {
  return ring.map(([x, y]) => ({ X: Math.round(x * OFFSET_SCALE), Y: Math.round(y * OFFSET_SCALE) }));
}

/**
 * Returns `ring` (mm, simple, any winding) grown outward by `distanceMm` ≥ 0 with round joins: every
 * point of the result's boundary is at least `distanceMm` from the ring (and at most about 15 µm more).
 * A zero distance returns the ring itself in µm, counter-clockwise.
 */
export function offsetRingUm(ring: readonly PointMm[], distanceMm: number): OffsetRing {
  const path = ringToIntPath(ring);
  if (!ClipperLib.Clipper.Orientation(path)) path.reverse();
  let paths: ClipperLib.Paths = [path];
  if (distanceMm > 0) {
    const co = new ClipperLib.ClipperOffset(2, ARC_TOLERANCE_UM);
    co.AddPath(path, ClipperLib.JoinType.jtRound, ClipperLib.EndType.etClosedPolygon);
    paths = [];
    co.Execute(paths, Math.round(distanceMm * OFFSET_SCALE) + ARC_SHORTFALL_UM + ROUNDING_MARGIN_UM);
  }
  let outer = paths[0];
  for (const p of paths) if (ClipperLib.Clipper.Area(p) > ClipperLib.Clipper.Area(outer)) outer = p;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const q of outer) {
    if (q.X < minX) minX = q.X;
    if (q.Y < minY) minY = q.Y;
    if (q.X > maxX) maxX = q.X;
    if (q.Y > maxY) maxY = q.Y;
  }
  return { paths, outerMm: outer.map((q) => [q.X / OFFSET_SCALE, q.Y / OFFSET_SCALE] as PointMm), minX, minY, maxX, maxY };
}
