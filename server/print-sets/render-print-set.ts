/**
 * Renders a print set into memory: the sheet plan, then the PDF print set and bench card, the SVG and the DXF
 * asked for, through the engine's exporters (the same steps as scripts/print-set-files.ts, which writes to a
 * directory instead). Nothing is stored here, so a pattern the engine refuses leaves no file behind.
 */
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { benchCardPdf } from '../../geometry/export/bench-card-pdf';
import { patternDxf } from '../../geometry/export/pattern-dxf';
import { patternSvg } from '../../geometry/export/pattern-svg';
import type { PdfFonts } from '../../geometry/export/pdf-canvas';
import { printSetPdf, type PrintMode } from '../../geometry/export/print-set-pdf';
import { planSheets } from '../../geometry/layout/plan-sheets';
import type { StockSheet } from '../../geometry/layout/stock-sheets';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import type { PrintFormat } from './print-set-request';

const FONT_DIR = path.join(__dirname, '..', '..', 'public', 'fonts');
const FONT_FILES = { regular: 'Archivo_400Regular.ttf', bold: 'Archivo_800ExtraBold.ttf', mono: 'DMMono_400Regular.ttf' } as const;

/** One rendered file: its name in the print set, IANA media type and bytes. */
export interface RenderedFile {
  name: string;
  contentType: string;
  bytes: Uint8Array;
}

/**
 * Media types: application/pdf (RFC 8118), image/svg+xml (SVG 1.1, IANA), image/vnd.dxf (IANA vendor
 * registration), application/json (RFC 8259).
 */
export const CONTENT_TYPES = { pdf: 'application/pdf', svg: 'image/svg+xml', dxf: 'image/vnd.dxf', json: 'application/json' } as const;

let fontsOnce: Promise<PdfFonts> | null = null;

/** Returns the shipped TTF fonts (public/fonts), read once per process. */
function shippedFonts(): Promise<PdfFonts> {
  fontsOnce ??= (async () => {
    const [regular, bold, mono] = await Promise.all(
      [FONT_FILES.regular, FONT_FILES.bold, FONT_FILES.mono].map(async (f) => new Uint8Array(await readFile(path.join(FONT_DIR, f)))),
    );
    return { regular, bold, mono };
  })();
  fontsOnce.catch(() => (fontsOnce = null));
  return fontsOnce;
}

export interface RenderOptions {
  formats: readonly PrintFormat[];
  page: string;
  mode: PrintMode;
  /** Print-set name printed on every page. */
  name: string;
  /** The shop's stock sheets per thickness (the engine's defaults when absent), so the print set's sheet plan matches the one the maker previewed. */
  stock?: readonly StockSheet[];
}

/**
 * Returns the files of the print set: sheet-plan.json always; print-set.pdf and bench-card.pdf for 'pdf';
 * pattern.svg for 'svg'; pattern.dxf for 'dxf' (in that order). Throws the engine's GeometryError (with a
 * message naming the piece or option) when the pattern cannot be laid out or drawn.
 */
export async function renderPrintSet(doc: PatternDoc, opts: RenderOptions): Promise<RenderedFile[]> {
  const plan = planSheets(doc, opts.stock ? { stock: opts.stock } : {});
  const text = (s: string) => new TextEncoder().encode(s);
  const files: RenderedFile[] = [{ name: 'sheet-plan.json', contentType: CONTENT_TYPES.json, bytes: text(JSON.stringify(plan, null, 1)) }];
  if (opts.formats.includes('pdf')) {
    const fonts = await shippedFonts();
    files.push({ name: 'print-set.pdf', contentType: CONTENT_TYPES.pdf, bytes: await printSetPdf(doc, plan, { page: opts.page, mode: opts.mode, fonts, name: opts.name }) });
    files.push({ name: 'bench-card.pdf', contentType: CONTENT_TYPES.pdf, bytes: await benchCardPdf(doc, plan, { fonts, name: opts.name }) });
  }
  if (opts.formats.includes('svg')) files.push({ name: 'pattern.svg', contentType: CONTENT_TYPES.svg, bytes: text(patternSvg(doc, plan)) });
  if (opts.formats.includes('dxf')) files.push({ name: 'pattern.dxf', contentType: CONTENT_TYPES.dxf, bytes: text(patternDxf(doc, plan)) });
  return files;
}
