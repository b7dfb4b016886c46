/** Drizzle queries for the site admin screens. */
import { asc, count, eq } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { memberships, users } from '../../db/schema';

/** Returns every user (never the password hash) with how many shops they belong to, ordered by e-mail. */
export function selectUsersWithShopCounts(db: DbExecutor) {
  return db
    .select({ id: users.id, email: users.email, name: users.name, isAdmin: users.isAdmin, createdAt: users.createdAt, shopCount: count(memberships.shopId) })
    .from(users)
    .leftJoin(memberships, eq(memberships.userId, users.id))
    .groupBy(users.id)
    .orderBy(asc(users.email));
}
