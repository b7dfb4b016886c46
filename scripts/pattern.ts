/**
 * The `pattern` command: the engine from the command line (shared/DESIGN.md, "The `pattern` command").
 *
 *   npm run -s pattern -- <model.obj|.stl|.ply> --out <dir> [--seams obj|crease:<deg>|auto] [--units mm|cm|m|in]
 *     [--thickness <mm>] [--surface outer|mid|inner] [--stretch-budget <pct>] [--page a4|letter|a3|tabloid]
 *     [--format json,pdf,svg,dxf] [--mode tiled|piece-per-page|stock-sheet] [--spares <pct>]
 *
 * Default seams: the file's `l` polylines when it has any (the maker marked them), otherwise automatic seams
 * from the stretch budget (`auto`), which also follow sharp creases, so a hard-surface sculpt is cut at its
 * corners and a smooth one into pieces that lie flat. `crease:<deg>` must be asked for; with it (or with `obj`),
 * any part left closed is opened with automatic seams and the document's warnings say so. pattern.json is always written; pdf/svg/dxf come from
 * the print-set writer. On bad input the command prints one line on stderr (what is wrong, and the file line for
 * text formats) and exits 2 for a usage mistake, 1 for a problem with the model.
 */
import { existsSync, mkdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { basename, extname, join, resolve } from 'node:path';
import { isGeometryError } from '../geometry/errors';
import { importModel } from '../geometry/io/import-model';
import { buildPattern, DEFAULT_THICKNESS_MM } from '../geometry/pattern/build-pattern';
import type { PatternDoc, PatternSurface } from '../geometry/pattern/pattern-doc';
import type { SeamSource } from '../geometry/pattern/prepare-pieces';
import { MODEL_UNIT_MM, type ModelUnit } from '../geometry/units';
import { writePrintSetFiles } from './print-set-files';

type PrintFormat = 'pdf' | 'svg' | 'dxf';
type PageSize = 'a4' | 'letter' | 'a3' | 'tabloid';
type PrintMode = 'tiled' | 'piece-per-page' | 'stock-sheet';

interface CommandOptions {
  model: string;
  out: string;
  seams?: SeamSource;
  units: ModelUnit;
  thickness: number;
  surface: PatternSurface;
  stretchBudgetPct: number;
  page: PageSize;
  mode: PrintMode;
  sparesPct: number;
  formats: Array<'json' | PrintFormat>;
}

/** A mistake in how the command was called; printed as one line, exit status 2. */
class UsageError extends Error {}

const USAGE =
  'usage: pattern <model.obj|.stl|.ply> --out <dir> [--seams obj|crease:<deg>|auto] [--units mm|cm|m|in] ' +
  '[--thickness <mm>] [--surface outer|mid|inner] [--stretch-budget <pct>] [--page a4|letter|a3|tabloid] ' +
  '[--format json,pdf,svg,dxf] [--mode tiled|piece-per-page|stock-sheet] [--spares <pct>]';

const VALUE_OPTIONS = ['--out', '--seams', '--units', '--thickness', '--surface', '--stretch-budget', '--page', '--format', '--mode', '--spares'];

function parseNumber(option: string, text: string, check: (v: number) => boolean, want: string): number {
  const value = Number(text);
  if (text.trim() === '' || !Number.isFinite(value) || !check(value)) {
    throw new UsageError(`${option} expects ${want}, got '${text}'`);
  }
  return value;
}

function parseArgs(argv: string[]): CommandOptions {
  const values = new Map<string, string>();
  const positional: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i];
    if (arg === '--help' || arg === '-h') throw new UsageError(USAGE);
    if (!arg.startsWith('--')) {
      positional.push(arg);
      continue;
    }
    const eq = arg.indexOf('=');
    const name = eq >= 0 ? arg.slice(0, eq) : arg;
    if (!VALUE_OPTIONS.includes(name)) throw new UsageError(`unknown option ${name} (${USAGE})`);
    let value: string;
    if (eq >= 0) value = arg.slice(eq + 1);
    else {
      if (i + 1 >= argv.length || argv[i + 1].startsWith('--')) throw new UsageError(`${name} needs a value`);
      value = argv[++i];
    }
    if (values.has(name)) throw new UsageError(`${name} is given twice`);
    values.set(name, value);
  }
  if (positional.length === 0) throw new UsageError(`no model file given (${USAGE})`);
  if (positional.length > 1) throw new UsageError(`one model file expected, got ${positional.length}: ${positional.join(' ')}`);
  const out = values.get('--out');
  if (!out) throw new UsageError('--out <dir> is required');

  let seams: SeamSource | undefined;
  const seamText = values.get('--seams');
  if (seamText !== undefined) {
    if (seamText === 'obj' || seamText === 'auto') seams = seamText;
    else if (seamText.startsWith('crease:')) {
      seams = {
        crease: parseNumber('--seams crease:', seamText.slice(7), (v) => v > 0 && v < 180, 'an angle between 0 and 180 degrees'),
      };
    } else throw new UsageError(`--seams expects obj, crease:<deg> or auto, got '${seamText}'`);
  }
  const units = values.get('--units') ?? 'mm';
  if (!(units in MODEL_UNIT_MM)) throw new UsageError(`--units expects mm, cm, m or in, got '${units}'`);
  const surface = values.get('--surface') ?? 'outer';
  if (surface !== 'outer' && surface !== 'mid' && surface !== 'inner') {
    throw new UsageError(`--surface expects outer, mid or inner, got '${surface}'`);
  }
  const page = values.get('--page') ?? 'a4';
  if (page !== 'a4' && page !== 'letter' && page !== 'a3' && page !== 'tabloid') {
    throw new UsageError(`--page expects a4, letter, a3 or tabloid, got '${page}'`);
  }
  const mode = values.get('--mode') ?? 'tiled';
  if (mode !== 'tiled' && mode !== 'piece-per-page' && mode !== 'stock-sheet') {
    throw new UsageError(`--mode expects tiled, piece-per-page or stock-sheet, got '${mode}'`);
  }
  const sparesText = values.get('--spares');
  const formats: CommandOptions['formats'] = ['json'];
  for (const f of (values.get('--format') ?? 'json').split(',').map((s) => s.trim().toLowerCase())) {
    if (f !== 'json' && f !== 'pdf' && f !== 'svg' && f !== 'dxf') {
      throw new UsageError(`--format expects a list of json, pdf, svg, dxf, got '${f}'`);
    }
    if (!formats.includes(f)) formats.push(f);
  }
  const thicknessText = values.get('--thickness');
  const budgetText = values.get('--stretch-budget');
  return {
    model: positional[0],
    out,
    seams,
    units: units as ModelUnit,
    thickness:
      thicknessText === undefined
        ? DEFAULT_THICKNESS_MM
        : parseNumber('--thickness', thicknessText, (v) => v >= 0 && v <= 1000, 'a thickness in mm between 0 and 1000'),
    surface,
    stretchBudgetPct:
      budgetText === undefined
        ? 3
        : parseNumber('--stretch-budget', budgetText, (v) => v > 0 && v <= 100, 'a percentage above 0 and at most 100'),
    page,
    mode,
    sparesPct:
      sparesText === undefined
        ? 10
        : parseNumber('--spares', sparesText, (v) => v >= 0 && v <= 100, 'a spares allowance in percent from 0 to 100'),
    formats,
  };
}

