/** What site admins may see about people. */
import type { Db } from '../../db/client';
import { selectUsersWithShopCounts } from './queries';

export interface AdminUserView {
  id: string;
  email: string;
  name: string;
  isAdmin: boolean;
  createdAt: string;
  shopCount: number;
}

/** Returns all users for the admin list, timestamps as ISO strings. */
export async function listUsers(db: Db): Promise<AdminUserView[]> {
  const rows = await selectUsersWithShopCounts(db);
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString(), shopCount: Number(r.shopCount) }));
}
