/**
 * A shop's builds: list, one build, create, rename, delete.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { BuildCreateBody, BuildRenameBody } from '../db/validation';
import { ApiError, apiRequest } from './api-client';
import { buildEnvelopeSchema, buildListSchema, type Build } from './api-types';

/** Query key of a shop's build list; one build's key extends it so invalidating the list refreshes both. */
export const buildsQueryKey = (shopId: string) => ['shops', shopId, 'builds'] as const;
const buildQueryKey = (shopId: string, buildId: string) => [...buildsQueryKey(shopId), buildId] as const;

const shopPath = (shopId: string) => `/api/shops/${encodeURIComponent(shopId)}/builds`;
const buildPath = (shopId: string, buildId: string) => `${shopPath(shopId)}/${encodeURIComponent(buildId)}`;

/**
 * Orders builds newest first by creation time; equal times fall back to name so the order is stable.
 * Returns a new array; the input is not changed.
 */
export function sortBuildsNewestFirst(builds: readonly Build[]): Build[] {
  return [...builds].sort((a, b) => Date.parse(b.createdAt) - Date.parse(a.createdAt) || a.name.localeCompare(b.name));
}

/** GET /api/shops/:shopId/builds, newest first. Disabled until a shop is chosen (`shopId` null). */
export function useBuilds(shopId: string | null) {
  return useQuery({
    queryKey: buildsQueryKey(shopId ?? ''),
    queryFn: async () => sortBuildsNewestFirst((await apiRequest('GET', shopPath(shopId!), buildListSchema)).builds),
    enabled: shopId !== null,
  });
}

/** GET /api/shops/:shopId/builds/:buildId. */
export function useBuild(shopId: string, buildId: string) {
  return useQuery({
    queryKey: buildQueryKey(shopId, buildId),
    queryFn: async () => (await apiRequest('GET', buildPath(shopId, buildId), buildEnvelopeSchema)).build,
    retry: (count, error) => count < 2 && !(error instanceof ApiError && (error.status === 404 || error.status === 403)),
  });
}

/** POST /api/shops/:shopId/builds; the list is refreshed afterwards. Resolves to the new build. */
export function useCreateBuild(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: BuildCreateBody) => (await apiRequest('POST', shopPath(shopId), buildEnvelopeSchema, body)).build,
    onSuccess: (build) => {
      qc.setQueryData(buildQueryKey(shopId, build.id), build);
      return qc.invalidateQueries({ queryKey: buildsQueryKey(shopId), exact: true });
    },
  });
}

/** PATCH /api/shops/:shopId/builds/:buildId with a new name; the build and the list are refreshed. */
export function useRenameBuild(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ buildId, body }: { buildId: string; body: BuildRenameBody }) =>
      (await apiRequest('PATCH', buildPath(shopId, buildId), buildEnvelopeSchema, body)).build,
    onSuccess: (build) => {
      qc.setQueryData(buildQueryKey(shopId, build.id), build);
      return qc.invalidateQueries({ queryKey: buildsQueryKey(shopId), exact: true });
    },
  });
}

/** DELETE /api/shops/:shopId/builds/:buildId; the build leaves the cache and the list is refreshed. */
export function useDeleteBuild(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (buildId: string) => apiRequest('DELETE', buildPath(shopId, buildId), null),
    onSuccess: (_void, buildId) => {
      qc.removeQueries({ queryKey: buildQueryKey(shopId, buildId), exact: true });
      return qc.invalidateQueries({ queryKey: buildsQueryKey(shopId), exact: true });
    },
  });
}
