/**
 * Queries for the site admin screens: Drizzle for the application's tables, plain SQL for the job queue's own
 * tables (schema `pgboss`, owned by pg-boss, not described in db/schema).
 */
import { and, asc, count, countDistinct, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import type { Pool } from 'pg';
import type { DbExecutor } from '../../db/client';
import { builds, memberships, shops, users } from '../../db/schema-core';
import { orders, packs } from '../../db/schema-packs';
import { QUEUE_SCHEMA } from '../jobs/queue';

export interface Page {
  limit: number;
  offset: number;
}

/** `%text%` for ILIKE with the pattern characters in `text` taken literally. */
function containing(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/** Returns one page of users (never the password hash) with how many shops they belong to, ordered by e-mail, and the total matching `q`. */
export async function selectUsersWithShopCounts(db: DbExecutor, q: string | null, page: Page) {
  const where = q ? or(ilike(users.email, containing(q)), ilike(users.name, containing(q))) : undefined;
  const rows = await db
    .select({ id: users.id, email: users.email, name: users.name, isAdmin: users.isAdmin, createdAt: users.createdAt, shopCount: count(memberships.shopId) })
    .from(users)
    .leftJoin(memberships, eq(memberships.userId, users.id))
    .where(where)
    .groupBy(users.id)
    .orderBy(asc(users.email))
    .limit(page.limit)
    .offset(page.offset);
  const [total] = await db.select({ n: count() }).from(users).where(where);
  return { rows, total: Number(total.n) };
}

/** Returns one page of shops with member and build counts, newest first, and the total matching `q` (by name). */
export async function selectShops(db: DbExecutor, q: string | null, page: Page) {
  const where = q ? ilike(shops.name, containing(q)) : undefined;
  const rows = await db
    .select({
      id: shops.id,
      name: shops.name,
      createdAt: shops.createdAt,
      memberCount: countDistinct(memberships.userId),
      buildCount: countDistinct(builds.id),
      ownerEmails: sql<string[]>`coalesce(array_agg(distinct ${users.email}) filter (where ${memberships.role} = 'owner'), '{}')`,
    })
    .from(shops)
    .leftJoin(memberships, eq(memberships.shopId, shops.id))
    .leftJoin(users, eq(users.id, memberships.userId))
    .leftJoin(builds, eq(builds.shopId, shops.id))
    .where(where)
    .groupBy(shops.id)
    .orderBy(desc(shops.createdAt), asc(shops.id))
    .limit(page.limit)
    .offset(page.offset);
  const [total] = await db.select({ n: count() }).from(shops).where(where);
  return { rows, total: Number(total.n) };
}

/** Returns one page of orders (newest first) with their pack and shop, filtered by status and by `q` on the buyer's e-mail or pack title. */
export async function selectOrders(db: DbExecutor, filter: { status: 'pending' | 'paid' | 'refunded' | null; q: string | null }, page: Page) {
  const conditions: SQL[] = [];
  if (filter.status) conditions.push(eq(orders.status, filter.status));
  if (filter.q) conditions.push(or(ilike(orders.email, containing(filter.q)), ilike(packs.title, containing(filter.q)))!);
  const where = conditions.length > 0 ? and(...conditions) : undefined;
  const rows = await db
    .select({
      id: orders.id,
      email: orders.email,
      amountCents: orders.amountCents,
      currency: orders.currency,
      status: orders.status,
      createdAt: orders.createdAt,
      paidAt: orders.paidAt,
      refundedAt: orders.refundedAt,
      packId: packs.id,
      packTitle: packs.title,
      packSlug: packs.slug,
      shopId: shops.id,
      shopName: shops.name,
    })
    .from(orders)
    .innerJoin(packs, eq(packs.id, orders.packId))
    .innerJoin(shops, eq(shops.id, packs.shopId))
    .where(where)
    .orderBy(desc(orders.createdAt), asc(orders.id))
    .limit(page.limit)
    .offset(page.offset);
  const [total] = await db.select({ n: count() }).from(orders).innerJoin(packs, eq(packs.id, orders.packId)).where(where);
  return { rows, total: Number(total.n) };
}

export interface JobRow {
  id: string;
  name: string;
  state: string;
  retry_count: number;
  retry_limit: number;
  created_on: Date;
  started_on: Date | null;
  completed_on: Date | null;
  output: unknown;
  data: unknown;
}

/** pg-boss job states (pg-boss 10 schema, enum job_state). */
export const JOB_STATES = ['created', 'retry', 'active', 'completed', 'cancelled', 'failed'] as const;
export type JobState = (typeof JOB_STATES)[number];

/** True when PostgreSQL says the queue's tables do not exist yet (no worker or API has started pg-boss here). */
function queueMissing(err: unknown): boolean {
  return (err as { code?: string }).code === '42P01' || (err as { code?: string }).code === '3F000';
}

/**
 * Returns one page of queued, running and finished jobs (newest first) from pg-boss's table, filtered by state
 * and queue name, and the total; an empty page when the queue has never been started on this database.
 */
export async function selectJobs(pool: Pool, filter: { state: JobState | null; name: string | null }, page: Page): Promise<{ rows: JobRow[]; total: number }> {
  const where = ['($1::text IS NULL OR state::text = $1)', '($2::text IS NULL OR name = $2)'].join(' AND ');
  const params = [filter.state, filter.name];
  try {
    const rows = await pool.query<JobRow>(
      `SELECT id, name, state::text AS state, retry_count, retry_limit, created_on, started_on, completed_on, output, data
         FROM ${QUEUE_SCHEMA}.job WHERE ${where} ORDER BY created_on DESC, id LIMIT $3 OFFSET $4`,
      [...params, page.limit, page.offset],
    );
    const total = await pool.query<{ n: string }>(`SELECT count(*) AS n FROM ${QUEUE_SCHEMA}.job WHERE ${where}`, params);
    return { rows: rows.rows, total: Number(total.rows[0].n) };
  } catch (err) {
    if (queueMissing(err)) return { rows: [], total: 0 };
    throw err;
  }
}

/** Returns one job's queue name and state, or null when there is no such job (or no queue yet). */
export async function selectJob(pool: Pool, id: string): Promise<{ name: string; state: string } | null> {
  try {
    const res = await pool.query<{ name: string; state: string }>(`SELECT name, state::text AS state FROM ${QUEUE_SCHEMA}.job WHERE id = $1`, [id]);
    return res.rows[0] ?? null;
  } catch (err) {
    if (queueMissing(err)) return null;
    throw err;
  }
}

/** Returns the shop an order's pack belongs to, or null when there is no such order. */
export async function selectOrderShopId(db: DbExecutor, orderId: string): Promise<string | null> {
  const [row] = await db.select({ shopId: packs.shopId }).from(orders).innerJoin(packs, eq(packs.id, orders.packId)).where(eq(orders.id, orderId));
  return row?.shopId ?? null;
}
