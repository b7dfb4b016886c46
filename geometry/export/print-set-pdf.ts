/**
 * The print set as a PDF at 1:1: a first page with instructions, legend, cautions and a page map,
 * then the drawing pages. Modes:
 * - 'tiled': one paper template per piece, arranged and split over pages with overlap and alignment marks;
 * - 'piece-per-page': each piece on its own page (or its own tiles when bigger than a page);
 * - 'stock-sheet': each stock sheet of the sheet plan on one page of the sheet's size (large-format print
 *   or projector), every copy where the plan puts it.
 * Every page carries its row/column label, the print-set name and the 100 mm and 4 in check squares,
 * placed where they hide no piece (print-set-pages.ts).
 * Scale: 1 mm = 72/25.4 pt (ISO 32000-1 §8.3.2.3 user space unit of 1/72 in).
 */
import { GeometryError } from '../errors';
import type { SheetPlan } from '../layout/plan-sheets';
import type { PatternDoc, PointMm } from '../pattern/pattern-doc';
import { pageSize, type PageSize } from './page-sizes';
import { drawAlignmentMark, drawScaleSquares, PdfCanvas, PT_PER_MM, STYLE_PEN, type PdfFonts } from './pdf-canvas';
import { printSetPages, type PrintArea, type PrintMode } from './print-set-pages';
import { SAFETY_NOTES } from './safety-notes';
import { SCALE_SQUARE_SIDE_MM as SQUARE_SIDE } from './scale-square-spot';
import { drawingToPage, type Tile } from './tile-pages';

export type { PrintMode } from './print-set-pages';

export interface PrintSetPdfOptions {
  page: string;
  mode: PrintMode;
  fonts: PdfFonts;
  name?: string;
  marginMm?: number;
  overlapMm?: number;
}

