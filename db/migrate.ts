/**
 * Applies the committed migrations in drizzle/ to DATABASE_URL. Run by `npm run db:migrate`, scripts/start.sh
 * and scripts/test.sh; also callable from code (tests, future deploy tooling).
 */
import path from 'node:path';
import { migrate } from 'drizzle-orm/node-postgres/migrator';
import type { Pool } from 'pg';
import { createDb, createPool, DEFAULT_DATABASE_URL } from './client';

/** Arbitrary constant naming the advisory lock that serialises migrations across processes. */
const MIGRATION_LOCK_KEY = 7_340_826_001;

/**
 * Applies every migration in `migrationsFolder` not yet recorded in the database, and resolves when done.
 * Holds a PostgreSQL session advisory lock meanwhile, so several servers or test files starting together
 * migrate once instead of racing on the same DDL.
 */
export async function runMigrations(pool: Pool, migrationsFolder = path.join(__dirname, '..', 'drizzle')): Promise<void> {
  const lockClient = await pool.connect();
  try {
    await lockClient.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK_KEY]);
    await migrate(createDb(pool), { migrationsFolder });
  } finally {
    await lockClient.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]).catch(() => undefined);
    lockClient.release();
  }
}

async function main(): Promise<void> {
  const pool = createPool(process.env.DATABASE_URL ?? DEFAULT_DATABASE_URL, 2);
  try {
    await runMigrations(pool);
    console.log('migrate: database schema is up to date');
  } finally {
    await pool.end();
  }
}

if (require.main === module) {
  main().catch((err: unknown) => {
    console.error(`migrate: ${err instanceof Error ? err.message : String(err)}`);
    process.exit(1);
  });
}
