/** Drizzle queries for a shop's stock sheets. */
import { asc, eq } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { stockSheets } from '../../db/schema-bench';

export type StockRow = typeof stockSheets.$inferSelect;

/** The shop's stock sheets, thinnest first, in the order they were listed. */
export function selectStock(db: DbExecutor, shopId: string): Promise<StockRow[]> {
  return db.select().from(stockSheets).where(eq(stockSheets.shopId, shopId)).orderBy(asc(stockSheets.thicknessMm), asc(stockSheets.createdAt), asc(stockSheets.name));
}

/** Replaces the shop's stock list with `sheets` (call inside a transaction). */
export async function replaceStockRows(
  db: DbExecutor,
  shopId: string,
  sheets: ReadonlyArray<{ thicknessMm: number; name: string; widthMm: number; heightMm: number; price: number; currency: string }>,
): Promise<void> {
  await db.delete(stockSheets).where(eq(stockSheets.shopId, shopId));
  if (sheets.length > 0) await db.insert(stockSheets).values(sheets.map((s) => ({ ...s, shopId })));
}
