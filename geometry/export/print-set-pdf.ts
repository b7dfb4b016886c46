/**
 * The print set as a PDF at 1:1: a first page with instructions, legend, cautions and a page map,
 * then the drawing pages. Modes:
 * - 'tiled': one paper template per piece, arranged and split over pages with overlap and alignment marks;
 * - 'piece-per-page': each piece on its own page (or its own tiles when bigger than a page);
 * - 'stock-sheet': each stock sheet of the sheet plan on one page of the sheet's size (large-format print
 *   or projector), every copy where the plan puts it.
 * Every page carries its row/column label, the print-set name and the 100 mm and 4 in check squares.
 * Scale: 1 mm = 72/25.4 pt (ISO 32000-1 §8.3.2.3 user space unit of 1/72 in).
 */
import { GeometryError } from '../errors';
import { sharedAreaMm2 } from '../layout/clipper-paths';
import { boundsOf, placeRing, type BoundsMm } from '../layout/outline-transform';
import type { SheetPlan } from '../layout/plan-sheets';
import type { PatternDoc, PointMm } from '../pattern/pattern-doc';
import { arrangeTemplates, templateRotationDeg } from './arrange-templates';
import { pageSize, type PageSize } from './page-sizes';
import { drawAlignmentMark, drawScaleSquares, PdfCanvas, STYLE_PEN, type PdfFonts } from './pdf-canvas';
import { pieceDrawing, type PieceDrawing } from './piece-drawing';
import { SAFETY_NOTES } from './safety-notes';
import { drawingToPage, tilePages, type Tile, type TileGrid } from './tile-pages';

export type PrintMode = 'tiled' | 'piece-per-page' | 'stock-sheet';

export interface PrintSetPdfOptions {
  page: string;
  mode: PrintMode;
  fonts: PdfFonts;
  name?: string;
  marginMm?: number;
  overlapMm?: number;
}

interface Area {
  title: string;
  widthMm: number;
  heightMm: number;
  drawings: PieceDrawing[];
  /** Piece label and its box in drawing mm, for the page map. */
  boxes: Array<{ label: string; box: BoundsMm; outline: PointMm[] }>;
  grid: TileGrid;
}

const SQUARE_SIDE = 4 * 25.4;

function drawingBox(d: PieceDrawing): BoundsMm {
  return boundsOf(...d.lines.map((l) => l.points));
}

function buildAreas(doc: PatternDoc, plan: SheetPlan, opts: PrintSetPdfOptions): Area[] {
  const tile = { marginMm: opts.marginMm, overlapMm: opts.overlapMm };
  if (opts.mode === 'tiled') {
    const arr = arrangeTemplates(doc, opts.page, tile);
    const drawings = arr.items.map((it) => pieceDrawing(it.piece, doc, it.transform));
    return [{ title: 'templates', widthMm: arr.widthMm, heightMm: arr.heightMm, drawings, grid: arr.grid, boxes: drawings.map((d, i) => ({ label: arr.items[i].piece.label, box: drawingBox(d), outline: d.lines[0].points })) }];
  }
  if (opts.mode === 'piece-per-page') {
    return doc.pieces.map((piece) => {
      const rotationDeg = templateRotationDeg(piece);
      const b = boundsOf(placeRing(piece.outline, { mirrored: false, rotationDeg, x: 0, y: 0 }));
      const border = 14;
      const t = { mirrored: false, rotationDeg, x: border - b.minX, y: border - b.minY };
      const d = pieceDrawing(piece, doc, t);
      const widthMm = b.maxX - b.minX + 2 * border;
      const heightMm = b.maxY - b.minY + 2 * border;
      return { title: `piece ${piece.label}`, widthMm, heightMm, drawings: [d], grid: tilePages({ widthMm, heightMm }, opts.page, tile), boxes: [{ label: piece.label, box: drawingBox(d), outline: d.lines[0].points }] };
    });
  }
  const margin = opts.marginMm ?? 6;
  const header = 9;
  return plan.sheets.map((s, si) => {
    const drawings: PieceDrawing[] = [];
    const boxes: Area['boxes'] = [];
    for (const pl of plan.placements.filter((p) => p.sheetIndex === si)) {
      const piece = doc.pieces.find((q) => q.label === pl.pieceLabel);
      if (!piece) throw new GeometryError('EXPORT_FAILED', `the sheet plan places piece ${pl.pieceLabel}, which is not in the pattern`);
      const d = pieceDrawing(piece, doc, pl, pl.spare ? `spare ${pl.copy}` : `copy ${pl.copy}`);
      drawings.push(d);
      boxes.push({ label: pl.pieceLabel, box: drawingBox(d), outline: pl.outline });
    }
    const page: PageSize = { name: 'a4', orientation: 'portrait', widthMm: s.widthMm + 2 * margin, heightMm: s.heightMm + 2 * margin + header };
    const grid: TileGrid = {
      page,
      marginMm: margin,
      overlapMm: 0,
      headerMm: header,
      window: { left: margin, top: margin + header, width: s.widthMm, height: s.heightMm },
      rows: 1,
      cols: 1,
      tiles: [{ row: 0, col: 0, x0: 0, yTop: s.heightMm, marks: [] }],
    };
    return { title: `stock sheet ${si + 1} · ${s.thicknessMm} mm · ${s.widthMm.toFixed(0)}×${s.heightMm.toFixed(0)} mm`, widthMm: s.widthMm, heightMm: s.heightMm, drawings, boxes, grid };
  });
}

