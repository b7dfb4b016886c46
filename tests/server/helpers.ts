/**
 * Shared set-up for the API tests: the real PostgreSQL test database (DATABASE_URL, prepared by
 * scripts/test.sh), an in-process app, and people with roles made directly in the database.
 */
import { randomBytes, randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { Express } from 'express';
import type { Pool } from 'pg';
import { createDb, createPool, type Db } from '../../db/client';
import { runMigrations } from '../../db/migrate';
import { builds, memberships, shops, users } from '../../db/schema';
import type { Role } from '../../db/validation';
import { createApp, type AppDeps } from '../../server/app';
import { hashPassword } from '../../server/auth/passwords';
import { SESSION_COOKIE, sessionKey, signSessionToken } from '../../server/auth/session';
import { parseEnv } from '../../server/env';
import { createLogger } from '../../server/logger';

export const TEST_DATABASE_URL = process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/sheetsmith_test';

/** Throws unless the URL names a database whose name ends in _test, so tests never write to a real one. */
function assertTestDatabase(url: string): void {
  const name = new URL(url).pathname.replace(/^\//, '');
  if (!name.endsWith('_test')) {
    throw new Error(`DATABASE_URL names database "${name}"; the API tests only run against a database whose name ends in _test (npm test sets this up)`);
  }
}

export interface TestContext {
  app: Express;
  pool: Pool;
  db: Db;
  secret: string;
  key: Uint8Array;
  close(): Promise<void>;
}

/** Returns an app over the test database, with a fresh random session secret; `close` ends the pool. */
export async function makeTestApp(overrides: Partial<Omit<AppDeps, 'pool' | 'db' | 'env'>> & { env?: Record<string, string> } = {}): Promise<TestContext> {
  assertTestDatabase(TEST_DATABASE_URL);
  const pool = createPool(TEST_DATABASE_URL, 5);
  try {
    await pool.query('SELECT 1');
  } catch (err) {
    await pool.end();
    throw new Error(`cannot reach the test database at ${TEST_DATABASE_URL} (${(err as Error).message}); run the tests with npm test, which starts PostgreSQL`);
  }
  await runMigrations(pool);
  const db = createDb(pool);
  const secret = overrides.sessionSecret ?? randomBytes(32).toString('base64url');
  const env = parseEnv({ NODE_ENV: 'test', DATABASE_URL: TEST_DATABASE_URL, WEB_ROOT: '/nonexistent-web-root', ...(overrides.env ?? {}) });
  const app = createApp({
    env,
    pool,
    db,
    sessionSecret: secret,
    logger: overrides.logger ?? createLogger('silent', 'test'),
    signInLimit: overrides.signInLimit ?? { max: 3, windowMs: 60_000 },
    // Every test file signs up from the same loopback address, so the limit is off unless a test names
    // signUpLimit (explicitly undefined: the environment's setting).
    signUpLimit: 'signUpLimit' in overrides ? overrides.signUpLimit : null,
    jobs: overrides.jobs,
    files: overrides.files,
  });
  return { app, pool, db, secret, key: sessionKey(secret), close: () => pool.end() };
}

/** Returns an e-mail address no other test uses. */
export function uniqueEmail(tag: string): string {
  return `${tag.toLowerCase()}-${randomUUID().slice(0, 12)}@test.example.com`;
}

let sharedHash: Promise<string> | null = null;
export const FIXTURE_PASSWORD = 'bench-tested-pass-9';

/** Inserts a user with FIXTURE_PASSWORD (hashed once per test file) and returns its id and e-mail. */
export async function insertPerson(db: Db, tag: string, isAdmin = false): Promise<{ id: string; email: string }> {
  sharedHash ??= hashPassword(FIXTURE_PASSWORD);
  const email = uniqueEmail(tag);
  const [row] = await db.insert(users).values({ email, name: `Test ${tag}`, passwordHash: await sharedHash, isAdmin }).returning({ id: users.id });
  return { id: row.id, email };
}

/**
 * Returns a Cookie header value holding a session for `userId` at `generation`; the default 0 is the column's
 * default, so it is valid for a person made by `insertPerson` who has not signed out since.
 */
export async function sessionCookie(key: Uint8Array, userId: string, generation = 0): Promise<string> {
  return `${SESSION_COOKIE}=${await signSessionToken(key, { userId, generation })}`;
}

/** Returns a Cookie header value holding a valid session for `userId` at the person's current generation in the database. */
export async function currentSessionCookie(ctx: TestContext, userId: string): Promise<string> {
  const [row] = await ctx.db.select({ generation: users.sessionGeneration }).from(users).where(eq(users.id, userId));
  if (!row) throw new Error(`no user ${userId} in the test database`);
  return sessionCookie(ctx.key, userId, row.generation);
}

export type Persona = 'anonymous' | 'viewer' | 'editor' | 'owner' | 'otherOwner' | 'admin';
export const PERSONAS: readonly Persona[] = ['anonymous', 'viewer', 'editor', 'owner', 'otherOwner', 'admin'];

export interface ShopFixture {
  shopId: string;
  otherShopId: string;
  people: Record<Exclude<Persona, 'anonymous'>, { id: string; email: string; cookie: string }>;
}

/**
 * Makes a shop with an owner, an editor and a viewer; a second shop with its own owner; and a site admin
 * who belongs to no shop.
 */
export async function makeShopFixture(ctx: TestContext): Promise<ShopFixture> {
  const [shop] = await ctx.db.insert(shops).values({ name: 'Fixture shop' }).returning({ id: shops.id });
  const [other] = await ctx.db.insert(shops).values({ name: 'Other fixture shop' }).returning({ id: shops.id });
  const roles: [Exclude<Persona, 'anonymous'>, string, Role | null][] = [
    ['owner', shop.id, 'owner'],
    ['editor', shop.id, 'editor'],
    ['viewer', shop.id, 'viewer'],
    ['otherOwner', other.id, 'owner'],
    ['admin', shop.id, null],
  ];
  const people = {} as ShopFixture['people'];
  for (const [persona, shopId, role] of roles) {
    const person = await insertPerson(ctx.db, persona, persona === 'admin');
    if (role) await ctx.db.insert(memberships).values({ userId: person.id, shopId, role });
    people[persona] = { ...person, cookie: await sessionCookie(ctx.key, person.id) };
  }
  return { shopId: shop.id, otherShopId: other.id, people };
}

/**
 * Sets a member's print-set grant (memberships.canSeePrintSets): a viewer (commission client) sees a build's
 * print sets only when the owner granted it (issue 6, "no print sets unless granted").
 */
export async function grantPrintSets(db: Db, shopId: string, userId: string, granted = true): Promise<void> {
  await db.update(memberships).set({ canSeePrintSets: granted }).where(and(eq(memberships.shopId, shopId), eq(memberships.userId, userId)));
}

/** Inserts a build into a shop directly and returns its id. */
export async function insertBuild(db: Db, shopId: string, name: string): Promise<string> {
  const [row] = await db.insert(builds).values({ shopId, name }).returning({ id: builds.id });
  return row.id;
}

/** Returns the Set-Cookie header lines of a response as an array. */
export function setCookies(headers: Record<string, unknown>): string[] {
  const raw = headers['set-cookie'];
  return Array.isArray(raw) ? (raw as string[]) : typeof raw === 'string' ? [raw] : [];
}
