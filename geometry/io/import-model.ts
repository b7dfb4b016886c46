import { GeometryError } from '../errors';
import type { ImportedModel } from '../mesh/tri-mesh';
import { MODEL_UNIT_MM, type ModelUnit } from '../units';
import { DEFAULT_MAX_BYTES, DEFAULT_MAX_TRIANGLES } from './parse-limits';
import { parseObj } from './parse-obj';
import { parsePly } from './parse-ply';
import { looksLikeBinaryStl, parseStl } from './parse-stl';

/** Options for importModel. */
export interface ImportOptions {
  /** Largest file accepted, in bytes; default 200 MB (DESIGN.md, "Sculpt in"). */
  maxBytes?: number;
  /** Most triangles accepted after triangulation; default 2,000,000. */
  maxTriangles?: number;
  /** Units the file's coordinates are in; positions are scaled to millimetres. Default 'mm'. */
  unit?: ModelUnit;
}

/** The model formats the importer reads. */
export type ModelFormat = 'obj' | 'stl' | 'ply';

function startsWith(bytes: Uint8Array, text: string): boolean {
  for (let i = 0; i < text.length; i++) if (bytes[i] !== text.charCodeAt(i)) return false;
  return true;
}

/** True when the text starts with "solid" and says "facet" within its first kilobyte (an ASCII STL). */
function looksLikeAsciiStl(bytes: Uint8Array): boolean {
  let p = 0;
  while (p < bytes.length && p < 4096 && (bytes[p] === 32 || bytes[p] === 9 || bytes[p] === 10 || bytes[p] === 13)) p++;
  if (!startsWith(bytes.subarray(p), 'solid')) return false;
  const head = bytes.subarray(p, p + 1024);
  for (let i = 0; i + 5 <= head.length; i++) if (startsWith(head.subarray(i), 'facet')) return true;
  return false;
}

/**
 * The bytes without a leading UTF-8 byte-order mark (EF BB BF), which text editors on some systems put at the
 * start of a text file; left in place, the first statement of an OBJ (or the magic line of a PLY) would not be
 * recognised. An exactly-sized binary STL keeps all its bytes: its 80-byte header may begin with anything.
 */
function withoutByteOrderMark(bytes: Uint8Array): Uint8Array {
  const bom = bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf;
  return bom && !looksLikeBinaryStl(bytes) ? bytes.subarray(3) : bytes;
}

/**
 * Returns the format of a model file. Content that identifies itself wins over the extension, so a
 * mislabelled file still reads: a PLY magic line, an exactly-sized binary STL, or text starting "solid" with
 * "facet" in its first kilobyte. Otherwise the extension decides (.obj, .stl, .ply, any case); with no known
 * extension, text starting "solid" is STL and other text that starts like an OBJ statement is OBJ.
 * Returns null when nothing fits.
 */
export function detectModelFormat(bytes: Uint8Array, fileName: string): ModelFormat | null {
  if (startsWith(bytes, 'ply\n') || startsWith(bytes, 'ply\r\n')) return 'ply';
  if (looksLikeBinaryStl(bytes)) return 'stl';
  if (looksLikeAsciiStl(bytes)) return 'stl';
  const ext = /\.([a-z0-9]+)$/i.exec(fileName)?.[1]?.toLowerCase();
  if (ext === 'obj' || ext === 'stl' || ext === 'ply') return ext;
  let p = 0;
  while (p < bytes.length && p < 4096 && (bytes[p] === 32 || bytes[p] === 9 || bytes[p] === 10 || bytes[p] === 13)) p++;
  if (startsWith(bytes.subarray(p), 'solid')) return 'stl';
  const c = bytes[p];
  if (c === 35 || c === 118 || c === 102 || c === 111 || c === 103 || c === 109 || c === 117 || c === 115) return 'obj';
  return null;
}

/**
 * Reads a model file's bytes into an ImportedModel with positions in millimetres. Dispatches to parseObj,
 * parseStl (ASCII or binary) or parsePly by `detectModelFormat`, after skipping a UTF-8 byte-order mark. `fileName` is only used for its extension
 * and in messages. Throws GeometryError: EMPTY_FILE, FILE_TOO_LARGE (over `maxBytes`), UNKNOWN_FORMAT,
 * BAD_OPTION for a bad limit or unit, and every error of the parsers (with line numbers for text formats).
 * Pure: no file system; the caller reads the bytes.
 */
export function importModel(bytes: Uint8Array, fileName: string, opts: ImportOptions = {}): ImportedModel {
  const maxBytes = opts.maxBytes ?? DEFAULT_MAX_BYTES;
  const maxTriangles = opts.maxTriangles ?? DEFAULT_MAX_TRIANGLES;
  const unit = opts.unit ?? 'mm';
  if (!(maxBytes > 0) || !Number.isInteger(maxTriangles) || maxTriangles <= 0) {
    throw new GeometryError('BAD_OPTION', `maxBytes and maxTriangles must be positive (got ${maxBytes}, ${maxTriangles})`);
  }
  if (!Object.prototype.hasOwnProperty.call(MODEL_UNIT_MM, unit)) {
    throw new GeometryError('BAD_OPTION', `unknown model unit "${String(unit)}"; use one of ${Object.keys(MODEL_UNIT_MM).join(', ')}`);
  }
  if (bytes.length === 0) throw new GeometryError('EMPTY_FILE', `${fileName} is empty (0 bytes)`);
  if (bytes.length > maxBytes) {
    const mb = (n: number) => (n / (1024 * 1024)).toFixed(1);
    throw new GeometryError('FILE_TOO_LARGE', `${fileName} is ${mb(bytes.length)} MB, over the ${mb(maxBytes)} MB limit`);
  }
  const content = withoutByteOrderMark(bytes);
  const format = detectModelFormat(content, fileName);
  if (!format) {
    throw new GeometryError('UNKNOWN_FORMAT', `${fileName}: not an OBJ, STL or PLY file (unknown extension and unrecognised content)`);
  }
  const limits = { maxTriangles };
  const model =
    format === 'obj' ? parseObj(content, limits) : format === 'stl' ? parseStl(content, limits) : parsePly(content, limits);
  const scale = MODEL_UNIT_MM[unit];
  if (scale !== 1) {
    const P = model.mesh.positions;
    for (let i = 0; i < P.length; i++) P[i] *= scale;
    model.notes.push(`coordinates were in ${unit} and were scaled by ${scale} to millimetres`);
  }
  return model;
}
