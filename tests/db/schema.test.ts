/**
 * Constraints that the database itself enforces, so that no code path (or a hand-written SQL fix) can store
 * data the application would misread.
 */
import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, createPool, type Db } from '../../db/client';
import { runMigrations } from '../../db/migrate';
import { auditLog, builds, memberships, printSets, shops, users } from '../../db/schema';

const url = process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/sheetsmith_test';
const pool = createPool(url, 3);
let db: Db;

beforeAll(async () => {
  if (!new URL(url).pathname.endsWith('_test')) throw new Error(`refusing to run schema tests against ${url}; use a database whose name ends in _test`);
  await runMigrations(pool);
  db = createDb(pool);
});
afterAll(async () => {
  await pool.end();
});

const email = () => `schema-${randomUUID().slice(0, 8)}@test.example.com`;

async function pgError(promise: Promise<unknown>): Promise<{ code?: string; constraint?: string }> {
  try {
    await promise;
  } catch (err) {
    const cause = (err as { cause?: { code?: string; constraint?: string } }).cause ?? (err as { code?: string; constraint?: string });
    return { code: cause.code, constraint: cause.constraint };
  }
  throw new Error('the statement succeeded but should have been refused');
}

describe('database constraints (SQLSTATE codes from the PostgreSQL 15 manual, Appendix A)', () => {
  it('refuses an e-mail that is not lower-case (23514 check_violation)', async () => {
    const err = await pgError(db.insert(users).values({ email: `Mixed-${email()}`, name: 'x', passwordHash: 'h' }));
    expect(err).toEqual({ code: '23514', constraint: 'users_email_lower_case' });
  });

  it('refuses a second account with the same e-mail (23505 unique_violation)', async () => {
    const address = email();
    await db.insert(users).values({ email: address, name: 'x', passwordHash: 'h' });
    const err = await pgError(db.insert(users).values({ email: address, name: 'y', passwordHash: 'h' }));
    expect(err.code).toBe('23505');
  });

  it('refuses a second membership of the same person in the same shop, and an unknown role (22P02)', async () => {
    const [u] = await db.insert(users).values({ email: email(), name: 'x', passwordHash: 'h' }).returning();
    const [s] = await db.insert(shops).values({ name: 'Pair shop' }).returning();
    await db.insert(memberships).values({ userId: u.id, shopId: s.id, role: 'viewer' });
    expect((await pgError(db.insert(memberships).values({ userId: u.id, shopId: s.id, role: 'owner' }))).code).toBe('23505');
    const bad = pool.query('INSERT INTO memberships (user_id, shop_id, role) VALUES ($1, $2, $3)', [u.id, s.id, 'janitor']);
    expect((await pgError(bad)).code).toBe('22P02');
  });

  it('deletes a shop\'s builds and memberships with it, but keeps its audit entries with the shop reference cleared', async () => {
    const [u] = await db.insert(users).values({ email: email(), name: 'x', passwordHash: 'h' }).returning();
    const [s] = await db.insert(shops).values({ name: 'Closing shop' }).returning();
    await db.insert(memberships).values({ userId: u.id, shopId: s.id, role: 'owner' });
    const [b] = await db.insert(builds).values({ shopId: s.id, name: 'Last build' }).returning();
    const [entry] = await db.insert(auditLog).values({ shopId: s.id, userId: u.id, action: 'build.create', target: `build:${b.id}` }).returning();
    await db.delete(shops).where(eq(shops.id, s.id));
    expect(await db.select().from(builds).where(eq(builds.id, b.id))).toEqual([]);
    expect(await db.select().from(memberships).where(eq(memberships.shopId, s.id))).toEqual([]);
    const [kept] = await db.select().from(auditLog).where(eq(auditLog.id, entry.id));
    expect(kept.shopId).toBeNull();
    expect(kept.userId).toBe(u.id);
    expect(kept.detail).toEqual({});
  });

  it('refuses a build in a shop that does not exist (23503 foreign_key_violation)', async () => {
    expect((await pgError(db.insert(builds).values({ shopId: randomUUID(), name: 'Orphan' }))).code).toBe('23503');
  });

  it('deletes a build\'s print sets with it, keeps them when their creator leaves, and refuses an unknown status (22P02)', async () => {
    const [u] = await db.insert(users).values({ email: email(), name: 'x', passwordHash: 'h' }).returning();
    const [s] = await db.insert(shops).values({ name: 'Print shop' }).returning();
    const [b] = await db.insert(builds).values({ shopId: s.id, name: 'Printed build' }).returning();
    const values = { shopId: s.id, buildId: b.id, createdBy: u.id, name: 'Set', formats: ['pdf'], page: 'a4', mode: 'tiled', pieceCount: 0, pattern: { units: 'mm' as const, pieces: [], seams: [], warnings: [] } };
    const [p] = await db.insert(printSets).values(values).returning();
    expect(p.status).toBe('queued');
    expect(p.files).toEqual([]);
    await db.delete(users).where(eq(users.id, u.id));
    expect((await db.select().from(printSets).where(eq(printSets.id, p.id)))[0].createdBy).toBeNull();
    const bad = pool.query("UPDATE print_sets SET status = 'printing' WHERE id = $1", [p.id]);
    expect((await pgError(bad)).code).toBe('22P02');
    await db.delete(builds).where(eq(builds.id, b.id));
    expect(await db.select().from(printSets).where(eq(printSets.id, p.id))).toEqual([]);
  });

  it('re-running the migrations is a no-op', async () => {
    await runMigrations(pool);
    const applied = await pool.query('SELECT count(*)::int AS n FROM drizzle.__drizzle_migrations');
    expect(applied.rows[0].n).toBeGreaterThanOrEqual(1);
  });
});
