/**
 * Arranges one paper template per piece for the tiled print: each piece turned square to the page (its
 * minimum-area rectangle along the axes; the sheet plan's nesting turns are separate), in
 * shelves (rows) across a strip whose width is a whole number of page steps, choosing the width that
 * needs the fewest pages. Paper is cheap, so simple shelves (Coffman et al. 1980, next-fit decreasing
 * height) are enough here; foam is nested true-shape in layout/plan-sheets.ts.
 */
import type { PatternDoc, PatternPiece } from '../pattern/pattern-doc';
import { minAreaRect } from '../layout/min-area-rect';
import { boundsOf, placeRing, type PlaceTransform } from '../layout/outline-transform';
import { tilePages, type TileGrid, type TileOptions } from './tile-pages';
import type { PageSizeName } from './page-sizes';
import { templateCopies } from './piece-drawing';

export interface ArrangedTemplate {
  piece: PatternPiece;
  /** Which copy's match marks the template carries (0-based; piece-drawing.ts templateCopies). */
  copyIndex: number;
  transform: PlaceTransform;
}

export interface TemplateArrangement {
  widthMm: number;
  heightMm: number;
  items: ArrangedTemplate[];
  grid: TileGrid;
}

/**
 * The turn (degrees) that sets a template square to the page: its minimum-area rectangle axis-aligned,
 * long side along x (min-area-rect.ts), so a square cube face prints square rather than as a diamond.
 */
export function templateRotationDeg(piece: PatternPiece): number {
  return minAreaRect(piece.outline).rotationDeg;
}

function shelves(pieces: PatternPiece[], stripW: number, gap: number): { items: ArrangedTemplate[]; w: number; h: number } {
  const sized = pieces
    .flatMap((piece) => {
      const rotationDeg = templateRotationDeg(piece);
      const b = boundsOf(placeRing(piece.outline, { mirrored: false, rotationDeg, x: 0, y: 0 }));
      return templateCopies(piece).map((copyIndex) => ({ piece, copyIndex, rotationDeg, b }));
    })
    .sort((a, b) => b.b.maxY - b.b.minY - (a.b.maxY - a.b.minY));
  const rows: Array<{ list: typeof sized; h: number }> = [];
  let cur: { list: typeof sized; h: number; w: number } | null = null;
  for (const s of sized) {
    const w = s.b.maxX - s.b.minX;
    if (!cur || cur.w + w + gap > stripW) {
      cur = { list: [], h: s.b.maxY - s.b.minY, w: gap };
      rows.push(cur);
    }
    cur.list.push(s);
    cur.w += w + gap;
  }
  const total = rows.reduce((a, r) => a + r.h + gap, gap);
  const items: ArrangedTemplate[] = [];
  let maxW = 0;
  let top = total - gap;
  for (const r of rows) {
    let x = gap;
    for (const s of r.list) {
      items.push({ piece: s.piece, copyIndex: s.copyIndex, transform: { mirrored: false, rotationDeg: s.rotationDeg, x: x - s.b.minX, y: top - (s.b.maxY - s.b.minY) - s.b.minY } });
      x += s.b.maxX - s.b.minX + gap;
    }
    maxW = Math.max(maxW, x);
    top -= r.h + gap;
  }
  return { items, w: maxW, h: total };
}

/**
 * Returns the template arrangement (drawing mm, y up) and its page grid for `doc` on `page`, trying
 * strip widths of 1–6 page steps in both orientations and keeping the one with the fewest pages.
 * `gapMm` is the paper between templates (default 12, room for the bevel notes along edges).
 */
export function arrangeTemplates(doc: PatternDoc, page: PageSizeName | string, tile: TileOptions = {}, gapMm = 12): TemplateArrangement {
  let best: TemplateArrangement | null = null;
  for (const orientation of ['portrait', 'landscape'] as const) {
    const probe = tilePages({ widthMm: 1, heightMm: 1 }, page, { ...tile, orientation });
    const step = probe.window.width - probe.overlapMm;
    for (let k = 1; k <= 6; k++) {
      const { items, w, h } = shelves(doc.pieces, k * step + probe.overlapMm, gapMm);
      const grid = tilePages({ widthMm: w, heightMm: h }, page, { ...tile, orientation });
      if (!best || grid.rows * grid.cols < best.grid.rows * best.grid.cols) best = { widthMm: w, heightMm: h, items, grid };
    }
  }
  return best as TemplateArrangement;
}
