/**
 * The smallest-area rectangle around an outline, for turning paper templates square to the page.
 * The convex hull comes from Andrew's monotone chain (Andrew 1979); the rectangle from rotating
 * calipers over the hull's edges, using the theorem that a minimum-area enclosing rectangle has one
 * side collinear with a hull edge (Freeman and Shapira 1975; Toussaint 1983).
 */
import type { PointMm } from '../pattern/pattern-doc';

/** Convex hull of `points` (mm), counter-clockwise, collinear points dropped. Fewer than 3 distinct points give what there is. */
export function convexHull(points: readonly PointMm[]): PointMm[] {
  const pts = [...points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  if (pts.length < 3) return pts;
  const cross = (o: PointMm, a: PointMm, b: PointMm) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: PointMm[] = [];
  for (const p of pts) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: PointMm[] = [];
  for (let i = pts.length - 1; i >= 0; i--) {
    const p = pts[i];
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], p) <= 0) upper.pop();
    upper.push(p);
  }
  lower.pop();
  upper.pop();
  return lower.concat(upper);
}

export interface MinAreaRect {
  /** Rotation (degrees, counter-clockwise, in (−90, 90]) that turns the rectangle's long side along +x. */
  rotationDeg: number;
  /** Side lengths after that rotation, mm: width ≥ height. */
  widthMm: number;
  heightMm: number;
  areaMm2: number;
}

/**
 * Returns the minimum-area enclosing rectangle of `outline` (mm) as the rotation that makes it
 * axis-aligned with its long side along x, and its size. Ties in area (a square, a circle-like
 * polygon) go to the smallest turn, so an outline already square to the axes stays put.
 * Precondition: at least one point.
 */
export function minAreaRect(outline: readonly PointMm[]): MinAreaRect {
  const hull = convexHull(outline);
  let best: MinAreaRect | null = null;
  const n = hull.length;
  const candidates = n < 2 ? [0] : hull.map((p, i) => Math.atan2(hull[(i + 1) % n][1] - p[1], hull[(i + 1) % n][0] - p[0]));
  for (const edgeAngle of candidates) {
    // Turning by −edgeAngle lays this hull edge along x.
    const c = Math.cos(-edgeAngle);
    const s = Math.sin(-edgeAngle);
    let minX = Infinity, maxX = -Infinity, minY = Infinity, maxY = -Infinity;
    for (const [x, y] of hull) {
      const u = c * x - s * y;
      const v = s * x + c * y;
      if (u < minX) minX = u;
      if (u > maxX) maxX = u;
      if (v < minY) minY = v;
      if (v > maxY) maxY = v;
    }
    const w = maxX - minX;
    const h = maxY - minY;
    let rot = (-edgeAngle * 180) / Math.PI;
    if (h > w) rot += 90;
    rot = ((rot % 180) + 180) % 180;
    if (rot > 90) rot -= 180;
    if (rot <= -90 + 1e-9) rot += 180;
    const area = w * h;
    const cand: MinAreaRect = { rotationDeg: rot, widthMm: Math.max(w, h), heightMm: Math.min(w, h), areaMm2: area };
    const tol = 1e-9 * Math.max(1, area);
    if (!best || area < best.areaMm2 - tol || (Math.abs(area - best.areaMm2) <= tol && Math.abs(rot) < Math.abs(best.rotationDeg))) best = cand;
  }
  return best as MinAreaRect;
}
