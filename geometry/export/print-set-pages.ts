/**
 * The print set's drawing pages, laid out before anything is rendered: which drawing ("area") each
 * page shows, through which tile, and where on the page the scale-check squares go. Modes:
 * - 'tiled': one paper template per piece, arranged and split over pages with overlap and alignment marks;
 * - 'piece-per-page': each piece on its own page (or its own tiles when bigger than a page);
 * - 'stock-sheet': each stock sheet of the sheet plan on one page of the sheet's size (large-format print
 *   or projector), every copy where the plan puts it.
 * The squares never cover a piece: each page gets a spot that clipper proves free (scale-square-spot.ts).
 * Tiled templates are also arranged around a block kept clear on every tile (arrange-templates.ts) and
 * with a strip kept free on every page; of the layouts that give every page a spot, the one with the
 * fewest pages wins (plain first, then the blocks, then the strip). Other modes fall back to the strip
 * only when some page has no free spot.
 */
import { GeometryError } from '../errors';
import { boundsOf, placeRing, type BoundsMm } from '../layout/outline-transform';
import type { SheetPlan } from '../layout/plan-sheets';
import type { PatternDoc, PatternPiece, PointMm } from '../pattern/pattern-doc';
import { arrangeTemplates, templateArrangements, templateRotationDeg, type TemplateArrangement } from './arrange-templates';
import { declutterTexts } from './declutter-texts';
import type { PageSize } from './page-sizes';
import { markedCopyIndex, pieceDrawing, templateCopies, type PieceDrawing } from './piece-drawing';
import { freeSquareSpot, SCALE_SQUARE_FOOTPRINT_MM, SCALE_STRIP_MM, type PageContent } from './scale-square-spot';
import { drawingToPage, tilePages, type PageRectMm, type Tile, type TileGrid, type TileOptions } from './tile-pages';
import { textBox } from './text-box';

export type PrintMode = 'tiled' | 'piece-per-page' | 'stock-sheet';

export interface PrintArea {
  title: string;
  widthMm: number;
  heightMm: number;
  drawings: PieceDrawing[];
  /** Piece label, its box and outline in drawing mm, for the page map. */
  boxes: Array<{ label: string; box: BoundsMm; outline: PointMm[] }>;
  grid: TileGrid;
}

export interface PrintPage {
  area: PrintArea;
  tile: Tile;
  /** Lower-left corner of the check squares, page mm (y down). */
  squareCorner: PointMm;
}

export interface PrintPagesOptions {
  page: string;
  mode: PrintMode;
  marginMm?: number;
  overlapMm?: number;
}

function drawingBox(d: PieceDrawing): BoundsMm {
  return boundsOf(...d.lines.map((l) => l.points));
}

function areaOf(title: string, widthMm: number, heightMm: number, drawings: PieceDrawing[], labels: string[], grid: TileGrid): PrintArea {
  const tidy = declutterTexts(drawings);
  return { title, widthMm, heightMm, drawings: tidy, grid, boxes: tidy.map((d, i) => ({ label: labels[i], box: drawingBox(d), outline: d.lines[0].points })) };
}

/** Everything a tile shows, moved to page mm: outlines as rings, other lines and text as boxes. */
export function tileContent(area: PrintArea, tile: Tile): PageContent {
  const g = area.grid;
  const w = g.window;
  const onPage = (b: BoundsMm) => {
    const a = drawingToPage(g, tile, [b.minX, b.maxY]);
    const c = drawingToPage(g, tile, [b.maxX, b.minY]);
    return { minX: a[0], minY: a[1], maxX: c[0], maxY: c[1] };
  };
  const visible = (b: BoundsMm) => b.maxX >= w.left && b.minX <= w.left + w.width && b.maxY >= w.top && b.minY <= w.top + w.height;
  const content: PageContent = { rings: [], boxes: [] };
  for (const d of area.drawings) {
    if (!visible(onPage(drawingBox(d)))) continue;
    d.lines.forEach((l, i) => {
      if (i === 0 || (l.style === 'cut' && l.closed)) content.rings.push(l.points.map((p) => drawingToPage(g, tile, p)));
      else content.boxes.push(onPage(boundsOf(l.points)));
    });
    for (const t of d.texts) content.boxes.push(onPage(boundsOf(textBox(t))));
  }
  return content;
}

