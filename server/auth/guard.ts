/**
 * The access guard every route passes through: reads the session cookie, loads the person, finds their role
 * in the shop the route names, and applies the route's rule (server/auth/access.ts), including the print-set
 * grant a viewer needs on the routes PRINT_SET_GRANT_ROUTES lists.
 */
import type { Request, Response } from 'express';
import type { Db } from '../../db/client';
import type { Role } from '../../db/validation';
import { AppError } from '../errors';
import type { AccessGuard, SessionUser } from '../http/define-route';
import { selectSeesPrintSets } from '../members/queries';
import { decideAccess, needsPrintSetGrant, type AccessRule, type HttpMethod } from './access';
import { selectMembershipRole, shopExists } from './queries';
import { userForSession } from './service';
import { SESSION_COOKIE, sessionCookieOptions, verifySessionToken } from './session';

export interface GuardDeps {
  db: Db;
  sessionKey: Uint8Array;
  /** Whether cookies for this request must carry the Secure attribute. */
  cookieSecure: (req: Request) => boolean;
}

function unauthenticated(message: string): AppError {
  return new AppError('UNAUTHENTICATED', 401, message);
}

/** Returns the signed-in user from the request's cookie, null when there is none; throws 401 for a bad one. */
async function readSession(deps: GuardDeps, req: Request, res: Response): Promise<SessionUser | null> {
  const token: unknown = req.cookies?.[SESSION_COOKIE];
  if (typeof token !== 'string' || token === '') return null;
  const check = await verifySessionToken(deps.sessionKey, token);
  const clear = () => {
    const { maxAge: _unused, ...attributes } = sessionCookieOptions(deps.cookieSecure(req));
    res.clearCookie(SESSION_COOKIE, attributes);
  };
  if (!check.ok) {
    clear();
    throw unauthenticated(check.reason === 'expired' ? 'Your session has expired; sign in again' : 'Your session is not valid; sign in again');
  }
  const found = await userForSession(deps.db, check);
  if (!found.ok) {
    clear();
    throw unauthenticated(
      found.reason === 'account-gone'
        ? 'The account of this session no longer exists; sign in again'
        : 'This session was ended by a sign-out; sign in again',
    );
  }
  return found.user;
}

function forbiddenMessage(rule: AccessRule, shopRole: Role | null): string {
  if (rule === 'admin') return 'Only site admins may do this';
  if (typeof rule === 'object') {
    return shopRole
      ? `Your role in this shop (${shopRole}) does not allow this; it needs ${rule.shopRole}`
      : 'You are not a member of this shop';
  }
  return 'You may not do this';
}

/** Returns the guard used by `mountRoutes`. */
export function createAccessGuard(deps: GuardDeps): AccessGuard {
  return async (req: Request, res: Response, rule: AccessRule, method: HttpMethod, shopId: string | null) => {
    // A public route still learns who is calling (e.g. a signed-in visitor), but a bad cookie must not block it.
    const user = rule === 'public' ? await readSession(deps, req, res).catch(() => null) : await readSession(deps, req, res);
    const shopRole = user && shopId ? await selectMembershipRole(deps.db, user.id, shopId) : null;
    const decision = decideAccess(rule, method, { signedIn: user !== null, isAdmin: user?.isAdmin ?? false, shopRole });
    if (decision === 'unauthenticated') throw unauthenticated('Sign in to continue');
    if (decision === 'forbidden') {
      throw new AppError('FORBIDDEN', 403, forbiddenMessage(rule, shopRole));
    }
    // req.route is the matched route, whose path is the pattern the access table lists.
    const routePath = (req.route as { path?: unknown } | undefined)?.path;
    if (user && shopId && shopRole === 'viewer' && needsPrintSetGrant(method, typeof routePath === 'string' ? routePath : undefined)) {
      if (!(await selectSeesPrintSets(deps.db, user.id, shopId))) {
        throw new AppError('FORBIDDEN', 403, 'The shop owner has not shared print sets with you; ask them to allow it in the members list');
      }
    }
    if (typeof rule === 'object' && shopId) {
      // Only a site admin reaches here without a membership; tell them plainly when the shop does not exist.
      if (!shopRole && !(await shopExists(deps.db, shopId))) throw new AppError('NOT_FOUND', 404, 'Shop was not found');
      return { user: user as SessionUser, shop: { id: shopId, role: shopRole } };
    }
    return { user };
  };
}
