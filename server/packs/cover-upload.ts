/**
 * Reads a cover image from a request: multipart/form-data with one file in the field `cover` (multer, in
 * memory, at most 5 MB), or JSON `{ dataUrl }` with a PNG/JPEG data URL rendered by the app from the 3D view.
 */
import type { Request, Response } from 'express';
import multer from 'multer';
import { coverDataUrlBody } from '../../db/validation-packs';
import { AppError, validationError } from '../errors';
import { bytesFromDataUrl, COVER_MAX_BYTES } from './cover-image';

/** Path whose JSON body may carry a cover data URL; app.ts gives it a larger body limit. */
export const PACK_COVER_PATH = '/api/shops/:shopId/packs/:packId/cover';

/** Largest JSON body on PACK_COVER_PATH: a 5 MB image in base64 (4/3) plus room for the JSON around it. */
export const PACK_COVER_JSON_LIMIT = '7mb';

const upload = multer({ storage: multer.memoryStorage(), limits: { fileSize: COVER_MAX_BYTES, files: 1, fields: 4 } }).single('cover');

/** Returns the cover bytes and a phrase saying where they came from (for error messages). */
export async function readCoverFromRequest(req: Request, res: Response): Promise<{ bytes: Uint8Array; where: string }> {
  if (req.is('multipart/form-data')) {
    await new Promise<void>((resolve, reject) => {
      upload(req, res, (err: unknown) => {
        if (err instanceof multer.MulterError) {
          reject(
            err.code === 'LIMIT_FILE_SIZE'
              ? new AppError('TOO_LARGE', 413, 'The cover image is larger than 5 MB')
              : new AppError('BAD_UPLOAD', 400, `The upload could not be read (${err.message}${err.field ? `, field "${err.field}"` : ''}); send one file in the field "cover"`),
          );
        } else if (err) reject(err);
        else resolve();
      });
    });
    const file = req.file;
    if (!file) throw new AppError('BAD_UPLOAD', 400, 'The upload has no file in the field "cover"', { cover: 'missing' });
    return { bytes: new Uint8Array(file.buffer), where: `uploaded file "${file.originalname}"` };
  }
  const parsed = coverDataUrlBody.safeParse(req.body ?? {});
  if (!parsed.success) throw validationError(parsed.error, 'body');
  return { bytes: bytesFromDataUrl(parsed.data.dataUrl), where: 'data URL' };
}
