/** What site admins may see and do: people, shops, orders, queued jobs (retrying failed ones) and caught mail. */
import type { Pool } from 'pg';
import type { Db } from '../../db/client';
import { AppError, notFound } from '../errors';
import type { JobAdmin } from '../jobs/job-admin';
import { refundShopOrder, type OrderView } from '../orders/service';
import type { PaymentGateway } from '../pay/payment-gateway';
import { selectJob, selectJobs, selectOrderShopId, selectOrders, selectShops, selectUsersWithShopCounts, type JobState, type Page } from './queries';

/** One page of a list and where it sits in the whole. */
export interface PageOf<T> {
  items: T[];
  page: number;
  pageSize: number;
  total: number;
}

export interface AdminUserView {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  createdAt: string;
  shopCount: number;
}

export interface AdminShopView {
  id: string;
  name: string;
  createdAt: string;
  memberCount: number;
  buildCount: number;
  ownerEmails: string[];
}

export interface AdminOrderView {
  id: string;
  email: string;
  amountCents: number;
  currency: string;
  status: 'pending' | 'paid' | 'refunded';
  createdAt: string;
  paidAt: string | null;
  refundedAt: string | null;
  pack: { id: string; title: string; slug: string };
  shop: { id: string; name: string };
}

export interface AdminJobView {
  id: string;
  name: string;
  state: string;
  retryCount: number;
  retryLimit: number;
  createdAt: string;
  startedAt: string | null;
  completedAt: string | null;
  /** For a failed job, the error it ended with (pg-boss keeps the thrown error's message in its output). */
  error: string | null;
  data: unknown;
}

/** Returns the limit/offset of page `page` (1-based) of `pageSize` rows. */
export function pageWindow(page: number, pageSize: number): Page {
  return { limit: pageSize, offset: (page - 1) * pageSize };
}

const iso = (d: Date | null) => (d ? d.toISOString() : null);

/** Returns one page of users matching `q` (e-mail or name), ordered by e-mail. */
export async function listUsers(db: Db, q: string | null, page: number, pageSize: number): Promise<PageOf<AdminUserView>> {
  const { rows, total } = await selectUsersWithShopCounts(db, q, pageWindow(page, pageSize));
  return { items: rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), shopCount: Number(r.shopCount) })), page, pageSize, total };
}

/** Returns one page of shops matching `q` (name), newest first. */
export async function listShops(db: Db, q: string | null, page: number, pageSize: number): Promise<PageOf<AdminShopView>> {
  const { rows, total } = await selectShops(db, q, pageWindow(page, pageSize));
  const items = rows.map((r) => ({
    id: r.id,
    name: r.name,
    createdAt: r.createdAt.toISOString(),
    memberCount: Number(r.memberCount),
    buildCount: Number(r.buildCount),
    ownerEmails: [...r.ownerEmails].sort(),
  }));
  return { items, page, pageSize, total };
}

/** Returns one page of orders, newest first, filtered by status and by `q` (buyer e-mail or pack title). */
export async function listOrders(db: Db, filter: { status: AdminOrderView['status'] | null; q: string | null }, page: number, pageSize: number): Promise<PageOf<AdminOrderView>> {
  const { rows, total } = await selectOrders(db, filter, pageWindow(page, pageSize));
  const items = rows.map((r) => ({
    id: r.id,
    email: r.email,
    amountCents: r.amountCents,
    currency: r.currency,
    status: r.status,
    createdAt: r.createdAt.toISOString(),
    paidAt: iso(r.paidAt),
    refundedAt: iso(r.refundedAt),
    pack: { id: r.packId, title: r.packTitle, slug: r.packSlug },
    shop: { id: r.shopId, name: r.shopName },
  }));
  return { items, page, pageSize, total };
}

/**
 * Refunds order `orderId` of whichever shop sold it, by the shop's own refund rules (server/orders/service.ts:
 * the payment is refunded, the order marked refunded, its download links revoked). Throws 404 NOT_FOUND for an
 * unknown order and the refund's own errors (409 NOT_PAID, 503 PAYMENT_UNAVAILABLE, 502).
 */
export async function refundOrderAsAdmin(db: Db, payments: PaymentGateway | null, orderId: string): Promise<OrderView> {
  const shopId = await selectOrderShopId(db, orderId);
  if (!shopId) throw notFound('Order');
  return refundShopOrder(db, payments, shopId, orderId);
}

