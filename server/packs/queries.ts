/** Drizzle queries for packs; shop-side reads are scoped to the shop, public reads to published packs. */
import { and, count, desc, eq, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { printSets, shops } from '../../db/schema-core';
import { orders, packs } from '../../db/schema-packs';

export type PackRow = typeof packs.$inferSelect;

/** A pack with the shop's name and the print set it sells (for views and downloads). */
export interface PackWithSet {
  pack: PackRow;
  shopName: string;
  buildId: string;
  printSetName: string;
  pieceCount: number;
  files: Array<{ name: string; sizeBytes: number; contentType: string }>;
}

const withSetColumns = {
  pack: packs,
  shopName: shops.name,
  buildId: printSets.buildId,
  printSetName: printSets.name,
  pieceCount: printSets.pieceCount,
  files: printSets.files,
};

/** Inserts a pack and returns it; throws the driver's unique-violation error (23505) when the slug is taken. */
export async function insertPack(db: DbExecutor, row: typeof packs.$inferInsert): Promise<PackRow> {
  const [inserted] = await db.insert(packs).values(row).returning();
  return inserted;
}

/** Returns whether a pack already uses `slug`. */
export async function slugTaken(db: DbExecutor, slug: string): Promise<boolean> {
  const rows = await db.select({ id: packs.id }).from(packs).where(eq(packs.slug, slug));
  return rows.length > 0;
}

/** Returns the shop's packs, newest first, each with its print set and paid/refunded order counts. */
export async function selectShopPacks(db: DbExecutor, shopId: string) {
  const paid = sql<number>`(select count(*)::int from ${orders} where ${orders.packId} = ${packs.id} and ${orders.status} = 'paid')`;
  const refunded = sql<number>`(select count(*)::int from ${orders} where ${orders.packId} = ${packs.id} and ${orders.status} = 'refunded')`;
  return db
    .select({ ...withSetColumns, paidOrders: paid, refundedOrders: refunded })
    .from(packs)
    .innerJoin(shops, eq(shops.id, packs.shopId))
    .innerJoin(printSets, eq(printSets.id, packs.printSetId))
    .where(eq(packs.shopId, shopId))
    .orderBy(desc(packs.createdAt), desc(packs.id));
}

/** Returns one pack of the shop with its print set, or null. */
export async function selectShopPack(db: DbExecutor, shopId: string, packId: string): Promise<PackWithSet | null> {
  const rows = await db
    .select(withSetColumns)
    .from(packs)
    .innerJoin(shops, eq(shops.id, packs.shopId))
    .innerJoin(printSets, eq(printSets.id, packs.printSetId))
    .where(and(eq(packs.shopId, shopId), eq(packs.id, packId)));
  return rows[0] ?? null;
}

/** Returns the pack with `slug` and its print set, whatever its status, or null. */
export async function selectPackBySlug(db: DbExecutor, slug: string): Promise<PackWithSet | null> {
  const rows = await db
    .select(withSetColumns)
    .from(packs)
    .innerJoin(shops, eq(shops.id, packs.shopId))
    .innerJoin(printSets, eq(printSets.id, packs.printSetId))
    .where(eq(packs.slug, slug));
  return rows[0] ?? null;
}

/** Returns one page of published packs, newest first, and how many are published in all. */
export async function selectPublishedPacks(db: DbExecutor, offset: number, limit: number): Promise<{ rows: PackWithSet[]; total: number }> {
  const published = eq(packs.status, 'published');
  const rows = await db
    .select(withSetColumns)
    .from(packs)
    .innerJoin(shops, eq(shops.id, packs.shopId))
    .innerJoin(printSets, eq(printSets.id, packs.printSetId))
    .where(published)
    .orderBy(desc(packs.publishedAt), desc(packs.id))
    .offset(offset)
    .limit(limit);
  const [{ n }] = await db.select({ n: count() }).from(packs).where(published);
  return { rows, total: n };
}

/** Applies `changes` to the shop's pack and returns it, or null when there is no such pack. */
export async function updatePack(db: DbExecutor, shopId: string, packId: string, changes: Partial<typeof packs.$inferInsert>): Promise<PackRow | null> {
  const rows = await db
    .update(packs)
    .set(changes)
    .where(and(eq(packs.shopId, shopId), eq(packs.id, packId)))
    .returning();
  return rows[0] ?? null;
}
