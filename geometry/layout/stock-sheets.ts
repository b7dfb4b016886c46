/**
 * Stock sheet sizes and prices per foam thickness. Sizes are common practice from the trade
 * (shared/DESIGN.md, "What the trade knows"), not a standard: thin craft foam comes in 12×18 in and
 * A3-ish sheets, 4–6 mm foam in sheets around 1000×500 mm, 10 mm floor-mat tiles around 600×600 mm.
 * Prices are placeholders for the maker to overwrite in settings; the note on each entry says so.
 */
import { GeometryError } from '../errors';

export interface StockSheet {
  /** Foam thickness this sheet is for, mm. */
  thicknessMm: number;
  /** Sheet size, mm (either way round; the planner uses width along x, height along y). */
  widthMm: number;
  heightMm: number;
  /** Price of one sheet in the maker's own currency (no currency is assumed). */
  pricePerSheet: number;
  /** Where the size and price come from, shown beside the figure. */
  note: string;
}

const DEFAULT_PRICE_NOTE = 'default price: set your own in settings';

/** The default stock list (common practice sizes; prices are editable defaults). */
export const DEFAULT_STOCK_SHEETS: readonly StockSheet[] = [
  { thicknessMm: 2, widthMm: 457.2, heightMm: 304.8, pricePerSheet: 1.5, note: `12×18 in craft foam sheet (common practice); ${DEFAULT_PRICE_NOTE}` },
  { thicknessMm: 4, widthMm: 1000, heightMm: 500, pricePerSheet: 7, note: `about 1000×500 mm sheet (common practice); ${DEFAULT_PRICE_NOTE}` },
  { thicknessMm: 6, widthMm: 1000, heightMm: 500, pricePerSheet: 9, note: `about 1000×500 mm sheet (common practice); ${DEFAULT_PRICE_NOTE}` },
  { thicknessMm: 10, widthMm: 600, heightMm: 600, pricePerSheet: 5, note: `about 600×600 mm floor-mat tile (common practice); ${DEFAULT_PRICE_NOTE}` },
];

/**
 * Returns the stock sheet options for one thickness: the exact matches in `stock` when there are any,
 * otherwise the entry with the nearest thickness, re-labelled for the requested thickness (a custom
 * thickness borrows the size class of its neighbour). Throws GeometryError('BAD_OPTION') when `stock`
 * is empty or the thickness is not a positive number.
 */
export function stockForThickness(thicknessMm: number, stock: readonly StockSheet[] = DEFAULT_STOCK_SHEETS): StockSheet[] {
  if (!(Number.isFinite(thicknessMm) && thicknessMm > 0)) {
    throw new GeometryError('BAD_OPTION', `foam thickness must be a positive number of mm, got ${thicknessMm}`);
  }
  if (stock.length === 0) throw new GeometryError('BAD_OPTION', 'the stock sheet list is empty: add at least one sheet size');
  for (const [i, s] of stock.entries()) {
    if (!(s.widthMm > 0 && s.heightMm > 0 && s.thicknessMm > 0 && Number.isFinite(s.pricePerSheet) && s.pricePerSheet >= 0)) {
      throw new GeometryError('BAD_OPTION', `stock sheet ${i + 1} (${s.thicknessMm} mm) needs a positive size and thickness and a price of 0 or more`);
    }
  }
  const exact = stock.filter((s) => Math.abs(s.thicknessMm - thicknessMm) < 1e-9);
  if (exact.length > 0) return exact;
  let nearest = stock[0];
  for (const s of stock) if (Math.abs(s.thicknessMm - thicknessMm) < Math.abs(nearest.thicknessMm - thicknessMm)) nearest = s;
  return [{ ...nearest, thicknessMm, note: `size borrowed from the ${nearest.thicknessMm} mm stock; ${nearest.note}` }];
}
