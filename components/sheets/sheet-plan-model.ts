/**
 * What the sheets page shows of a sheet plan and the shop's stock: money in the shop's currency, the sheet
 * drawings' paths, a first stock list suggested from the trade's common sheet sizes, and the stock form's rows
 * read back into numbers with messages that say which row and field is wrong.
 */
import { DEFAULT_STOCK_SHEETS } from '../../geometry/layout/stock-sheets';
import type { PointMm } from '../../geometry/pattern/pattern-doc';
import { stockReplaceBody, type StockReplaceBody } from '../../db/validation-bench';

/**
 * Formats `amount` in `currency` (ISO 4217 code) for `locale` (default: the reader's), e.g. "€12.50". An unknown
 * code falls back to "12.50 XYZ" rather than throwing.
 */
export function formatMoney(amount: number, currency: string, locale?: string): string {
  try {
    return new Intl.NumberFormat(locale, { style: 'currency', currency }).format(amount);
  } catch {
    return `${amount.toFixed(2)} ${currency}`;
  }
}

/** SVG path data of a placed outline on a sheet `sheetHeightMm` tall: sheet y is up, SVG y is down. */
export function sheetRingPath(ring: readonly PointMm[], sheetHeightMm: number): string {
  if (ring.length === 0) return '';
  return ring.map(([x, y], i) => `${i === 0 ? 'M' : 'L'}${Math.round(x * 10) / 10} ${Math.round((sheetHeightMm - y) * 10) / 10}`).join(' ') + ' Z';
}

/** The centre of a ring's bounding box, in SVG coordinates of a sheet `sheetHeightMm` tall (for the copy's label). */
export function ringLabelPoint(ring: readonly PointMm[], sheetHeightMm: number): [number, number] {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const [x, y] of ring) {
    minX = Math.min(minX, x); maxX = Math.max(maxX, x); minY = Math.min(minY, y); maxY = Math.max(maxY, y);
  }
  return [(minX + maxX) / 2, sheetHeightMm - (minY + maxY) / 2];
}

/** One row of the stock form as typed (all text, so a half-typed number stays as typed). */
export interface StockRowText {
  thicknessMm: string;
  name: string;
  widthMm: string;
  heightMm: string;
  price: string;
  currency: string;
}

/**
 * A first stock row for each thickness in `thicknesses` that has none yet, from the engine's common sheet sizes
 * (geometry/layout/stock-sheets.ts; the nearest thickness's size for one not listed), price left at 0 for the
 * maker to fill in.
 */
export function suggestedStockRows(thicknesses: readonly number[], have: readonly number[], currency: string): StockRowText[] {
  const out: StockRowText[] = [];
  for (const t of [...new Set(thicknesses)].sort((a, b) => a - b)) {
    if (have.includes(t)) continue;
    const near = [...DEFAULT_STOCK_SHEETS].sort((a, b) => Math.abs(a.thicknessMm - t) - Math.abs(b.thicknessMm - t))[0];
    out.push({
      thicknessMm: String(t),
      name: `${t} mm sheet`,
      widthMm: String(Math.round(near.widthMm)),
      heightMm: String(Math.round(near.heightMm)),
      price: '0',
      currency,
    });
  }
  return out;
}

const FIELD_WORDS: Record<keyof StockRowText, string> = {
  thicknessMm: 'thickness',
  name: 'name',
  widthMm: 'width',
  heightMm: 'height',
  price: 'price',
  currency: 'currency',
};

/**
 * Reads the typed rows into the PUT body and checks it with the server's own schema (db/validation-bench.ts
 * stockReplaceBody). Returns the body, or errors keyed "row.field" (e.g. "1.widthMm", rows from 0) with messages
 * that name the row as people count it ("Sheet 2 width: must be more than 0 mm"). A decimal comma is read as a point.
 */
export function readStockRows(rows: readonly StockRowText[]): { ok: true; body: StockReplaceBody } | { ok: false; errors: Record<string, string> } {
  const num = (s: string) => {
    const t = s.trim().replace(',', '.');
    return t === '' ? Number.NaN : Number(t);
  };
  const errors: Record<string, string> = {};
  const sheets = rows.map((r, i) => {
    for (const f of ['thicknessMm', 'widthMm', 'heightMm', 'price'] as const) {
      if (!Number.isFinite(num(r[f]))) errors[`${i}.${f}`] = `Sheet ${i + 1} ${FIELD_WORDS[f]}: "${r[f].trim()}" is not a number.`;
    }
    return { thicknessMm: num(r.thicknessMm), name: r.name, widthMm: num(r.widthMm), heightMm: num(r.heightMm), price: num(r.price), currency: r.currency.trim().toUpperCase() };
  });
  const parsed = stockReplaceBody.safeParse({ sheets });
  if (!parsed.success) {
    for (const issue of parsed.error.issues) {
      const [, row, field] = issue.path;
      if (typeof row === 'number' && typeof field === 'string') {
        const key = `${row}.${field}`;
        errors[key] ??= `Sheet ${row + 1} ${FIELD_WORDS[field as keyof StockRowText] ?? field}: ${issue.message}`;
      } else {
        errors.form ??= issue.message;
      }
    }
  }
  return Object.keys(errors).length > 0 ? { ok: false, errors } : { ok: true, body: parsed.data! };
}
