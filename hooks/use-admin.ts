/**
 * Data for the site admin pages: people, shops, orders, queued jobs (with retry) and caught mail, each a page
 * of a list from /api/admin/*. The response shapes are checked with zod so a server change shows up as a
 * clear error on the page rather than as blank cells.
 */
import { keepPreviousData, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { apiRequest } from './api-client';
import { orderSchema } from './use-packs';

const pageFields = { page: z.number(), pageSize: z.number(), total: z.number() };

const adminUser = z.object({ id: z.string(), email: z.string(), name: z.string(), isAdmin: z.boolean(), createdAt: z.string(), shopCount: z.number() });
const adminShop = z.object({ id: z.string(), name: z.string(), createdAt: z.string(), memberCount: z.number(), buildCount: z.number(), ownerEmails: z.array(z.string()) });
// The same order row as the owner's order list (use-packs.ts), with its pack and shop instead of the pack's title.
const adminOrder = orderSchema.omit({ packTitle: true, packSlug: true }).extend({
  pack: z.object({ id: z.string(), title: z.string(), slug: z.string() }),
  shop: z.object({ id: z.string(), name: z.string() }),
});
const adminJob = z.object({
  id: z.string(),
  name: z.string(),
  state: z.string(),
  retryCount: z.number(),
  retryLimit: z.number(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  completedAt: z.string().nullable(),
  error: z.string().nullable(),
  data: z.unknown(),
});
const caughtMail = z.object({ id: z.string(), from: z.string(), to: z.string(), subject: z.string(), text: z.string(), html: z.string(), date: z.string() });

const usersPage = z.object({ users: z.array(adminUser), ...pageFields });
const shopsPage = z.object({ shops: z.array(adminShop), ...pageFields });
const ordersPage = z.object({ orders: z.array(adminOrder), ...pageFields });
const jobsPage = z.object({ jobs: z.array(adminJob), ...pageFields });
const mailList = z.object({ messages: z.array(caughtMail) });
const retried = z.object({ job: z.object({ id: z.string(), name: z.string(), state: z.string() }) });

export type AdminUser = z.infer<typeof adminUser>;
export type AdminShop = z.infer<typeof adminShop>;
export type AdminOrder = z.infer<typeof adminOrder>;
export type AdminJob = z.infer<typeof adminJob>;
export type CaughtMail = z.infer<typeof caughtMail>;
export type OrderStatus = AdminOrder['status'];
export const JOB_STATE_FILTERS = ['failed', 'active', 'retry', 'created', 'completed', 'cancelled'] as const;
export type JobStateFilter = (typeof JOB_STATE_FILTERS)[number];

/** Rows per page on the admin lists. */
export const ADMIN_PAGE_SIZE = 25;

/** Returns `path` with the given query parameters (empty and null ones left out). */
export function withQuery(path: string, params: Record<string, string | number | null | undefined>): string {
  const search = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== null && v !== undefined && v !== '') search.set(k, String(v));
  const s = search.toString();
  return s ? `${path}?${s}` : path;
}

/** One page of people whose e-mail or name contains `q`. */
export function useAdminUsers(q: string, page: number) {
  const url = withQuery('/api/admin/users', { q, page, pageSize: ADMIN_PAGE_SIZE });
  return useQuery({ queryKey: ['admin', 'users', q, page], queryFn: () => apiRequest('GET', url, usersPage), placeholderData: keepPreviousData });
}

/** One page of shops whose name contains `q`. */
export function useAdminShops(q: string, page: number) {
  const url = withQuery('/api/admin/shops', { q, page, pageSize: ADMIN_PAGE_SIZE });
  return useQuery({ queryKey: ['admin', 'shops', q, page], queryFn: () => apiRequest('GET', url, shopsPage), placeholderData: keepPreviousData });
}

/** One page of orders, optionally of one status, whose buyer or pack title contains `q`. */
export function useAdminOrders(q: string, status: OrderStatus | null, page: number) {
  const url = withQuery('/api/admin/orders', { q, status, page, pageSize: ADMIN_PAGE_SIZE });
  return useQuery({ queryKey: ['admin', 'orders', q, status, page], queryFn: () => apiRequest('GET', url, ordersPage), placeholderData: keepPreviousData });
}

/** One page of queued jobs, optionally in one state; refreshed every 5 s so running work moves on screen. */
export function useAdminJobs(state: JobStateFilter | null, page: number) {
  const url = withQuery('/api/admin/jobs', { state, page, pageSize: ADMIN_PAGE_SIZE });
  return useQuery({ queryKey: ['admin', 'jobs', state, page], queryFn: () => apiRequest('GET', url, jobsPage), placeholderData: keepPreviousData, refetchInterval: 5_000 });
}

/** Puts a failed job back on its queue; refreshes the job lists when done. */
export function useRetryJob() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiRequest('POST', `/api/admin/jobs/${encodeURIComponent(id)}/retry`, retried),
    onSettled: () => client.invalidateQueries({ queryKey: ['admin', 'jobs'] }),
  });
}

/** Refunds a paid order (any shop's); refreshes the order lists when done. */
export function useRefundOrder() {
  const client = useQueryClient();
  return useMutation({
    mutationFn: (id: string) => apiRequest('POST', `/api/admin/orders/${encodeURIComponent(id)}/refund`, z.object({ order: z.object({ id: z.string(), status: z.string() }) })),
    onSettled: () => client.invalidateQueries({ queryKey: ['admin', 'orders'] }),
  });
}

/** The local mail catcher's messages, newest first; refreshed every 5 s. */
export function useCaughtMail() {
  return useQuery({ queryKey: ['admin', 'mail'], queryFn: () => apiRequest('GET', '/api/admin/mail', mailList), refetchInterval: 5_000, retry: false });
}
