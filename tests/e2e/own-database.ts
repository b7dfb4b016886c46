/**
 * A migrated database of a browser suite's own, next to the test database. A suite that runs a worker needs one:
 * every worker on a database takes jobs from its one queue, so a worker of another suite (or the API tests'
 * queued jobs) would otherwise cross over, and a job would look for its files in another suite's file store.
 */
import { createPool } from '../../db/client';
import { runMigrations } from '../../db/migrate';

export interface OwnDatabase {
  /** postgres:// URL of the new database. */
  url: string;
  /** Drops the database (closing any connection still open to it). */
  drop(): Promise<void>;
}

function withDatabase(url: string, name: string): string {
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}

/**
 * Creates and migrates a database named `<prefix>_<time>_<pid>` on the server of `baseUrl` (normally the test
 * database's DATABASE_URL). The name ends in `_test`, which the API test helpers insist on.
 */
export async function createOwnDatabase(baseUrl: string, prefix: string): Promise<OwnDatabase> {
  const name = `${prefix}_${Date.now().toString(36)}_${process.pid}_test`;
  const admin = createPool(withDatabase(baseUrl, 'postgres'), 1);
  try {
    await admin.query(`CREATE DATABASE ${name}`);
  } finally {
    await admin.end();
  }
  const url = withDatabase(baseUrl, name);
  // Two connections: runMigrations holds an advisory lock on one while it migrates on another.
  const pool = createPool(url, 2);
  try {
    await runMigrations(pool);
  } finally {
    await pool.end();
  }
  return {
    url,
    async drop() {
      const pool = createPool(withDatabase(baseUrl, 'postgres'), 1);
      try {
        await pool.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      } finally {
        await pool.end();
      }
    },
  };
}
