/**
 * Rigid placement of pattern outlines on a sheet: optional mirror, rotation about the piece origin,
 * then translation. Convention used by every layout and export module:
 *   p' = R(rotationDeg) · M · p + (x, y),  M = diag(−1, 1) when mirrored, identity otherwise.
 * Mirroring reverses the winding, so closed outlines are re-reversed to stay counter-clockwise;
 * open paths (seam edges, score lines) keep their point order so distances along them still read
 * from the same end.
 */
import type { PointMm } from '../pattern/pattern-doc';

export interface PlaceTransform {
  mirrored: boolean;
  rotationDeg: number;
  x: number;
  y: number;
}

/** Returns a function mapping a piece-plane point (mm) to its placed position (mm). */
export function placePointFn(t: PlaceTransform): (p: PointMm) => PointMm {
  const a = (t.rotationDeg * Math.PI) / 180;
  const c = Math.cos(a);
  const s = Math.sin(a);
  const m = t.mirrored ? -1 : 1;
  return (p) => {
    const px = m * p[0];
    return [c * px - s * p[1] + t.x, s * px + c * p[1] + t.y];
  };
}

/** Places an open path (point order kept). */
export function placePath(path: readonly PointMm[], t: PlaceTransform): PointMm[] {
  const f = placePointFn(t);
  return path.map(f);
}

/** Places a closed ring and keeps its winding sense (reverses the order when mirrored). */
export function placeRing(ring: readonly PointMm[], t: PlaceTransform): PointMm[] {
  const out = placePath(ring, t);
  return t.mirrored ? out.reverse() : out;
}

export interface BoundsMm {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** Axis-aligned bounds of one or more point lists (mm). Precondition: at least one point. */
export function boundsOf(...lists: readonly (readonly PointMm[])[]): BoundsMm {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const l of lists) {
    for (const [x, y] of l) {
      if (x < minX) minX = x;
      if (y < minY) minY = y;
      if (x > maxX) maxX = x;
      if (y > maxY) maxY = y;
    }
  }
  return { minX, minY, maxX, maxY };
}
