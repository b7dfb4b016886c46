/** Drizzle queries for shops and their members. */
import { asc, eq } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { memberships, shops, users } from '../../db/schema';

/** Returns the shop's id and name, or null. */
export async function selectShop(db: DbExecutor, shopId: string) {
  const rows = await db.select({ id: shops.id, name: shops.name }).from(shops).where(eq(shops.id, shopId));
  return rows[0] ?? null;
}

/** Returns the shop's members with their roles, ordered by name. */
export function selectShopMembers(db: DbExecutor, shopId: string) {
  return db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.shopId, shopId))
    .orderBy(asc(users.name), asc(users.id));
}
