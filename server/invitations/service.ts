/**
 * Invitation rules. An owner invites an e-mail address into the shop as crew (editor) or client (viewer); the
 * mail carries a single-use link that works for 7 days. Only the token's hash is stored, so a lost mail cannot
 * be re-sent as is: "resend" makes a new token (the old link stops working) and a new expiry. A failed send
 * keeps the invitation; the answer says the mail did not go so the owner can resend. Accepting needs the
 * signed-in e-mail to be the invited one, so a forwarded link does not let someone else in.
 */
import type { Db } from '../../db/client';
import { roleAtLeast } from '../auth/access';
import type { Role } from '../../db/validation';
import type { InvitationCreateBody } from '../../db/validation-crew';
import { insertAuditEntry } from '../audit/queries';
import { AppError, notFound } from '../errors';
import type { SessionUser } from '../http/define-route';
import { hashLinkToken, newLinkToken } from '../mail/link-token';
import type { Mailer } from '../mail/send-mail';
import { invitationMail } from '../mail/templates/invitation-mail';
import { selectShop } from '../shops/queries';
import {
  accountExists,
  insertInvitation,
  markInvitationAccepted,
  renewInvitationToken,
  revokeInvitation,
  revokeOpenInvitationsFor,
  selectInvitation,
  selectInvitationByTokenHash,
  selectOpenInvitations,
  selectRoleByEmail,
  upsertMembershipAtLeast,
} from './queries';

/** How long an invitation link works: 7 days (common practice for team invitations). */
export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000;

export type InvitationStatus = 'pending' | 'expired' | 'accepted' | 'revoked';

/** An invitation as its shop's owners see it. */
export interface InvitationView {
  id: string;
  email: string;
  role: Role;
  status: InvitationStatus;
  invitedBy: { id: string; name: string } | null;
  createdAt: string;
  expiresAt: string;
}

/** Whether the invitation mail went out; `message` says why not when it did not. */
export interface MailOutcome {
  sent: boolean;
  message?: string;
}

export interface InvitationDeps {
  db: Db;
  mailer: Mailer;
  /** Origin for the accept link (server/mail/public-url.ts). */
  baseUrl: string;
}

interface InvitationLike {
  expiresAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
}

function statusOf(row: InvitationLike, now = Date.now()): InvitationStatus {
  if (row.acceptedAt) return 'accepted';
  if (row.revokedAt) return 'revoked';
  return row.expiresAt.getTime() <= now ? 'expired' : 'pending';
}

function viewOf(row: InvitationLike & { id: string; email: string; role: Role; createdAt: Date; invitedById: string | null; invitedByName: string | null }): InvitationView {
  return {
    id: row.id,
    email: row.email,
    role: row.role,
    status: statusOf(row),
    invitedBy: row.invitedById && row.invitedByName !== null ? { id: row.invitedById, name: row.invitedByName } : null,
    createdAt: row.createdAt.toISOString(),
    expiresAt: row.expiresAt.toISOString(),
  };
}

/** Returns the accept-page URL for a token. */
export function acceptUrl(baseUrl: string, token: string): string {
  return `${baseUrl}/invite/${token}`;
}

async function mailInvitation(deps: InvitationDeps, input: { invitationId: string; shopName: string; email: string; role: Role; inviterName: string; token: string; expiresAt: Date }): Promise<MailOutcome> {
  const content = invitationMail({ shopName: input.shopName, role: input.role, invitedByName: input.inviterName, acceptUrl: acceptUrl(deps.baseUrl, input.token), expiresAt: input.expiresAt });
  try {
    await deps.mailer.send({ kind: 'invitation', to: input.email, ...content, detail: { invitationId: input.invitationId } });
    return { sent: true };
  } catch (err) {
    return { sent: false, message: `The invitation is saved but the e-mail did not go out (${(err as Error).message}); use Resend to try again` };
  }
}

/** Returns the shop's open invitations (pending and expired), newest first. */
export async function listInvitations(db: Db, shopId: string): Promise<InvitationView[]> {
  return (await selectOpenInvitations(db, shopId)).map(viewOf);
}

/**
 * Invites `input.email` at `input.role`, replacing any open invitation of the same address, and mails the link.
 * Throws 409 ALREADY_MEMBER when the address already belongs to a member of the shop.
 */
export async function createInvitation(deps: InvitationDeps, user: SessionUser, shopId: string, input: InvitationCreateBody): Promise<{ invitation: InvitationView; mail: MailOutcome }> {
  const { db } = deps;
  const shop = await selectShop(db, shopId);
  if (!shop) throw notFound('Shop');
  const { token, tokenHash } = newLinkToken();
  const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_MS);
  const id = await db.transaction(async (tx) => {
    const existing = await selectRoleByEmail(tx, shopId, input.email);
    if (existing) {
      throw new AppError('ALREADY_MEMBER', 409, `${input.email} is already a member of this shop (${existing}); change their role in the members list instead`, {
        email: 'This person is already a member of this shop',
      });
    }
    await revokeOpenInvitationsFor(tx, shopId, input.email);
    const newId = await insertInvitation(tx, { shopId, email: input.email, role: input.role, tokenHash, invitedBy: user.id, expiresAt });
    await insertAuditEntry(tx, { shopId, userId: user.id, action: 'invitation.create', target: `invitation:${newId}`, detail: { email: input.email, role: input.role } });
    return newId;
  });
  const mail = await mailInvitation(deps, { invitationId: id, shopName: shop.name, email: input.email, role: input.role, inviterName: user.name, token, expiresAt });
  const row = await selectInvitation(db, shopId, id);
  if (!row) throw notFound('Invitation');
  return { invitation: viewOf(row), mail };
}

