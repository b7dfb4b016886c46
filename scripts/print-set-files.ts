/**
 * Node side of the print set: reads the shipped fonts, plans the sheets and writes the files the
 * maker asked for into `outDir`. Called by the `pattern` command and the server's print job.
 */
import { mkdir, readFile, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { planSheets, type SparesFor } from '../geometry/layout/plan-sheets';
import { benchCardPdf } from '../geometry/export/bench-card-pdf';
import { pageSize } from '../geometry/export/page-sizes';
import { patternDxf } from '../geometry/export/pattern-dxf';
import { patternSvg } from '../geometry/export/pattern-svg';
import { printSetPdf, type PrintMode } from '../geometry/export/print-set-pdf';
import type { PatternDoc } from '../geometry/pattern/pattern-doc';

const FONT_DIR = path.join(__dirname, '..', 'public', 'fonts');

export interface PrintSetFileOptions {
  page?: 'a4' | 'letter' | 'a3' | 'tabloid';
  mode?: PrintMode;
  gapMm?: number;
  sparesPct?: number;
  sparesFor?: SparesFor;
}

/**
 * Writes print-set.pdf and bench-card.pdf (for 'pdf'), sheet-plan.json (always), pattern.svg and
 * pattern.dxf into `outDir` (created when missing). Returns the written paths. Errors from the
 * engine (GeometryError with a code and a message naming the piece or option) pass through.
 */
export async function writePrintSetFiles(doc: PatternDoc, formats: Array<'pdf' | 'svg' | 'dxf'>, outDir: string, opts: PrintSetFileOptions = {}): Promise<string[]> {
  const page = opts.page ?? 'a4';
  pageSize(page);
  const plan = planSheets(doc, { gapMm: opts.gapMm, sparesPct: opts.sparesPct, sparesFor: opts.sparesFor });
  await mkdir(outDir, { recursive: true });
  const written: string[] = [];
  const put = async (name: string, data: string | Uint8Array) => {
    const p = path.join(outDir, name);
    await writeFile(p, data);
    written.push(p);
  };
  await put('sheet-plan.json', JSON.stringify(plan, null, 1));
  if (formats.includes('pdf')) {
    const [regular, bold, mono] = await Promise.all(
      ['Archivo_400Regular.ttf', 'Archivo_800ExtraBold.ttf', 'DMMono_400Regular.ttf'].map(async (f) => new Uint8Array(await readFile(path.join(FONT_DIR, f)))),
    );
    const fonts = { regular, bold, mono };
    await put('print-set.pdf', await printSetPdf(doc, plan, { page, mode: opts.mode ?? 'tiled', fonts }));
    await put('bench-card.pdf', await benchCardPdf(doc, plan, { fonts }));
  }
  if (formats.includes('svg')) await put('pattern.svg', patternSvg(doc, plan));
  if (formats.includes('dxf')) await put('pattern.dxf', patternDxf(doc, plan));
  return written;
}
