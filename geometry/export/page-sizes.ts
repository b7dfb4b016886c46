/**
 * Paper sizes for the print set: A4 and A3 (ISO 216), Letter and Tabloid (ANSI/ASME Y14.1 sizes A and B),
 * in millimetres, portrait or landscape.
 */
import { GeometryError } from '../errors';
import { MM_PER_INCH } from '../units';

export type PageSizeName = 'a4' | 'a3' | 'letter' | 'tabloid';
export type PageOrientation = 'portrait' | 'landscape';

export interface PageSize {
  name: PageSizeName;
  orientation: PageOrientation;
  widthMm: number;
  heightMm: number;
}

/** Portrait sizes, mm: ISO 216 A4 210×297, A3 297×420; ANSI/ASME Y14.1 Letter 8.5×11 in, Tabloid 11×17 in. */
export const PAGE_SIZES_MM: Readonly<Record<PageSizeName, readonly [number, number]>> = {
  a4: [210, 297],
  a3: [297, 420],
  letter: [8.5 * MM_PER_INCH, 11 * MM_PER_INCH],
  tabloid: [11 * MM_PER_INCH, 17 * MM_PER_INCH],
};

/**
 * Returns the page size for a name ('a4', 'a3', 'letter', 'tabloid'; case-insensitive) in the given
 * orientation. Throws GeometryError('BAD_OPTION') naming the unknown size and the known ones.
 */
export function pageSize(name: string, orientation: PageOrientation = 'portrait'): PageSize {
  const key = String(name).toLowerCase() as PageSizeName;
  const dims = Object.prototype.hasOwnProperty.call(PAGE_SIZES_MM, key) ? PAGE_SIZES_MM[key] : undefined;
  if (!dims) throw new GeometryError('BAD_OPTION', `unknown page size "${name}": use one of a4, letter, a3, tabloid`);
  if (orientation !== 'portrait' && orientation !== 'landscape') {
    throw new GeometryError('BAD_OPTION', `unknown page orientation "${orientation}": use portrait or landscape`);
  }
  const [w, h] = dims;
  return orientation === 'portrait' ? { name: key, orientation, widthMm: w, heightMm: h } : { name: key, orientation, widthMm: h, heightMm: w };
}
