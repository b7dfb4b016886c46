/**
 * Who is signed in, and in which shops with which role.
 */
import { useQuery } from '@tanstack/react-query';
import { ApiError, apiRequest } from './api-client';
import { meSchema, type Me } from './api-types';

export const meQueryKey = ['me'] as const;

/** Fetches GET /api/me; resolves to `null` when signed out (401), throws ApiError otherwise. */
export async function fetchMe(): Promise<Me | null> {
  try {
    return await apiRequest('GET', '/api/me', meSchema);
  } catch (e) {
    if (e instanceof ApiError && e.status === 401) return null;
    throw e;
  }
}

/**
 * The signed-in person and their memberships (`data` is `null` when signed out, `undefined` while loading).
 * Network failures are retried twice; a signed-out answer is not an error and is not retried.
 */
export function useMe() {
  return useQuery({ queryKey: meQueryKey, queryFn: fetchMe, staleTime: 60_000, retry: 2 });
}
