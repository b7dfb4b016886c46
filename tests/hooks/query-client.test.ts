import { afterEach, describe, expect, it } from 'vitest';
import { ApiError } from '../../hooks/api-client';
import type { Me } from '../../hooks/api-types';
import { createAppQueryClient } from '../../hooks/query-client';
import { meQueryKey } from '../../hooks/use-me';

// Issue 2's API answers 401 UNAUTHENTICATED when the session token is missing, expired or tampered with; the
// client must then treat the person as signed out (RFC 9110 §15.5.2: 401 means the request lacks valid
// credentials). Other failures (403 FORBIDDEN, 500) must not sign anyone out.

const me: Me = { user: { id: 'u1', email: 'a@b.co', name: 'A', isAdmin: false }, memberships: [] };
let client = createAppQueryClient();
afterEach(() => client.clear());

async function failQuery(error: ApiError) {
  await client.fetchQuery({ queryKey: ['shops', 's1', 'builds'], queryFn: () => Promise.reject(error), retry: false }).catch(() => undefined);
}

describe('createAppQueryClient', () => {
  it('marks the person signed out when a query is answered 401', async () => {
    client = createAppQueryClient();
    client.setQueryData(meQueryKey, me);
    await failQuery(new ApiError(401, 'UNAUTHENTICATED', 'Sign in first.'));
    expect(client.getQueryData(meQueryKey)).toBeNull();
  });

  it('marks the person signed out when a mutation is answered 401', async () => {
    client = createAppQueryClient();
    client.setQueryData(meQueryKey, me);
    const m = client.getMutationCache().build(client, { mutationFn: () => Promise.reject(new ApiError(401, 'UNAUTHENTICATED', 'x')) });
    await m.execute(undefined).catch(() => undefined);
    expect(client.getQueryData(meQueryKey)).toBeNull();
  });

  it.each([403, 404, 500, 0])('keeps the person signed in after a %i', async (status) => {
    client = createAppQueryClient();
    client.setQueryData(meQueryKey, me);
    await failQuery(new ApiError(status, `HTTP_${status}`, 'x'));
    expect(client.getQueryData(meQueryKey)).toEqual(me);
  });

  it('does not retry a failed mutation (a create must not run twice)', async () => {
    client = createAppQueryClient();
    let calls = 0;
    const m = client.getMutationCache().build(client, {
      mutationFn: () => {
        calls += 1;
        return Promise.reject(new ApiError(0, 'NETWORK', 'x'));
      },
    });
    await m.execute(undefined).catch(() => undefined);
    expect(calls).toBe(1);
  });
});
