/**
 * The PostgreSQL pool and the Drizzle handle built on it. One pool per process; the API server, the worker
 * and the scripts each make their own from DATABASE_URL.
 */
import { drizzle, type NodePgDatabase } from 'drizzle-orm/node-postgres';
import { Pool } from 'pg';
import * as schema from './schema';

export type Db = NodePgDatabase<typeof schema>;

/** The URL used when DATABASE_URL is not set: the private cluster that scripts/postgres.sh starts. */
export const DEFAULT_DATABASE_URL = 'postgres://postgres@127.0.0.1:54329/sheetsmith';

/**
 * Returns a new connection pool for `url` (a postgres:// URL). `max` bounds open connections per process.
 * The caller owns the pool and must `end()` it on shutdown.
 */
export function createPool(url: string, max = 10): Pool {
  return new Pool({ connectionString: url, max, application_name: 'sheetsmith' });
}

/** Returns a Drizzle handle with the Sheetsmith schema over an existing pool. */
export function createDb(pool: Pool): Db {
  return drizzle(pool, { schema });
}

/** The handle inside `db.transaction(async (tx) => ...)`. */
export type DbTransaction = Parameters<Parameters<Db['transaction']>[0]>[0];

/** Either a plain handle or a transaction: query functions take this so services decide the transaction scope. */
export type DbExecutor = Db | DbTransaction;
