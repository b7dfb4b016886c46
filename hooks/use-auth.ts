/**
 * Sign up, sign in and sign out. Each keeps the cached `me` in step so the route guards react at once.
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SignInBody, SignUpBody } from '../db/validation';
import { apiRequest } from './api-client';
import { meSchema } from './api-types';
import { meQueryKey } from './use-me';

/** POST /api/auth/signup; on success the new person is cached as `me` (with their own shop as owner). */
export function useSignUp() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SignUpBody) => apiRequest('POST', '/api/auth/signup', meSchema, body),
    onSuccess: (me) => qc.setQueryData(meQueryKey, me),
  });
}

/** POST /api/auth/signin; on success the person is cached as `me`. Errors: BAD_CREDENTIALS (401), RATE_LIMITED (429). */
export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: SignInBody) => apiRequest('POST', '/api/auth/signin', meSchema, body),
    onSuccess: (me) => qc.setQueryData(meQueryKey, me),
  });
}

/**
 * POST /api/auth/signout; afterwards `me` becomes `null` and every other cached answer is dropped, so nothing
 * of the last person's shops stays in memory. (`me` is set rather than removed: the guards are watching it.)
 */
export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => apiRequest('POST', '/api/auth/signout', null),
    onSuccess: () => {
      qc.setQueryData(meQueryKey, null);
      qc.removeQueries({ predicate: (q) => q.queryKey[0] !== meQueryKey[0] });
    },
  });
}