/** Revokes an open invitation (its link stops working). Throws 404 when it is not this shop's, 409 when already accepted. */
export async function revokeShopInvitation(db: Db, user: SessionUser, shopId: string, id: string): Promise<void> {
  const row = await selectInvitation(db, shopId, id);
  if (!row) throw notFound('Invitation');
  if (row.acceptedAt) throw new AppError('INVITATION_USED', 409, `The invitation to ${row.email} was already accepted; remove the member instead`);
  if (row.revokedAt) return;
  await revokeInvitation(db, id);
  await insertAuditEntry(db, { shopId, userId: user.id, action: 'invitation.revoke', target: `invitation:${id}`, detail: { email: row.email } });
}

/**
 * Mails an open invitation again with a new token and a fresh 7-day expiry (the earlier link stops working).
 * Throws 404 when it is not this shop's, 409 when it was accepted or revoked.
 */
export async function resendInvitation(deps: InvitationDeps, user: SessionUser, shopId: string, id: string): Promise<{ invitation: InvitationView; mail: MailOutcome }> {
  const { db } = deps;
  const row = await selectInvitation(db, shopId, id);
  if (!row) throw notFound('Invitation');
  const status = statusOf(row);
  if (status === 'accepted' || status === 'revoked') {
    throw new AppError(`INVITATION_${status.toUpperCase()}`, 409, `The invitation to ${row.email} was ${status}; it cannot be sent again (invite the address anew)`);
  }
  const shop = await selectShop(db, shopId);
  if (!shop) throw notFound('Shop');
  const { token, tokenHash } = newLinkToken();
  const expiresAt = new Date(Date.now() + INVITATION_LIFETIME_MS);
  await renewInvitationToken(db, id, tokenHash, expiresAt);
  const mail = await mailInvitation(deps, { invitationId: id, shopName: shop.name, email: row.email, role: row.role, inviterName: user.name, token, expiresAt });
  const renewed = await selectInvitation(db, shopId, id);
  if (!renewed) throw notFound('Invitation');
  return { invitation: viewOf(renewed), mail };
}

/** What the invite page shows to whoever holds the link. */
export interface InvitationPreview {
  shopName: string;
  role: Role;
  email: string;
  invitedByName: string | null;
  expiresAt: string;
  status: InvitationStatus;
  /** Whether an account with the invited address exists (the page then offers sign-in rather than sign-up). */
  hasAccount: boolean;
}

function unknownLink(): AppError {
  return new AppError('INVITATION_NOT_FOUND', 404, 'This invitation link is not valid (it may have been replaced by a newer one); ask the shop owner to send it again');
}

/** Returns the preview for a link token; throws 404 INVITATION_NOT_FOUND for an unknown token. */
export async function previewInvitation(db: Db, token: string): Promise<InvitationPreview> {
  const row = await selectInvitationByTokenHash(db, hashLinkToken(token));
  if (!row) throw unknownLink();
  return {
    shopName: row.shopName,
    role: row.role,
    email: row.email,
    invitedByName: row.invitedByName,
    expiresAt: row.expiresAt.toISOString(),
    status: statusOf(row),
    hasAccount: await accountExists(db, row.email),
  };
}

/**
 * Accepts the invitation for the signed-in `user` and returns the shop and the role they now hold there. The
 * row is locked, so a link used twice at once is accepted once. Throws 404 for an unknown token, 410 for an
 * expired, used or revoked one, 403 EMAIL_MISMATCH when signed in with another address. A member invited at a
 * higher role is raised to it; a lower invited role never lowers them.
 */
export async function acceptInvitation(db: Db, user: SessionUser, token: string): Promise<{ shopId: string; shopName: string; role: Role }> {
  return db.transaction(async (tx) => {
    const row = await selectInvitationByTokenHash(tx, hashLinkToken(token), true);
    if (!row) throw unknownLink();
    const status = statusOf(row);
    if (status === 'accepted') throw new AppError('INVITATION_USED', 410, 'This invitation was already accepted; each link works once. Sign in to reach the shop, or ask the owner for a new invitation');
    if (status === 'revoked') throw new AppError('INVITATION_REVOKED', 410, 'The shop owner withdrew this invitation; ask them for a new one');
    if (status === 'expired') throw new AppError('INVITATION_EXPIRED', 410, `This invitation expired on ${row.expiresAt.toUTCString()}; ask the shop owner to send it again`);
    if (user.email !== row.email) {
      throw new AppError('EMAIL_MISMATCH', 403, `This invitation is for ${row.email}, but you are signed in as ${user.email}; sign out and sign in or sign up with ${row.email}`);
    }
    const current = await selectRoleByEmail(tx, row.shopId, row.email);
    const role = current && roleAtLeast(current, row.role) ? current : row.role;
    if (role !== current) await upsertMembershipAtLeast(tx, user.id, row.shopId, role, current);
    await markInvitationAccepted(tx, row.id, user.id);
    await insertAuditEntry(tx, { shopId: row.shopId, userId: user.id, action: 'invitation.accept', target: `invitation:${row.id}`, detail: { email: row.email, role } });
    return { shopId: row.shopId, shopName: row.shopName, role };
  });
}
