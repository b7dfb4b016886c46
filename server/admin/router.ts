/** HTTP routes for site admins. */
import type { Db } from '../../db/client';
import { defineRoute, type MountableRoute } from '../http/define-route';
import { listUsers } from './service';

/** Returns the admin routes. */
export function adminRoutes(db: Db): MountableRoute[] {
  return [
    defineRoute({
      method: 'GET',
      path: '/api/admin/users',
      access: 'admin',
      handler: async () => ({ status: 200, json: { users: await listUsers(db) } }),
    }),
  ];
}
