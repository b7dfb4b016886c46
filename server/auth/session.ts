/**
 * The signed-in session: a JWT (RFC 7519) signed with HS256 holding the user id in `sub` and the person's
 * session generation in the private claim `gen`, carried in the httpOnly cookie `ss_session`. API servers keep
 * no session state; the guard compares `gen` with `users.session_generation`, so raising that number (sign-out)
 * ends every token issued before, including copies of the cookie.
 */
import type { CookieOptions } from 'express';
import { errors as joseErrors, jwtVerify, SignJWT } from 'jose';

export const SESSION_COOKIE = 'ss_session';
export const SESSION_TTL_SECONDS = 7 * 24 * 60 * 60;
const ISSUER = 'sheetsmith';
const GENERATION_CLAIM = 'gen';

/** Who a token is for: the user id and their session generation when it was issued. */
export interface SessionClaims {
  userId: string;
  generation: number;
}

/** Returns the HMAC key bytes for `secret` (at least 32 characters, i.e. ≥ 256 bits for HS256 per RFC 7518 §3.2). */
export function sessionKey(secret: string): Uint8Array {
  if (secret.length < 32) throw new Error('the session secret must be at least 32 characters');
  return new TextEncoder().encode(secret);
}

/**
 * Returns a compact JWT for `claims` that expires `SESSION_TTL_SECONDS` after `nowSeconds` (Unix seconds).
 * `claims.generation` must be a non-negative integer (the person's current `users.session_generation`).
 */
export async function signSessionToken(key: Uint8Array, claims: SessionClaims, nowSeconds = Math.floor(Date.now() / 1000)): Promise<string> {
  if (!Number.isSafeInteger(claims.generation) || claims.generation < 0) {
    throw new Error(`session generation must be a non-negative integer, got ${claims.generation}`);
  }
  return new SignJWT({ [GENERATION_CLAIM]: claims.generation })
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(claims.userId)
    .setIssuer(ISSUER)
    .setIssuedAt(nowSeconds)
    .setExpirationTime(nowSeconds + SESSION_TTL_SECONDS)
    .sign(key);
}

export type SessionCheck = ({ ok: true } & SessionClaims) | { ok: false; reason: 'expired' | 'invalid' };

/**
 * Returns the user id and session generation inside `token`, or why the token cannot be used (expired, or bad
 * signature/shape, including a missing or non-integer `gen` claim, as tokens issued before generations had).
 */
export async function verifySessionToken(key: Uint8Array, token: string): Promise<SessionCheck> {
  try {
    const { payload } = await jwtVerify(token, key, { algorithms: ['HS256'], issuer: ISSUER });
    if (typeof payload.sub !== 'string' || payload.sub.length === 0) return { ok: false, reason: 'invalid' };
    const generation = payload[GENERATION_CLAIM];
    if (typeof generation !== 'number' || !Number.isSafeInteger(generation) || generation < 0) return { ok: false, reason: 'invalid' };
    return { ok: true, userId: payload.sub, generation };
  } catch (err) {
    return { ok: false, reason: err instanceof joseErrors.JWTExpired ? 'expired' : 'invalid' };
  }
}

/**
 * Returns the cookie attributes (RFC 6265 §4.1.2): HttpOnly so page scripts cannot read it, SameSite=Lax
 * against cross-site form posts, Secure when served over https, Path=/ and a Max-Age equal to the token life.
 */
export function sessionCookieOptions(secure: boolean): CookieOptions {
  return { httpOnly: true, sameSite: 'lax', secure, path: '/', maxAge: SESSION_TTL_SECONDS * 1000 };
}
