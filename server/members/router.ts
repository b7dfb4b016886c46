/** HTTP routes for a shop's members: list, change role or print-set grant, remove. */
import { z } from 'zod';
import type { Db } from '../../db/client';
import { memberUpdateBody } from '../../db/validation-crew';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { shopParams } from '../http/params';
import { changeMember, listMembers, removeMember } from './service';

const memberParams = shopParams.extend({ userId: z.string().uuid('must be a person id (a UUID)') });

/** Path of a shop's members list. */
export const MEMBERS_PATH = '/api/shops/:shopId/members';

/** Returns the members routes. */
export function memberRoutes(db: Db): MountableRoute[] {
  return [
    defineRoute({
      method: 'GET',
      path: MEMBERS_PATH,
      access: { shopRole: 'viewer' },
      params: shopParams,
      handler: async ({ user, shop }) => ({ status: 200, json: { members: await listMembers(db, user, shop) } }),
    }),
    defineRoute({
      method: 'PATCH',
      path: `${MEMBERS_PATH}/:userId`,
      access: { shopRole: 'owner' },
      params: memberParams,
      body: memberUpdateBody,
      handler: async ({ user, shop, params, body }) => ({ status: 200, json: { member: await changeMember(db, user, shop.id, params.userId, body) } }),
    }),
    defineRoute({
      method: 'DELETE',
      path: `${MEMBERS_PATH}/:userId`,
      access: { shopRole: 'owner' },
      params: memberParams,
      handler: async ({ user, shop, params }) => {
        await removeMember(db, user, shop.id, params.userId);
        return { status: 204 };
      },
    }),
  ];
}
