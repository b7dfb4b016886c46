/**
 * A build's sculpt versions (the sculpts API, CONTRACTS.md): the list and one version, polled while its
 * processing job is queued or running.
 */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { ApiError, apiRequest } from './api-client';

const id = z.union([z.string().min(1), z.number().int()]).transform(String);
const workStatus = z.enum(['queued', 'running', 'done', 'failed']);

export const sculptReportSchema = z.object({
  sourceTriangles: z.number(),
  sourceVertices: z.number(),
  weldedVertices: z.number(),
  droppedFaces: z.number(),
  flippedFaces: z.number(),
  nonManifoldEdges: z.number(),
  nonManifoldVertices: z.number(),
  workingTriangles: z.number(),
  workingVertices: z.number(),
  sizeMm: z.tuple([z.number(), z.number(), z.number()]),
  warnings: z.array(z.string()),
});
export type SculptReport = z.infer<typeof sculptReportSchema>;

/** SculptView of CONTRACTS.md. */
export const sculptSchema = z.object({
  id,
  buildId: id,
  version: z.number().int(),
  fileName: z.string(),
  format: z.string(),
  sourceBytes: z.number(),
  units: z.string(),
  scale: z.number(),
  wearer: z.object({ headCircumferenceMm: z.number().nullable(), headHeightMm: z.number().nullable() }).nullable(),
  targetTriangles: z.number(),
  status: workStatus,
  progress: z.number(),
  stage: z.string().nullable(),
  error: z.string().nullable(),
  report: sculptReportSchema.nullable(),
  meshUrl: z.string().nullable(),
  createdAt: z.string(),
  startedAt: z.string().nullable(),
  finishedAt: z.string().nullable(),
  createdBy: id.nullable(),
});
export type Sculpt = z.infer<typeof sculptSchema>;

export const sculptEnvelopeSchema = z.object({ sculpt: sculptSchema });
const sculptListSchema = z.object({ sculpts: z.array(sculptSchema) });

/** Path of a build's sculpts collection. */
export const sculptsPath = (shopId: string, buildId: string) =>
  `/api/shops/${encodeURIComponent(shopId)}/builds/${encodeURIComponent(buildId)}/sculpts`;

export const sculptsQueryKey = (shopId: string, buildId: string) => ['shops', shopId, 'builds', buildId, 'sculpts'] as const;

/** True while a sculpt's processing job has not ended, so its view should be polled. */
export function sculptInProgress(s: Pick<Sculpt, 'status'>): boolean {
  return s.status === 'queued' || s.status === 'running';
}

/**
 * GET .../sculpts: the build's versions, newest first. Polls every 2 s while any version is queued or running.
 * Disabled while `shopId` is empty.
 */
export function useSculpts(shopId: string, buildId: string) {
  return useQuery({
    queryKey: sculptsQueryKey(shopId, buildId),
    queryFn: async () => (await apiRequest('GET', sculptsPath(shopId, buildId), sculptListSchema)).sculpts,
    enabled: shopId !== '',
    refetchInterval: (q) => (q.state.data?.some(sculptInProgress) ? 2000 : false),
    retry: (count, error) => count < 2 && !(error instanceof ApiError && (error.status === 404 || error.status === 403)),
  });
}

/**
 * GET .../sculpts/:sculptId, polled every second while its job is queued or running (the upload page shows the
 * job's progress). Disabled while `sculptId` is null.
 */
export function useSculpt(shopId: string, buildId: string, sculptId: string | null) {
  return useQuery({
    queryKey: [...sculptsQueryKey(shopId, buildId), sculptId ?? ''],
    queryFn: async () => (await apiRequest('GET', `${sculptsPath(shopId, buildId)}/${encodeURIComponent(sculptId!)}`, sculptEnvelopeSchema)).sculpt,
    enabled: sculptId !== null && shopId !== '',
    refetchInterval: (q) => (q.state.data && !sculptInProgress(q.state.data) ? false : 1000),
  });
}