function tileName(t: Tile): string {
  return `R${t.row + 1}·C${t.col + 1}`;
}

/** Lower-left corner (page mm) for the check squares: the window corner whose square covers the least piece area. */
function squareCorner(grid: TileGrid, tile: Tile, area: Area): PointMm {
  const w = grid.window;
  const inset = 3;
  const corners: PointMm[] = [
    [w.left + w.width - SQUARE_SIDE - inset, w.top + w.height - inset],
    [w.left + inset, w.top + w.height - inset],
    [w.left + w.width - SQUARE_SIDE - inset, w.top + SQUARE_SIDE + inset],
    [w.left + inset, w.top + SQUARE_SIDE + inset],
  ];
  let best = corners[0];
  let bestCost = Infinity;
  for (const c of corners) {
    const sq: PointMm[] = [[c[0], c[1]], [c[0] + SQUARE_SIDE, c[1]], [c[0] + SQUARE_SIDE, c[1] - SQUARE_SIDE], [c[0], c[1] - SQUARE_SIDE]];
    let cost = 0;
    for (const b of area.boxes) cost += sharedAreaMm2(sq, b.outline.map((p) => drawingToPage(grid, tile, p)));
    if (cost < bestCost - 1e-6) {
      bestCost = cost;
      best = c;
    }
  }
  return best;
}

function header(c: PdfCanvas, page: PageSize, margin: number, left: string, right: string): void {
  c.text(left, [margin + 0.5 + c.pdf.font('bold').fontSize(3.6 * 2.8346).widthOfString(left) / 2 / 2.8346, margin + 3], 3.6, 'bold');
  const w = c.pdf.font('regular').fontSize(2.6 * 2.8346).widthOfString(right) / 2.8346;
  c.text(right, [page.widthMm - margin - w / 2, margin + 3], 2.6, 'regular');
}

function drawLegend(c: PdfCanvas, x: number, y: number, width: number): number {
  const rows: Array<[string, (cx: number, cy: number) => void]> = [
    ['Cut line: cut on the line.', (cx, cy) => c.polyline([[cx, cy], [cx + 14, cy]], STYLE_PEN.cut)],
    ['Match mark: ticks from the edge; long = tens, short = units of the seam number (seam 12 shown). Both pieces carry it at the same place: line them up at glue-up.', (cx, cy) => {
      c.polyline([[cx, cy + 3], [cx + 14, cy + 3]], STYLE_PEN.cut);
      [7, 4, 4].forEach((h, i) => c.polyline([[cx + 5.4 + i * 1.6, cy + 3], [cx + 5.4 + i * 1.6, cy + 3 - h]], STYLE_PEN.match));
    }],
    ['Bevel, outside corner: hollow triangles point at the edge to bevel; the angle and the face it comes off are written along the edge.', (cx, cy) => {
      c.polyline([[cx, cy + 3], [cx + 14, cy + 3]], STYLE_PEN.cut);
      for (const k of [3, 10]) c.polyline([[cx + k, cy + 1.8], [cx + k + 1.6, cy - 1], [cx + k - 1.6, cy - 1]], STYLE_PEN.bevel, true);
    }],
    ['Bevel, inside corner: solid triangles. No triangles: square cut.', (cx, cy) => {
      c.polyline([[cx, cy + 3], [cx + 14, cy + 3]], STYLE_PEN.cut);
      for (const k of [3, 10]) c.polyline([[cx + k, cy + 1.8], [cx + k + 1.6, cy - 1], [cx + k - 1.6, cy - 1]], STYLE_PEN.bevel, true, true);
    }],
    ['Bevel station: the bevel changes along the edge; the bar gives the angle there.', (cx, cy) => {
      c.polyline([[cx, cy + 3], [cx + 14, cy + 3]], STYLE_PEN.cut);
      c.polyline([[cx + 7, cy + 4], [cx + 7, cy - 2]], STYLE_PEN.station);
    }],
    ['Score line: cut a shallow V-groove on the inner face, then fold.', (cx, cy) => c.polyline([[cx, cy], [cx + 14, cy]], STYLE_PEN.score)],
    ['Dart: cut along the dashes to the V, then close the dart.', (cx, cy) => c.polyline([[cx, cy], [cx + 14, cy]], STYLE_PEN.dart)],
    ['Alignment mark: lay the next page over this one until the marks meet, then tape.', (cx, cy) => drawAlignmentMark(c, [cx + 6, cy], 'V1')],
  ];
  let yy = y;
  c.para('Legend', [x, yy], width, 9, 'bold');
  yy += 5;
  for (const [text, sample] of rows) {
    sample(x + 1, yy + 2.2);
    const h = c.para(text, [x + 19, yy], width - 19, 6.8);
    yy += Math.max(h, 6) + 1.2;
  }
  return yy - y;
}

