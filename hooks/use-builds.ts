/**
 * A shop's builds: list, one build, create, rename, delete.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ROLES, type BuildCreateBody, type BuildRenameBody } from '../db/validation';
import { ApiError, apiRequest } from './api-client';
import { buildEnvelopeSchema, buildSchema, type Build } from './api-types';

const workStatus = z.enum(['queued', 'running', 'done', 'failed']);

/** Stages of a build as the server names them (server/builds/build-progress.ts BUILD_STAGES). */
export const BUILD_STAGES = ['no-sculpt', 'processing', 'marking-seams', 'flattening', 'pieces-ready', 'at-the-bench', 'finished', 'failed'] as const;
export type BuildStage = (typeof BUILD_STAGES)[number];

export const buildSummarySchema = z.object({
  stage: z.enum(BUILD_STAGES),
  sculptVersion: z.number().int().nullable(),
  sculptStatus: workStatus.nullable(),
  sculptProgress: z.number().nullable(),
  patternStatus: workStatus.nullable(),
  pieceCount: z.number().int(),
  progressPct: z.number(),
});
export type BuildSummary = z.infer<typeof buildSummarySchema>;

/** A build as the list sends it: the build and where it stands. */
export const buildListItemSchema = buildSchema.extend({ summary: buildSummarySchema });
export type BuildListItem = z.infer<typeof buildListItemSchema>;
const buildListSchema = z.object({ builds: z.array(buildListItemSchema) });

const benchTotalsSchema = z.object({
  pieces: z.number(),
  cut: z.number(),
  shaped: z.number(),
  glued: z.number(),
  progressPct: z.number(),
  stale: z.number(),
});

/** GET .../builds/:buildId/overview (server/builds/build-overview.ts BuildOverview). */
export const buildOverviewSchema = z.object({
  buildId: z.string(),
  stage: z.enum(BUILD_STAGES),
  pattern: z
    .object({
      id: z.string(),
      status: workStatus,
      progress: z.number(),
      stage: z.string().nullable(),
      error: z.string().nullable(),
      createdAt: z.string(),
      finishedAt: z.string().nullable(),
    })
    .nullable(),
  pieces: z.array(z.object({ label: z.string(), quantity: z.number(), thicknessMm: z.number(), maxStretchPct: z.number(), overBudget: z.boolean() })),
  seamCount: z.number(),
  warnings: z.array(z.string()),
  stretchBudgetPct: z.number().nullable(),
  bench: benchTotalsSchema,
  sheetPlans: z.array(
    z.object({
      id: z.string(),
      patternId: z.string(),
      status: workStatus,
      error: z.string().nullable(),
      sheets: z.number().nullable(),
      usedPct: z.number().nullable(),
      totalCost: z.number().nullable(),
      createdAt: z.string(),
    }),
  ),
  printSets: z
    .array(
      z.object({
        id: z.string(),
        name: z.string(),
        status: workStatus,
        formats: z.array(z.string()),
        page: z.string(),
        files: z.array(z.object({ name: z.string(), sizeBytes: z.number(), contentType: z.string() })),
        error: z.string().nullable(),
        createdAt: z.string(),
      }),
    )
    .nullable(),
  members: z.array(z.object({ userId: z.string(), name: z.string(), role: z.enum(ROLES) })),
});
export type BuildOverview = z.infer<typeof buildOverviewSchema>;

/** Query key of a shop's build list; one build's key extends it so invalidating the list refreshes both. */
export const buildsQueryKey = (shopId: string) => ['shops', shopId, 'builds'] as const;
const buildQueryKey = (shopId: string, buildId: string) => [...buildsQueryKey(shopId), buildId] as const;

const shopPath = (shopId: string) => `/api/shops/${encodeURIComponent(shopId)}/builds`;
const buildPath = (shopId: string, buildId: string) => `${shopPath(shopId)}/${encodeURIComponent(buildId)}`;

/**
 * Orders builds newest first by creation time; equal times fall back to name so the order is stable.
 * Returns a new array; the input is not changed.
 */
export function sortBuildsNewestFirst<B extends Build>(builds: readonly B[]): B[] {
  return [...builds].sort((a, b) => Date.parse(b.createdAt) - Date.parse(a.createdAt) || a.name.localeCompare(b.name));
}

/**
 * GET /api/shops/:shopId/builds, newest first, each with its summary. Disabled until a shop is chosen
 * (`shopId` null). Polls every 3 s while some build's sculpt is being processed.
 */
export function useBuilds(shopId: string | null) {
  return useQuery({
    queryKey: buildsQueryKey(shopId ?? ''),
    queryFn: async () => sortBuildsNewestFirst((await apiRequest('GET', shopPath(shopId!), buildListSchema)).builds),
    enabled: shopId !== null,
    refetchInterval: (q) => (q.state.data?.some((b) => b.summary.stage === 'processing' || b.summary.stage === 'flattening') ? 3000 : false),
  });
}

/**
 * GET .../builds/:buildId/overview: the build page's pieces, checklist, sheet plans, print sets and members.
 * Polls every 3 s while a pattern or sheet plan is being made, so the page follows the jobs.
 */
export function useBuildOverview(shopId: string, buildId: string) {
  return useQuery({
    queryKey: [...buildQueryKey(shopId, buildId), 'overview'],
    queryFn: async () => (await apiRequest('GET', `${buildPath(shopId, buildId)}/overview`, z.object({ overview: buildOverviewSchema }))).overview,
    enabled: shopId !== '',
    refetchInterval: (q) => {
      const o = q.state.data;
      const busy = (s: string) => s === 'queued' || s === 'running';
      return o && (busy(o.pattern?.status ?? '') || o.sheetPlans.some((p) => busy(p.status)) || (o.printSets ?? []).some((p) => busy(p.status))) ? 3000 : false;
    },
    retry: (count, error) => count < 2 && !(error instanceof ApiError && (error.status === 404 || error.status === 403)),
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
