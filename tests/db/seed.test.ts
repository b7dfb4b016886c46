/**
 * The demo seed on a database of its own (created and dropped here), since it only writes into an empty one.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb, createPool } from '../../db/client';
import { runMigrations } from '../../db/migrate';
import { DEMO_ACCOUNTS, DEMO_BUILD_NAMES, DEMO_SHOP_NAME, seedDemoIfEmpty } from '../../db/seed';
import { signInBody, signUpBody } from '../../db/validation';
import { verifyPassword } from '../../server/auth/passwords';

const baseUrl = new URL(process.env.DATABASE_URL ?? 'postgres://postgres@127.0.0.1:54329/sheetsmith_test');
const dbName = `sheetsmith_seed_${randomUUID().replace(/-/g, '').slice(0, 10)}_test`;
const admin = createPool(new URL('/postgres', baseUrl).toString(), 1);
const seedUrl = new URL(`/${dbName}`, baseUrl).toString();
let pool: ReturnType<typeof createPool>;

beforeAll(async () => {
  await admin.query(`CREATE DATABASE ${dbName}`);
  pool = createPool(seedUrl, 2);
  await runMigrations(pool);
});
afterAll(async () => {
  await pool?.end();
  // A just-closed connection can take a moment to leave the server; a forced drop would kill it mid-exit and
  // surface as an error in this process, so wait for it instead.
  for (let attempt = 0; ; attempt++) {
    try {
      await admin.query(`DROP DATABASE IF EXISTS ${dbName}`);
      break;
    } catch (err) {
      if ((err as { code?: string }).code !== '55006' || attempt >= 40) throw err;
      await new Promise((r) => setTimeout(r, 100));
    }
  }
  await admin.end();
});

describe('demo seed', () => {
  it('fills an empty database once: shop, owner, crew, client, admin and two builds', async () => {
    const db = createDb(pool);
    expect(await seedDemoIfEmpty(db)).toBe(true);
    expect(await seedDemoIfEmpty(db)).toBe(false);

    const shops = await pool.query('SELECT id, name FROM shops');
    expect(shops.rows.map((r) => r.name)).toEqual([DEMO_SHOP_NAME]);
    const roles = await pool.query('SELECT u.email, m.role FROM memberships m JOIN users u ON u.id = m.user_id ORDER BY m.role');
    expect(roles.rows).toEqual([
      { email: 'owner@tallowlane.example.com', role: 'owner' },
      { email: 'crew@tallowlane.example.com', role: 'editor' },
      { email: 'client@tallowlane.example.com', role: 'viewer' },
    ]);
    const admins = await pool.query('SELECT email FROM users WHERE is_admin');
    expect(admins.rows).toEqual([{ email: 'admin@sheetsmith.example.com' }]);
    const builds = await pool.query('SELECT name FROM builds ORDER BY created_at DESC');
    expect(builds.rows.map((r) => r.name)).toEqual([...DEMO_BUILD_NAMES].reverse());
    const users = await pool.query('SELECT count(*)::int AS n FROM users');
    expect(users.rows[0].n).toBe(DEMO_ACCOUNTS.length);
  });

  it('stores hashes that verify against the printed passwords', async () => {
    for (const account of DEMO_ACCOUNTS) {
      const row = await pool.query('SELECT password_hash FROM users WHERE email = $1', [account.email]);
      expect(await verifyPassword(row.rows[0].password_hash, account.password), account.email).toBe(true);
    }
  });

  it('uses demo sign-ins that pass the same validation as the sign-up and sign-in forms', () => {
    for (const account of DEMO_ACCOUNTS) {
      expect(signUpBody.safeParse({ name: account.name, email: account.email, password: account.password }).success, account.email).toBe(true);
      expect(signInBody.safeParse({ email: account.email, password: account.password }).success).toBe(true);
      // RFC 2606 §3 reserves example.com (and its subdomains) for documentation: no real mailbox is addressed.
      expect(account.email).toMatch(/@([a-z0-9-]+\.)*example\.com$/);
    }
  });
});
