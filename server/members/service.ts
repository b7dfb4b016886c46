/**
 * Member rules: everyone in a shop sees who else is in it (e-mail addresses only for owners and site admins,
 * as in GET /api/shops/:shopId); owners change roles, grant print sets to clients, and remove members; a shop
 * always keeps at least one owner.
 */
import type { Db } from '../../db/client';
import type { Role } from '../../db/validation';
import type { MemberUpdateBody } from '../../db/validation-crew';
import { insertAuditEntry } from '../audit/queries';
import { AppError, notFound } from '../errors';
import type { SessionUser, ShopAccess } from '../http/define-route';
import { deleteMembership, lockOwners, selectMember, selectMembers, updateMembership } from './queries';

/** A member as the members list shows them. `canSeePrintSets` is true for owners and editors, and for granted viewers. */
export interface MemberListEntry {
  userId: string;
  name: string;
  role: Role;
  canSeePrintSets: boolean;
  joinedAt: string;
  /** Only for owners and site admins (data minimisation, GDPR Art. 5(1)(c)). */
  email?: string;
}

/** Returns the shop's members, owners first. */
export async function listMembers(db: Db, user: SessionUser, access: ShopAccess): Promise<MemberListEntry[]> {
  const seesEmails = access.role === 'owner' || user.isAdmin;
  const rows = await selectMembers(db, access.id);
  return rows.map((r) => ({
    userId: r.userId,
    name: r.name,
    role: r.role,
    canSeePrintSets: r.canSeePrintSets,
    joinedAt: r.joinedAt.toISOString(),
    ...(seesEmails ? { email: r.email } : {}),
  }));
}

function lastOwner(action: string): AppError {
  return new AppError(
    'LAST_OWNER',
    409,
    `This person is the shop's only owner, so they cannot be ${action}; make another member an owner first`,
  );
}

/**
 * Changes a member's role and/or print-set grant and returns the updated members list entry. Throws 404 when the
 * person is not a member, 409 LAST_OWNER when it would leave the shop without an owner.
 */
export async function changeMember(db: Db, user: SessionUser, shopId: string, userId: string, change: MemberUpdateBody): Promise<MemberListEntry> {
  return db.transaction(async (tx) => {
    const owners = await lockOwners(tx, shopId);
    const member = await selectMember(tx, shopId, userId);
    if (!member) throw notFound('Member');
    if (change.role !== undefined && change.role !== 'owner' && member.role === 'owner' && owners.length === 1) throw lastOwner('demoted');
    await updateMembership(tx, shopId, userId, change);
    await insertAuditEntry(tx, {
      shopId,
      userId: user.id,
      action: 'member.change',
      target: `user:${userId}`,
      detail: { name: member.name, from: { role: member.role, canSeePrintSets: member.canSeePrintSets }, to: change },
    });
    const role = change.role ?? member.role;
    const granted = change.canSeePrintSets ?? member.canSeePrintSets;
    return { userId, name: member.name, email: member.email, role, canSeePrintSets: role !== 'viewer' || granted, joinedAt: member.joinedAt.toISOString() };
  });
}

/** Removes a member from the shop. Throws 404 when not a member, 409 LAST_OWNER for the only owner. */
export async function removeMember(db: Db, user: SessionUser, shopId: string, userId: string): Promise<void> {
  await db.transaction(async (tx) => {
    const owners = await lockOwners(tx, shopId);
    const member = await selectMember(tx, shopId, userId);
    if (!member) throw notFound('Member');
    if (member.role === 'owner' && owners.length === 1) throw lastOwner('removed');
    await deleteMembership(tx, shopId, userId);
    await insertAuditEntry(tx, { shopId, userId: user.id, action: 'member.remove', target: `user:${userId}`, detail: { name: member.name, role: member.role } });
  });
}
