/** Shop rules: whoever creates a shop owns it; members see each other. */
import type { Db } from '../../db/client';
import type { Role, ShopCreateBody } from '../../db/validation';
import { recordAudit } from '../audit/service';
import { insertMembership, insertShop } from '../auth/queries';
import { notFound } from '../errors';
import type { SessionUser, ShopAccess } from '../http/define-route';
import { selectShop, selectShopMembers } from './queries';

/** Creates a shop owned by `user` (with an audit entry) and returns it with the caller's role. */
export function createShop(db: Db, user: SessionUser, input: ShopCreateBody) {
  return db.transaction(async (tx) => {
    const shop = await insertShop(tx, input.name);
    await insertMembership(tx, user.id, shop.id, 'owner');
    await recordAudit(tx, { shopId: shop.id, userId: user.id, action: 'shop.create', target: `shop:${shop.id}`, detail: { name: shop.name } });
    return { shop, role: 'owner' as Role };
  });
}

/** Returns the shop, the caller's role there (null for a site admin without membership) and its members. */
export async function describeShop(db: Db, access: ShopAccess) {
  const shop = await selectShop(db, access.id);
  if (!shop) throw notFound('Shop');
  return { shop, role: access.role, members: await selectShopMembers(db, access.id) };
}
