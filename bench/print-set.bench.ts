/**
 * Print-set benchmark (issue 4): a 40-piece set to a tiled A4 PDF (target ≤ 2 s), nesting 200 piece
 * copies (target ≤ 5 s), and true-shape nesting against a bounding-rectangle packer (maxrects-packer)
 * on the same pieces: true-shape must use no more sheets and a higher share of the sheet area.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { MaxRectsPacker } from 'maxrects-packer';
import { printSetPdf } from '../geometry/export/print-set-pdf';
import { boundsOf } from '../geometry/layout/outline-transform';
import { planSheets } from '../geometry/layout/plan-sheets';
import { signedAreaMm2 } from '../geometry/layout/outline-measure';
import { manyPieceDoc } from '../tests/fixtures/pattern-docs/shape-docs';
import type { BenchRow } from './bench-row';


export async function run(): Promise<BenchRow[]> {
  const rows: BenchRow[] = [];
  const font = (f: string) => new Uint8Array(readFileSync(path.join(__dirname, '..', 'public', 'fonts', f)));
  const fonts = { regular: font('Archivo_400Regular.ttf'), bold: font('Archivo_800ExtraBold.ttf'), mono: font('DMMono_400Regular.ttf') };

  const forty = manyPieceDoc(40, 1, 21);
  const plan40 = planSheets(forty);
  let t = performance.now();
  const bytes = await printSetPdf(forty, plan40, { page: 'a4', mode: 'tiled', fonts });
  const pdfS = (performance.now() - t) / 1000;
  rows.push({ group: 'print set', name: `40 pieces → tiled A4 PDF (${(bytes.length / 1024).toFixed(0)} KB)`, value: `${pdfS.toFixed(2)} s`, target: '≤ 2 s', ok: pdfS <= 2 });

  // 200 copies: 200 distinct random shapes, quantity 1, no spares.
  const big = manyPieceDoc(200, 1, 4);
  t = performance.now();
  const plan = planSheets(big, { sparesPct: 0 });
  const nestS = (performance.now() - t) / 1000;
  rows.push({ group: 'nesting', name: `200 piece copies, 15° rotations (${plan.sheets.length} sheets)`, value: `${nestS.toFixed(2)} s`, target: '≤ 5 s', ok: nestS <= 5 });

  // Same pieces on a bounding-rectangle packer: boxes grown by the same gap, rotation allowed, per thickness.
  for (const th of plan.byThickness) {
    const sheet = plan.sheets.find((s) => s.thicknessMm === th.thicknessMm)!;
    const packer = new MaxRectsPacker(sheet.widthMm, sheet.heightMm, plan.gapMm, { smart: false, pot: false, square: false, allowRotation: true, border: plan.gapMm / 2 });
    let area = 0;
    for (const p of big.pieces.filter((q) => q.thickness === th.thicknessMm)) {
      const b = boundsOf(p.outline);
      packer.add(b.maxX - b.minX, b.maxY - b.minY, { label: p.label });
      area += Math.abs(signedAreaMm2(p.outline));
    }
    const rectSheets = packer.bins.length;
    // How far up its last sheet the true-shape plan reaches: tighter packing shows here before it saves a sheet.
    const lastSheet = Math.max(...plan.placements.filter((p) => p.thicknessMm === th.thicknessMm).map((p) => p.sheetIndex));
    const reach = Math.max(...plan.placements.filter((p) => p.sheetIndex === lastSheet).flatMap((p) => p.outline.map((q) => q[1])));
    const rectPct = (100 * area) / (rectSheets * sheet.widthMm * sheet.heightMm);
    rows.push({
      group: 'nesting vs rectangles',
      name: `${th.thicknessMm} mm: true-shape ${th.sheets} sheets ${th.usedPct.toFixed(1)} % (last filled to ${reach.toFixed(0)} of ${sheet.heightMm} mm) | rectangles ${rectSheets} sheets ${rectPct.toFixed(1)} %`,
      value: `${th.sheets} vs ${rectSheets} sheets`,
      target: 'true-shape ≤ sheets and higher %',
      ok: th.sheets <= rectSheets && th.usedPct > rectPct,
    });
  }
  return rows;
}
