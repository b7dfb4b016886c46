import { randomBytes } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { SignJWT } from 'jose';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { users } from '../../db/schema';
import { SESSION_COOKIE, SESSION_TTL_SECONDS, signSessionToken } from '../../server/auth/session';
import { insertPerson, makeTestApp, sessionCookie, setCookies, uniqueEmail, FIXTURE_PASSWORD, type TestContext } from './helpers';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await makeTestApp();
});
afterAll(async () => {
  await ctx.close();
});

function sessionCookieLine(headers: Record<string, unknown>): string {
  const line = setCookies(headers).find((c) => c.startsWith(`${SESSION_COOKIE}=`));
  if (!line) throw new Error('no session cookie was set');
  return line;
}

describe('sign-up', () => {
  it('creates the person and a shop they own, and starts a session', async () => {
    const email = uniqueEmail('signup');
    const res = await request(ctx.app).post('/api/auth/signup').send({ name: 'Wren Calloway', email, password: 'long-enough-pw' });
    expect(res.status).toBe(201);
    expect(res.body.user).toMatchObject({ email, name: 'Wren Calloway', isAdmin: false });
    expect(res.body.memberships).toHaveLength(1);
    expect(res.body.memberships[0]).toMatchObject({ role: 'owner', shopName: "Wren Calloway's shop" });

    const me = await request(ctx.app).get('/api/me').set('Cookie', sessionCookieLine(res.headers).split(';')[0]);
    expect(me.status).toBe(200);
    expect(me.body.user.id).toBe(res.body.user.id);
    expect(me.body.memberships).toEqual(res.body.memberships);
  });

  it('sets the session cookie with the attributes of RFC 6265 §4.1.2: HttpOnly, SameSite=Lax, Path=/, Max-Age of 7 days', async () => {
    const res = await request(ctx.app).post('/api/auth/signup').send({ name: 'Pim', email: uniqueEmail('cookie'), password: 'long-enough-pw' });
    const line = sessionCookieLine(res.headers);
    expect(line).toMatch(/; HttpOnly/i);
    expect(line).toMatch(/; SameSite=Lax/i);
    expect(line).toMatch(/; Path=\//i);
    // 7 days × 86 400 s = 604 800 s.
    expect(line).toMatch(/; Max-Age=604800/i);
    // Plain http (no TLS, COOKIE_SECURE=auto): a Secure cookie would never come back (RFC 6265 §5.4).
    expect(line).not.toMatch(/; Secure/i);
  });

  it('marks the cookie Secure when COOKIE_SECURE=true (RFC 6265 §4.1.2.5)', async () => {
    const secure = await makeTestApp({ env: { COOKIE_SECURE: 'true' } });
    try {
      const res = await request(secure.app).post('/api/auth/signup').send({ name: 'Sol', email: uniqueEmail('secure'), password: 'long-enough-pw' });
      expect(sessionCookieLine(res.headers)).toMatch(/; Secure/i);
    } finally {
      await secure.close();
    }
  });

  it('stores an argon2id hash with the OWASP Password Storage Cheat Sheet parameters (m=19456 KiB, t=2, p=1), never the password', async () => {
    const email = uniqueEmail('hash');
    await request(ctx.app).post('/api/auth/signup').send({ name: 'Hash Check', email, password: 'long-enough-pw' }).expect(201);
    const [row] = await ctx.db.select({ hash: users.passwordHash }).from(users).where(eq(users.email, email));
    // PHC string format for argon2 (RFC 9106 reference encoding): $argon2id$v=19$m=...,t=...,p=...$salt$hash
    expect(row.hash).toMatch(/^\$argon2id\$v=19\$m=19456,t=2,p=1\$[A-Za-z0-9+/]+\$[A-Za-z0-9+/]+$/);
    expect(row.hash).not.toContain('long-enough-pw');
  });

  it('stores e-mail addresses lower-case, so a differently cased address is the same account', async () => {
    const email = uniqueEmail('case');
    await request(ctx.app).post('/api/auth/signup').send({ name: 'Case', email: email.toUpperCase(), password: 'long-enough-pw' }).expect(201);
    const again = await request(ctx.app).post('/api/auth/signup').send({ name: 'Case', email, password: 'long-enough-pw' });
    expect(again.status).toBe(409);
    const signIn = await request(ctx.app).post('/api/auth/signin').send({ email: `  ${email.toUpperCase()} `, password: 'long-enough-pw' });
    expect(signIn.status).toBe(200);
  });

  it('answers 409 EMAIL_TAKEN with a field error for an address already in use', async () => {
    const email = uniqueEmail('dup');
    await request(ctx.app).post('/api/auth/signup').send({ name: 'First', email, password: 'long-enough-pw' }).expect(201);
    const res = await request(ctx.app).post('/api/auth/signup').send({ name: 'Second', email, password: 'another-long-pw' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('EMAIL_TAKEN');
    expect(res.body.error.fields.email).toMatch(/already exists/);
  });

  it('answers 400 VALIDATION naming every bad field (body schema from db/validation.ts)', async () => {
    const res = await request(ctx.app).post('/api/auth/signup').send({ name: '   ', email: 'not-an-address', password: 'short' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('VALIDATION');
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['email', 'name', 'password']);
    expect(res.body.error.fields.password).toBe('Use at least 10 characters');
    expect(res.body.error.message).toMatch(/name/);
  });

  it('answers 400 VALIDATION for missing fields and 400 BAD_JSON for a body that is not JSON', async () => {
    const missing = await request(ctx.app).post('/api/auth/signup').send({});
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields).sort()).toEqual(['email', 'name', 'password']);

    const broken = await request(ctx.app).post('/api/auth/signup').set('Content-Type', 'application/json').send('{"name": "x",');
    expect(broken.status).toBe(400);
    expect(broken.body.error.code).toBe('BAD_JSON');
    // V8's JSON.parse names the place it stopped (the body is 13 characters long and ends early).
    expect(broken.body.error.message).toMatch(/^The request body is not valid JSON: .*(position 13|end of JSON input)/);
  });
});

describe('sign-in and sign-out', () => {
  it('signs in with the right password and returns the memberships', async () => {
    const person = await insertPerson(ctx.db, 'signin');
    const res = await request(ctx.app).post('/api/auth/signin').send({ email: person.email, password: FIXTURE_PASSWORD });
    expect(res.status).toBe(200);
    expect(res.body.user.id).toBe(person.id);
    expect(res.body.memberships).toEqual([]);
    expect(sessionCookieLine(res.headers)).toMatch(/HttpOnly/i);
  });

  it('answers a wrong password and an unknown e-mail identically (OWASP Authentication Cheat Sheet: generic error messages)', async () => {
    const person = await insertPerson(ctx.db, 'alike');
    const wrong = await request(ctx.app).post('/api/auth/signin').send({ email: person.email, password: 'not-the-password' });
    const unknown = await request(ctx.app).post('/api/auth/signin').send({ email: uniqueEmail('nobody'), password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(wrong.status);
    expect(unknown.body).toEqual(wrong.body);
    expect(wrong.body).toEqual({ error: { code: 'BAD_CREDENTIALS', message: 'E-mail or password is wrong' } });
    expect(setCookies(wrong.headers).some((c) => c.startsWith(SESSION_COOKIE))).toBe(false);
  });

  it('spends comparable time on an unknown e-mail as on a wrong password (OWASP: avoid user enumeration by timing; bound is common practice)', async () => {
    const people = await Promise.all([1, 2, 3, 4].map(() => insertPerson(ctx.db, 'timing')));
    const time = async (email: string) => {
      const t0 = performance.now();
      await request(ctx.app).post('/api/auth/signin').send({ email, password: 'not-the-password' });
      return performance.now() - t0;
    };
    await time(uniqueEmail('warm'));
    // The fastest of several tries filters out pauses from other work on a shared machine.
    const fastest = async (emailFor: () => string): Promise<number> => {
      let best = Infinity;
      for (let i = 0; i < 4; i++) best = Math.min(best, await time(emailFor()));
      return best;
    };
    // A different known account per try keeps every try under the sign-in limit (3 failures per address here).
    const known = await fastest(() => people.shift()!.email);
    const unknown = await fastest(() => uniqueEmail('ghost'));
    // Without the decoy hash an unknown address answers in ~1 ms against ~20+ ms for an argon2 check.
    expect(unknown).toBeGreaterThan(known * 0.4);
  });

  it('signs out: 204 and the cookie is cleared with an expiry in the past (RFC 6265 §3.1)', async () => {
    const person = await insertPerson(ctx.db, 'signout');
    const res = await request(ctx.app).post('/api/auth/signout').set('Cookie', await sessionCookie(ctx.key, person.id));
    expect(res.status).toBe(204);
    const line = sessionCookieLine(res.headers);
    const expires = /Expires=([^;]+)/i.exec(line)?.[1];
    expect(expires).toBeDefined();
    expect(new Date(expires!).getTime()).toBeLessThan(Date.now());
    expect(line).toMatch(/HttpOnly/i);
  });

  it('answers 401 UNAUTHENTICATED to /api/me without a cookie', async () => {
    const res = await request(ctx.app).get('/api/me');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('UNAUTHENTICATED');
  });
});

describe('session tokens', () => {
  it('rejects an expired token with 401 (RFC 7519 §4.1.4: "exp" must be after the current time) and clears the cookie', async () => {
    const person = await insertPerson(ctx.db, 'expired');
    const issued = Math.floor(Date.now() / 1000) - SESSION_TTL_SECONDS - 60;
    const token = await signSessionToken(ctx.key, { userId: person.id, generation: 0 }, issued);
    const res = await request(ctx.app).get('/api/me').set('Cookie', `${SESSION_COOKIE}=${token}`);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('UNAUTHENTICATED');
    expect(res.body.error.message).toMatch(/expired/);
    expect(sessionCookieLine(res.headers)).toMatch(/Expires=Thu, 01 Jan 1970/);
  });

  it('accepts the same token shape while it is still valid', async () => {
    const person = await insertPerson(ctx.db, 'fresh');
    const token = await signSessionToken(ctx.key, { userId: person.id, generation: 0 }, Math.floor(Date.now() / 1000) - SESSION_TTL_SECONDS + 120);
    const res = await request(ctx.app).get('/api/me').set('Cookie', `${SESSION_COOKIE}=${token}`);
    expect(res.status).toBe(200);
  });

  it('rejects a tampered token: a changed payload no longer matches the HS256 signature (RFC 7515 §5.2)', async () => {
    const victim = await insertPerson(ctx.db, 'victim');
    const attacker = await insertPerson(ctx.db, 'attacker');
    const [header, , signature] = (await signSessionToken(ctx.key, { userId: attacker.id, generation: 0 })).split('.');
    const forgedPayload = Buffer.from(JSON.stringify({ sub: victim.id, iss: 'sheetsmith', exp: Math.floor(Date.now() / 1000) + 3600 })).toString('base64url');
    const res = await request(ctx.app).get('/api/me').set('Cookie', `${SESSION_COOKIE}=${header}.${forgedPayload}.${signature}`);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('UNAUTHENTICATED');
  });

  it('rejects a token with a flipped signature character, one signed with another key, and an unsigned ("alg": "none") token', async () => {
    const person = await insertPerson(ctx.db, 'forged');
    const good = await signSessionToken(ctx.key, { userId: person.id, generation: 0 });
    const last = good.at(-2) === 'A' ? 'B' : 'A';
    const flipped = `${good.slice(0, -2)}${last}${good.at(-1)}`;
    const otherKey = await signSessionToken(new TextEncoder().encode('a-different-secret-of-32-characters!!'), { userId: person.id, generation: 0 });
    const now = Math.floor(Date.now() / 1000);
    const unsigned = [
      Buffer.from(JSON.stringify({ alg: 'none' })).toString('base64url'),
      Buffer.from(JSON.stringify({ sub: person.id, iss: 'sheetsmith', exp: now + 3600 })).toString('base64url'),
      '',
    ].join('.');
    for (const token of [flipped, otherKey, unsigned, 'not-a-jwt']) {
      const res = await request(ctx.app).get('/api/me').set('Cookie', `${SESSION_COOKIE}=${token}`);
      expect(res.status, token).toBe(401);
    }
  });

  it('rejects a valid token whose "sub" is missing or names no account', async () => {
    const noSub = await new SignJWT({}).setProtectedHeader({ alg: 'HS256' }).setIssuer('sheetsmith').setExpirationTime('1h').sign(ctx.key);
    const res1 = await request(ctx.app).get('/api/me').set('Cookie', `${SESSION_COOKIE}=${noSub}`);
    expect(res1.status).toBe(401);
    const res2 = await request(ctx.app).get('/api/me').set('Cookie', await sessionCookie(ctx.key, '5b0f7a9e-3c1d-4e2f-8a6b-9c0d1e2f3a4b'));
    expect(res2.status).toBe(401);
    expect(res2.body.error.message).toMatch(/no longer exists/);
  });

  it('lets a public route through even with a broken cookie', async () => {
    const res = await request(ctx.app).get('/api/health').set('Cookie', `${SESSION_COOKIE}=garbage`);
    expect(res.status).toBe(200);
  });
});

describe('sign-out ends the session on the server', () => {
  // OWASP ASVS 4.0 V3.3.1 and the OWASP Session Management Cheat Sheet ("Logout"): logging out must invalidate
  // the session token on the server, not only remove it from the browser (requirement numbers from memory).
  const cookieOf = (headers: Record<string, unknown>) => sessionCookieLine(headers).split(';')[0];
  const generationOf = async (id: string) => (await ctx.db.select({ g: users.sessionGeneration }).from(users).where(eq(users.id, id)))[0].g;

  it('signs out every session of the person: two sign-ins, sign out with one, both cookies then get 401 and a cleared cookie', async () => {
    const person = await insertPerson(ctx.db, 'two-devices');
    const first = await request(ctx.app).post('/api/auth/signin').send({ email: person.email, password: FIXTURE_PASSWORD }).expect(200);
    const second = await request(ctx.app).post('/api/auth/signin').send({ email: person.email, password: FIXTURE_PASSWORD }).expect(200);
    const [laptop, phone] = [cookieOf(first.headers), cookieOf(second.headers)];
    await request(ctx.app).get('/api/me').set('Cookie', laptop).expect(200);
    await request(ctx.app).get('/api/me').set('Cookie', phone).expect(200);

    await request(ctx.app).post('/api/auth/signout').set('Cookie', laptop).expect(204);
    expect(await generationOf(person.id)).toBe(1);

    for (const cookie of [laptop, phone]) {
      const res = await request(ctx.app).get('/api/me').set('Cookie', cookie);
      expect(res.status).toBe(401);
      expect(res.body.error).toEqual({ code: 'UNAUTHENTICATED', message: 'This session was ended by a sign-out; sign in again' });
      // RFC 6265 §3.1: a cookie is removed by setting it again with an expiry in the past.
      expect(sessionCookieLine(res.headers)).toMatch(/Expires=Thu, 01 Jan 1970/);
    }
    // Signing out again with the stale cookie is refused and does not raise the generation a second time.
    expect((await request(ctx.app).post('/api/auth/signout').set('Cookie', phone)).status).toBe(401);
    expect(await generationOf(person.id)).toBe(1);
  });

  it('lets the person sign in again afterwards, and the new cookie works', async () => {
    const person = await insertPerson(ctx.db, 'again');
    const before = cookieOf((await request(ctx.app).post('/api/auth/signin').send({ email: person.email, password: FIXTURE_PASSWORD }).expect(200)).headers);
    await request(ctx.app).post('/api/auth/signout').set('Cookie', before).expect(204);
    const after = cookieOf((await request(ctx.app).post('/api/auth/signin').send({ email: person.email, password: FIXTURE_PASSWORD }).expect(200)).headers);
    const me = await request(ctx.app).get('/api/me').set('Cookie', after);
    expect(me.status).toBe(200);
    expect(me.body.user.id).toBe(person.id);
    await request(ctx.app).get('/api/me').set('Cookie', before).expect(401);
  });

  it('leaves other people signed in', async () => {
    const leaving = await insertPerson(ctx.db, 'leaving');
    const staying = await insertPerson(ctx.db, 'staying');
    await request(ctx.app).post('/api/auth/signout').set('Cookie', await sessionCookie(ctx.key, leaving.id)).expect(204);
    await request(ctx.app).get('/api/me').set('Cookie', await sessionCookie(ctx.key, staying.id)).expect(200);
    expect(await generationOf(staying.id)).toBe(0);
  });

  it('rejects a token whose generation claim was edited: the HS256 signature no longer matches (RFC 7515 §5.2)', async () => {
    const person = await insertPerson(ctx.db, 'edited-gen');
    const old = await signSessionToken(ctx.key, { userId: person.id, generation: 0 });
    await request(ctx.app).post('/api/auth/signout').set('Cookie', `${SESSION_COOKIE}=${old}`).expect(204);
    // The holder of a signed-out cookie raises "gen" to the current generation, keeping the signature.
    const [header, payload, signature] = old.split('.');
    const claims = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8')) as Record<string, unknown>;
    expect(claims.gen).toBe(0);
    const edited = Buffer.from(JSON.stringify({ ...claims, gen: 1 })).toString('base64url');
    const res = await request(ctx.app).get('/api/me').set('Cookie', `${SESSION_COOKIE}=${header}.${edited}.${signature}`);
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('UNAUTHENTICATED');
    expect(res.body.error.message).toMatch(/not valid/);
  });

  it('rejects a well-signed token whose generation is not the current one, or is missing or malformed (tokens from before generations)', async () => {
    const person = await insertPerson(ctx.db, 'wrong-gen');
    const ahead = await signSessionToken(ctx.key, { userId: person.id, generation: 5 });
    const resAhead = await request(ctx.app).get('/api/me').set('Cookie', `${SESSION_COOKIE}=${ahead}`);
    expect(resAhead.status).toBe(401);
    expect(resAhead.body.error.message).toMatch(/sign-out/);

    const sign = (extra: Record<string, unknown>) =>
      new SignJWT(extra).setProtectedHeader({ alg: 'HS256' }).setSubject(person.id).setIssuer('sheetsmith').setExpirationTime('1h').sign(ctx.key);
    for (const extra of [{}, { gen: '0' }, { gen: -1 }, { gen: 0.5 }, { gen: null }]) {
      const res = await request(ctx.app).get('/api/me').set('Cookie', `${SESSION_COOKIE}=${await sign(extra)}`);
      expect(res.status, JSON.stringify(extra)).toBe(401);
      expect(res.body.error.message, JSON.stringify(extra)).toMatch(/not valid/);
    }
    // The same hand-made shape with the right generation is accepted, so the rejections above are about "gen".
    await request(ctx.app).get('/api/me').set('Cookie', `${SESSION_COOKIE}=${await sign({ gen: 0 })}`).expect(200);
  });

  it('refuses to sign a token for a generation that is not a non-negative integer', async () => {
    await expect(signSessionToken(ctx.key, { userId: 'x', generation: -1 })).rejects.toThrow(/non-negative integer, got -1/);
    await expect(signSessionToken(ctx.key, { userId: 'x', generation: 1.5 })).rejects.toThrow(/non-negative integer, got 1.5/);
  });
});

describe('sign-in rate limit', () => {
  it('answers 429 RATE_LIMITED after the configured number of failed attempts for one address (OWASP: limit automated guessing)', async () => {
    const person = await insertPerson(ctx.db, 'limited');
    // The test app allows 3 failures per window.
    for (let i = 0; i < 3; i++) {
      const res = await request(ctx.app).post('/api/auth/signin').send({ email: person.email, password: `wrong-${i}-password` });
      expect(res.status).toBe(401);
    }
    const blocked = await request(ctx.app).post('/api/auth/signin').send({ email: person.email, password: FIXTURE_PASSWORD });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('RATE_LIMITED');
    expect(blocked.body.error.message).toMatch(/Too many failed sign-ins/);
    // IETF draft-ietf-httpapi-ratelimit-headers (draft 8): a RateLimit-Policy header names the quota.
    expect(blocked.headers['ratelimit-policy']).toMatch(/q=3/);

    const otherAddress = await insertPerson(ctx.db, 'not-limited');
    const fine = await request(ctx.app).post('/api/auth/signin').send({ email: otherAddress.email, password: FIXTURE_PASSWORD });
    expect(fine.status).toBe(200);
  });

  it('answers an absurdly long e-mail with 400 VALIDATION, not a server error from the limiter key', async () => {
    // Random hex does not compress, so as a raw key it would exceed PostgreSQL's B-tree entry limit (about 2.7 kB).
    const res = await request(ctx.app).post('/api/auth/signin').send({ email: `${randomBytes(8_000).toString('hex')}@test.example.com`, password: 'whatever-pass' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.email).toBeDefined();
  });

  it('does not count successful sign-ins', async () => {
    const person = await insertPerson(ctx.db, 'regular');
    for (let i = 0; i < 5; i++) {
      const res = await request(ctx.app).post('/api/auth/signin').send({ email: person.email, password: FIXTURE_PASSWORD });
      expect(res.status).toBe(200);
    }
  });

  it('shares the count between two app instances on the same database (servers keep no state)', async () => {
    const second = await makeTestApp({ sessionSecret: ctx.secret });
    try {
      const person = await insertPerson(ctx.db, 'shared');
      for (const app of [ctx.app, second.app, ctx.app]) {
        await request(app).post('/api/auth/signin').send({ email: person.email, password: 'wrong-password!' }).expect(401);
      }
      const res = await request(second.app).post('/api/auth/signin').send({ email: person.email, password: 'wrong-password!' });
      expect(res.status).toBe(429);
    } finally {
      await second.close();
    }
  });
});

describe('sign-up rate limit', () => {
  /** A random address in the IPv6 documentation range 2001:db8::/32 (RFC 3849), one /56 network per call. */
  const networkPrefix = () => `2001:db8:${randomBytes(2).toString('hex')}:${randomBytes(1).toString('hex')}`;
  const signUp = (app: TestContext['app'], from: string) =>
    request(app).post('/api/auth/signup').set('X-Forwarded-For', from).send({ name: 'Rush Signer', email: uniqueEmail('rush'), password: 'long-enough-pw' });

  it('answers 429 RATE_LIMITED once one address has used its sign-ups, counting failed attempts too, and not other addresses', async () => {
    // TRUST_PROXY=true so X-Forwarded-For sets the client address (Express "trust proxy"), giving this test its own.
    const limited = await makeTestApp({ sessionSecret: ctx.secret, env: { TRUST_PROXY: 'true' }, signUpLimit: { max: 3, windowMs: 60_000 } });
    try {
      const from = `${networkPrefix()}00::17`;
      await signUp(limited.app, from).expect(201);
      // A bad form still counts (an answer of "e-mail taken" would otherwise list registered addresses for free).
      await request(limited.app).post('/api/auth/signup').set('X-Forwarded-For', from).send({ name: 'Rush', email: 'not-an-address', password: 'x' }).expect(400);
      await signUp(limited.app, from).expect(201);
      const blocked = await signUp(limited.app, from);
      expect(blocked.status).toBe(429);
      expect(blocked.body).toEqual({ error: { code: 'RATE_LIMITED', message: 'Too many sign-ups from your network address; wait up to 1 minutes and try again' } });
      // IETF draft-ietf-httpapi-ratelimit-headers (draft 8): a RateLimit-Policy header names the quota.
      expect(blocked.headers['ratelimit-policy']).toMatch(/q=3/);
      expect(blocked.headers['set-cookie']).toBeUndefined();

      await signUp(limited.app, `203.0.113.${1 + (randomBytes(1)[0] % 254)}`).expect(201);
    } finally {
      await limited.close();
    }
  });

  it('counts an IPv6 /56 network as one client (a subscriber usually holds a whole prefix; express-rate-limit ipKeyGenerator)', async () => {
    const limited = await makeTestApp({ sessionSecret: ctx.secret, env: { TRUST_PROXY: 'true' }, signUpLimit: { max: 1, windowMs: 60_000 } });
    try {
      const prefix = networkPrefix();
      await signUp(limited.app, `${prefix}12::1`).expect(201);
      expect((await signUp(limited.app, `${prefix}ab::99`)).status).toBe(429);
    } finally {
      await limited.close();
    }
  });

  it('takes its size and window from SIGNUP_RATE_LIMIT and SIGNUP_RATE_WINDOW_MINUTES', async () => {
    const limited = await makeTestApp({
      sessionSecret: ctx.secret,
      env: { TRUST_PROXY: 'true', SIGNUP_RATE_LIMIT: '2', SIGNUP_RATE_WINDOW_MINUTES: '45' },
      signUpLimit: undefined,
    });
    try {
      const from = `${networkPrefix()}00::5`;
      await signUp(limited.app, from).expect(201);
      await signUp(limited.app, from).expect(201);
      const blocked = await signUp(limited.app, from);
      expect(blocked.status).toBe(429);
      expect(blocked.body.error.message).toMatch(/wait up to 45 minutes/);
      // RateLimit-Policy "w" is the window in seconds: 45 × 60.
      expect(blocked.headers['ratelimit-policy']).toMatch(/q=2; w=2700/);
    } finally {
      await limited.close();
    }
  });
});
