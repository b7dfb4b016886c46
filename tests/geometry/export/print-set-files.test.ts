import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import DxfParser from 'dxf-parser';
import { parse as parseSvg } from 'svg-parser';
import { afterAll, describe, expect, it } from 'vitest';
import { benchCardPdf } from '../../../geometry/export/bench-card-pdf';
import { patternDxf } from '../../../geometry/export/pattern-dxf';
import { patternSvg } from '../../../geometry/export/pattern-svg';
import { printSetPdf } from '../../../geometry/export/print-set-pdf';
import { ringPerimeterMm } from '../../../geometry/layout/outline-measure';
import { planSheets } from '../../../geometry/layout/plan-sheets';
import { writePrintSetFiles } from '../../../scripts/print-set-files';
import { helmetLikeDoc } from '../../fixtures/pattern-docs/shape-docs';

const root = path.join(__dirname, '..', '..', '..');
const font = (f: string) => new Uint8Array(readFileSync(path.join(root, 'public', 'fonts', f)));
const fonts = { regular: font('Archivo_400Regular.ttf'), bold: font('Archivo_800ExtraBold.ttf'), mono: font('DMMono_400Regular.ttf') };
const dir = mkdtempSync(path.join(tmpdir(), 'sheetsmith-print-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

interface ReadPage { view: number[]; texts: string[]; boxes: number[][] }
/** Reads a PDF with pdfjs-dist in a child process (it clashes with other PDF code in one process). */
function readPdf(bytes: Uint8Array, name: string): { numPages: number; pages: ReadPage[] } {
  const file = path.join(dir, name);
  writeFileSync(file, bytes);
  return JSON.parse(execFileSync(process.execPath, [path.join(__dirname, 'read-pdf.mjs'), file], { encoding: 'utf8', maxBuffer: 64 << 20 }));
}

// ISO 32000-1 §8.3.2.3: 1 user unit = 1/72 in, so 100 mm = 283.46 pt and 4 in = 288 pt.
const PT_100MM = (100 / 25.4) * 72;
const hasSquare = (p: ReadPage, side: number) => p.boxes.some((b) => Math.abs(b[2] - side) < 0.01 && Math.abs(b[3] - side) < 0.01);

const doc = helmetLikeDoc();
const plan = planSheets(doc);

describe('printSetPdf', () => {
  it('tiled on A4: page boxes 595.28×841.89 pt, scale squares on every page, every piece label and seam number as text', async () => {
    const read = readPdf(await printSetPdf(doc, plan, { page: 'a4', mode: 'tiled', fonts }), 'tiled.pdf');
    expect(read.numPages).toBeGreaterThan(2);
    const text = new Set(read.pages.flatMap((p) => p.texts.map((t) => t.trim())));
    for (const p of read.pages) {
      const [x0, y0, x1, y1] = p.view;
      // A4 portrait or landscape (ISO 216 210×297 mm → 595.28×841.89 pt).
      expect([Math.min(x1 - x0, y1 - y0), Math.max(x1 - x0, y1 - y0)].map((v) => v.toFixed(2))).toEqual(['595.28', '841.89']);
      expect(hasSquare(p, PT_100MM)).toBe(true);
      expect(hasSquare(p, 288)).toBe(true);
      expect(p.texts.some((t) => /page \d+ of \d+/.test(t))).toBe(true);
    }
    expect(read.pages[0].texts.join(' ')).toMatch(/PRINT AT 100 % \/ ACTUAL SIZE/);
    expect(read.pages[0].texts.join(' ')).toMatch(/safety data sheet/);
    expect(read.pages[0].texts.join(' ')).toMatch(/Legend/);
    for (const p of doc.pieces) expect(text.has(p.label)).toBe(true);
    for (const s of doc.seams) expect(text.has(s.label)).toBe(true);
    expect([...text].some((t) => t.includes('mirror one'))).toBe(true);
    expect(read.pages.slice(1).every((p) => p.texts.some((t) => /^R\d+·C\d+/.test(t)))).toBe(true);
  });

  it('piece-per-page on Letter gives 612×792 pt pages (ANSI/ASME Y14.1 8.5×11 in) and stock-sheet pages match the sheets', async () => {
    const letter = readPdf(await printSetPdf(doc, plan, { page: 'letter', mode: 'piece-per-page', fonts }), 'ppp.pdf');
    for (const p of letter.pages) expect([Math.min(p.view[2], p.view[3]), Math.max(p.view[2], p.view[3])].map((v) => v.toFixed(2))).toEqual(['612.00', '792.00']);
    expect(letter.numPages).toBeGreaterThanOrEqual(1 + doc.pieces.length);
    const sheets = readPdf(await printSetPdf(doc, plan, { page: 'a3', mode: 'stock-sheet', fonts }), 'stock.pdf');
    expect(sheets.numPages).toBe(1 + plan.sheets.length);
    plan.sheets.forEach((s, i) => {
      // Page = sheet + 6 mm margins each side (+ 9 mm header band in height), in pt.
      expect(sheets.pages[i + 1].view[2]).toBeCloseTo(((s.widthMm + 12) / 25.4) * 72, 2);
      expect(hasSquare(sheets.pages[i + 1], PT_100MM)).toBe(true);
    });
  });

  it('rejects an unknown page size or mode with a clear message', async () => {
    await expect(printSetPdf(doc, plan, { page: 'b4', mode: 'tiled', fonts })).rejects.toThrow(/unknown page size "b4"/);
    await expect(printSetPdf(doc, plan, { page: 'a4', mode: 'poster' as 'tiled', fonts })).rejects.toThrow(/unknown print mode "poster"/);
    await expect(printSetPdf(doc, plan, { page: 'a4', mode: 'tiled', fonts: { ...fonts, mono: new Uint8Array() } })).rejects.toThrow(/font "mono" is missing/);
  });
});

describe('benchCardPdf', () => {
  it('lists every piece and seam with bevels and the cautions', async () => {
    const read = readPdf(await benchCardPdf(doc, plan, { fonts }), 'bench.pdf');
    const all = read.pages.flatMap((p) => p.texts).join('\n');
    for (const p of doc.pieces) expect(read.pages.flatMap((q) => q.texts).map((t) => t.trim())).toContain(p.label);
    expect(all).toMatch(/22\.5° inner/);
    expect(all).toMatch(/outside/);
    expect(all).toMatch(/inside/);
    // The spares rule is stated on the card (shared/DESIGN.md "What the trade knows": spares of repeated parts).
    expect(all.replace(/\s+/g, ' ')).toMatch(/10 % of the quantity, rounded up per piece, for repeated parts only/);
    expect(all).toMatch(/respirator/);
    expect(all).toMatch(/safety data sheet/);
  });
});

describe('patternDxf', () => {
  it('reads back with dxf-parser: $INSUNITS = 4, one closed polyline per piece copy, lengths equal the outline perimeters within 0.01 mm', () => {
    const dxf = new DxfParser().parseSync(patternDxf(doc, plan)) as unknown as {
      header: Record<string, unknown>;
      tables: { layer: { layers: Record<string, unknown> } };
      entities: Array<{ type: string; layer: string; shape?: boolean; vertices?: Array<{ x: number; y: number }>; text?: string }>;
    };
    // DXF reference: $INSUNITS 4 = millimetres.
    expect(dxf.header.$INSUNITS).toBe(4);
    expect(Object.keys(dxf.tables.layer.layers)).toEqual(expect.arrayContaining(['SS_CUT', 'SS_SCORE', 'SS_MARKS', 'SS_TEXT']));
    const cut = dxf.entities.filter((e) => e.type === 'LWPOLYLINE' && e.layer === 'SS_CUT');
    expect(cut.length).toBe(plan.placements.length);
    cut.forEach((e, i) => {
      expect(e.shape).toBe(true);
      const pts = e.vertices!.map((v) => [v.x, v.y] as [number, number]);
      expect(Math.abs(ringPerimeterMm(pts) - ringPerimeterMm(plan.placements[i].outline))).toBeLessThan(0.01);
    });
    const texts = dxf.entities.filter((e) => e.type === 'TEXT').map((e) => e.text);
    for (const p of doc.pieces) expect(texts).toContain(p.label);
    expect(dxf.entities.some((e) => e.layer === 'SS_SCORE')).toBe(true);
  });
});

describe('patternSvg', () => {
  it('parses with svg-parser: mm width/height and a mm viewBox, one outline per copy with the JSON perimeter within 0.01 mm', () => {
    const svg = patternSvg(doc, plan);
    type Node = { tagName?: string; properties?: Record<string, string | number>; children?: Node[] };
    const root = (parseSvg(svg) as unknown as Node).children![0];
    const w = String(root.properties!.width);
    const h = String(root.properties!.height);
    expect(w).toMatch(/^[\d.]+mm$/);
    expect(String(root.properties!.viewBox)).toBe(`0 0 ${parseFloat(w)} ${parseFloat(h)}`);
    const outlines: Node[] = [];
    const groups: string[] = [];
    const walk = (n: Node) => {
      if (n.tagName === 'g' && n.properties?.id) groups.push(String(n.properties.id));
      if (n.tagName === 'path' && String(n.properties?.id ?? '').startsWith('ss-outline-')) outlines.push(n);
      n.children?.forEach(walk);
    };
    walk(root);
    for (const t of plan.byThickness) for (const layer of ['cut', 'score', 'marks', 'text']) expect(groups).toContain(`ss-t${t.thicknessMm}mm-${layer}`);
    expect(outlines.length).toBe(plan.placements.length);
    const byId = new Map(plan.placements.map((p) => [`ss-outline-${p.pieceLabel}-${p.copy}`, p]));
    for (const o of outlines) {
      const pts = String(o.properties!.d).replace(/[MZ]/g, '').split('L').map((s) => s.trim().split(',').map(Number) as [number, number]);
      const p = byId.get(String(o.properties!.id))!;
      expect(Math.abs(ringPerimeterMm(pts) - ringPerimeterMm(p.outline))).toBeLessThan(0.01);
    }
  });
});

describe('writePrintSetFiles', () => {
  it('writes the asked formats and returns their paths', async () => {
    const out = path.join(dir, 'set');
    const files = await writePrintSetFiles(doc, ['pdf', 'svg', 'dxf'], out, { page: 'tabloid' });
    expect(files.map((f) => path.basename(f)).sort()).toEqual(['bench-card.pdf', 'pattern.dxf', 'pattern.svg', 'print-set.pdf', 'sheet-plan.json']);
    expect(readFileSync(files.find((f) => f.endsWith('print-set.pdf'))!).subarray(0, 5).toString()).toBe('%PDF-');
    await expect(writePrintSetFiles(doc, ['pdf'], out, { page: 'folio' as 'a4' })).rejects.toThrow(/unknown page size "folio"/);
    await expect(writePrintSetFiles({ ...doc, pieces: [] }, ['svg'], out)).rejects.toThrow(/no pieces/);
  });
});
