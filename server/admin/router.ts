/** HTTP routes for site admins: lists with paging and filters, job retry, and the caught-mail view. */
import type { Request } from 'express';
import type { Pool } from 'pg';
import { z } from 'zod';
import type { Db } from '../../db/client';
import type { Env } from '../env';
import { validationError } from '../errors';
import { defineRoute, type MountableRoute } from '../http/define-route';
import type { JobAdmin } from '../jobs/job-admin';
import type { PaymentGateway } from '../pay/payment-gateway';
import { JOB_STATES } from './queries';
import { listCaughtMail, listJobs, listOrders, listShops, listUsers, refundOrderAsAdmin, retryJob } from './service';

export interface AdminDeps {
  db: Db;
  pool: Pool;
  env: Pick<Env, 'MAIL_CATCHER_URL'>;
  /** Retries failed jobs; null where the server runs without a queue (retry then answers 503). */
  jobAdmin: JobAdmin | null;
  /** Refunds payments; null where payments are not set up (refunds of paid orders then answer 503). */
  payments: PaymentGateway | null;
}

const paging = {
  page: z.coerce.number().int().min(1, 'must be 1 or more').default(1),
  pageSize: z.coerce.number().int().min(1, 'must be 1 or more').max(200, 'must be at most 200').default(50),
  q: z.string().trim().max(200, 'must be at most 200 characters').optional(),
};
const usersQuery = z.object(paging);
const ordersQuery = z.object({ ...paging, status: z.enum(['pending', 'paid', 'refunded']).optional() });
const jobsQuery = z.object({ ...paging, state: z.enum(JOB_STATES).optional(), name: z.string().max(200).optional() });
const jobParams = z.object({ id: z.string().uuid('must be a job id (a UUID)') });
const orderParams = z.object({ id: z.string().uuid('must be an order id (a UUID)') });

/** Returns the request's query string checked by `schema`; a bad value answers 400 VALIDATION naming the parameter. */
function parseQuery<T>(schema: z.ZodType<T>, req: Request): T {
  const parsed = schema.safeParse(req.query);
  if (!parsed.success) throw validationError(parsed.error, 'query');
  return parsed.data;
}

const orNull = (s: string | undefined) => (s ? s : null);

/** Returns the admin routes. */
export function adminRoutes(deps: AdminDeps): MountableRoute[] {
  return [
    defineRoute({
      method: 'GET',
      path: '/api/admin/users',
      access: 'admin',
      handler: async ({ req }) => {
        const q = parseQuery(usersQuery, req);
        const page = await listUsers(deps.db, orNull(q.q), q.page, q.pageSize);
        return { status: 200, json: { users: page.items, page: page.page, pageSize: page.pageSize, total: page.total } };
      },
    }),
    defineRoute({
      method: 'GET',
      path: '/api/admin/shops',
      access: 'admin',
      handler: async ({ req }) => {
        const q = parseQuery(usersQuery, req);
        const page = await listShops(deps.db, orNull(q.q), q.page, q.pageSize);
        return { status: 200, json: { shops: page.items, page: page.page, pageSize: page.pageSize, total: page.total } };
      },
    }),
    defineRoute({
      method: 'GET',
      path: '/api/admin/orders',
      access: 'admin',
      handler: async ({ req }) => {
        const q = parseQuery(ordersQuery, req);
        const page = await listOrders(deps.db, { status: q.status ?? null, q: orNull(q.q) }, q.page, q.pageSize);
        return { status: 200, json: { orders: page.items, page: page.page, pageSize: page.pageSize, total: page.total } };
      },
    }),
    defineRoute({
      method: 'POST',
      path: '/api/admin/orders/:id/refund',
      access: 'admin',
      handler: async ({ req }) => {
        const parsed = orderParams.safeParse(req.params);
        if (!parsed.success) throw validationError(parsed.error, 'path');
        return { status: 200, json: { order: await refundOrderAsAdmin(deps.db, deps.payments, parsed.data.id) } };
      },
    }),
    defineRoute({
      method: 'GET',
      path: '/api/admin/jobs',
      access: 'admin',
      handler: async ({ req }) => {
        const q = parseQuery(jobsQuery, req);
        const page = await listJobs(deps.pool, { state: q.state ?? null, name: orNull(q.name) }, q.page, q.pageSize);
        return { status: 200, json: { jobs: page.items, page: page.page, pageSize: page.pageSize, total: page.total } };
      },
    }),
    defineRoute({
      method: 'POST',
      path: '/api/admin/jobs/:id/retry',
      access: 'admin',
      // The id is checked after the access check (not as a params schema, which runs first), so a caller who
      // is not a site admin gets 403 whatever the URL holds.
      handler: async ({ req }) => {
        const parsed = jobParams.safeParse(req.params);
        if (!parsed.success) throw validationError(parsed.error, 'path');
        return { status: 200, json: { job: await retryJob(deps.pool, deps.jobAdmin, parsed.data.id) } };
      },
    }),
    defineRoute({
      method: 'GET',
      path: '/api/admin/mail',
      access: 'admin',
      handler: async () => ({ status: 200, json: { messages: await listCaughtMail(deps.env.MAIL_CATCHER_URL) } }),
    }),
  ];
}
