/**
 * Checks a pack's cover image: PNG or JPEG told apart by their signature bytes (not by name or declared type),
 * at most COVER_MAX_BYTES. Covers come as an upload or as a data URL the app renders from the 3D view.
 */
import { AppError } from '../errors';

export const COVER_MAX_BYTES = 5 * 1024 * 1024;

export type CoverType = { contentType: 'image/png'; ext: 'png' } | { contentType: 'image/jpeg'; ext: 'jpg' };

/** PNG signature (ISO/IEC 15948 §5.2) and JPEG SOI marker followed by a marker prefix (ITU-T T.81 §B.1.1.3). */
const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];
const JPEG_START = [0xff, 0xd8, 0xff];

function startsWith(bytes: Uint8Array, prefix: readonly number[]): boolean {
  return bytes.length >= prefix.length && prefix.every((b, i) => bytes[i] === b);
}

/**
 * Returns the cover's type from its first bytes. Throws 400 BAD_COVER naming `where` when the bytes are neither
 * PNG nor JPEG or are empty, 413 TOO_LARGE when they exceed COVER_MAX_BYTES.
 */
export function coverType(bytes: Uint8Array, where: string): CoverType {
  if (bytes.length === 0) throw new AppError('BAD_COVER', 400, `The cover image (${where}) is empty`);
  if (bytes.length > COVER_MAX_BYTES) {
    throw new AppError('TOO_LARGE', 413, `The cover image (${where}) is ${(bytes.length / 1048576).toFixed(1)} MB; the limit is 5 MB`);
  }
  if (startsWith(bytes, PNG_SIGNATURE)) return { contentType: 'image/png', ext: 'png' };
  if (startsWith(bytes, JPEG_START)) return { contentType: 'image/jpeg', ext: 'jpg' };
  throw new AppError('BAD_COVER', 400, `The cover image (${where}) is not a PNG or JPEG file (its first bytes say otherwise)`);
}

/**
 * Returns the bytes of a `data:image/png;base64,...` or `data:image/jpeg;base64,...` URL (RFC 2397). Throws
 * 400 BAD_COVER when the URL is not a base64 image data URL.
 */
export function bytesFromDataUrl(dataUrl: string): Uint8Array {
  const match = /^data:image\/(png|jpeg);base64,([A-Za-z0-9+/=\s]*)$/.exec(dataUrl);
  if (!match) throw new AppError('BAD_COVER', 400, 'The cover data URL must look like data:image/png;base64,… or data:image/jpeg;base64,…');
  return new Uint8Array(Buffer.from(match[2], 'base64'));
}
