/** Drizzle queries for a shop's members: listing, locking the owners, changing and removing memberships. */
import { and, asc, eq, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { memberships, users } from '../../db/schema-core';
import type { Role } from '../../db/validation';

/** SQL for "may see print sets": owners and editors always, viewers when granted. */
const seesPrintSets = sql<boolean>`(${memberships.role} <> 'viewer' OR ${memberships.canSeePrintSets})`;

/** Returns the shop's members with e-mail, role, print-set access and join time, owners first, then by name. */
export function selectMembers(db: DbExecutor, shopId: string) {
  return db
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      role: memberships.role,
      canSeePrintSets: seesPrintSets,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.shopId, shopId))
    .orderBy(sql`CASE ${memberships.role} WHEN 'owner' THEN 0 WHEN 'editor' THEN 1 ELSE 2 END`, asc(users.name), asc(users.id));
}

/**
 * Returns the user ids of the shop's owners and locks their membership rows until the transaction ends, so two
 * owners demoting each other at once cannot leave the shop with none.
 */
export async function lockOwners(tx: DbExecutor, shopId: string): Promise<string[]> {
  const rows = await tx
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.shopId, shopId), eq(memberships.role, 'owner')))
    .for('update');
  return rows.map((r) => r.userId);
}

/** Returns one membership with the member's name and e-mail and the stored print-set grant, or null. */
export async function selectMember(db: DbExecutor, shopId: string, userId: string) {
  const rows = await db
    .select({
      userId: users.id,
      name: users.name,
      email: users.email,
      role: memberships.role,
      canSeePrintSets: memberships.canSeePrintSets,
      joinedAt: memberships.createdAt,
    })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.shopId, shopId), eq(memberships.userId, userId)));
  return rows[0] ?? null;
}

/** Sets the given fields of one membership. */
export async function updateMembership(db: DbExecutor, shopId: string, userId: string, set: { role?: Role; canSeePrintSets?: boolean }): Promise<void> {
  await db
    .update(memberships)
    .set(set)
    .where(and(eq(memberships.shopId, shopId), eq(memberships.userId, userId)));
}

/** Deletes one membership. */
export async function deleteMembership(db: DbExecutor, shopId: string, userId: string): Promise<void> {
  await db.delete(memberships).where(and(eq(memberships.shopId, shopId), eq(memberships.userId, userId)));
}

/** Returns whether the member may see the shop's print sets (role above viewer, or a viewer with the grant). */
export async function selectSeesPrintSets(db: DbExecutor, userId: string, shopId: string): Promise<boolean> {
  const rows = await db
    .select({ sees: seesPrintSets })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.shopId, shopId)));
  return rows[0]?.sees ?? false;
}
