/**
 * Demo data: an invented prop shop, its owner, a crew member, a commission client, two builds, and a site
 * admin; with a file store, the first build also gets a processed sculpt, seams, a pattern, ticks, a note,
 * stock and a sheet plan (db/seed-demo-build.ts). Written only into an empty database (no users yet), so a
 * second `npm start` never duplicates it and never touches real accounts.
 *
 *   node --import tsx db/seed.ts [--migrate] [--print-sign-ins]
 */
import { and, desc, eq, sql } from 'drizzle-orm';
import { hashPassword } from '../server/auth/passwords';
import { createDb, createPool, DEFAULT_DATABASE_URL, type Db, type DbExecutor } from './client';
import { runMigrations } from './migrate';
import { seedDemoBuild } from './seed-demo-build';
import { parseEnv } from '../server/env';
import type { FileStore } from '../server/storage/file-store';
import { createFileStore } from '../server/storage/create-file-store';
import { auditLog, builds, memberships, patterns, shops, users } from './schema';
import { DEMO_PACKS, seedDemoPacks } from './seed-packs';
import type { Role } from './validation';

export const DEMO_SHOP_NAME = 'Tallow Lane Props';

export interface DemoAccount {
  email: string;
  password: string;
  name: string;
  /** Role in the demo shop; null for the site admin, who is not a member. */
  role: Role | null;
  isAdmin: boolean;
}

/** The demo sign-ins; printed by scripts/start.sh and listed in the README. */
export const DEMO_ACCOUNTS: readonly DemoAccount[] = [
  { email: 'owner@tallowlane.example.com', password: 'foam-owner-26', name: 'Odile Varrick', role: 'owner', isAdmin: false },
  { email: 'crew@tallowlane.example.com', password: 'foam-crew-26', name: 'Tamsin Brae', role: 'editor', isAdmin: false },
  { email: 'client@tallowlane.example.com', password: 'foam-client-26', name: 'Corvin Ashdale', role: 'viewer', isAdmin: false },
  { email: 'admin@sheetsmith.example.com', password: 'foam-admin-26', name: 'Site Admin', role: null, isAdmin: true },
];

export const DEMO_BUILD_NAMES = ['Beetle knight helmet', 'Lantern bearer pauldrons'] as const;

/** Arbitrary constant naming the advisory lock that keeps two seeders from both finding the table empty. */
const SEED_LOCK_KEY = 7_340_826_002;

async function hasUsers(db: DbExecutor): Promise<boolean> {
  const rows = await db.select({ id: users.id }).from(users).limit(1);
  return rows.length > 0;
}

/**
 * Seeds the demo when the users table is empty; returns true when it wrote data, false when it left it alone.
 * With `files`, the first demo build ("Beetle knight helmet") is also filled with its sculpt, seams, pattern and
 * sheet plan (about two seconds of engine work on the demo helmet).
 */
export async function seedDemoIfEmpty(db: Db, files?: FileStore): Promise<boolean> {
  if (await hasUsers(db)) return false;
  const hashes = await Promise.all(DEMO_ACCOUNTS.map((a) => hashPassword(a.password)));
  const seeded = await db.transaction(async (tx) => {
    await tx.execute(sql`SELECT pg_advisory_xact_lock(${SEED_LOCK_KEY})`);
    if (await hasUsers(tx)) return null;

    const people = await tx
      .insert(users)
      .values(DEMO_ACCOUNTS.map((a, i) => ({ email: a.email, name: a.name, passwordHash: hashes[i], isAdmin: a.isAdmin })))
      .returning({ id: users.id, email: users.email });
    const idOf = (email: string) => people.find((p) => p.email === email)!.id;
    const [shop] = await tx.insert(shops).values({ name: DEMO_SHOP_NAME }).returning({ id: shops.id });
    const members = DEMO_ACCOUNTS.filter((a) => a.role !== null);
    await tx.insert(memberships).values(members.map((a) => ({ userId: idOf(a.email), shopId: shop.id, role: a.role as Role })));

    const owner = idOf(DEMO_ACCOUNTS[0].email);
    // Staggered creation times so "newest first" has a visible order in the demo.
    const made = await tx
      .insert(builds)
      .values(
        DEMO_BUILD_NAMES.map((name, i) => ({
          shopId: shop.id,
          name,
          createdAt: sql`now() - make_interval(days => ${DEMO_BUILD_NAMES.length - i})`,
          updatedAt: sql`now() - make_interval(days => ${DEMO_BUILD_NAMES.length - i})`,
        })),
      )
      .returning({ id: builds.id, name: builds.name });
    await tx.insert(auditLog).values(
      made.map((b) => ({ shopId: shop.id, userId: owner, action: 'build.create', target: `build:${b.id}`, detail: { name: b.name, seeded: true } })),
    );
    return { shopId: shop.id, buildId: made.find((b) => b.name === DEMO_BUILD_NAMES[0])!.id, secondBuildId: made.find((b) => b.name === DEMO_BUILD_NAMES[1])!.id, ownerId: owner, crewId: idOf(DEMO_ACCOUNTS[1].email) };
  });
  if (!seeded) return false;
  if (files) {
    await seedDemoBuild(db, files, seeded);
    // The paid demo pack sells the helmet's own pattern, so a visitor who buys it prints what the demo shows.
    const [done] = await db
      .select({ doc: patterns.doc })
      .from(patterns)
      .where(and(eq(patterns.buildId, seeded.buildId), eq(patterns.status, 'done')))
      .orderBy(desc(patterns.createdAt))
      .limit(1);
    const [helmetPack, samplerPack] = DEMO_PACKS;
    await seedDemoPacks(db, files, seeded, { pattern: done?.doc ?? undefined, demos: [helmetPack] });
    // The free sampler is a small pattern of its own, kept on the second demo build so each pack's files match it.
    await seedDemoPacks(db, files, { ...seeded, buildId: seeded.secondBuildId }, { demos: [samplerPack] });
  }
  return true;
}

/** Returns the demo sign-ins as printable lines. */
export function demoSignInLines(): string[] {
  return DEMO_ACCOUNTS.map((a) => `  ${(a.role ?? 'site admin').padEnd(10)} ${a.email.padEnd(32)} ${a.password}`);
}

async function main(): Promise<void> {
  const pool = createPool(process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL, 2);
  try {
    // `--migrate` saves start.sh a second process start: migrations, then the seed, in one run.
    if (process.argv.includes('--migrate')) {
      await runMigrations(pool);
      console.log('migrate: database schema is up to date');
    }
    const seeded = await seedDemoIfEmpty(createDb(pool), createFileStore(parseEnv(process.env)));
    console.log(seeded ? `seed: demo shop "${DEMO_SHOP_NAME}" created` : 'seed: the database already has users; demo not added');
    if (process.argv.includes('--print-sign-ins')) console.log(['Demo sign-ins (role, e-mail, password):', ...demoSignInLines()].join('\n'));
  } finally {
    await pool.end();
  }
}

if (require.main === module) {
  main().catch((err: unknown) => {
    console.error(`seed: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
}
