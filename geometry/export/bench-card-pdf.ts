/**
 * The bench card: one or more A4 pages with the pieces to cut (label, thickness, quantity, mirror,
 * which stock sheets) and the seams to glue (number, the two pieces, the bevel on each side and the
 * face it comes off, outside or inside corner, length), then the usual workshop cautions.
 */
import type { SheetPlan } from '../layout/plan-sheets';
import type { PatternDoc } from '../pattern/pattern-doc';
import { GeometryError } from '../errors';
import { PdfCanvas, type PdfFonts } from './pdf-canvas';
import { SAFETY_NOTES } from './safety-notes';

const PAGE_W = 210;
const PAGE_H = 297;
const M = 12;

function table(c: PdfCanvas, yStart: number, heads: string[], widths: number[], rows: string[][], newPage: () => number): number {
  let y = yStart;
  const row = (cells: string[], font: 'bold' | 'regular' | 'mono', shade: boolean) => {
    const h = 6.2;
    if (y + h > PAGE_H - M) y = newPage();
    if (shade) c.pdf.save().rect(M * 2.8346, y * 2.8346, (PAGE_W - 2 * M) * 2.8346, h * 2.8346).fill('#eef3f2').restore();
    let x = M + 1;
    cells.forEach((cell, i) => {
      c.para(cell, [x, y + 1.3], widths[i] - 2, 9, font);
      x += widths[i];
    });
    y += h;
  };
  row(heads, 'bold', true);
  rows.forEach((r, i) => row(r, 'regular', i % 2 === 1));
  return y;
}

/**
 * Renders the bench card for `doc` and its sheet plan. Resolves to PDF bytes with embedded fonts.
 * Throws GeometryError('EXPORT_FAILED') for a pattern without pieces.
 */
export async function benchCardPdf(doc: PatternDoc, plan: SheetPlan, opts: { fonts: PdfFonts; name?: string }): Promise<Uint8Array> {
  if (doc.pieces.length === 0) throw new GeometryError('EXPORT_FAILED', 'the pattern has no pieces for a bench card');
  const name = opts.name ?? doc.name ?? 'Sheetsmith pattern';
  const c = new PdfCanvas(opts.fonts, `${name} · bench card`);
  let page = 0;
  const newPage = () => {
    c.addPage(PAGE_W, PAGE_H);
    page++;
    c.para(`${name} · bench card · page ${page}`, [M, M - 4], PAGE_W - 2 * M, 8, 'regular', '#555555');
    return M + 4;
  };
  let y = newPage();
  y += c.para(`Bench card: ${name}`, [M, y], PAGE_W - 2 * M, 16, 'bold') + 2;
  y += c.para(`Foam: ${plan.byThickness.map((t) => `${t.thicknessMm} mm, ${t.sheets} sheet${t.sheets === 1 ? '' : 's'} (${t.usedPct.toFixed(0)} % used, cost ${t.cost.toFixed(2)})`).join('; ')}. ${plan.sparesRule[0].toUpperCase()}${plan.sparesRule.slice(1)}. Cutting gap ${plan.gapMm} mm. Prices are defaults until you set your own.`, [M, y], PAGE_W - 2 * M, 8.5) + 3;

  y += c.para('Pieces', [M, y], 100, 11, 'bold') + 1;
  const pieceRows = doc.pieces.map((p) => {
    const sheets = [...new Set(plan.placements.filter((q) => q.pieceLabel === p.label).map((q) => q.sheetIndex + 1))].sort((a, b) => a - b);
    const spares = plan.placements.filter((q) => q.pieceLabel === p.label && q.spare).length;
    return [p.label, `${p.thickness} mm`, `${p.quantity}${spares ? ` + ${spares} spare` : ''}`, p.mirrored ? 'mirror one' : '—', sheets.join(', '), '[ ] cut  [ ] shaped  [ ] glued'];
  });
  y = table(c, y, ['piece', 'thickness', 'quantity', 'mirror', 'sheet', 'progress'], [18, 24, 30, 26, 22, 66], pieceRows, newPage) + 5;

  y += c.para('Seams', [M, y], 100, 11, 'bold') + 1;
  const seamRows = doc.seams.map((s) => {
    const sideBevel = (side: 0 | 1) => {
      const pieceLabel = s.pieces[Math.min(side, s.pieces.length - 1)];
      const e = doc.pieces.find((p) => p.label === pieceLabel)?.seamEdges?.find((q) => q.seam === s.label && q.side === side);
      if (!e) return `${s.bevel.mean.toFixed(1)}°`;
      return e.bevelFace === 'none' || e.bevelDeg < 0.5 ? 'square' : `${e.bevelDeg.toFixed(1)}° ${e.bevelFace}`;
    };
    const range = s.bevel.max - s.bevel.min >= 1 ? ` (${s.bevel.min.toFixed(0)}–${s.bevel.max.toFixed(0)}° along)` : '';
    const pieces = s.pieces.length === 1 ? `${s.pieces[0]} (closes on itself)` : s.pieces.join(' + ');
    return [s.label, pieces, `${sideBevel(0)}${range}`, sideBevel(1), s.convex ? 'outside' : 'inside', `${s.length3d.toFixed(0)} mm`];
  });
  y = table(c, y, ['seam', 'pieces', 'bevel side 1', 'bevel side 2', 'corner', 'length'], [16, 40, 46, 34, 22, 28], seamRows, newPage) + 6;
  if (doc.seams.length === 0) y += c.para('No seams: every piece stands alone.', [M, y], PAGE_W - 2 * M, 9);

  if (y > PAGE_H - M - 50) y = newPage();
  y += c.para('Cautions', [M, y], 100, 11, 'bold') + 1;
  for (const n of SAFETY_NOTES) y += c.para(`• ${n}`, [M, y], PAGE_W - 2 * M, 8.5) + 1;
  return c.finish();
}
