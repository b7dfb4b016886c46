/**
 * The app's react-query client, with the one rule every request shares: a 401 means the session is over.
 */
import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';
import { meQueryKey } from './use-me';

/**
 * Returns a QueryClient on which any query or mutation answered 401 (session expired or revoked elsewhere)
 * sets `me` to `null`, so the signed-in layout sends the person to sign in instead of showing a broken page.
 * Failed mutations are not retried (a create must not run twice).
 */
export function createAppQueryClient(): QueryClient {
  const signedOut = (error: unknown) => {
    if (error instanceof ApiError && error.status === 401) client.setQueryData(meQueryKey, null);
  };
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: signedOut }),
    mutationCache: new MutationCache({ onError: signedOut }),
    defaultOptions: { mutations: { retry: false } },
  });
  return client;
}
