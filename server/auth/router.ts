/** HTTP routes for signing up, in and out, and for the signed-in person's profile. */
import type { Request, Response } from 'express';
import type { Db } from '../../db/client';
import { signInBody, signUpBody } from '../../db/validation';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { loadProfile, signIn, signOutEverywhere, signUp } from './service';
import { signInLimiter, type SignInLimitOptions } from './sign-in-limit';
import { signUpLimiter, type SignUpLimitOptions } from './sign-up-limit';
import { SESSION_COOKIE, sessionCookieOptions, signSessionToken, type SessionClaims } from './session';

export interface AuthRouteDeps {
  db: Db;
  sessionKey: Uint8Array;
  cookieSecure: (req: Request) => boolean;
  signInLimit: SignInLimitOptions;
  /** Null leaves sign-up unlimited (only for tests about something else that share one client address). */
  signUpLimit: SignUpLimitOptions | null;
}

async function startSession(deps: AuthRouteDeps, req: Request, res: Response, claims: SessionClaims): Promise<void> {
  res.cookie(SESSION_COOKIE, await signSessionToken(deps.sessionKey, claims), sessionCookieOptions(deps.cookieSecure(req)));
}

/** Returns the sign-up, sign-in, sign-out and profile routes. */
export function authRoutes(deps: AuthRouteDeps): MountableRoute[] {
  const { db } = deps;
  return [
    defineRoute({
      method: 'POST',
      path: '/api/auth/signup',
      access: 'public',
      body: signUpBody,
      before: deps.signUpLimit ? [signUpLimiter(db, deps.signUpLimit)] : [],
      handler: async ({ body, req, res }) => {
        const { profile, session } = await signUp(db, body);
        await startSession(deps, req, res, session);
        return { status: 201, json: profile };
      },
    }),
    defineRoute({
      method: 'POST',
      path: '/api/auth/signin',
      access: 'public',
      body: signInBody,
      before: [signInLimiter(db, deps.signInLimit)],
      handler: async ({ body, req, res }) => {
        const { profile, session } = await signIn(db, body);
        await startSession(deps, req, res, session);
        return { status: 200, json: profile };
      },
    }),
    defineRoute({
      method: 'POST',
      path: '/api/auth/signout',
      access: 'signedIn',
      handler: async ({ user, req, res }) => {
        // Ends this person's sessions everywhere, so a copied cookie stops working too, not just this browser's.
        await signOutEverywhere(db, user.id);
        const { maxAge: _unused, ...attributes } = sessionCookieOptions(deps.cookieSecure(req));
        res.clearCookie(SESSION_COOKIE, attributes);
        return { status: 204 };
      },
    }),
    defineRoute({
      method: 'GET',
      path: '/api/me',
      access: 'signedIn',
      handler: async ({ user }) => ({ status: 200, json: await loadProfile(db, user) }),
    }),
  ];
}
