/** Session cookie for the fault tests, which run their own app and database rather than tests/server/helpers.ts. */
import { SESSION_COOKIE, sessionKey, signSessionToken } from '../../server/auth/session';

/** Returns a Cookie header value with a valid session for `userId` (generation 0, a new person's default) under `secret`. */
export async function sessionCookieValue(secret: string, userId: string): Promise<string> {
  return `${SESSION_COOKIE}=${await signSessionToken(sessionKey(secret), { userId, generation: 0 })}`;
}
