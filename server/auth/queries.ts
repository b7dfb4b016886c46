/** Drizzle queries for people, their shops and memberships as needed by sign-in and access checks. */
import { and, eq, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { memberships, shops, users } from '../../db/schema';
import type { Role } from '../../db/validation';

const publicUserColumns = { id: users.id, email: users.email, name: users.name, isAdmin: users.isAdmin };

/** Returns the user with `email` (already lower-case) including the password hash and session generation, or null. */
export async function selectUserForSignIn(db: DbExecutor, email: string) {
  const rows = await db
    .select({ ...publicUserColumns, passwordHash: users.passwordHash, sessionGeneration: users.sessionGeneration })
    .from(users)
    .where(eq(users.email, email));
  return rows[0] ?? null;
}

/** Returns the user's public fields and current session generation (one primary-key lookup), or null when there is no such user. */
export async function selectUserForSession(db: DbExecutor, id: string) {
  const rows = await db.select({ ...publicUserColumns, sessionGeneration: users.sessionGeneration }).from(users).where(eq(users.id, id));
  return rows[0] ?? null;
}

/** Inserts a user and returns its public fields and session generation; null when the e-mail is already taken. */
export async function insertUser(db: DbExecutor, user: { email: string; name: string; passwordHash: string; isAdmin?: boolean }) {
  const rows = await db
    .insert(users)
    .values(user)
    .onConflictDoNothing({ target: users.email })
    .returning({ ...publicUserColumns, sessionGeneration: users.sessionGeneration });
  return rows[0] ?? null;
}

/** Raises the user's session generation by one in a single statement (so concurrent sign-outs both count). */
export async function incrementSessionGeneration(db: DbExecutor, id: string): Promise<void> {
  await db
    .update(users)
    .set({ sessionGeneration: sql`${users.sessionGeneration} + 1` })
    .where(eq(users.id, id));
}

/** Inserts a shop and returns it. */
export async function insertShop(db: DbExecutor, name: string) {
  const rows = await db.insert(shops).values({ name }).returning({ id: shops.id, name: shops.name });
  return rows[0];
}

/** Adds `userId` to `shopId` with `role`. */
export async function insertMembership(db: DbExecutor, userId: string, shopId: string, role: Role): Promise<void> {
  await db.insert(memberships).values({ userId, shopId, role });
}

/**
 * Returns the user's memberships with shop names, ordered by shop name; `canSeePrintSets` is true for owners
 * and editors, and for viewers the owner granted print sets to.
 */
export function selectMembershipsOfUser(db: DbExecutor, userId: string) {
  return db
    .select({
      shopId: memberships.shopId,
      shopName: shops.name,
      role: memberships.role,
      canSeePrintSets: sql<boolean>`(${memberships.role} <> 'viewer' OR ${memberships.canSeePrintSets})`,
    })
    .from(memberships)
    .innerJoin(shops, eq(shops.id, memberships.shopId))
    .where(eq(memberships.userId, userId))
    .orderBy(shops.name, shops.id);
}

/** Returns the user's role in the shop, or null when not a member. */
export async function selectMembershipRole(db: DbExecutor, userId: string, shopId: string): Promise<Role | null> {
  const rows = await db
    .select({ role: memberships.role })
    .from(memberships)
    .where(and(eq(memberships.userId, userId), eq(memberships.shopId, shopId)));
  return rows[0]?.role ?? null;
}

/** Returns whether a shop with this id exists. */
export async function shopExists(db: DbExecutor, shopId: string): Promise<boolean> {
  const rows = await db.select({ id: shops.id }).from(shops).where(eq(shops.id, shopId));
  return rows.length > 0;
}