async function main(argv: string[]): Promise<void> {
  const options = parseArgs(argv);
  const printFormats = options.formats.filter((f): f is PrintFormat => f !== 'json');
  const modelPath = resolve(options.model);
  if (!existsSync(modelPath)) throw new UsageError(`model file not found: ${options.model}`);
  if (!statSync(modelPath).isFile()) throw new UsageError(`not a file: ${options.model}`);
  const bytes = new Uint8Array(readFileSync(modelPath));
  const model = importModel(bytes, basename(modelPath), { unit: options.units });
  const doc = buildPattern(model, {
    seams: options.seams,
    thickness: options.thickness,
    surface: options.surface,
    stretchBudgetPct: options.stretchBudgetPct,
    name: basename(modelPath, extname(modelPath)),
  });
  const outDir = resolve(options.out);
  mkdirSync(outDir, { recursive: true });
  const jsonPath = join(outDir, 'pattern.json');
  writeFileSync(jsonPath, JSON.stringify(doc, null, 1) + '\n');
  const written = [jsonPath];
  if (printFormats.length > 0) {
    written.push(
      ...(await writePrintSetFiles(doc, printFormats, outDir, { page: options.page, mode: options.mode, sparesPct: options.sparesPct })),
    );
  }
  const quantity = doc.pieces.reduce((n, p) => n + p.quantity, 0);
  process.stdout.write(
    `pattern: ${doc.pieces.length} piece templates (${quantity} to cut), ${doc.seams.length} seams, ` +
      `${doc.warnings.length} warning(s)\n${written.map((f) => `wrote ${f}`).join('\n')}\n`,
  );
  for (const w of doc.warnings) process.stdout.write(`warning: ${w}\n`);
}

/** One line, no stack trace: what is wrong and where. */
function describeFailure(e: unknown, modelArg: string | undefined): { line: string; code: number } {
  const oneLine = (s: string): string => s.replace(/\s+/g, ' ').trim();
  if (e instanceof UsageError) return { line: `pattern: ${oneLine(e.message)}`, code: 2 };
  if (isGeometryError(e)) {
    const where = e.line !== undefined ? `${modelArg ?? 'model'}:${e.line}: ` : modelArg ? `${modelArg}: ` : '';
    const at = e.line === undefined && e.face !== undefined ? ` (face ${e.face})` : '';
    // The parsers' messages start "OBJ line 12: …"; with the file:line prefix that would name the line twice.
    const message = e.line !== undefined ? e.message.replace(/^(OBJ|STL|PLY) line \d+: /, '$1: ') : e.message;
    return { line: `pattern: ${where}${oneLine(message)}${at}`, code: 1 };
  }
  const err = e as NodeJS.ErrnoException;
  if (err && typeof err === 'object' && typeof err.code === 'string' && typeof err.message === 'string') {
    return { line: `pattern: ${oneLine(err.message)}`, code: 1 };
  }
  return { line: `pattern: internal error: ${oneLine(e instanceof Error ? e.message : String(e))}`, code: 1 };
}

const args = process.argv.slice(2);
main(args).catch((e: unknown) => {
  const { line, code } = describeFailure(e, args.find((a, i) => !a.startsWith('--') && !VALUE_OPTIONS.includes(args[i - 1] ?? '')));
  process.stderr.write(line + '\n');
  process.exitCode = code;
});
