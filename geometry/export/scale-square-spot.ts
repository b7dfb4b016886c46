/**
 * Where the scale-check squares (a 4 in square around a 100 mm square, labelled) can sit on a printed
 * page without hiding any piece: a conservative raster of the page's content (raster-mask.ts: every
 * cell a piece outline touches is set, plus the boxes of marks and text) finds free spots through a
 * summed-area table (Crow 1984), and clipper's boolean intersection (Vatti 1992) then proves the chosen
 * square shares no area with any piece outline.
 */
import { sharedAreaMm2 } from '../layout/clipper-paths';
import type { BoundsMm } from '../layout/outline-transform';
import { rasterizeRing } from '../layout/raster-mask';
import type { PointMm } from '../pattern/pattern-doc';
import type { PageRectMm } from './tile-pages';

/** Side of the outer (4 in) check square, mm. */
export const SCALE_SQUARE_SIDE_MM = 4 * 25.4;
/** Room the squares and their labels take: the 4 in square plus the label line above it, mm. */
export const SCALE_SQUARE_FOOTPRINT_MM = { width: SCALE_SQUARE_SIDE_MM, height: SCALE_SQUARE_SIDE_MM + 4.5 };
/** Depth of the strip a page keeps free for the squares when no free spot exists, mm. */
export const SCALE_STRIP_MM = SCALE_SQUARE_FOOTPRINT_MM.height + 4;

/** What is printed on a page, in page mm (y down): piece outlines as rings, marks and text as boxes. */
export interface PageContent {
  rings: PointMm[][];
  boxes: BoundsMm[];
}

/** The footprint rectangle (page mm) of squares whose lower-left corner is `corner`. */
export function squareFootprint(corner: PointMm): PointMm[] {
  const [x, y] = corner;
  const { width, height } = SCALE_SQUARE_FOOTPRINT_MM;
  return [[x, y], [x + width, y], [x + width, y - height], [x, y - height]];
}

/**
 * Returns the lower-left corner (page mm, y down) for the check squares inside `region`, keeping
 * `clearanceMm` from everything in `content`, or null when no such spot exists. Among free spots the
 * one nearest a corner of the region wins, so the squares sit in a page corner when they can.
 */
export function freeSquareSpot(region: PageRectMm, content: PageContent, clearanceMm = 2): PointMm | null {
  const cell = 2;
  const nx = Math.floor(region.width / cell);
  const ny = Math.floor(region.height / cell);
  const fw = Math.ceil((SCALE_SQUARE_FOOTPRINT_MM.width + 2 * clearanceMm) / cell);
  const fh = Math.ceil((SCALE_SQUARE_FOOTPRINT_MM.height + 2 * clearanceMm) / cell);
  if (nx < fw || ny < fh) return null;
  const busy = new Uint8Array(nx * ny);
  const mark = (c0: number, c1: number, r: number) => {
    if (r < 0 || r >= ny) return;
    for (let c = Math.max(0, c0); c <= Math.min(nx - 1, c1); c++) busy[r * nx + c] = 1;
  };
  for (const ring of content.rings) {
    let minX = Infinity, minY = Infinity;
    for (const [x, y] of ring) {
      if (x < minX) minX = x;
      if (y < minY) minY = y;
    }
    // Shift by whole cells so the ring's raster lines up with the page grid.
    const ox = Math.floor((minX - region.left) / cell);
    const oy = Math.floor((minY - region.top) / cell);
    const local = ring.map(([x, y]) => [x - region.left - ox * cell, y - region.top - oy * cell] as PointMm);
    const mask = rasterizeRing(local, cell);
    mask.rows.forEach((runs, r) => {
      for (let k = 0; k < runs.length; k += 2) mark(runs[k] + ox, runs[k + 1] + ox, r + oy);
    });
  }
  for (const b of content.boxes) {
    const c0 = Math.floor((b.minX - region.left) / cell);
    const c1 = Math.floor((b.maxX - region.left) / cell);
    for (let r = Math.floor((b.minY - region.top) / cell); r <= Math.floor((b.maxY - region.top) / cell); r++) mark(c0, c1, r);
  }
  // Summed-area table: sat[(r)(nx+1)+c] = busy cells above and left of (r, c).
  const w = nx + 1;
  const sat = new Int32Array(w * (ny + 1));
  for (let r = 0; r < ny; r++) {
    let row = 0;
    for (let c = 0; c < nx; c++) {
      row += busy[r * nx + c];
      sat[(r + 1) * w + c + 1] = sat[r * w + c + 1] + row;
    }
  }
  const free = (r: number, c: number) => sat[(r + fh) * w + c + fw] - sat[r * w + c + fw] - sat[(r + fh) * w + c] + sat[r * w + c] === 0;
  const spots: Array<{ r: number; c: number; d: number }> = [];
  const maxR = ny - fh;
  const maxC = nx - fw;
  for (let r = 0; r <= maxR; r++) {
    for (let c = 0; c <= maxC; c++) {
      if (free(r, c)) spots.push({ r, c, d: Math.min(r, maxR - r) + Math.min(c, maxC - c) });
    }
  }
  spots.sort((a, b) => a.d - b.d || b.r - a.r || b.c - a.c);
  for (const s of spots.slice(0, 8)) {
    const corner: PointMm = [region.left + (s.c * cell) + clearanceMm, region.top + (s.r + fh) * cell - clearanceMm];
    const foot = squareFootprint(corner);
    if (content.rings.every((ring) => sharedAreaMm2(foot, ring) === 0)) return corner;
  }
  return null;
}