/** The part of a tile's window the squares may use: away from the overlap bands the neighbours cover. */
function squareRegion(g: TileGrid, t: Tile): PageRectMm {
  const w = g.window;
  const ov = g.overlapMm;
  const l = t.col > 0 ? ov : 0;
  const r = t.col < g.cols - 1 ? ov : 0;
  const top = t.row > 0 ? ov : 0;
  const b = t.row < g.rows - 1 ? ov : 0;
  return { left: w.left + l, top: w.top + top, width: w.width - l - r, height: w.height - top - b };
}

/** Corner for the squares inside a reserved strip: its lower-left, clear of the strip's edges. */
function stripCorner(strip: PageRectMm): PointMm {
  return [strip.left + 2, strip.top + 2 + SCALE_SQUARE_FOOTPRINT_MM.height];
}

/** Squares for every tile of `area`, or null when some tile has no free spot. */
function placeSquares(area: PrintArea): PointMm[] | null {
  const g = area.grid;
  if (g.reserved) return g.tiles.map(() => stripCorner(g.reserved as PageRectMm));
  const out: PointMm[] = [];
  for (const t of g.tiles) {
    const spot = freeSquareSpot(squareRegion(g, t), tileContent(area, t));
    if (!spot) return null;
    out.push(spot);
  }
  return out;
}

function tiledArea(doc: PatternDoc, page: string, tile: TileOptions, given?: TemplateArrangement): PrintArea {
  const arr = given ?? arrangeTemplates(doc, page, tile);
  const drawings = arr.items.map((it) => pieceDrawing(it.piece, doc, it.transform, copyNote(it.piece, it.copyIndex), it.copyIndex));
  return areaOf('templates', arr.widthMm, arr.heightMm, drawings, arr.items.map((it) => it.piece.label), arr.grid);
}

/** "copy 2 of 6" under the label of a template that carries one copy's own match marks. */
function copyNote(piece: PatternPiece, copyIndex: number): string | undefined {
  return templateCopies(piece).length > 1 ? `copy ${copyIndex + 1} of ${piece.quantity}` : undefined;
}

function pieceArea(doc: PatternDoc, index: number, copyIndex: number, page: string, tile: TileOptions): PrintArea {
  const piece = doc.pieces[index];
  const rotationDeg = templateRotationDeg(piece);
  const b = boundsOf(placeRing(piece.outline, { mirrored: false, rotationDeg, x: 0, y: 0 }));
  const border = 14;
  const d = pieceDrawing(piece, doc, { mirrored: false, rotationDeg, x: border - b.minX, y: border - b.minY }, copyNote(piece, copyIndex), copyIndex);
  const widthMm = b.maxX - b.minX + 2 * border;
  const heightMm = b.maxY - b.minY + 2 * border;
  return areaOf(`piece ${piece.label}`, widthMm, heightMm, [d], [piece.label], tilePages({ widthMm, heightMm }, page, tile));
}

