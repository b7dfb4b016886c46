/**
 * Pattern packs in the app: the public catalogue and pack page, checkout, the buyer's download link, and the
 * owner's packs with create, change (publish/withdraw) and cover.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { PackCreateBody, PackUpdateBody } from '../db/validation-packs';
import { ApiError, apiErrorFromResponse, apiRequest } from './api-client';

/** GET /api/packs/:slug and the catalogue's items (server/packs/service.ts PackPublicView). */
export const packPublicSchema = z.object({
  slug: z.string(),
  title: z.string(),
  description: z.string(),
  licence: z.string(),
  priceCents: z.number(),
  currency: z.string(),
  priceLabel: z.string(),
  shopName: z.string(),
  coverUrl: z.string().nullable(),
  publishedAt: z.string().nullable(),
  pieceCount: z.number(),
  files: z.array(z.object({ name: z.string(), sizeBytes: z.number() })),
  cautions: z.string(),
});
export type PackPublic = z.infer<typeof packPublicSchema>;

/** The shop's own view of a pack (PackView). */
export const packSchema = packPublicSchema.extend({
  id: z.string(),
  status: z.enum(['draft', 'published', 'withdrawn']),
  printSetId: z.string(),
  buildId: z.string(),
  createdAt: z.string(),
  paidOrders: z.number(),
  refundedOrders: z.number(),
});
export type Pack = z.infer<typeof packSchema>;

const catalogueSchema = z.object({ packs: z.array(packPublicSchema), page: z.number(), perPage: z.number(), total: z.number() });
const checkoutSchema = z.object({ url: z.string().nullable(), emailed: z.boolean() });

/** GET /api/downloads/:token (server/downloads/service.ts DownloadView). */
export const downloadSchema = z.object({
  packTitle: z.string(),
  packSlug: z.string(),
  shopName: z.string(),
  licence: z.string(),
  files: z.array(z.object({ name: z.string(), sizeBytes: z.number(), contentType: z.string(), url: z.string() })),
  uses: z.number(),
  maxUses: z.number(),
  expiresAt: z.string(),
});
export type Download = z.infer<typeof downloadSchema>;

/** Returns page `page` of the public catalogue (24 a page, newest first). */
export function useCatalogue(page = 1) {
  return useQuery({
    queryKey: ['packs', 'catalogue', page],
    queryFn: () => apiRequest('GET', `/api/packs?page=${page}`, catalogueSchema),
  });
}

/** Returns the published pack `slug`. */
export function usePublicPack(slug: string) {
  return useQuery({
    queryKey: ['packs', 'public', slug],
    queryFn: async () => (await apiRequest('GET', `/api/packs/${encodeURIComponent(slug)}`, z.object({ pack: packPublicSchema }))).pack,
    retry: (count, err) => !(err instanceof ApiError && err.status < 500) && count < 2,
  });
}

/** Starts buying (or taking) pack `slug` for an e-mail address: `{ url }` of the pay page, or `{ url: null, emailed }`. */
export function useCheckout(slug: string) {
  return useMutation({
    mutationFn: (body: { email: string }) => apiRequest('POST', `/api/packs/${encodeURIComponent(slug)}/checkout`, checkoutSchema, body),
  });
}

/** Returns what download link `token` offers (the listing does not use up the link). */
export function useDownload(token: string) {
  return useQuery({
    queryKey: ['downloads', token],
    queryFn: async () => (await apiRequest('GET', `/api/downloads/${encodeURIComponent(token)}`, z.object({ download: downloadSchema }))).download,
    retry: false,
  });
}

/** Returns the shop's packs. */
export function useShopPacks(shopId: string) {
  return useQuery({
    queryKey: ['shops', shopId, 'packs'],
    queryFn: async () => (await apiRequest('GET', `/api/shops/${shopId}/packs`, z.object({ packs: z.array(packSchema) }))).packs,
  });
}

/** Creates a draft pack; on success the shop's pack list is refreshed. */
export function useCreatePack(shopId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (body: PackCreateBody) => (await apiRequest('POST', `/api/shops/${shopId}/packs`, z.object({ pack: packSchema }), body)).pack,
    onSuccess: () => client.invalidateQueries({ queryKey: ['shops', shopId, 'packs'] }),
  });
}

/** Changes a pack (title, price, status: publish or withdraw). */
export function useUpdatePack(shopId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async ({ packId, body }: { packId: string; body: PackUpdateBody }) =>
      (await apiRequest('PATCH', `/api/shops/${shopId}/packs/${packId}`, z.object({ pack: packSchema }), body)).pack,
    onSuccess: () => client.invalidateQueries({ queryKey: ['shops', shopId, 'packs'] }),
  });
}

/**
 * Sets a pack's cover from a file the person picked (a Blob/File) or a PNG data URL rendered from the 3D view.
 * Uses fetch directly: the upload is multipart and the route is a PUT.
 */
export function useSetPackCover(shopId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async ({ packId, cover }: { packId: string; cover: Blob | string }) => {
      const url = `/api/shops/${shopId}/packs/${packId}/cover`;
      let init: RequestInit;
      if (typeof cover === 'string') {
        init = { method: 'PUT', credentials: 'same-origin', headers: { 'Content-Type': 'application/json', Accept: 'application/json' }, body: JSON.stringify({ dataUrl: cover }) };
      } else {
        const form = new FormData();
        form.append('cover', cover, cover instanceof File ? cover.name : 'cover.png');
        init = { method: 'PUT', credentials: 'same-origin', headers: { Accept: 'application/json' }, body: form };
      }
      let res: Response;
      try {
        res = await fetch(url, init);
      } catch {
        throw new ApiError(0, 'NETWORK', 'Cannot reach the Sheetsmith server. Check your connection and try again.');
      }
      const body: unknown = await res.json().catch(() => undefined);
      if (!res.ok) throw apiErrorFromResponse(res.status, body);
      return packSchema.parse((body as { pack: unknown }).pack);
    },
    onSuccess: () => client.invalidateQueries({ queryKey: ['shops', shopId, 'packs'] }),
  });
}

/** An order as the shop's owner sees it (server/orders/service.ts OrderView). */
export const orderSchema = z.object({
  id: z.string(),
  packTitle: z.string().optional(),
  packSlug: z.string().optional(),
  email: z.string(),
  amountCents: z.number(),
  currency: z.string(),
  status: z.enum(['pending', 'paid', 'refunded']),
  createdAt: z.string(),
  paidAt: z.string().nullable(),
  refundedAt: z.string().nullable(),
});
export type Order = z.infer<typeof orderSchema>;

/** Returns the shop's pack orders, newest first (owners only). */
export function useShopOrders(shopId: string) {
  return useQuery({
    queryKey: ['shops', shopId, 'orders'],
    queryFn: async () => (await apiRequest('GET', `/api/shops/${shopId}/orders`, z.object({ orders: z.array(orderSchema) }))).orders,
  });
}

/** Refunds a paid order (through the payment service when it was paid for); its download links stop working. */
export function useRefundOrder(shopId: string) {
  const client = useQueryClient();
  return useMutation({
    mutationFn: async (orderId: string) => (await apiRequest('POST', `/api/shops/${shopId}/orders/${orderId}/refund`, z.object({ order: orderSchema }))).order,
    onSuccess: () => {
      void client.invalidateQueries({ queryKey: ['shops', shopId, 'orders'] });
      void client.invalidateQueries({ queryKey: ['shops', shopId, 'packs'] });
    },
  });
}
