/** Drizzle queries for invitations to a shop. */
import { and, desc, eq, isNull } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { DbExecutor } from '../../db/client';
import { memberships, shops, users } from '../../db/schema-core';
import { invitations } from '../../db/schema-sharing';
import type { Role } from '../../db/validation';

const inviter = alias(users, 'inviter');

const invitationColumns = {
  id: invitations.id,
  shopId: invitations.shopId,
  email: invitations.email,
  role: invitations.role,
  createdAt: invitations.createdAt,
  expiresAt: invitations.expiresAt,
  acceptedAt: invitations.acceptedAt,
  revokedAt: invitations.revokedAt,
  invitedById: invitations.invitedBy,
  invitedByName: inviter.name,
};

/** Inserts an invitation and returns its id. */
export async function insertInvitation(
  db: DbExecutor,
  row: { shopId: string; email: string; role: Role; tokenHash: string; invitedBy: string; expiresAt: Date },
): Promise<string> {
  const [inserted] = await db.insert(invitations).values(row).returning({ id: invitations.id });
  return inserted.id;
}

/** Returns one invitation of the shop with the inviter's name, or null. */
export async function selectInvitation(db: DbExecutor, shopId: string, id: string) {
  const rows = await db
    .select(invitationColumns)
    .from(invitations)
    .leftJoin(inviter, eq(inviter.id, invitations.invitedBy))
    .where(and(eq(invitations.shopId, shopId), eq(invitations.id, id)));
  return rows[0] ?? null;
}

/** Returns the shop's invitations that were neither accepted nor revoked (pending or expired), newest first. */
export function selectOpenInvitations(db: DbExecutor, shopId: string) {
  return db
    .select(invitationColumns)
    .from(invitations)
    .leftJoin(inviter, eq(inviter.id, invitations.invitedBy))
    .where(and(eq(invitations.shopId, shopId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
    .orderBy(desc(invitations.createdAt));
}

/** Marks every open invitation of `email` to the shop as revoked (a new invitation replaces them). */
export async function revokeOpenInvitationsFor(db: DbExecutor, shopId: string, email: string): Promise<void> {
  await db
    .update(invitations)
    .set({ revokedAt: new Date() })
    .where(and(eq(invitations.shopId, shopId), eq(invitations.email, email), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)));
}

/** Sets revokedAt on one invitation. */
export async function revokeInvitation(db: DbExecutor, id: string): Promise<void> {
  await db.update(invitations).set({ revokedAt: new Date() }).where(eq(invitations.id, id));
}

/** Gives an invitation a new token hash and expiry (resend). */
export async function renewInvitationToken(db: DbExecutor, id: string, tokenHash: string, expiresAt: Date): Promise<void> {
  await db.update(invitations).set({ tokenHash, expiresAt }).where(eq(invitations.id, id));
}

/**
 * Returns the invitation with this token hash, its shop's name and whether an account with the invited address
 * exists, locking the invitation row when `forUpdate` (accepting), or null.
 */
export async function selectInvitationByTokenHash(db: DbExecutor, tokenHash: string, forUpdate = false) {
  const query = db
    .select({ ...invitationColumns, shopName: shops.name })
    .from(invitations)
    .innerJoin(shops, eq(shops.id, invitations.shopId))
    .leftJoin(inviter, eq(inviter.id, invitations.invitedBy))
    .where(eq(invitations.tokenHash, tokenHash));
  const rows = forUpdate ? await query.for('update', { of: invitations }) : await query;
  return rows[0] ?? null;
}

/** Returns whether an account with this (lower-case) e-mail exists. */
export async function accountExists(db: DbExecutor, email: string): Promise<boolean> {
  const rows = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  return rows.length > 0;
}

/** Returns the role of the person with this e-mail in the shop, or null when they are not a member. */
export async function selectRoleByEmail(db: DbExecutor, shopId: string, email: string): Promise<Role | null> {
  const rows = await db
    .select({ role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(and(eq(memberships.shopId, shopId), eq(users.email, email)));
  return rows[0]?.role ?? null;
}

/** Marks the invitation accepted by `userId`. */
export async function markInvitationAccepted(db: DbExecutor, id: string, userId: string): Promise<void> {
  await db.update(invitations).set({ acceptedAt: new Date(), acceptedBy: userId }).where(eq(invitations.id, id));
}

/** Adds the person to the shop at `role`, or raises their role to it when they are a member at a lower one. */
export async function upsertMembershipAtLeast(db: DbExecutor, userId: string, shopId: string, role: Role, current: Role | null): Promise<void> {
  if (current === null) await db.insert(memberships).values({ userId, shopId, role });
  else await db.update(memberships).set({ role }).where(and(eq(memberships.userId, userId), eq(memberships.shopId, shopId)));
}
