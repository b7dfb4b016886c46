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

/** A shop member as GET /api/shops/:shopId shows them; `email` only to owners and site admins. */
export interface MemberView {
  userId: string;
  name: string;
  role: Role;
  email?: string;
}

/**
 * Returns the shop, the caller's role there (null for a site admin without membership) and its members.
 * Members' e-mail addresses are personal data that viewers and editors do not need to follow or edit builds
 * (data minimisation, GDPR Art. 5(1)(c)), so only owners, who manage the shop, and site admins, who see every
 * address in /api/admin/users anyway, get them; everyone else gets names and roles. Throws 404 NOT_FOUND when
 * the shop does not exist.
 */
export async function describeShop(db: Db, user: SessionUser, access: ShopAccess) {
  const shop = await selectShop(db, access.id);
  if (!shop) throw notFound('Shop');
  const seesEmails = access.role === 'owner' || user.isAdmin;
  const members: MemberView[] = (await selectShopMembers(db, access.id)).map(({ userId, name, role, email }) =>
    seesEmails ? { userId, name, role, email } : { userId, name, role },
  );
  return { shop, role: access.role, members };
}
