/**
 * Reading a sculpt upload: the multipart body (one file in the field "file" plus short text fields) into
 * memory with multer, under a size limit, after the caller's access has been checked; then a look at the
 * bytes to make sure they are a model (OBJ, STL or PLY) and not, say, an image with a model's extension.
 */
import type { Request, Response } from 'express';
import multer from 'multer';
import { detectModelFormat, type ModelFormat } from '../../geometry/io/import-model';
import { isBinaryByte } from '../../geometry/io/parse-limits';
import { AppError } from '../errors';

/** The uploaded file as the service sees it. */
export interface UploadedModel {
  bytes: Buffer;
  /** The client's file name reduced to its last part, without control characters; shown to people only. */
  fileName: string;
  format: ModelFormat;
  fields: Record<string, string>;
}

/** A size for people: megabytes from 1 MB up, bytes below. */
const mb = (n: number) => (n >= 1024 * 1024 ? `${Math.round((n / (1024 * 1024)) * 10) / 10} MB` : `${n}-byte`);

/**
 * Returns the client's file name for display: the part after the last "/" or "\" with control characters
 * removed, at most 200 characters. Throws 400 BAD_FILE_NAME for a name with a NUL character or with nothing
 * left (such as "../"). Stored files never use it: their keys are made from the sculpt's id.
 */
export function displayFileName(raw: string): string {
  if (raw.includes('\0')) throw new AppError('BAD_FILE_NAME', 400, 'The file name contains a NUL character; rename the file and upload it again', { file: 'the file name contains a NUL character' });
  const last = raw.split(/[/\\]/).pop() ?? '';
  // Control characters (C0 and DEL) never belong in a name shown to people, and could garble a log line.
  const clean = Array.from(last).filter((c) => c.charCodeAt(0) >= 32 && c.charCodeAt(0) !== 127).join('').trim().slice(0, 200);
  if (clean === '' || clean === '.' || clean === '..') {
    throw new AppError('BAD_FILE_NAME', 400, `The file name "${raw.slice(0, 80)}" has no name part; upload a file such as helm.obj`, { file: 'the file name has no name part' });
  }
  return clean;
}

/** Known non-model file signatures, for a message that says what the upload really is. */
const SIGNATURES: Array<{ bytes: number[]; what: string }> = [
  { bytes: [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a], what: 'a PNG image' },
  { bytes: [0xff, 0xd8, 0xff], what: 'a JPEG image' },
  { bytes: [0x47, 0x49, 0x46, 0x38], what: 'a GIF image' },
  { bytes: [0x25, 0x50, 0x44, 0x46, 0x2d], what: 'a PDF document' },
  { bytes: [0x50, 0x4b, 0x03, 0x04], what: 'a ZIP archive (unpack it and upload the model inside)' },
  { bytes: [0x1f, 0x8b], what: 'a gzip-compressed file (unpack it and upload the model inside)' },
  { bytes: [0x52, 0x49, 0x46, 0x46], what: 'a RIFF file (an image, sound or video)' },
  { bytes: [0x67, 0x6c, 0x54, 0x46], what: 'a binary glTF model (export it as OBJ, STL or PLY)' },
];

/**
 * Returns the model format of the upload's bytes. Throws 415 UNSUPPORTED_TYPE saying what the content looks
 * like when it is a known other kind of file, when it matches no model format, or when a text format's first
 * 64 KiB hold binary bytes.
 */
export function sniffModelFormat(bytes: Uint8Array, fileName: string): ModelFormat {
  const refuse = (why: string) => new AppError('UNSUPPORTED_TYPE', 415, `"${fileName}" ${why}; upload an OBJ, STL or PLY model`, { file: why });
  for (const sig of SIGNATURES) {
    if (sig.bytes.every((b, i) => bytes[i] === b)) throw refuse(`is ${sig.what}, not a 3D model`);
  }
  const format = detectModelFormat(bytes, fileName);
  if (!format) throw refuse('is not a model file this app reads (its content is not OBJ, STL or PLY and its name has no such extension)');
  if (format === 'obj') {
    const n = Math.min(bytes.length, 65536);
    let binary = 0;
    for (let i = 0; i < n; i++) if (bytes[i] === 0 || isBinaryByte(bytes[i])) binary++;
    if (binary > 0) throw refuse(`is named as an OBJ (text) file but its first ${n} bytes hold ${binary} binary bytes`);
  }
  return format;
}

/**
 * Reads the multipart upload of `req` (after access checks) and returns the model and its text fields.
 * `maxBytes` bounds the file. Throws AppError: 413 FILE_TOO_LARGE naming the limit, 400 NO_FILE when the body
 * is not multipart or holds no "file", 400 BAD_UPLOAD for other malformed forms, plus displayFileName's and
 * sniffModelFormat's errors.
 */
export async function readModelUpload(req: Request, res: Response, maxBytes: number): Promise<UploadedModel> {
  const middleware = multer({
    storage: multer.memoryStorage(),
    preservePath: true,
    defParamCharset: 'utf8',
    limits: { fileSize: maxBytes, files: 1, fields: 10, fieldSize: 1024, parts: 12 },
  }).single('file');
  try {
    await new Promise<void>((resolve, reject) => middleware(req, res, (err: unknown) => (err ? reject(err) : resolve())));
  } catch (err) {
    if (err instanceof multer.MulterError) {
      if (err.code === 'LIMIT_FILE_SIZE') {
        throw new AppError('FILE_TOO_LARGE', 413, `The file is larger than the ${mb(maxBytes)} limit for a sculpt; reduce the model or export it in a binary format`, { file: `over the ${mb(maxBytes)} limit` });
      }
      if (err.code === 'LIMIT_UNEXPECTED_FILE') {
        throw new AppError('BAD_UPLOAD', 400, `Send one model file in the form field "file" (got a file in "${err.field ?? '?'}")`, { file: 'one file, in the field "file"' });
      }
      throw new AppError('BAD_UPLOAD', 400, `The upload form is not valid: ${err.message}${err.field ? ` (field "${err.field}")` : ''}`);
    }
    throw new AppError('BAD_UPLOAD', 400, `The upload could not be read: ${err instanceof Error ? err.message : String(err)}`);
  }
  const file = req.file;
  if (!file) throw new AppError('NO_FILE', 400, 'No model file was sent: post multipart/form-data with the model in the field "file"', { file: 'choose a model file' });
  const fileName = displayFileName(file.originalname);
  if (file.size === 0) throw new AppError('EMPTY_FILE', 400, `"${fileName}" is empty (0 bytes)`, { file: 'the file is empty' });
  const format = sniffModelFormat(file.buffer, fileName);
  const fields: Record<string, string> = {};
  for (const [k, v] of Object.entries((req.body ?? {}) as Record<string, unknown>)) if (typeof v === 'string') fields[k] = v;
  return { bytes: file.buffer, fileName, format, fields };
}