function tileName(t: Tile): string {
  return `R${t.row + 1}·C${t.col + 1}`;
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
    ['Bevel, outside corner: hollow triangles point at the edge to bevel; the angle and the face it comes off are written along the edge (on a short edge only the angle and face, e.g. "22.5° inner").', (cx, cy) => {
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

function drawCover(c: PdfCanvas, doc: PatternDoc, plan: SheetPlan, areas: PrintArea[], pageNo: Map<PrintArea, number>, page: PageSize, name: string, total: number, mode: PrintMode): void {
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

  // Page map: each area's drawing scaled into a box, tiles outlined and named with their page number
  // in type big enough to read at 100 %; with many areas (one per piece) a list of pages instead.
  const mapBottom = page.heightMm - m - SQUARE_SIDE - 6;
  const mapTop = y + 2;
  c.para('Page map', [m, mapTop], W, 9, 'bold');
  const boxTop = mapTop + 5;
  if (areas.length > 6) {
    const lines = areas.map((a) => {
      const first = pageNo.get(a) ?? 0;
      const n = a.grid.tiles.length;
      return `${a.title}: page${n > 1 ? `s ${first}–${first + n - 1}` : ` ${first}`}${n > 1 ? ` (${a.grid.rows} × ${a.grid.cols})` : ''}`;
    });
    const colsN = Math.max(1, Math.min(4, Math.ceil((lines.length * 4.2) / Math.max(20, mapBottom - boxTop))));
    const perCol = Math.ceil(lines.length / colsN);
    const colW = W / colsN;
    lines.forEach((l, i) => c.para(l, [m + Math.floor(i / perCol) * colW, boxTop + (i % perCol) * 4.2], colW - 2, 8, 'regular'));
  } else {
    const cols = Math.min(areas.length, 2);
    const rowsN = Math.ceil(areas.length / cols);
    const cellW = W / cols;
    const cellH = Math.max(30, (mapBottom - boxTop) / rowsN);
    areas.forEach((a, i) => {
      const gx = m + (i % cols) * cellW;
      const gy = boxTop + Math.floor(i / cols) * cellH;
      const g = a.grid;
      const fullW = g.cols * (g.window.width - g.overlapMm) + g.overlapMm;
      const fullH = g.rows * (g.window.height - g.overlapMm) + g.overlapMm;
      const sc = Math.min((cellW - 4) / fullW, (cellH - 9) / fullH);
      const top = a.heightMm;
      const map = (p: PointMm): PointMm => [gx + 2 + p[0] * sc, gy + 7 + (top - p[1]) * sc];
      c.text(`${a.title} · from page ${pageNo.get(a)}`, [gx + cellW / 2, gy + 2.8], 3.2, 'bold');
      for (const b of a.boxes) {
        c.polyline(b.outline.map(map), { color: '#8a8a8a', widthPt: 0.4 }, true);
        const cc = map([(b.box.minX + b.box.maxX) / 2, (b.box.minY + b.box.maxY) / 2]);
        const size = Math.max(2.2, Math.min(4, Math.min(b.box.maxX - b.box.minX, b.box.maxY - b.box.minY) * sc * 0.45));
        c.text(b.label, cc, size, 'bold', '#3a3a3a');
      }
      for (const t of g.tiles) {
        const a0 = map([t.x0, t.yTop]);
        const a1 = map([t.x0 + g.window.width, t.yTop - g.window.height]);
        c.polyline([a0, [a1[0], a0[1]], a1, [a0[0], a1[1]]], { color: '#1f4e9a', widthPt: 0.6 }, true);
        // Label in the tile's own corner, past the overlap band it shares with its neighbours.
        const label = `p${(pageNo.get(a) ?? 0) + g.tiles.indexOf(t)} · ${tileName(t)}`;
        const size = Math.max(2.8, Math.min(5, (a1[0] - a0[0]) * 0.09));
        const w = c.pdf.font('bold').fontSize(size * PT_PER_MM).widthOfString(label) / PT_PER_MM;
        const ov = g.overlapMm * sc;
        const at: PointMm = [a0[0] + ov + 1 + w / 2, a0[1] + ov + 1 + size * 0.6];
        c.pdf.save().rect((at[0] - w / 2 - 0.8) * PT_PER_MM, (at[1] - size * 0.65) * PT_PER_MM, (w + 1.6) * PT_PER_MM, size * 1.3 * PT_PER_MM).fill('#ffffff').restore();
        c.text(label, at, size, 'bold', '#1f4e9a');
      }
    });
  }

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
  const { areas, pages } = printSetPages(doc, plan, opts);
  const pageNo = new Map<PrintArea, number>();
  let n = 2;
  for (const a of areas) {
    pageNo.set(a, n);
    n += a.grid.tiles.length;
  }
  const total = n - 1;
  drawCover(c, doc, plan, areas, pageNo, cover, name, total, opts.mode);

  pages.forEach(({ area: a, tile: t, squareCorner }, k) => {
    const g = a.grid;
    const page = g.page;
    c.addPage(page.widthMm, page.heightMm);
    const w = g.window;
    header(c, page, g.marginMm, `${tileName(t)}  ·  row ${t.row + 1} of ${g.rows}, column ${t.col + 1} of ${g.cols}  ·  ${name} · ${a.title}`, `page ${k + 2} of ${total} · print at 100 %`);
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
    if (g.reserved) {
      const r = g.reserved;
      const note = 'strip kept clear for the scale check: nothing to cut here';
      if (r.width >= r.height) c.text(note, [r.left + SQUARE_SIDE + 4 + (r.width - SQUARE_SIDE - 4) / 2, r.top + r.height / 2], 2.4, 'regular', '#777777');
      else c.text(note, [r.left + r.width / 2, r.top + SQUARE_SIDE + 8 + (r.height - SQUARE_SIDE - 8) / 2], 2.4, 'regular', '#777777', 90);
    }
    drawScaleSquares(c, squareCorner[0], squareCorner[1]);
  });
  return c.finish();
}
