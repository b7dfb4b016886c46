/**
 * What each shop role may do with builds, as the client shows it. The server enforces the same rules; the
 * client only hides controls that would be refused.
 */
import type { Role } from '../db/validation';

export interface BuildPermissions {
  create: boolean;
  rename: boolean;
  delete: boolean;
}

/**
 * Returns the build actions open to `role`, per issue 2's roles: an owner may do everything, an editor (crew)
 * may create and rename but not delete, a viewer (client) may only look.
 */
export function buildPermissionsFor(role: Role): BuildPermissions {
  switch (role) {
    case 'owner':
      return { create: true, rename: true, delete: true };
    case 'editor':
      return { create: true, rename: true, delete: false };
    case 'viewer':
      return { create: false, rename: false, delete: false };
  }
}

/** Words a maker reads beside a role, in the product's own terms. */
export const roleLabels: Record<Role, { name: string; blurb: string }> = {
  owner: { name: 'Owner', blurb: 'Runs the shop: every build, every change.' },
  editor: { name: 'Crew', blurb: 'Works on builds; cannot delete them.' },
  viewer: { name: 'Client', blurb: 'Follows builds; cannot change them.' },
};
