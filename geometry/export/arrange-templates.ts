/**
 * Arranges one paper template per piece for the tiled print: each piece turned square to the page (its
 * minimum-area rectangle along the axes; the sheet plan's nesting turns are separate), in shelves
 * (rows) across a strip whose width is a whole number of page steps, choosing the width that needs the
 * fewest pages. Paper is cheap, so simple shelves are enough here (Coffman et al. 1980, decreasing
 * height; the open shelf takes the tallest template that still fits before a new one opens); foam is
 * nested true-shape in layout/plan-sheets.ts. With `keepOut`, the tiles' positions in the drawing are
 * known in advance (page step = window minus overlap), so each tile keeps a block for the check squares
 * at a corner, an edge middle or the centre of its window, and the shelves place templates around the
 * blocks; every page then has room for the squares without a strip across the whole page.
 */
import type { PatternDoc, PatternPiece } from '../pattern/pattern-doc';
import { minAreaRect } from '../layout/min-area-rect';
import { boundsOf, placeRing, type PlaceTransform } from '../layout/outline-transform';
import { tilePages, type TileGrid, type TileOptions } from './tile-pages';
import type { PageSizeName } from './page-sizes';
import { templateCopies } from './piece-drawing';
import { SCALE_SQUARE_FOOTPRINT_MM } from './scale-square-spot';

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

/** Room kept clear for the check squares in each tile: their footprint rounded up to the 2 mm spot grid, plus slack, mm. */
const KEEP_OUT = {
  width: Math.ceil((SCALE_SQUARE_FOOTPRINT_MM.width + 4) / 2) * 2 + 4,
  height: Math.ceil((SCALE_SQUARE_FOOTPRINT_MM.height + 4) / 2) * 2 + 4,
};

/** Where a tile's block may sit: 0–8 on a 3×3 grid of its window (corners, edge middles, centre), top-left first. */
const SPOTS = [0, 2, 6, 8, 1, 7, 3, 5, 4];

/** Axis box in drawing x and depth below the drawing's top edge, mm. */
interface Box {
  x0: number;
  x1: number;
  d0: number;
  d1: number;
}

const meets = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.d0 < b.d1 && b.d0 < a.d1;

/** Page lattice of a strip: window size and step, for the keep-out block of every tile. */
interface Lattice {
  winW: number;
  winH: number;
  overlap: number;
}

/**
 * Keep-out blocks, one per tile, inside the tile's window clear of the overlap bands: at a corner, an
 * edge's middle or the centre. A template may cover a tile's block when the block can move to another of
 * those spots that no template uses.
 */
class KeepOuts {
  private spot = new Map<string, number>();
  private placed: Box[] = [];
  constructor(private lat: Lattice) {}

  private block(r: number, c: number, k: number): Box {
    const { winW, winH, overlap: ov } = this.lat;
    const x0 = c * (winW - ov) + ov;
    const d0 = r * (winH - ov) + ov;
    const x = x0 + ((k % 3) / 2) * (winW - 2 * ov - KEEP_OUT.width);
    const d = d0 + (Math.floor(k / 3) / 2) * (winH - 2 * ov - KEEP_OUT.height);
    return { x0: x, x1: x + KEEP_OUT.width, d0: d, d1: d + KEEP_OUT.height };
  }

  private tilesUnder(b: Box): Array<[number, number]> {
    const sx = this.lat.winW - this.lat.overlap;
    const sy = this.lat.winH - this.lat.overlap;
    const out: Array<[number, number]> = [];
    for (let r = Math.max(0, Math.floor(b.d0 / sy) - 1); r * sy < b.d1; r++) {
      for (let c = Math.max(0, Math.floor(b.x0 / sx) - 1); c * sx < b.x1; c++) out.push([r, c]);
    }
    return out;
  }

  /**
   * The block moves that let `b` be placed (empty when none are needed), or null when some tile's
   * block cannot go anywhere clear. The right edge of the blocking block comes back for the caller to skip.
   */
  fit(b: Box): { moves: Array<[string, number]> } | { blockedTo: number } {
    const moves: Array<[string, number]> = [];
    for (const [r, c] of this.tilesUnder(b)) {
      const key = `${r},${c}`;
      const k = this.spot.get(key) ?? 0;
      if (k < 0) continue;
      const cur = this.block(r, c, k);
      if (!meets(cur, b)) continue;
      const alt = SPOTS.find((j) => {
        const q = this.block(r, c, j);
        return !meets(q, b) && this.placed.every((p) => !meets(q, p));
      });
      if (alt === undefined) return { blockedTo: cur.x1 };
      moves.push([key, alt]);
    }
    return { moves };
  }

  /** Records `b` as taken, applying its block moves; `force` gives up the blocks of tiles it still covers. */
  take(b: Box, moves: Array<[string, number]>, force = false): void {
    for (const [key, k] of moves) this.spot.set(key, k);
    if (force) {
      for (const [r, c] of this.tilesUnder(b)) {
        const key = `${r},${c}`;
        const k = this.spot.get(key) ?? 0;
        if (k >= 0 && meets(this.block(r, c, k), b)) this.spot.set(key, -1);
      }
    }
    this.placed.push(b);
  }
}

