/**
 * Stock rules: a shop lists the sheets it buys per thickness (size, price, currency). A shop that has listed
 * none plans on the engine's defaults (geometry/layout/stock-sheets.ts, common practice sizes with placeholder
 * prices), and the answer says so.
 */
import type { Db } from '../../db/client';
import type { StockReplaceBody } from '../../db/validation-bench';
import { DEFAULT_STOCK_SHEETS, type StockSheet } from '../../geometry/layout/stock-sheets';
import { AppError } from '../errors';
import { replaceStockRows, selectStock } from './queries';

/** Currency of the default stock prices (the defaults are placeholders in no particular money). */
export const DEFAULT_STOCK_CURRENCY = 'EUR';

export interface StockSheetView {
  thicknessMm: number;
  name: string;
  widthMm: number;
  heightMm: number;
  price: number;
  currency: string;
  /** 'shop' for the shop's own list, 'default' for the engine's defaults shown until the shop sets its own. */
  source: 'shop' | 'default';
}

/** The default stock as views (name from its note's size words). */
function defaultStockViews(): StockSheetView[] {
  return DEFAULT_STOCK_SHEETS.map((s) => ({
    thicknessMm: s.thicknessMm,
    name: `${s.thicknessMm} mm, ${s.note.split(' (')[0]}`,
    widthMm: s.widthMm,
    heightMm: s.heightMm,
    price: s.pricePerSheet,
    currency: DEFAULT_STOCK_CURRENCY,
    source: 'default',
  }));
}

/** Returns the shop's stock list, or the defaults when it has none. */
export async function listStock(db: Db, shopId: string): Promise<StockSheetView[]> {
  const rows = await selectStock(db, shopId);
  if (rows.length === 0) return defaultStockViews();
  return rows.map((r) => ({ thicknessMm: r.thicknessMm, name: r.name, widthMm: r.widthMm, heightMm: r.heightMm, price: r.price, currency: r.currency, source: 'shop' }));
}

/**
 * Replaces the shop's stock list and returns it. An empty list goes back to the defaults. Throws 400 VALIDATION
 * when sheets mix currencies (a sheet plan adds their prices) naming the first sheet that differs.
 */
export async function replaceStock(db: Db, shopId: string, body: StockReplaceBody): Promise<StockSheetView[]> {
  const first = body.sheets[0]?.currency;
  const odd = body.sheets.findIndex((s) => s.currency !== first);
  if (odd >= 0) {
    throw new AppError('VALIDATION', 400, `Every stock sheet must be priced in one currency: sheet ${odd + 1} is in ${body.sheets[odd].currency}, sheet 1 in ${first}`, {
      [`sheets.${odd}.currency`]: `must be ${first}, like the other sheets`,
    });
  }
  await db.transaction((tx) => replaceStockRows(tx, shopId, body.sheets));
  return listStock(db, shopId);
}

/** The stock a sheet plan nests on: the shop's sheets (or the defaults) as the engine takes them, and their currency. */
export async function stockForPlanning(db: Db, shopId: string): Promise<{ stock: StockSheet[]; currency: string; source: 'shop' | 'default' }> {
  const rows = await selectStock(db, shopId);
  if (rows.length === 0) return { stock: [...DEFAULT_STOCK_SHEETS], currency: DEFAULT_STOCK_CURRENCY, source: 'default' };
  return {
    stock: rows.map((r) => ({ thicknessMm: r.thicknessMm, widthMm: r.widthMm, heightMm: r.heightMm, pricePerSheet: r.price, note: r.name })),
    currency: rows[0].currency,
    source: 'shop',
  };
}
