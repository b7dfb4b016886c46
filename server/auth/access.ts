/**
 * Who may call which route, kept as data. Every route the server mounts must appear here with the same
 * rule (server/http/define-route.ts refuses to start otherwise), and the tests walk this table.
 */
import type { Role } from '../../db/validation';

/**
 * - `public`: anyone, signed in or not.
 * - `signedIn`: any signed-in person.
 * - `{ shopRole }`: a member of the shop named by `:shopId` with at least that role (owner > editor > viewer);
 *   a site admin may also read (GET) any shop.
 * - `admin`: site admins only.
 */
export type AccessRule = 'public' | 'signedIn' | 'admin' | { shopRole: Role };

export type HttpMethod = 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';

export interface RouteAccess {
  method: HttpMethod;
  path: string;
  access: AccessRule;
}

export const ROUTE_ACCESS: readonly RouteAccess[] = [
  { method: 'GET', path: '/api/health', access: 'public' },
  { method: 'POST', path: '/api/auth/signup', access: 'public' },
  { method: 'POST', path: '/api/auth/signin', access: 'public' },
  { method: 'POST', path: '/api/auth/signout', access: 'signedIn' },
  { method: 'GET', path: '/api/me', access: 'signedIn' },
  { method: 'GET', path: '/api/shops/:shopId/members', access: { shopRole: 'viewer' } },
  { method: 'PATCH', path: '/api/shops/:shopId/members/:userId', access: { shopRole: 'owner' } },
  { method: 'DELETE', path: '/api/shops/:shopId/members/:userId', access: { shopRole: 'owner' } },
  { method: 'GET', path: '/api/shops/:shopId/invitations', access: { shopRole: 'owner' } },
  { method: 'POST', path: '/api/shops/:shopId/invitations', access: { shopRole: 'owner' } },
  { method: 'DELETE', path: '/api/shops/:shopId/invitations/:invitationId', access: { shopRole: 'owner' } },
  { method: 'POST', path: '/api/shops/:shopId/invitations/:invitationId/resend', access: { shopRole: 'owner' } },
  { method: 'GET', path: '/api/invitations/:token', access: 'public' },
  { method: 'POST', path: '/api/invitations/:token/accept', access: 'signedIn' },
  { method: 'POST', path: '/api/auth/password-reset', access: 'public' },
  { method: 'POST', path: '/api/auth/password-reset/confirm', access: 'public' },
  { method: 'POST', path: '/api/shops', access: 'signedIn' },
  { method: 'GET', path: '/api/shops/:shopId', access: { shopRole: 'viewer' } },
  { method: 'GET', path: '/api/shops/:shopId/builds', access: { shopRole: 'viewer' } },
  { method: 'POST', path: '/api/shops/:shopId/builds', access: { shopRole: 'editor' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId', access: { shopRole: 'viewer' } },
  { method: 'PATCH', path: '/api/shops/:shopId/builds/:buildId', access: { shopRole: 'editor' } },
  { method: 'DELETE', path: '/api/shops/:shopId/builds/:buildId', access: { shopRole: 'owner' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/overview', access: { shopRole: 'viewer' } },
  { method: 'POST', path: '/api/shops/:shopId/builds/:buildId/print-sets', access: { shopRole: 'editor' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/print-sets', access: { shopRole: 'viewer' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/print-sets/:printSetId', access: { shopRole: 'viewer' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/print-sets/:printSetId/files/:fileName', access: { shopRole: 'viewer' } },
  { method: 'GET', path: '/api/shops/:shopId/audit', access: { shopRole: 'owner' } },
  { method: 'GET', path: '/api/admin/users', access: 'admin' },
  { method: 'GET', path: '/api/admin/shops', access: 'admin' },
  { method: 'GET', path: '/api/admin/orders', access: 'admin' },
  { method: 'POST', path: '/api/admin/orders/:id/refund', access: 'admin' },
  { method: 'GET', path: '/api/admin/jobs', access: 'admin' },
  { method: 'POST', path: '/api/admin/jobs/:id/retry', access: 'admin' },
  { method: 'GET', path: '/api/admin/mail', access: 'admin' },
  { method: 'POST', path: '/api/shops/:shopId/packs', access: { shopRole: 'owner' } },
  { method: 'GET', path: '/api/shops/:shopId/packs', access: { shopRole: 'viewer' } },
  { method: 'PATCH', path: '/api/shops/:shopId/packs/:packId', access: { shopRole: 'owner' } },
  { method: 'PUT', path: '/api/shops/:shopId/packs/:packId/cover', access: { shopRole: 'owner' } },
  { method: 'GET', path: '/api/shops/:shopId/packs/:packId/cover', access: { shopRole: 'viewer' } },
  { method: 'GET', path: '/api/packs', access: 'public' },
  { method: 'GET', path: '/api/packs/:slug', access: 'public' },
  { method: 'GET', path: '/api/packs/:slug/cover', access: 'public' },
  { method: 'POST', path: '/api/packs/:slug/checkout', access: 'public' },
  { method: 'POST', path: '/api/pay/webhook', access: 'public' },
  { method: 'GET', path: '/api/shops/:shopId/orders', access: { shopRole: 'owner' } },
  { method: 'POST', path: '/api/shops/:shopId/orders/:orderId/refund', access: { shopRole: 'owner' } },
  { method: 'GET', path: '/api/downloads/:token', access: 'public' },
  { method: 'GET', path: '/api/downloads/:token/files/:name', access: 'public' },
  { method: 'POST', path: '/api/shops/:shopId/builds/:buildId/sculpts', access: { shopRole: 'editor' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/sculpts', access: { shopRole: 'viewer' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/sculpts/:sculptId', access: { shopRole: 'viewer' } },
  { method: 'PATCH', path: '/api/shops/:shopId/builds/:buildId/sculpts/:sculptId', access: { shopRole: 'editor' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/sculpts/:sculptId/mesh', access: { shopRole: 'viewer' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/sculpts/:sculptId/seams', access: { shopRole: 'viewer' } },
  { method: 'PUT', path: '/api/shops/:shopId/builds/:buildId/sculpts/:sculptId/seams', access: { shopRole: 'editor' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/pattern', access: { shopRole: 'viewer' } },
  { method: 'POST', path: '/api/shops/:shopId/builds/:buildId/pattern', access: { shopRole: 'editor' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/patterns/:patternId/faces', access: { shopRole: 'viewer' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/pieces', access: { shopRole: 'viewer' } },
  { method: 'PATCH', path: '/api/shops/:shopId/builds/:buildId/pieces/:label', access: { shopRole: 'editor' } },
  { method: 'PATCH', path: '/api/shops/:shopId/builds/:buildId/pieces/:label/progress', access: { shopRole: 'editor' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/pieces/:label/notes', access: { shopRole: 'viewer' } },
  { method: 'POST', path: '/api/shops/:shopId/builds/:buildId/pieces/:label/notes', access: { shopRole: 'editor' } },
  { method: 'GET', path: '/api/shops/:shopId/stock', access: { shopRole: 'viewer' } },
  { method: 'PUT', path: '/api/shops/:shopId/stock', access: { shopRole: 'editor' } },
  { method: 'POST', path: '/api/shops/:shopId/builds/:buildId/sheet-plans', access: { shopRole: 'editor' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/sheet-plans', access: { shopRole: 'viewer' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/sheet-plans/:planId', access: { shopRole: 'viewer' } },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/bench', access: { shopRole: 'viewer' } },
];

const ROLE_RANK: Record<Role, number> = { viewer: 1, editor: 2, owner: 3 };

/** Returns whether `role` is at least `needed` in the order viewer < editor < owner. */
export function roleAtLeast(role: Role, needed: Role): boolean {
  return ROLE_RANK[role] >= ROLE_RANK[needed];
}

/** Returns the rule as one readable word, e.g. "public" or "shop editor" (for messages and test names). */
export function describeAccess(rule: AccessRule): string {
  return typeof rule === 'string' ? rule : `shop ${rule.shopRole}`;
}

/** Returns whether two rules are the same. */
export function sameAccess(a: AccessRule, b: AccessRule): boolean {
  return describeAccess(a) === describeAccess(b);
}

export interface Caller {
  signedIn: boolean;
  isAdmin: boolean;
  /** The caller's role in the shop the route names; null when not a member or no shop is named. */
  shopRole: Role | null;
}

export type AccessDecision = 'allow' | 'unauthenticated' | 'forbidden';

/**
 * Returns whether `caller` may make a `method` request under `rule`. Admins read any shop but write only
 * where they are members, so a slip in the admin screens cannot change a shop's work.
 */
export function decideAccess(rule: AccessRule, method: HttpMethod, caller: Caller): AccessDecision {
  if (rule === 'public') return 'allow';
  if (!caller.signedIn) return 'unauthenticated';
  if (rule === 'signedIn') return 'allow';
  if (rule === 'admin') return caller.isAdmin ? 'allow' : 'forbidden';
  if (caller.shopRole && roleAtLeast(caller.shopRole, rule.shopRole)) return 'allow';
  if (caller.isAdmin && method === 'GET') return 'allow';
  return 'forbidden';
}

/**
 * Routes a viewer (a commission client) may call only when the shop's owner granted them print sets
 * (memberships.canSeePrintSets); owners, editors and site admins are not affected. The guard enforces it and the
 * access walk reads it, so the rule is written once.
 */
export const PRINT_SET_GRANT_ROUTES: readonly { method: HttpMethod; path: string }[] = [
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/print-sets' },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/print-sets/:printSetId' },
  { method: 'GET', path: '/api/shops/:shopId/builds/:buildId/print-sets/:printSetId/files/:fileName' },
];

/** Returns whether a viewer needs the print-set grant for `method` on the route pattern `path`. */
export function needsPrintSetGrant(method: HttpMethod, path: string | undefined): boolean {
  return PRINT_SET_GRANT_ROUTES.some((r) => r.method === method && r.path === path);
}
