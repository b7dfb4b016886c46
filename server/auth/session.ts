/**
 * The signed-in session: a JWT (RFC 7519) signed with HS256 holding the user id in `sub`, carried in the
 * httpOnly cookie `ss_session`. API servers keep no session state, so any server with the secret can check it.
 */
import type { CookieOptions } from 'express';
import { errors as joseErrors, jwtVerify, SignJWT } from 'jose';

export const SESSION_COOKIE = 'ss_session';
export const SESSION_TTL_SECONDS = 7 * 24 * 60 * 60;
const ISSUER = 'sheetsmith';

/** Returns the HMAC key bytes for `secret` (at least 32 characters, i.e. ≥ 256 bits for HS256 per RFC 7518 §3.2). */
export function sessionKey(secret: string): Uint8Array {
  if (secret.length < 32) throw new Error('the session secret must be at least 32 characters');
  return new TextEncoder().encode(secret);
}

/** Returns a compact JWT for `userId` that expires `SESSION_TTL_SECONDS` after `nowSeconds` (Unix seconds). */
export function signSessionToken(key: Uint8Array, userId: string, nowSeconds = Math.floor(Date.now() / 1000)): Promise<string> {
  return new SignJWT({})
    .setProtectedHeader({ alg: 'HS256' })
    .setSubject(userId)
    .setIssuer(ISSUER)
    .setIssuedAt(nowSeconds)
    .setExpirationTime(nowSeconds + SESSION_TTL_SECONDS)
    .sign(key);
}

export type SessionCheck = { ok: true; userId: string } | { ok: false; reason: 'expired' | 'invalid' };

/** Returns the user id inside `token`, or why the token cannot be used (expired, or bad signature/shape). */
export async function verifySessionToken(key: Uint8Array, token: string): Promise<SessionCheck> {
  try {
    const { payload } = await jwtVerify(token, key, { algorithms: ['HS256'], issuer: ISSUER });
    if (typeof payload.sub !== 'string' || payload.sub.length === 0) return { ok: false, reason: 'invalid' };
    return { ok: true, userId: payload.sub };
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