function shelves(pieces: PatternPiece[], stripW: number, gap: number, lattice: Lattice | null): { items: ArrangedTemplate[]; w: number; h: number; forced: number } {
  const sized = pieces
    .flatMap((piece) => {
      const rotationDeg = templateRotationDeg(piece);
      const b = boundsOf(placeRing(piece.outline, { mirrored: false, rotationDeg, x: 0, y: 0 }));
      return templateCopies(piece).map((copyIndex) => ({ piece, copyIndex, rotationDeg, b }));
    })
    .sort((a, b) => b.b.maxY - b.b.minY - (a.b.maxY - a.b.minY));
  const keep = lattice ? new KeepOuts(lattice) : null;
  // Labels and bevel notes reach into the gap around an outline, so the block stays half a gap clear of it.
  const pad = gap / 2;
  const placedAt: Array<{ s: (typeof sized)[number]; x: number; d: number }> = [];
  let shelfTop = gap;
  let shelfH = -1;
  let cursor = gap;
  let forced = 0;
  const tryShelf = (w: number, h: number, d: number, x: number, fresh: boolean): { x: number } | null => {
    for (let tries = 0; tries < 64; tries++) {
      if (!fresh && x + w + gap > stripW) return null;
      if (fresh && x > gap && x + w + gap > stripW) return null;
      const box = { x0: x - pad, x1: x + w + pad, d0: d - pad, d1: d + h + pad };
      const f = keep ? keep.fit(box) : { moves: [] };
      if ('moves' in f) {
        keep?.take(box, f.moves);
        return { x };
      }
      x = f.blockedTo + pad;
    }
    return null;
  };
  const dims = (s: (typeof sized)[number]) => ({ w: s.b.maxX - s.b.minX, h: s.b.maxY - s.b.minY });
  const left = [...sized];
  const put = (i: number, x: number, d: number, newShelf: boolean) => {
    const s = left.splice(i, 1)[0];
    placedAt.push({ s, x, d });
    if (newShelf) {
      shelfTop = d;
      shelfH = dims(s).h;
    }
    cursor = x + dims(s).w + gap;
  };
  while (left.length) {
    // The tallest template that still fits on the current shelf, pushed right past blocks as needed.
    let i = shelfH < 0 ? -1 : left.findIndex((s) => dims(s).h <= shelfH && dims(s).w + 2 * gap <= stripW);
    let at: { x: number } | null = null;
    for (; i >= 0 && i < left.length; i++) {
      at = tryShelf(dims(left[i]).w, dims(left[i]).h, shelfTop, cursor, false);
      if (at) break;
    }
    if (at) {
      put(i, at.x, shelfTop, false);
      continue;
    }
    // A new shelf opens with the tallest template that fits at its start; when none does, the shelf
    // moves down (at most one page step) below the blocks in its way.
    const start = shelfH >= 0 ? shelfTop + shelfH + gap : gap;
    let placed = false;
    for (let top = start; !placed && lattice && top < start + lattice.winH; top += 2) {
      for (let j = 0; j < left.length && !placed; j++) {
        const o = tryShelf(dims(left[j]).w, dims(left[j]).h, top, gap, true);
        if (o) {
          put(j, o.x, top, true);
          placed = true;
        }
      }
    }
    if (placed) continue;
    const first = tryShelf(dims(left[0]).w, dims(left[0]).h, start, gap, true);
    if (!first) forced++;
    if (!first) keep?.take({ x0: gap - pad, x1: gap + dims(left[0]).w + pad, d0: start - pad, d1: start + dims(left[0]).h + pad }, [], true);
    put(0, first ? first.x : gap, start, true);
  }
  const total = placedAt.reduce((m, p) => Math.max(m, p.d + p.s.b.maxY - p.s.b.minY), 0) + gap;
  const maxW = placedAt.reduce((m, p) => Math.max(m, p.x + p.s.b.maxX - p.s.b.minX), 0) + gap;
  const items: ArrangedTemplate[] = placedAt.map(({ s, x, d }) => ({
    piece: s.piece,
    copyIndex: s.copyIndex,
    transform: { mirrored: false, rotationDeg: s.rotationDeg, x: x - s.b.minX, y: total - d - s.b.maxY },
  }));
  return { items, w: maxW, h: total, forced };
}

/**
 * Returns the candidate template arrangements (drawing mm, y up) with their page grids for `doc` on
 * `page`: strip widths of 1–6 page steps in both orientations, fewest pages first (on a tie, fewest
 * templates laid over a block). `gapMm` is the paper between templates (default 12, room for the bevel
 * notes along edges). With `keepOut`, every tile keeps a block clear for the check squares; a template
 * too big to miss a block gives that block up, so the caller checks each page for a free spot and may
 * move on to the next candidate.
 */
export function templateArrangements(doc: PatternDoc, page: PageSizeName | string, tile: TileOptions = {}, gapMm = 12, keepOut = false): TemplateArrangement[] {
  const out: Array<{ arr: TemplateArrangement; forced: number }> = [];
  for (const orientation of ['portrait', 'landscape'] as const) {
    const probe = tilePages({ widthMm: 1, heightMm: 1 }, page, { ...tile, orientation });
    const step = probe.window.width - probe.overlapMm;
    const lattice = keepOut ? { winW: probe.window.width, winH: probe.window.height, overlap: probe.overlapMm } : null;
    for (let k = 1; k <= 6; k++) {
      const { items, w, h, forced } = shelves(doc.pieces, k * step + probe.overlapMm, gapMm, lattice);
      const grid = tilePages({ widthMm: w, heightMm: h }, page, { ...tile, orientation });
      out.push({ arr: { widthMm: w, heightMm: h, items, grid }, forced });
    }
  }
  return out.sort((a, b) => a.arr.grid.tiles.length - b.arr.grid.tiles.length || a.forced - b.forced).map((o) => o.arr);
}

/** The first of templateArrangements: the arrangement needing the fewest pages. */
export function arrangeTemplates(doc: PatternDoc, page: PageSizeName | string, tile: TileOptions = {}, gapMm = 12, keepOut = false): TemplateArrangement {
  return templateArrangements(doc, page, tile, gapMm, keepOut)[0];
}