/** Returns the error text of a job's output: pg-boss stores a thrown Error as { message, stack }, a timeout as { value: { message } }. */
export function jobErrorText(state: string, output: unknown): string | null {
  if (state !== 'failed' || output === null || output === undefined) return null;
  const o = output as { message?: unknown; value?: { message?: unknown } };
  if (typeof o.message === 'string') return o.message;
  if (typeof o.value?.message === 'string') return o.value.message;
  return JSON.stringify(output);
}

/** Returns one page of jobs, newest first, filtered by state and queue name. */
export async function listJobs(pool: Pool, filter: { state: JobState | null; name: string | null }, page: number, pageSize: number): Promise<PageOf<AdminJobView>> {
  const { rows, total } = await selectJobs(pool, filter, pageWindow(page, pageSize));
  const items = rows.map((r) => ({
    id: r.id,
    name: r.name,
    state: r.state,
    retryCount: r.retry_count,
    retryLimit: r.retry_limit,
    createdAt: r.created_on.toISOString(),
    startedAt: iso(r.started_on),
    completedAt: iso(r.completed_on),
    error: jobErrorText(r.state, r.output),
    data: r.data,
  }));
  return { items, page, pageSize, total };
}

/**
 * Puts failed job `id` back on its queue and returns its new state ("retry"). Throws 404 NOT_FOUND for an
 * unknown job, 409 JOB_NOT_FAILED for a job in any other state, 503 QUEUE_UNAVAILABLE without a queue.
 */
export async function retryJob(pool: Pool, jobAdmin: JobAdmin | null, id: string): Promise<{ id: string; name: string; state: string }> {
  if (!jobAdmin) throw new AppError('QUEUE_UNAVAILABLE', 503, 'The job queue is not running on this server, so jobs cannot be retried now');
  const job = await selectJob(pool, id);
  if (!job) throw notFound(`Job ${id}`);
  if (job.state !== 'failed') throw new AppError('JOB_NOT_FAILED', 409, `Job ${id} is ${job.state}, not failed; only failed jobs can be retried`);
  await jobAdmin.retry(job.name, id);
  const after = await selectJob(pool, id);
  return { id, name: job.name, state: after?.state ?? 'retry' };
}

/** One message as the local mail catcher lists it (server/dev/mail-catcher.ts). */
export interface CaughtMail {
  id: string;
  from: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  date: string;
}

/**
 * Returns the messages the local mail catcher at `catcherUrl` has caught, newest first. Throws 404
 * MAIL_CATCHER_NOT_CONFIGURED when no catcher is configured (a real mail service is in use) and 502
 * MAIL_CATCHER_UNREACHABLE when it does not answer.
 */
export async function listCaughtMail(catcherUrl: string | undefined, fetchImpl: typeof fetch = fetch): Promise<CaughtMail[]> {
  if (!catcherUrl) {
    throw new AppError('MAIL_CATCHER_NOT_CONFIGURED', 404, 'No local mail catcher is configured (MAIL_CATCHER_URL is not set); mail goes to the SMTP server in SMTP_URL');
  }
  const url = `${catcherUrl.replace(/\/+$/, '')}/messages`;
  let res: Response;
  try {
    res = await fetchImpl(url, { signal: AbortSignal.timeout(5_000) });
  } catch (err) {
    throw new AppError('MAIL_CATCHER_UNREACHABLE', 502, `The mail catcher at ${url} did not answer (${(err as Error).message})`);
  }
  if (!res.ok) throw new AppError('MAIL_CATCHER_UNREACHABLE', 502, `The mail catcher at ${url} answered ${res.status}`);
  const body = (await res.json()) as unknown;
  const list = Array.isArray(body) ? body : ((body as { messages?: unknown }).messages ?? []);
  if (!Array.isArray(list)) throw new AppError('MAIL_CATCHER_UNREACHABLE', 502, `The mail catcher at ${url} answered something other than a message list`);
  const messages = (list as Array<Record<string, unknown>>).map((m) => ({
    id: String(m.id ?? ''),
    from: String(m.from ?? ''),
    to: Array.isArray(m.to) ? m.to.join(', ') : String(m.to ?? ''),
    subject: String(m.subject ?? ''),
    text: String(m.text ?? ''),
    html: String(m.html ?? ''),
    date: String(m.date ?? ''),
  }));
  return messages.sort((a, b) => (a.date < b.date ? 1 : a.date > b.date ? -1 : 0));
}
