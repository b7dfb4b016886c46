/**
 * Splits a drawing (mm, y up) into printed page tiles at 1:1. Each page keeps a printable-area margin,
 * a header band for its row/column label, and shares an overlap band with its neighbours; alignment
 * marks sit in the overlap bands at the same drawing position on both pages, so the maker lays one
 * page over the next until the marks coincide. Page coordinates are mm from the page's top-left
 * corner, y down (the PDF convention after the usual flip).
 */
import { GeometryError } from '../errors';
import type { PointMm } from '../pattern/pattern-doc';
import { pageSize, type PageOrientation, type PageSize, type PageSizeName } from './page-sizes';

export interface TileOptions {
  /** Unprintable edge most home printers need, mm. Default 6. */
  marginMm?: number;
  /** Overlap shared by neighbouring tiles, mm. Default 10. */
  overlapMm?: number;
  /** Band under the top margin for the page label, mm. Default 9. */
  headerMm?: number;
  /** Force an orientation instead of choosing the one with fewer pages. */
  orientation?: PageOrientation;
  /**
   * Depth of a strip kept free of drawing at the far end of the page's long side (bottom of a portrait
   * page, right of a landscape one), mm; room for the scale-check squares when no tile has a free spot.
   * Default 0 (no strip).
   */
  reserveMm?: number;
}

/** A page rectangle, mm from the page's top-left corner, y down. */
export interface PageRectMm {
  left: number;
  top: number;
  width: number;
  height: number;
}

export interface AlignmentMark {
  /** Same id on both pages that share it. */
  id: string;
  /** Position in the drawing, mm, y up. */
  at: PointMm;
}

export interface Tile {
  row: number;
  col: number;
  /** Drawing window of this tile, drawing mm: x from x0 to x0 + window width, y from yTop down. */
  x0: number;
  yTop: number;
  marks: AlignmentMark[];
}

export interface TileGrid {
  page: PageSize;
  marginMm: number;
  overlapMm: number;
  headerMm: number;
  /** Drawing window on each page: left/top in page mm, width/height mm. */
  window: PageRectMm;
  /** The strip kept free of drawing (TileOptions.reserveMm), or null. */
  reserved: PageRectMm | null;
  rows: number;
  cols: number;
  tiles: Tile[];
}

/** Page position (mm from top-left, y down) of a drawing point on `tile`. */
export function drawingToPage(grid: TileGrid, tile: Tile, p: PointMm): PointMm {
  return [grid.window.left + (p[0] - tile.x0), grid.window.top + (tile.yTop - p[1])];
}

function gridFor(area: { widthMm: number; heightMm: number }, page: PageSize, margin: number, overlap: number, header: number, reserve: number): TileGrid {
  const window = { left: margin, top: margin + header, width: page.widthMm - 2 * margin, height: page.heightMm - 2 * margin - header };
  let reserved: PageRectMm | null = null;
  if (reserve > 0 && page.orientation === 'portrait') {
    window.height -= reserve;
    reserved = { left: window.left, top: window.top + window.height, width: window.width, height: reserve };
  } else if (reserve > 0) {
    window.width -= reserve;
    reserved = { left: window.left + window.width, top: window.top, width: reserve, height: window.height };
  }
  if (window.width <= overlap + 1 || window.height <= overlap + 1) {
    throw new GeometryError('BAD_OPTION', `page ${page.name} leaves no room to draw with a ${margin} mm margin, a ${overlap} mm overlap${reserve > 0 ? ` and a ${reserve} mm strip for the check squares` : ''}`);
  }
  const stepX = window.width - overlap;
  const stepY = window.height - overlap;
  const cols = Math.max(1, Math.ceil((area.widthMm - overlap) / stepX - 1e-9));
  const rows = Math.max(1, Math.ceil((area.heightMm - overlap) / stepY - 1e-9));
  const tiles: Tile[] = [];
  for (let r = 0; r < rows; r++) {
    for (let c = 0; c < cols; c++) {
      const x0 = c * stepX;
      const yTop = area.heightMm - r * stepY;
      const marks: AlignmentMark[] = [];
      // Marks in the vertical overlap band shared with the left and right neighbours, at 30 % and 70 %
      // of the window height (away from the horizontal bands so the two kinds never crowd each other).
      for (const cc of [c, c + 1]) {
        if (cc < 1 || cc >= cols) continue;
        const x = cc * stepX + overlap / 2;
        for (const f of [0.3, 0.7]) marks.push({ id: `V${cc}.${r}.${f * 10}`, at: [x, area.heightMm - r * stepY - f * window.height] });
      }
      for (const rr of [r, r + 1]) {
        if (rr < 1 || rr >= rows) continue;
        const y = area.heightMm - rr * stepY - overlap / 2;
        for (const f of [0.3, 0.7]) marks.push({ id: `H${c}.${rr}.${f * 10}`, at: [c * stepX + f * window.width, y] });
      }
      tiles.push({ row: r, col: c, x0, yTop, marks });
    }
  }
  return { page, marginMm: margin, overlapMm: overlap, headerMm: header, window, reserved, rows, cols, tiles };
}

/**
 * Tiles a drawing of `area` (mm) onto pages of `pageName`. Returns the grid (rows × cols tiles) in the
 * orientation that needs fewer pages (portrait on a tie) unless one is forced; with `reserveMm` each
 * page keeps a strip free of drawing (TileOptions). Throws
 * GeometryError('BAD_OPTION') for an unknown page size, a non-positive area, or margins that leave no
 * room on the page.
 */
export function tilePages(area: { widthMm: number; heightMm: number }, pageName: PageSizeName | string, opts: TileOptions = {}): TileGrid {
  const margin = opts.marginMm ?? 6;
  const overlap = opts.overlapMm ?? 10;
  const header = opts.headerMm ?? 9;
  const reserve = opts.reserveMm ?? 0;
  if (!(area.widthMm > 0 && area.heightMm > 0)) throw new GeometryError('BAD_OPTION', `drawing area must be positive, got ${area.widthMm}×${area.heightMm} mm`);
  if (!(margin >= 0 && overlap >= 0 && header >= 0 && reserve >= 0)) throw new GeometryError('BAD_OPTION', 'margin, overlap, header and reserved strip must be 0 mm or more');
  const options: PageOrientation[] = opts.orientation ? [opts.orientation] : ['portrait', 'landscape'];
  let best: TileGrid | null = null;
  for (const o of options) {
    const g = gridFor(area, pageSize(pageName, o), margin, overlap, header, reserve);
    if (!best || g.rows * g.cols < best.rows * best.cols) best = g;
  }
  return best as TileGrid;
}
