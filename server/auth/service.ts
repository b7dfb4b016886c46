/** Sign-up and sign-in rules: one shop per new person, identical answers for unknown e-mails and wrong passwords. */
import type { Db } from '../../db/client';
import type { SignInBody, SignUpBody } from '../../db/validation';
import { recordAudit } from '../audit/service';
import { AppError } from '../errors';
import type { SessionUser } from '../http/define-route';
import { hashPassword, verifyAgainstDecoy, verifyPassword } from './passwords';
import {
  incrementSessionGeneration,
  insertMembership,
  insertShop,
  insertUser,
  selectMembershipsOfUser,
  selectUserForSession,
  selectUserForSignIn,
} from './queries';
import type { SessionClaims } from './session';

export interface MembershipView {
  shopId: string;
  shopName: string;
  role: 'owner' | 'editor' | 'viewer';
  /** Whether print sets are visible: owners and editors always, viewers when the owner granted it. */
  canSeePrintSets: boolean;
}

export interface Profile {
  user: SessionUser;
  memberships: MembershipView[];
}

/** A successful sign-up or sign-in: the profile to answer with and the claims for the new session token. */
export interface SignedIn {
  profile: Profile;
  session: SessionClaims;
}

/** Why a well-signed token no longer opens a session: the account is gone, or the person signed out since. */
export type SessionLookup = { ok: true; user: SessionUser } | { ok: false; reason: 'account-gone' | 'signed-out' };

/** The one answer for a failed sign-in, whatever the cause (OWASP Authentication Cheat Sheet). */
export function badCredentials(): AppError {
  return new AppError('BAD_CREDENTIALS', 401, 'E-mail or password is wrong');
}

/** Returns the name given to the first shop of a new person. */
export function firstShopName(personName: string): string {
  return `${personName}'s shop`.slice(0, 80);
}

/**
 * Creates the person, their first shop (they own it) and an audit entry in one transaction, and returns the
 * profile and session claims. Throws 409 EMAIL_TAKEN (with fields.email) when the address already has an account.
 */
export async function signUp(db: Db, input: SignUpBody): Promise<SignedIn> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const inserted = await insertUser(tx, { email: input.email, name: input.name, passwordHash });
    if (!inserted) {
      throw new AppError('EMAIL_TAKEN', 409, 'An account with this e-mail already exists', {
        email: 'An account with this e-mail already exists; sign in instead',
      });
    }
    const { sessionGeneration, ...user } = inserted;
    const shop = await insertShop(tx, firstShopName(input.name));
    await insertMembership(tx, user.id, shop.id, 'owner');
    await recordAudit(tx, { shopId: shop.id, userId: user.id, action: 'user.signup', target: `user:${user.id}`, detail: { email: user.email, shopName: shop.name } });
    return {
      profile: { user, memberships: [{ shopId: shop.id, shopName: shop.name, role: 'owner' as const, canSeePrintSets: true }] },
      session: { userId: user.id, generation: sessionGeneration },
    };
  });
}

/** Returns the profile and session claims when the e-mail and password match; otherwise throws 401 BAD_CREDENTIALS. */
export async function signIn(db: Db, input: SignInBody): Promise<SignedIn> {
  const found = await selectUserForSignIn(db, input.email);
  const ok = found ? await verifyPassword(found.passwordHash, input.password) : await verifyAgainstDecoy(input.password);
  if (!found || !ok) throw badCredentials();
  const { passwordHash: _hash, sessionGeneration, ...user } = found;
  return { profile: { user, memberships: await selectMembershipsOfUser(db, user.id) }, session: { userId: user.id, generation: sessionGeneration } };
}

/**
 * Ends every session of the person, on every device: raises their session generation, so each token issued
 * before (this cookie and any copy of it) fails the guard's check. Deliberately all sessions rather than one:
 * the server keeps no list of sessions, and for a small shop's tool "sign out everywhere" is the safe choice.
 */
export function signOutEverywhere(db: Db, userId: string): Promise<void> {
  return incrementSessionGeneration(db, userId);
}

/** Returns the profile of a signed-in person (who they are and the shops they belong to). */
export async function loadProfile(db: Db, user: SessionUser): Promise<Profile> {
  return { user, memberships: await selectMembershipsOfUser(db, user.id) };
}

/**
 * Returns the user for a verified token's claims, or why the session is over: the account no longer exists, or
 * the token's generation is not the person's current one (they signed out since it was issued).
 */
export async function userForSession(db: Db, claims: SessionClaims): Promise<SessionLookup> {
  const found = await selectUserForSession(db, claims.userId);
  if (!found) return { ok: false, reason: 'account-gone' };
  const { sessionGeneration, ...user } = found;
  if (sessionGeneration !== claims.generation) return { ok: false, reason: 'signed-out' };
  return { ok: true, user };
}
