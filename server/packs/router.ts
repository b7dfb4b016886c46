/** HTTP routes for pattern packs: the shop's own (create, list, change, cover) and the public catalogue. */
import { z } from 'zod';
import { checkoutBody, packCreateBody, packUpdateBody } from '../../db/validation-packs';
import { validationError } from '../errors';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { shopParams } from '../http/params';
import { checkoutLimiter, type CheckoutLimitOptions } from './checkout-limit';
import { PACK_COVER_PATH, readCoverFromRequest } from './cover-upload';
import { changePack, checkoutPack, createPack, getPublishedPack, listPublishedPacks, listShopPacks, openPublicCover, openShopPackCover, setPackCover, type PackDeps } from './service';

const packParams = z.object({ shopId: shopParams.shape.shopId, packId: z.string().uuid('must be a pack id (a UUID)') });
const slugParams = z.object({ slug: z.string().regex(/^[a-z0-9-]{1,80}$/, 'must be a pack address such as wolf-helmet') });
const catalogueQuery = z.object({
  page: z.coerce.number().int().min(1, 'must be 1 or more').max(10_000).default(1),
  perPage: z.coerce.number().int().min(1, 'must be 1 or more').max(60, 'must be at most 60').default(24),
});

/** Returns the pack routes; `checkoutLimit` null turns the checkout rate limit off. */
export function packRoutes(deps: PackDeps & { checkoutLimit: CheckoutLimitOptions | null }): MountableRoute[] {
  return [
    defineRoute({
      method: 'POST',
      path: '/api/shops/:shopId/packs',
      access: { shopRole: 'owner' },
      params: shopParams,
      body: packCreateBody,
      handler: async ({ user, shop, body }) => ({ status: 201, json: { pack: await createPack(deps, user, shop.id, body) } }),
    }),
    defineRoute({
      method: 'GET',
      path: '/api/shops/:shopId/packs',
      access: { shopRole: 'viewer' },
      params: shopParams,
      handler: async ({ shop }) => ({ status: 200, json: { packs: await listShopPacks(deps.db, shop.id) } }),
    }),
    defineRoute({
      method: 'PATCH',
      path: '/api/shops/:shopId/packs/:packId',
      access: { shopRole: 'owner' },
      params: packParams,
      body: packUpdateBody,
      handler: async ({ user, shop, params, body }) => ({ status: 200, json: { pack: await changePack(deps, user, shop.id, params.packId, body) } }),
    }),
    defineRoute({
      method: 'PUT',
      path: PACK_COVER_PATH,
      access: { shopRole: 'owner' },
      params: packParams,
      handler: async ({ shop, params, req, res }) => {
        const { bytes, where } = await readCoverFromRequest(req, res);
        return { status: 200, json: { pack: await setPackCover(deps, shop.id, params.packId, bytes, where) } };
      },
    }),
    defineRoute({
      method: 'GET',
      path: PACK_COVER_PATH,
      access: { shopRole: 'viewer' },
      params: packParams,
      handler: async ({ shop, params }) => {
        const { file, contentType, name } = await openShopPackCover(deps, shop.id, params.packId);
        return { status: 200, file: { stream: file.stream, sizeBytes: file.sizeBytes, contentType, fileName: name } };
      },
    }),
    defineRoute({
      method: 'GET',
      path: '/api/packs',
      access: 'public',
      handler: async ({ req }) => {
        const query = catalogueQuery.safeParse(req.query);
        if (!query.success) throw validationError(query.error, 'query');
        return { status: 200, json: await listPublishedPacks(deps.db, query.data.page, query.data.perPage) };
      },
    }),
    defineRoute({
      method: 'GET',
      path: '/api/packs/:slug',
      access: 'public',
      params: slugParams,
      handler: async ({ params }) => ({ status: 200, json: { pack: await getPublishedPack(deps.db, params.slug) } }),
    }),
    defineRoute({
      method: 'GET',
      path: '/api/packs/:slug/cover',
      access: 'public',
      params: slugParams,
      handler: async ({ params, res }) => {
        const { file, contentType, name } = await openPublicCover(deps, params.slug);
        // The file name is random per upload, so a cover may be cached for a while.
        res.setHeader('Cache-Control', 'public, max-age=300');
        return { status: 200, file: { stream: file.stream, sizeBytes: file.sizeBytes, contentType, fileName: name } };
      },
    }),
    defineRoute({
      method: 'POST',
      path: '/api/packs/:slug/checkout',
      access: 'public',
      params: slugParams,
      body: checkoutBody,
      before: deps.checkoutLimit ? [checkoutLimiter(deps.db, deps.checkoutLimit)] : [],
      handler: async ({ params, body }) => ({ status: 200, json: await checkoutPack(deps, params.slug, body.email) }),
    }),
  ];
}