function sheetArea(doc: PatternDoc, plan: SheetPlan, si: number, margin: number, reserve: number): PrintArea {
  const s = plan.sheets[si];
  const header = 9;
  const drawings: PieceDrawing[] = [];
  const labels: string[] = [];
  for (const pl of plan.placements.filter((p) => p.sheetIndex === si)) {
    const piece = doc.pieces.find((q) => q.label === pl.pieceLabel);
    if (!piece) throw new GeometryError('EXPORT_FAILED', `the sheet plan places piece ${pl.pieceLabel}, which is not in the pattern`);
    drawings.push(pieceDrawing(piece, doc, pl, pl.spare ? `spare ${pl.copy}` : `copy ${pl.copy}`, markedCopyIndex(piece, pl.copy)));
    labels.push(pl.pieceLabel);
  }
  // The page is the sheet plus margins; a strip for the squares, when needed, goes under the sheet so
  // the page keeps the sheet's width.
  const page: PageSize = { name: 'a4', orientation: 'portrait', widthMm: s.widthMm + 2 * margin, heightMm: s.heightMm + 2 * margin + header + reserve };
  const window = { left: margin, top: margin + header, width: s.widthMm, height: s.heightMm };
  const grid: TileGrid = {
    page,
    marginMm: margin,
    overlapMm: 0,
    headerMm: header,
    window,
    reserved: reserve > 0 ? { left: margin, top: window.top + window.height, width: Math.max(s.widthMm, SCALE_SQUARE_FOOTPRINT_MM.width + 4), height: reserve } : null,
    rows: 1,
    cols: 1,
    tiles: [{ row: 0, col: 0, x0: 0, yTop: s.heightMm, marks: [] }],
  };
  return areaOf(`stock sheet ${si + 1} · ${s.thicknessMm} mm · ${s.widthMm.toFixed(0)}×${s.heightMm.toFixed(0)} mm`, s.widthMm, s.heightMm, drawings, labels, grid);
}

/**
 * Lays out the drawing pages of a print set: returns the areas (one per mode unit: the template
 * sheet, each piece, or each stock sheet) and the pages in print order, each with its tile and the
 * spot for the check squares (free of every piece, or in a reserved strip). Throws
 * GeometryError('BAD_OPTION') for an unknown page size or mode and 'EXPORT_FAILED' for a plan naming a piece
 * that is not in `doc`.
 */
export function printSetPages(doc: PatternDoc, plan: SheetPlan, opts: PrintPagesOptions): { areas: PrintArea[]; pages: PrintPage[] } {
  if (!['tiled', 'piece-per-page', 'stock-sheet'].includes(opts.mode)) {
    throw new GeometryError('BAD_OPTION', `unknown print mode "${opts.mode}": use tiled, piece-per-page or stock-sheet`);
  }
  const tile: TileOptions = { marginMm: opts.marginMm, overlapMm: opts.overlapMm };
  const strip: TileOptions = { ...tile, reserveMm: SCALE_STRIP_MM };
  const builders: Array<(reserve: boolean) => PrintArea> =
    opts.mode === 'tiled' ? [(r) => tiledArea(doc, opts.page, r ? strip : tile)]
      : opts.mode === 'piece-per-page' ? doc.pieces.flatMap((piece, i) => templateCopies(piece).map((k) => (r: boolean) => pieceArea(doc, i, k, opts.page, r ? strip : tile)))
        : plan.sheets.map((_, si) => (r: boolean) => sheetArea(doc, plan, si, opts.marginMm ?? 6, r ? SCALE_STRIP_MM : 0));
  const areas: PrintArea[] = [];
  const pages: PrintPage[] = [];
  for (const build of builders) {
    let area = build(false);
    let corners = placeSquares(area);
    if (opts.mode === 'tiled') {
      // Templates arranged around a block kept clear on every tile, or the strip layout, when either needs
      // fewer pages than the plain arrangement (or it leaves some page without a spot).
      const alts = [...templateArrangements(doc, opts.page, tile, undefined, true).map((a) => () => tiledArea(doc, opts.page, tile, a)), () => build(true)];
      for (const make of alts) {
        const alt = make();
        if (corners && alt.grid.tiles.length >= area.grid.tiles.length) continue;
        const altCorners = placeSquares(alt);
        if (altCorners) {
          area = alt;
          corners = altCorners;
        }
      }
    }
    if (!corners) {
      area = build(true);
      corners = placeSquares(area) as PointMm[];
    }
    areas.push(area);
    area.grid.tiles.forEach((t, i) => pages.push({ area, tile: t, squareCorner: corners[i] }));
  }
  return { areas, pages };
}