function drawCover(c: PdfCanvas, doc: PatternDoc, plan: SheetPlan, areas: Area[], pageNo: Map<Area, number>, page: PageSize, name: string, total: number, mode: PrintMode): void {
  const m = 6;
  c.addPage(page.widthMm, page.heightMm);
  header(c, page, m, `${name} · first page · page map`, `page 1 of ${total}`);
  const W = page.widthMm - 2 * m;
  let y = m + 9;
  y += c.para('PRINT AT 100 % / ACTUAL SIZE', [m, y], W, 15, 'bold');
  y += c.para('Turn off "fit to page" and any scaling in the print dialog. Measure the 100 mm square (or the 4 in square) on every page with a ruler before cutting; if it is off, reprint. Pages overlap by the dashed band: lay each page over its neighbour so the alignment marks meet, then tape. Page labels give the row (R) and column (C).', [m, y + 1], W, 7.5) + 3;
  const pieces = doc.pieces.map((p) => `${p.label}: ${p.thickness} mm ×${p.quantity}${p.mirrored ? ' (mirror one)' : ''}`).join('   ');
  y += c.para(`Mode: ${mode}. Pieces: ${pieces}`, [m, y], W, 7) + 2;
  y += c.para(`Foam: ${plan.byThickness.map((t) => `${t.thicknessMm} mm: ${t.sheets} sheet${t.sheets === 1 ? '' : 's'}, ${t.usedPct.toFixed(0)} % used`).join('; ')}.`, [m, y], W, 7) + 2;

  // Page map: the drawing of each area scaled into a box, tiles outlined and named with their page number.
  const mapBottom = page.heightMm - m - SQUARE_SIDE - 6;
  const mapTop = y + 2;
  c.para('Page map', [m, mapTop], W, 9, 'bold');
  const boxTop = mapTop + 5;
  const cols = Math.min(areas.length, 4);
  const rowsN = Math.ceil(areas.length / cols);
  const cellW = W / cols;
  const cellH = Math.max(20, (mapBottom - boxTop) / rowsN);
  areas.forEach((a, i) => {
    const gx = m + (i % cols) * cellW;
    const gy = boxTop + Math.floor(i / cols) * cellH;
    const g = a.grid;
    const fullW = g.cols * (g.window.width - g.overlapMm) + g.overlapMm;
    const fullH = g.rows * (g.window.height - g.overlapMm) + g.overlapMm;
    const s = Math.min((cellW - 4) / fullW, (cellH - 8) / fullH);
    const top = a.heightMm;
    const map = (p: PointMm): PointMm => [gx + 2 + p[0] * s, gy + 6 + (top - p[1]) * s];
    c.text(`${a.title} · from page ${pageNo.get(a)}`, [gx + cellW / 2, gy + 2.5], 2.4, 'bold');
    for (const t of g.tiles) {
      const x0 = t.x0;
      const x1 = t.x0 + g.window.width;
      const y0 = t.yTop;
      const y1 = t.yTop - g.window.height;
      c.polyline([map([x0, y0]), map([x1, y0]), map([x1, y1]), map([x0, y1])], STYLE_PEN.grid, true);
      const ctr = map([(x0 + x1) / 2, (y0 + y1) / 2]);
      c.text(`${tileName(t)} p${(pageNo.get(a) ?? 0) + g.tiles.indexOf(t)}`, [ctr[0], ctr[1] - Math.min(8, (g.window.height * s) / 2 - 2)], 1.9, 'mono', '#777777');
    }
    for (const b of a.boxes) {
      c.polyline(b.outline.map(map), { color: '#1b1b1b', widthPt: 0.4 }, true);
      const cc = map([(b.box.minX + b.box.maxX) / 2, (b.box.minY + b.box.maxY) / 2]);
      c.text(b.label, cc, 2.8, 'bold');
    }
  });

  const lower = page.heightMm - m - SQUARE_SIDE - 2;
  const colW = W - SQUARE_SIDE - 4;
  const used = drawLegend(c, m, lower, colW);
  let yy = lower + used + 1;
  yy += c.para('Cautions', [m, yy], colW, 8, 'bold');
  for (const n of SAFETY_NOTES) yy += c.para(`• ${n}`, [m, yy], colW, 6.2) + 0.4;
  drawScaleSquares(c, page.widthMm - m - SQUARE_SIDE, page.heightMm - m);
}

