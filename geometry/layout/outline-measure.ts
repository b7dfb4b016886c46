/**
 * Measures of closed outlines and open paths in millimetres (shoelace area, polygon perimeter).
 */
import type { PointMm } from '../pattern/pattern-doc';

/** Signed area (mm²) of a closed ring by the shoelace formula; positive when counter-clockwise. */
export function signedAreaMm2(ring: readonly PointMm[]): number {
  let a = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) a += ring[j][0] * ring[i][1] - ring[i][0] * ring[j][1];
  return a / 2;
}

/** Perimeter (mm) of a closed ring, the closing edge included. */
export function ringPerimeterMm(ring: readonly PointMm[]): number {
  let s = 0;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) s += Math.hypot(ring[i][0] - ring[j][0], ring[i][1] - ring[j][1]);
  return s;
}

/** Length (mm) of an open path. */
export function pathLengthMm(path: readonly PointMm[]): number {
  let s = 0;
  for (let i = 1; i < path.length; i++) s += Math.hypot(path[i][0] - path[i - 1][0], path[i][1] - path[i - 1][1]);
  return s;
}

/**
 * The point and unit tangent at distance `d` (mm) along an open path, clamped to its ends.
 * Precondition: the path has at least two distinct points.
 */
export function pointAlongPath(path: readonly PointMm[], d: number): { p: PointMm; tangent: PointMm } {
  let rest = Math.max(0, d);
  for (let i = 1; i < path.length; i++) {
    const dx = path[i][0] - path[i - 1][0];
    const dy = path[i][1] - path[i - 1][1];
    const len = Math.hypot(dx, dy);
    if (len === 0) continue;
    if (rest <= len || i === path.length - 1) {
      const t = Math.min(1, rest / len);
      return { p: [path[i - 1][0] + t * dx, path[i - 1][1] + t * dy], tangent: [dx / len, dy / len] };
    }
    rest -= len;
  }
  return { p: path[0], tangent: [1, 0] };
}
