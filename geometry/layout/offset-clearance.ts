/**
 * The exact no-fit test of the sheet plan: a candidate's offset ring (outline grown by half the cutting
 * gap) must share no area with the offset ring of any piece already on the sheet and must lie inside the
 * sheet. Shared area comes from clipper-lib's boolean intersection (Vatti 1992) on integer micrometres,
 * after a bounding-box prefilter; containment in the sheet rectangle is a bounds test, exact because a
 * polygon lies inside a convex region exactly when all its vertices do.
 */
import ClipperLib from 'clipper-lib';
import type { OffsetRing } from './offset-ring';

interface Occupant {
  paths: ClipperLib.Paths;
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

const shift = (paths: ClipperLib.Paths, dx: number, dy: number): ClipperLib.Paths => paths.map((p) => p.map((q) => ({ X: q.X + dx, Y: q.Y + dy })));

/** The offset rings placed on one stock sheet, sheet coordinates in µm (origin at the lower-left corner). */
export class OffsetClearance {
  private readonly widthUm: number;
  private readonly heightUm: number;
  private readonly occupants: Occupant[] = [];

  /** A sheet of `widthUm` × `heightUm` micrometres, empty. */
  constructor(widthUm: number, heightUm: number) {
    this.widthUm = widthUm;
    this.heightUm = heightUm;
  }

  /**
   * True when `ring` moved by (`dx`, `dy`) µm lies inside the sheet and its intersection with every placed
   * offset ring has zero area (touching is allowed: each side already carries half the gap).
   */
  fits(ring: OffsetRing, dx: number, dy: number): boolean {
    const minX = ring.minX + dx;
    const minY = ring.minY + dy;
    const maxX = ring.maxX + dx;
    const maxY = ring.maxY + dy;
    if (minX < 0 || minY < 0 || maxX > this.widthUm || maxY > this.heightUm) return false;
    const near: ClipperLib.Paths = [];
    for (const o of this.occupants) {
      if (o.maxX <= minX || maxX <= o.minX || o.maxY <= minY || maxY <= o.minY) continue;
      for (const p of o.paths) near.push(p);
    }
    if (near.length === 0) return true;
    const c = new ClipperLib.Clipper();
    c.AddPaths(shift(ring.paths, dx, dy), ClipperLib.PolyType.ptSubject, true);
    c.AddPaths(near, ClipperLib.PolyType.ptClip, true);
    const shared: ClipperLib.Paths = [];
    c.Execute(ClipperLib.ClipType.ctIntersection, shared, ClipperLib.PolyFillType.pftNonZero, ClipperLib.PolyFillType.pftNonZero);
    let area = 0;
    for (const p of shared) area += ClipperLib.Clipper.Area(p);
    return area <= 0;
  }

  /** Records `ring` moved by (`dx`, `dy`) µm as placed. Precondition: fits(ring, dx, dy). */
  add(ring: OffsetRing, dx: number, dy: number): void {
    this.occupants.push({ paths: shift(ring.paths, dx, dy), minX: ring.minX + dx, minY: ring.minY + dy, maxX: ring.maxX + dx, maxY: ring.maxY + dy });
  }
}
