/** HTTP routes for invitations: the owner's list, invite, revoke and resend; the public preview and the accept. */
import { z } from 'zod';
import type { Db } from '../../db/client';
import { invitationCreateBody, linkTokenField } from '../../db/validation-crew';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { shopParams } from '../http/params';
import type { Mailer } from '../mail/send-mail';
import { invitationLimiter } from './invite-limit';
import { acceptInvitation, createInvitation, listInvitations, previewInvitation, resendInvitation, revokeShopInvitation } from './service';

const invitationParams = shopParams.extend({ invitationId: z.string().uuid('must be an invitation id (a UUID)') });
const tokenParams = z.object({ token: linkTokenField });

/** Path of a shop's invitations. */
export const INVITATIONS_PATH = '/api/shops/:shopId/invitations';

/**
 * Returns the invitation routes; `baseUrl` is the origin used in the mailed links, `perShopHourly` the number of
 * invitation mails a shop may send per hour.
 */
export function invitationRoutes(deps: { db: Db; mailer: Mailer; baseUrl: string; perShopHourly: number }): MountableRoute[] {
  const { db } = deps;
  const limit = invitationLimiter(db, deps.perShopHourly);
  return [
    defineRoute({
      method: 'GET',
      path: INVITATIONS_PATH,
      access: { shopRole: 'owner' },
      params: shopParams,
      handler: async ({ shop }) => ({ status: 200, json: { invitations: await listInvitations(db, shop.id) } }),
    }),
    defineRoute({
      method: 'POST',
      path: INVITATIONS_PATH,
      access: { shopRole: 'owner' },
      params: shopParams,
      body: invitationCreateBody,
      before: [limit],
      handler: async ({ user, shop, body }) => ({ status: 201, json: await createInvitation(deps, user, shop.id, body) }),
    }),
    defineRoute({
      method: 'DELETE',
      path: `${INVITATIONS_PATH}/:invitationId`,
      access: { shopRole: 'owner' },
      params: invitationParams,
      handler: async ({ user, shop, params }) => {
        await revokeShopInvitation(db, user, shop.id, params.invitationId);
        return { status: 204 };
      },
    }),
    defineRoute({
      method: 'POST',
      path: `${INVITATIONS_PATH}/:invitationId/resend`,
      access: { shopRole: 'owner' },
      params: invitationParams,
      before: [limit],
      handler: async ({ user, shop, params }) => ({ status: 200, json: await resendInvitation(deps, user, shop.id, params.invitationId) }),
    }),
    defineRoute({
      method: 'GET',
      path: '/api/invitations/:token',
      access: 'public',
      params: tokenParams,
      handler: async ({ params }) => ({ status: 200, json: { invitation: await previewInvitation(db, params.token) } }),
    }),
    defineRoute({
      method: 'POST',
      path: '/api/invitations/:token/accept',
      access: 'signedIn',
      params: tokenParams,
      handler: async ({ user, params }) => ({ status: 200, json: await acceptInvitation(db, user, params.token) }),
    }),
  ];
}
