import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Clipper, FillRule, Paths64 } from 'clipper2-js';
import { afterAll, describe, expect, it } from 'vitest';
import { printSetPages, type PrintMode } from '../../../geometry/export/print-set-pages';
import { printSetPdf } from '../../../geometry/export/print-set-pdf';
import { arrangeTemplates, templateArrangements } from '../../../geometry/export/arrange-templates';
import { SCALE_SQUARE_FOOTPRINT_MM, SCALE_SQUARE_SIDE_MM, SCALE_STRIP_MM } from '../../../geometry/export/scale-square-spot';
import { drawingToPage } from '../../../geometry/export/tile-pages';
import { CLIPPER_SCALE, ringToPath64 } from '../../../geometry/layout/clipper-paths';
import { boundsOf, placeRing } from '../../../geometry/layout/outline-transform';
import { planSheets } from '../../../geometry/layout/plan-sheets';
import type { PatternDoc, PointMm } from '../../../geometry/pattern/pattern-doc';
import { helmetLikeDoc, manyPieceDoc, piece } from '../../fixtures/pattern-docs/shape-docs';

const root = path.join(__dirname, '..', '..', '..');
const font = (f: string) => new Uint8Array(readFileSync(path.join(root, 'public', 'fonts', f)));
const fonts = { regular: font('Archivo_400Regular.ttf'), bold: font('Archivo_800ExtraBold.ttf'), mono: font('DMMono_400Regular.ttf') };
const dir = mkdtempSync(path.join(tmpdir(), 'sheetsmith-pages-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

const rect = (l: number, t: number, w: number, h: number): PointMm[] => [[l, t], [l + w, t], [l + w, t + h], [l, t + h]];

/** Area (mm²) of `piece` that is printed (inside `window`) and lies under `square`, by clipper's boolean intersection (Vatti 1992). */
function hiddenArea(piece: PointMm[], window: PointMm[], square: PointMm[]): number {
  const one = (r: PointMm[]) => {
    const p = new Paths64();
    p.push(ringToPath64(r));
    return p;
  };
  const printed = Clipper.Intersect(one(piece), one(window), FillRule.NonZero);
  const hidden = Clipper.Intersect(printed, one(square), FillRule.NonZero);
  return Math.abs(Clipper.areaPaths(hidden)) / CLIPPER_SCALE ** 2;
}

/** Every page's check squares against every printed piece outline: returns the pages where a piece lies under them. */
function coveredPieces(doc: PatternDoc, page: string, mode: PrintMode): string[] {
  const plan = planSheets(doc);
  const { pages } = printSetPages(doc, plan, { page, mode });
  const bad: string[] = [];
  pages.forEach(({ area, tile, squareCorner }, k) => {
    const g = area.grid;
    const w = g.window;
    const [x, y] = squareCorner;
    // The squares and their label stay on the paper, inside the printable margin.
    expect(x).toBeGreaterThanOrEqual(g.marginMm - 1e-9);
    expect(x + SCALE_SQUARE_SIDE_MM).toBeLessThanOrEqual(g.page.widthMm - g.marginMm + 1e-9);
    expect(y - SCALE_SQUARE_FOOTPRINT_MM.height).toBeGreaterThanOrEqual(g.marginMm + g.headerMm - 1e-9);
    expect(y).toBeLessThanOrEqual(g.page.heightMm - g.marginMm + 1e-9);
    const square = rect(x, y - SCALE_SQUARE_FOOTPRINT_MM.height, SCALE_SQUARE_FOOTPRINT_MM.width, SCALE_SQUARE_FOOTPRINT_MM.height);
    for (const b of area.boxes) {
      const onPage = b.outline.map((p) => drawingToPage(g, tile, p));
      const a = hiddenArea(onPage, rect(w.left, w.top, w.width, w.height), square);
      if (a > 0) bad.push(`page ${k + 2}: piece ${b.label} (${a.toFixed(1)} mm²)`);
    }
  });
  return bad;
}

describe('printSetPages: the scale-check squares never hide a piece (W1 brief, item 1)', () => {
  it('tiled, on all four page sizes, for a small set and a dense 40-piece set', () => {
    for (const doc of [helmetLikeDoc(), manyPieceDoc(40, 1, 21)]) {
      for (const page of ['a4', 'letter', 'a3', 'tabloid']) expect(coveredPieces(doc, page, 'tiled')).toEqual([]);
    }
  });

  it('piece-per-page and stock-sheet modes', () => {
    const doc = helmetLikeDoc();
    expect(coveredPieces(doc, 'a4', 'piece-per-page')).toEqual([]);
    expect(coveredPieces(doc, 'letter', 'stock-sheet')).toEqual([]);
    // A 1000×500 mm sheet packed by the planner: the squares find a free spot, or a strip under the sheet.
    const full = manyPieceDoc(30, 1, 8);
    expect(coveredPieces(full, 'a4', 'stock-sheet')).toEqual([]);
  });

  it('tiled templates keep a block clear on every tile instead of a full-width strip, on no more pages (W8 brief)', () => {
    // The old layout re-tiled the whole drawing with a strip SCALE_STRIP_MM deep across every page; the
    // arrangement around per-tile blocks must need no more pages and keep the full printable window.
    for (const doc of [helmetLikeDoc(), manyPieceDoc(40, 1, 21)]) {
      const { areas, pages } = printSetPages(doc, planSheets(doc), { page: 'a4', mode: 'tiled' });
      const g = areas[0].grid;
      const strip = arrangeTemplates(doc, 'a4', { reserveMm: SCALE_STRIP_MM });
      expect(pages.length).toBeLessThanOrEqual(strip.grid.tiles.length);
      expect(g.reserved).toBeNull();
      expect(g.window.height).toBeCloseTo(g.page.heightMm - 2 * g.marginMm - g.headerMm, 9);
      expect(g.window.width).toBeCloseTo(g.page.widthMm - 2 * g.marginMm, 9);
    }
    // 40 plates: the strip layout took 15 A4 pages, the blocks 14 (measured when this check was written).
    const dense = manyPieceDoc(40, 1, 21);
    expect(printSetPages(dense, planSheets(dense), { page: 'a4', mode: 'tiled' }).pages.length).toBeLessThan(
      arrangeTemplates(dense, 'a4', { reserveMm: SCALE_STRIP_MM }).grid.tiles.length,
    );
  });

  it('templates arranged around the blocks keep their 12 mm gap and stay inside the drawing', () => {
    // Shelf packing (Coffman et al. 1980): boxes never overlap; here each pair is at least the gap apart.
    const doc = manyPieceDoc(20, 1, 5);
    for (const arr of templateArrangements(doc, 'a4', {}, 12, true)) {
      const boxes = arr.items.map((it) => boundsOf(placeRing(it.piece.outline, it.transform)));
      boxes.forEach((p, i) => {
        expect(p.minX).toBeGreaterThanOrEqual(12 - 1e-6);
        expect(p.minY).toBeGreaterThanOrEqual(12 - 1e-6);
        expect(p.maxX).toBeLessThanOrEqual(arr.widthMm - 12 + 1e-6);
        expect(p.maxY).toBeLessThanOrEqual(arr.heightMm - 12 + 1e-6);
        for (const q of boxes.slice(i + 1)) {
          const apart = Math.max(q.minX - p.maxX, p.minX - q.maxX, q.minY - p.maxY, p.minY - q.maxY);
          expect(apart).toBeGreaterThanOrEqual(12 - 1e-6);
        }
      });
    }
  });

  it('falls back to a strip kept clear when one piece fills its page (piece-per-page)', () => {
    // A 180×250 mm plate fills the A4 printable window (198×276 mm less the 9 mm header), leaving no 4 in hole.
    const doc: PatternDoc = { units: 'mm', name: 'Big plate', pieces: [piece('P', rect(0, 0, 180, 250))], seams: [], warnings: [] };
    const { areas, pages } = printSetPages(doc, planSheets(doc), { page: 'a4', mode: 'piece-per-page' });
    expect(areas[0].grid.reserved).not.toBeNull();
    expect(coveredPieces(doc, 'a4', 'piece-per-page')).toEqual([]);
    for (const p of pages) {
      const r = p.area.grid.reserved!;
      expect(p.squareCorner[0]).toBeGreaterThanOrEqual(r.left);
      expect(p.squareCorner[1]).toBeLessThanOrEqual(r.top + r.height);
      expect(p.squareCorner[1] - SCALE_SQUARE_FOOTPRINT_MM.height).toBeGreaterThanOrEqual(r.top);
    }
  });

  it('the PDF draws the 100 mm and 4 in squares where the layout put them (read back with pdfjs-dist)', async () => {
    const doc = helmetLikeDoc();
    const plan = planSheets(doc);
    const { pages } = printSetPages(doc, plan, { page: 'a4', mode: 'tiled' });
    const file = path.join(dir, 'squares.pdf');
    writeFileSync(file, await printSetPdf(doc, plan, { page: 'a4', mode: 'tiled', fonts }));
    const read = JSON.parse(execFileSync(process.execPath, [path.join(__dirname, 'read-pdf.mjs'), file], { encoding: 'utf8', maxBuffer: 64 << 20 })) as {
      pages: Array<{ view: number[]; boxes: number[][] }>;
    };
    // ISO 32000-1 §8.3.2.3: 1 pt = 1/72 in, so 100 mm = 283.46 pt and 4 in = 288 pt; PDF y runs up from the page foot.
    const PT = 72 / 25.4;
    pages.forEach((p, k) => {
      const pdfPage = read.pages[k + 1];
      const sq = pdfPage.boxes.find((b) => Math.abs(b[2] - 100 * PT) < 0.01 && Math.abs(b[3] - 100 * PT) < 0.01)!;
      expect(sq[0]).toBeCloseTo(p.squareCorner[0] * PT, 2);
      expect(sq[1]).toBeCloseTo(pdfPage.view[3] - p.squareCorner[1] * PT, 2);
    });
  });
});
