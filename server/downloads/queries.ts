/** Drizzle queries for download links as a buyer uses them. */
import { and, eq, gt, isNull, lt, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { printSets, shops } from '../../db/schema-core';
import { downloadLinks, orders, packs } from '../../db/schema-packs';

/** Returns the link with token hash `tokenHash` with its order's status, pack and print set files, or null. */
export async function selectDownload(db: DbExecutor, tokenHash: string) {
  const rows = await db
    .select({
      link: downloadLinks,
      orderStatus: orders.status,
      packTitle: packs.title,
      packSlug: packs.slug,
      licence: packs.licence,
      shopName: shops.name,
      printSetId: printSets.id,
      files: printSets.files,
    })
    .from(downloadLinks)
    .innerJoin(orders, eq(orders.id, downloadLinks.orderId))
    .innerJoin(packs, eq(packs.id, orders.packId))
    .innerJoin(shops, eq(shops.id, packs.shopId))
    .innerJoin(printSets, eq(printSets.id, packs.printSetId))
    .where(eq(downloadLinks.tokenHash, tokenHash));
  return rows[0] ?? null;
}

/**
 * Counts one use of the link if it is still good (not revoked, not expired, uses left, order paid) in one
 * statement, so two downloads at once cannot both take the last use. Returns the uses after counting, or null.
 */
export async function takeLinkUse(db: DbExecutor, tokenHash: string): Promise<number | null> {
  const rows = await db
    .update(downloadLinks)
    .set({ uses: sql`${downloadLinks.uses} + 1` })
    .where(
      and(
        eq(downloadLinks.tokenHash, tokenHash),
        isNull(downloadLinks.revokedAt),
        gt(downloadLinks.expiresAt, sql`now()`),
        lt(downloadLinks.uses, downloadLinks.maxUses),
        sql`exists (select 1 from ${orders} where ${orders.id} = ${downloadLinks.orderId} and ${orders.status} = 'paid')`,
      ),
    )
    .returning({ uses: downloadLinks.uses });
  return rows[0]?.uses ?? null;
}
