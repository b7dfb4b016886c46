/**
 * The sheet plan as SVG at 1:1 for laser and blade cutters: width and height in mm and a viewBox in
 * mm (SVG 1.1 §7.10, units), so one user unit is one millimetre. Sheets sit side by side
 * (sheet-frames.ts); one <g> per thickness, and inside it one <g> per layer: cut, score, marks, text.
 */
import type { SheetPlan } from '../layout/plan-sheets';
import type { PatternDoc, PointMm } from '../pattern/pattern-doc';
import { GeometryError } from '../errors';
import { declutterTexts } from './declutter-texts';
import { markedCopyIndex, pieceDrawing, type DrawLayer, type PieceDrawing } from './piece-drawing';
import { sheetFrames } from './sheet-frames';

const esc = (s: string) => s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;');
const num = (v: number) => (Math.round(v * 1000) / 1000).toString();

/**
 * Returns the SVG text of the plan: every placed copy with its marks. Throws
 * GeometryError('EXPORT_FAILED') when the plan names a piece missing from `doc`.
 */
export function patternSvg(doc: PatternDoc, plan: SheetPlan): string {
  const { offsets, widthMm, heightMm } = sheetFrames(plan);
  const toSvg = (si: number) => (p: PointMm): string => `${num(p[0] + offsets[si])},${num(heightMm - p[1])}`;
  const layers: DrawLayer[] = ['cut', 'score', 'marks', 'text'];
  const thicknesses = [...new Set(plan.sheets.map((s) => s.thicknessMm))].sort((a, b) => a - b);
  const out: string[] = [];
  out.push('<?xml version="1.0" encoding="UTF-8"?>');
  out.push(`<svg xmlns="http://www.w3.org/2000/svg" version="1.1" width="${num(widthMm)}mm" height="${num(heightMm)}mm" viewBox="0 0 ${num(widthMm)} ${num(heightMm)}">`);
  out.push(`<title>${esc(doc.name ?? 'Sheetsmith pattern')} · sheet plan at 1:1 (1 unit = 1 mm)</title>`);
  out.push('<style>.ss-cut{fill:none;stroke:#1b1b1b;stroke-width:0.25}.ss-score{fill:none;stroke:#6b3fa0;stroke-width:0.25;stroke-dasharray:3 1 0.5 1}.ss-marks{fill:none;stroke:#00756f;stroke-width:0.2}.ss-sheet{fill:none;stroke:#9a9a9a;stroke-width:0.2}.ss-text{font-family:Archivo,sans-serif;fill:#1b1b1b}</style>');
  for (const t of thicknesses) {
    const sheetIdx = plan.sheets.map((s, i) => (s.thicknessMm === t ? i : -1)).filter((i) => i >= 0);
    const drawn: Array<{ si: number; d: PieceDrawing; copyId: string }> = [];
    for (const pl of plan.placements.filter((p) => p.thicknessMm === t)) {
      const piece = doc.pieces.find((q) => q.label === pl.pieceLabel);
      if (!piece) throw new GeometryError('EXPORT_FAILED', `the sheet plan places piece ${pl.pieceLabel}, which is not in the pattern`);
      // Same marks as the printed set: notes that would clash are moved or left off (declutter-texts.ts).
      const [d] = declutterTexts([pieceDrawing(piece, doc, pl, pl.spare ? `spare ${pl.copy}` : `copy ${pl.copy}`, markedCopyIndex(piece, pl.copy))]);
      drawn.push({ si: pl.sheetIndex, d, copyId: `${pl.pieceLabel}-${pl.copy}` });
    }
    const tid = `t${String(t).replace('.', '_')}mm`;
    out.push(`<g id="ss-${tid}" data-thickness-mm="${t}">`);
    out.push(`<g class="ss-sheet" id="ss-${tid}-sheets">`);
    for (const si of sheetIdx) {
      const s = plan.sheets[si];
      const f = toSvg(si);
      out.push(`<path d="M${f([0, 0])} L${f([s.widthMm, 0])} L${f([s.widthMm, s.heightMm])} L${f([0, s.heightMm])} Z"/>`);
    }
    out.push('</g>');
    for (const layer of layers) {
      out.push(`<g class="ss-${layer}" id="ss-${tid}-${layer}">`);
      for (const { si, d, copyId } of drawn) {
        const f = toSvg(si);
        if (layer === 'text') {
          for (const tx of d.texts) {
            const [x, y] = f(tx.at).split(',');
            out.push(`<text x="${x}" y="${y}" font-size="${num(tx.sizeMm)}" text-anchor="middle" dominant-baseline="middle" transform="rotate(${num(-tx.angleDeg)} ${x} ${y})"${tx.weight === 'bold' ? ' font-weight="800"' : ''}>${esc(tx.text)}</text>`);
          }
          continue;
        }
        d.lines.forEach((l, k) => {
          if (l.layer !== layer) return;
          const id = layer === 'cut' && k === 0 ? ` id="ss-outline-${esc(copyId)}"` : '';
          out.push(`<path${id} d="M${l.points.map(f).join(' L')}${l.closed ? ' Z' : ''}"${l.filled ? ' style="fill:#b4501b"' : ''}/>`);
        });
      }
      out.push('</g>');
    }
    out.push('</g>');
  }
  out.push('</svg>');
  return out.join('\n') + '\n';
}
