/** Sign-up and sign-in rules: one shop per new person, identical answers for unknown e-mails and wrong passwords. */
import type { Db } from '../../db/client';
import type { SignInBody, SignUpBody } from '../../db/validation';
import { recordAudit } from '../audit/service';
import { AppError } from '../errors';
import type { SessionUser } from '../http/define-route';
import { hashPassword, verifyAgainstDecoy, verifyPassword } from './passwords';
import { insertMembership, insertShop, insertUser, selectMembershipsOfUser, selectUserById, selectUserForSignIn } from './queries';

export interface MembershipView {
  shopId: string;
  shopName: string;
  role: 'owner' | 'editor' | 'viewer';
}

export interface Profile {
  user: SessionUser;
  memberships: MembershipView[];
}

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
 * profile. Throws 409 EMAIL_TAKEN (with fields.email) when the address already has an account.
 */
export async function signUp(db: Db, input: SignUpBody): Promise<Profile> {
  const passwordHash = await hashPassword(input.password);
  return db.transaction(async (tx) => {
    const user = await insertUser(tx, { email: input.email, name: input.name, passwordHash });
    if (!user) {
      throw new AppError('EMAIL_TAKEN', 409, 'An account with this e-mail already exists', {
        email: 'An account with this e-mail already exists; sign in instead',
      });
    }
    const shop = await insertShop(tx, firstShopName(input.name));
    await insertMembership(tx, user.id, shop.id, 'owner');
    await recordAudit(tx, { shopId: shop.id, userId: user.id, action: 'user.signup', target: `user:${user.id}`, detail: { email: user.email, shopName: shop.name } });
    return { user, memberships: [{ shopId: shop.id, shopName: shop.name, role: 'owner' as const }] };
  });
}

/** Returns the profile when the e-mail and password match; otherwise throws 401 BAD_CREDENTIALS. */
export async function signIn(db: Db, input: SignInBody): Promise<Profile> {
  const found = await selectUserForSignIn(db, input.email);
  const ok = found ? await verifyPassword(found.passwordHash, input.password) : await verifyAgainstDecoy(input.password);
  if (!found || !ok) throw badCredentials();
  const { passwordHash: _hash, ...user } = found;
  return { user, memberships: await selectMembershipsOfUser(db, user.id) };
}

/** Returns the profile of a signed-in person (who they are and the shops they belong to). */
export async function loadProfile(db: Db, user: SessionUser): Promise<Profile> {
  return { user, memberships: await selectMembershipsOfUser(db, user.id) };
}

/** Returns the user for a session's user id, or null when the account no longer exists. */
export function userForSession(db: Db, userId: string): Promise<SessionUser | null> {
  return selectUserById(db, userId);
}
