import { describe, expect, it } from 'vitest';
import { ROLES } from '../../db/validation';
import { buildPermissionsFor } from '../../hooks/role-permissions';

// The role table is issue 2 / the H2 brief: "viewer: no create/rename/delete; editor: no delete; owner: all".
const expected = {
  owner: { create: true, rename: true, delete: true },
  editor: { create: true, rename: true, delete: false },
  viewer: { create: false, rename: false, delete: false },
} as const;

describe('buildPermissionsFor', () => {
  it.each(ROLES)('matches the issue-2 role table for %s', (role) => {
    expect(buildPermissionsFor(role)).toEqual(expected[role]);
  });

  it('never lets a lower role do what a higher one cannot (owner ⊇ editor ⊇ viewer)', () => {
    const [owner, editor, viewer] = (['owner', 'editor', 'viewer'] as const).map(buildPermissionsFor);
    for (const action of ['create', 'rename', 'delete'] as const) {
      expect(!viewer[action] || editor[action]).toBe(true);
      expect(!editor[action] || owner[action]).toBe(true);
    }
  });
});
