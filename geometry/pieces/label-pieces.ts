import { GeometryError } from '../errors';

/**
 * Returns the label of the piece with 0-based index `i`: A…Z, then AA, AB, …, AZ, BA, … ZZ, AAA, … (bijective
 * base-26 numbering, the way spreadsheet columns are named). Throws GeometryError('BAD_OPTION') unless i is a
 * whole number ≥ 0.
 */
export function pieceLabel(i: number): string {
  if (!Number.isSafeInteger(i) || i < 0) throw new GeometryError('BAD_OPTION', `piece index must be a whole number ≥ 0, got ${String(i)}`);
  let n = i + 1;
  let out = '';
  while (n > 0) {
    const r = (n - 1) % 26;
    out = String.fromCharCode(65 + r) + out;
    n = (n - 1 - r) / 26;
  }
  return out;
}

/** Returns the 0-based index of a piece label (inverse of pieceLabel), or null when it is not a label (A–Z only). */
export function pieceIndexOfLabel(label: string): number | null {
  if (!/^[A-Z]+$/.test(label)) return null;
  let n = 0;
  for (const ch of label) n = n * 26 + (ch.charCodeAt(0) - 64);
  return n - 1;
}
