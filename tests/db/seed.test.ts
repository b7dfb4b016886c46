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
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { decodePatternFaces } from '../../geometry/pattern/pattern-faces-file';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { readStoredBytes } from '../../server/storage/read-stored-bytes';
import { localDiskStore } from '../../server/storage/local-disk-store';

const files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-seed-')));

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
    const started = Date.now();
    expect(await seedDemoIfEmpty(db, files)).toBe(true);
    // The brief's bound for `npm start`: seeding stays under 10 s (2 cores, shared).
    expect(Date.now() - started).toBeLessThan(10_000);
    expect(await seedDemoIfEmpty(db, files)).toBe(false);

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

  it('gives the helmet build a processed sculpt, seams, a finished pattern, ticks, a note, stock and a sheet plan', async () => {
    const [build] = (await pool.query("SELECT id FROM builds WHERE name = 'Beetle knight helmet'")).rows;
    const [sculpt] = (await pool.query('SELECT id, status, mesh_key, report FROM sculpts WHERE build_id = $1', [build.id])).rows;
    expect(sculpt.status).toBe('done');
    const [seams] = (await pool.query('SELECT seams FROM seam_sets WHERE sculpt_id = $1', [sculpt.id])).rows;
    expect(seams.seams.length).toBeGreaterThan(0);
    const [pattern] = (await pool.query('SELECT status, doc, faces_key FROM patterns WHERE build_id = $1', [build.id])).rows;
    expect(pattern.status).toBe('done');
    const doc = pattern.doc as PatternDoc;
    expect(doc.pieces.length).toBeGreaterThan(1);
    // Each piece's flat area stays within its max stretch of its 3D area (the flattening's own bound, since
    // area scales by σ1·σ2 per triangle; Sander et al. 2001).
    for (const p of doc.pieces) expect(Math.abs(p.area2d / p.area3d - 1)).toBeLessThan(2 * (p.stretch.maxPct / 100) + 1e-6);
    // The faces file has one entry per working-mesh face (the sculpt report's count), each naming a piece.
    const faces = decodePatternFaces((await readStoredBytes(files, pattern.faces_key))!);
    expect(faces.pieceIndex.length).toBe(sculpt.report.workingTriangles);
    expect(Math.min(...faces.pieceIndex)).toBe(0);
    expect(Math.max(...faces.pieceIndex)).toBe(doc.pieces.length - 1);
    const ticks = (await pool.query('SELECT count(*)::int AS n FROM build_pieces WHERE build_id = $1 AND cut', [build.id])).rows[0].n;
    expect(ticks).toBe(3);
    expect((await pool.query('SELECT count(*)::int AS n FROM piece_notes WHERE build_id = $1', [build.id])).rows[0].n).toBe(1);
    const stock = (await pool.query('SELECT thickness_mm FROM stock_sheets ORDER BY thickness_mm')).rows.map((r) => r.thickness_mm);
    expect(stock).toEqual([2, 4, 6, 10]);
    const [plan] = (await pool.query('SELECT status, plan FROM sheet_plans WHERE build_id = $1', [build.id])).rows;
    expect(plan.status).toBe('done');
    // Every piece copy is placed: the sum of quantities plus spares (planSheets' rule) equals the placements.
    expect(plan.plan.placements.length).toBeGreaterThanOrEqual(doc.pieces.reduce((s, p) => s + p.quantity, 0));
    expect(plan.plan.totalCost).toBeGreaterThan(0);
  });
});
