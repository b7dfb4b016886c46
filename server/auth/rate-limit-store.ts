/**
 * An express-rate-limit store kept in PostgreSQL (table rate_limit_hits), so the count of failed sign-ins is
 * shared by every API server instead of living in one process's memory.
 */
import { lt, sql } from 'drizzle-orm';
import type { ClientRateLimitInfo, Options, Store } from 'express-rate-limit';
import type { DbExecutor } from '../../db/client';
import { rateLimitHits } from '../../db/schema';

/** Counts hits per key in fixed windows of `windowMs` stored in PostgreSQL. */
export class PostgresRateLimitStore implements Store {
  localKeys = false;
  private windowMs = 60_000;

  constructor(
    private readonly db: DbExecutor,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  /** Adds one hit for `key`, starting a new window when the old one has ended; returns the count and reset time. */
  async increment(key: string): Promise<ClientRateLimitInfo> {
    const resetAt = new Date(Date.now() + this.windowMs);
    const rows = await this.db
      .insert(rateLimitHits)
      .values({ key: this.prefix + key, hits: 1, resetAt })
      .onConflictDoUpdate({
        target: rateLimitHits.key,
        set: {
          hits: sql`CASE WHEN ${rateLimitHits.resetAt} <= now() THEN 1 ELSE ${rateLimitHits.hits} + 1 END`,
          resetAt: sql`CASE WHEN ${rateLimitHits.resetAt} <= now() THEN excluded.reset_at ELSE ${rateLimitHits.resetAt} END`,
        },
      })
      .returning({ hits: rateLimitHits.hits, resetAt: rateLimitHits.resetAt });
    return { totalHits: rows[0].hits, resetTime: rows[0].resetAt };
  }

  /** Takes one hit back (express-rate-limit calls this for requests it decides not to count). */
  async decrement(key: string): Promise<void> {
    await this.db
      .update(rateLimitHits)
      .set({ hits: sql`GREATEST(${rateLimitHits.hits} - 1, 0)` })
      .where(sql`${rateLimitHits.key} = ${this.prefix + key}`);
  }

  /** Forgets the count for `key`. */
  async resetKey(key: string): Promise<void> {
    await this.db.delete(rateLimitHits).where(sql`${rateLimitHits.key} = ${this.prefix + key}`);
  }
}

/** Deletes counters whose window ended before now and returns how many rows went (run by the worker). */
export async function pruneRateLimitHits(db: DbExecutor): Promise<number> {
  const gone = await db.delete(rateLimitHits).where(lt(rateLimitHits.resetAt, sql`now()`)).returning({ key: rateLimitHits.key });
  return gone.length;
}
