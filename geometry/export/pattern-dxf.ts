/**
 * The sheet plan as an ASCII DXF (AutoCAD 2000 format, AC1015) at 1:1 in millimetres ($INSUNITS = 4)
 * for laser, CNC and blade cutters. Sheets sit side by side (sheet-frames.ts). Layers:
 * SS_CUT (one closed LWPOLYLINE per piece copy), SS_CUT_HOLES, SS_SCORE (score lines and darts),
 * SS_MARKS (match marks, bevels, stations, texture lines), SS_TEXT (labels and notes as TEXT),
 * SS_SHEET (stock sheet borders). Group codes follow the DXF reference (2000 edition).
 */
import type { SheetPlan } from '../layout/plan-sheets';
import type { PatternDoc, PointMm } from '../pattern/pattern-doc';
import { GeometryError } from '../errors';
import { declutterTexts } from './declutter-texts';
import { markedCopyIndex, pieceDrawing } from './piece-drawing';
import { sheetFrames } from './sheet-frames';

const LAYERS: ReadonlyArray<[string, number]> = [
  ['SS_CUT', 7],
  ['SS_CUT_HOLES', 7],
  ['SS_SCORE', 6],
  ['SS_MARKS', 4],
  ['SS_TEXT', 3],
  ['SS_SHEET', 8],
];

/**
 * Returns the DXF text. Throws GeometryError('EXPORT_FAILED') when the plan names a piece missing from `doc`.
 */
export function patternDxf(doc: PatternDoc, plan: SheetPlan): string {
  const { offsets } = sheetFrames(plan);
  const lines: string[] = [];
  let handle = 0x100;
  const g = (code: number, value: string | number) => lines.push(String(code), typeof value === 'number' ? String(Math.round(value * 1e6) / 1e6) : value);
  const h = () => (handle++).toString(16).toUpperCase();
  const poly = (layer: string, pts: PointMm[], closed: boolean, dx: number) => {
    g(0, 'LWPOLYLINE'); g(5, h()); g(100, 'AcDbEntity'); g(8, layer); g(100, 'AcDbPolyline');
    g(90, pts.length); g(70, closed ? 1 : 0);
    for (const [x, y] of pts) { g(10, x + dx); g(20, y); }
  };
  const asciiText = (s: string) => s.replace(/×/g, 'x').replace(/°/g, '%%d').replace(/·/g, '-').replace(/[^\x20-\x7e%]/g, '?');

  g(0, 'SECTION'); g(2, 'HEADER');
  g(9, '$ACADVER'); g(1, 'AC1015');
  g(9, '$INSUNITS'); g(70, 4);
  g(9, '$MEASUREMENT'); g(70, 1);
  g(0, 'ENDSEC');
  g(0, 'SECTION'); g(2, 'TABLES');
  g(0, 'TABLE'); g(2, 'LAYER'); g(5, h()); g(100, 'AcDbSymbolTable'); g(70, LAYERS.length);
  for (const [name, color] of LAYERS) {
    g(0, 'LAYER'); g(5, h()); g(100, 'AcDbSymbolTableRecord'); g(100, 'AcDbLayerTableRecord');
    g(2, name); g(70, 0); g(62, color); g(6, 'CONTINUOUS');
  }
  g(0, 'ENDTAB');
  g(0, 'ENDSEC');
  g(0, 'SECTION'); g(2, 'ENTITIES');
  plan.sheets.forEach((s, si) => poly('SS_SHEET', [[0, 0], [s.widthMm, 0], [s.widthMm, s.heightMm], [0, s.heightMm]], true, offsets[si]));
  for (const pl of plan.placements) {
    const piece = doc.pieces.find((q) => q.label === pl.pieceLabel);
    if (!piece) throw new GeometryError('EXPORT_FAILED', `the sheet plan places piece ${pl.pieceLabel}, which is not in the pattern`);
    // Same marks as the printed set: notes that would clash are moved or left off (declutter-texts.ts).
    const [d] = declutterTexts([pieceDrawing(piece, doc, pl, pl.spare ? `spare ${pl.copy}` : `copy ${pl.copy}`, markedCopyIndex(piece, pl.copy))]);
    const dx = offsets[pl.sheetIndex];
    d.lines.forEach((l, k) => {
      const layer = l.layer === 'cut' ? (k === 0 ? 'SS_CUT' : 'SS_CUT_HOLES') : l.layer === 'score' ? 'SS_SCORE' : 'SS_MARKS';
      poly(layer, l.points, l.closed, dx);
    });
    for (const t of d.texts) {
      g(0, 'TEXT'); g(5, h()); g(100, 'AcDbEntity'); g(8, 'SS_TEXT'); g(100, 'AcDbText');
      g(10, t.at[0] + dx); g(20, t.at[1]); g(30, 0); g(40, t.sizeMm); g(1, asciiText(t.text)); g(50, t.angleDeg);
      g(72, 1); g(11, t.at[0] + dx); g(21, t.at[1]); g(31, 0);
      g(100, 'AcDbText'); g(73, 2);
    }
  }
  g(0, 'ENDSEC');
  g(0, 'EOF');
  return lines.join('\n') + '\n';
}
