import { GeometryError } from '../errors';
import { lineOfOffset } from './text-scanner';

/** Upper bounds a parser enforces while reading, so an oversized file fails early with a clear message. */
export interface ParseLimits {
  /** Most triangles accepted (after triangulating polygons); default 2,000,000 (DESIGN.md "Sculpt in"). */
  maxTriangles?: number;
}

/** Default triangle limit, 2 million (DESIGN.md, step 1). */
export const DEFAULT_MAX_TRIANGLES = 2_000_000;
/** Default file size limit, 200 MB (DESIGN.md, step 1). */
export const DEFAULT_MAX_BYTES = 200 * 1024 * 1024;

/**
 * Throws GeometryError('BINARY_GARBAGE') with the line number when the first 64 KiB of a text format's bytes
 * contain a NUL byte or more than 10% control characters other than tab, CR, LF and form feed (a binary file
 * given a text extension). Binary bytes further in are caught by the parsers where they meet them
 * (`isBinaryByte`), so a large file is not scanned twice. `what` names the format for the message.
 */
export function checkNotBinary(bytes: Uint8Array, what: string): void {
  const n = Math.min(bytes.length, 65536);
  let control = 0;
  let first = -1;
  for (let i = 0; i < n; i++) {
    const c = bytes[i];
    if (c === 0) {
      const line = lineOfOffset(bytes, i);
      throw new GeometryError('BINARY_GARBAGE', `${what} line ${line}: the file contains binary data (a zero byte at offset ${i}); is it the right file?`, { line });
    }
    if (isBinaryByte(c)) {
      control++;
      if (first < 0) first = i;
    }
  }
  if (control > n / 10) {
    const line = lineOfOffset(bytes, first);
    throw new GeometryError('BINARY_GARBAGE', `${what} line ${line}: the file looks like binary data, not text`, { line });
  }
}

/** True for a byte that never appears in a text model file: a control character other than tab, LF, FF, CR. */
export const isBinaryByte = (c: number): boolean => c < 32 && c !== 9 && c !== 10 && c !== 12 && c !== 13;