/**
 * Renders the print set. `doc` gives the pieces and seams, `plan` the sheet plan (its sheets are drawn
 * in 'stock-sheet' mode and summarised on the first page). Resolves to the PDF bytes with the fonts
 * embedded. Throws GeometryError('BAD_OPTION') for an unknown page size or mode or missing fonts.
 */
export async function printSetPdf(doc: PatternDoc, plan: SheetPlan, opts: PrintSetPdfOptions): Promise<Uint8Array> {
  const cover = pageSize(opts.page, 'portrait');
  if (!['tiled', 'piece-per-page', 'stock-sheet'].includes(opts.mode)) {
    throw new GeometryError('BAD_OPTION', `unknown print mode "${opts.mode}": use tiled, piece-per-page or stock-sheet`);
  }
  if (doc.pieces.length === 0) throw new GeometryError('EXPORT_FAILED', 'the pattern has no pieces to print');
  const name = opts.name ?? doc.name ?? 'Sheetsmith print set';
  const c = new PdfCanvas(opts.fonts, name);
  const areas = buildAreas(doc, plan, opts);
  const pageNo = new Map<Area, number>();
  let n = 2;
  for (const a of areas) {
    pageNo.set(a, n);
    n += a.grid.tiles.length;
  }
  const total = n - 1;
  drawCover(c, doc, plan, areas, pageNo, cover, name, total, opts.mode);

  for (const a of areas) {
    const g = a.grid;
    g.tiles.forEach((t, i) => {
      const page = g.page;
      c.addPage(page.widthMm, page.heightMm);
      const w = g.window;
      header(c, page, g.marginMm, `${tileName(t)}  ·  row ${t.row + 1} of ${g.rows}, column ${t.col + 1} of ${g.cols}  ·  ${name} · ${a.title}`, `page ${(pageNo.get(a) ?? 0) + i} of ${total} · print at 100 %`);
      const toPage = (p: PointMm) => drawingToPage(g, t, p);
      c.clipRect(w.left, w.top, w.width, w.height);
      for (const d of a.drawings) {
        for (const l of d.lines) c.line(l, toPage);
        for (const tx of d.texts) c.drawText(tx, toPage);
      }
      c.unclip();
      // Overlap bands: dashed line where the neighbouring page's window ends.
      const ov = g.overlapMm;
      if (t.col > 0) c.polyline([[w.left + ov, w.top], [w.left + ov, w.top + w.height]], STYLE_PEN.grid);
      if (t.col < g.cols - 1) c.polyline([[w.left + w.width - ov, w.top], [w.left + w.width - ov, w.top + w.height]], STYLE_PEN.grid);
      if (t.row > 0) c.polyline([[w.left, w.top + ov], [w.left + w.width, w.top + ov]], STYLE_PEN.grid);
      if (t.row < g.rows - 1) c.polyline([[w.left, w.top + w.height - ov], [w.left + w.width, w.top + w.height - ov]], STYLE_PEN.grid);
      for (const mk of t.marks) drawAlignmentMark(c, toPage(mk.at), mk.id.split('.').slice(0, 2).join('.'));
      c.polyline([[w.left, w.top], [w.left + w.width, w.top], [w.left + w.width, w.top + w.height], [w.left, w.top + w.height]], { color: '#bbbbbb', widthPt: 0.3 }, true);
      drawScaleSquares(c, ...squareCorner(g, t, a));
    });
  }
  return c.finish();
}
