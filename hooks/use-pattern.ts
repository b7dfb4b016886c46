/**
 * A build's pattern (the flattened pieces of its newest sculpt) and the per-face file that ties the 3D view to
 * the pieces: which piece each face belongs to and how much it stretches.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { PatternDoc } from '../geometry/pattern/pattern-doc';
import type { PatternFaceMaps } from '../geometry/pattern/build-pattern';
import { decodePatternFaces } from '../geometry/pattern/pattern-faces-file';
import { ApiError, apiRequest, fetchBytes } from './api-client';

const id = z.union([z.string().min(1), z.number().int()]).transform(String);
const timestamp = z.string().refine((s) => !Number.isNaN(Date.parse(s)), 'expected an ISO 8601 date-time');

/** Work states the server's job rows go through (CONTRACTS.md, SculptView and PatternView). */
export const JOB_STATES = ['queued', 'running', 'done', 'failed'] as const;
export type JobState = (typeof JOB_STATES)[number];

/**
 * A pattern document as the API sends it. The server built it with the engine, so only the parts the screens
 * read are checked here (pieces with label and outline, seams with label and bevel); the rest passes through.
 */
const patternDocSchema = z.custom<PatternDoc>((value) => {
  if (!value || typeof value !== 'object') return false;
  const doc = value as { pieces?: unknown; seams?: unknown; warnings?: unknown };
  if (!Array.isArray(doc.pieces) || !Array.isArray(doc.seams)) return false;
  const piecesOk = doc.pieces.every(
    (p: unknown) => !!p && typeof (p as { label?: unknown }).label === 'string' && Array.isArray((p as { outline?: unknown }).outline),
  );
  const seamsOk = doc.seams.every(
    (s: unknown) => !!s && typeof (s as { label?: unknown }).label === 'string' && typeof (s as { bevel?: unknown }).bevel === 'object',
  );
  return piecesOk && seamsOk;
}, 'expected a pattern document with pieces (label, outline) and seams (label, bevel)');

export const patternViewSchema = z.object({
  id,
  sculptId: id,
  seamRevision: z.number().int(),
  status: z.enum(JOB_STATES),
  progress: z.number().min(0).max(100).nullable().optional().transform((p) => p ?? 0),
  stage: z.string().nullable().optional().transform((s) => s ?? null),
  error: z.string().nullable().optional().transform((s) => s ?? null),
  doc: patternDocSchema.nullable(),
  facesUrl: z.string().nullable(),
  createdAt: timestamp,
  finishedAt: timestamp.nullable(),
});
export type PatternView = z.infer<typeof patternViewSchema>;

const patternEnvelopeSchema = z.object({ pattern: patternViewSchema.nullable() });
const patternQueuedSchema = z.object({ pattern: patternViewSchema });

/** True while a job of this state is still to finish, so the screen keeps asking. */
export function isJobActive(status: JobState | null | undefined): boolean {
  return status === 'queued' || status === 'running';
}

/** How often a queued or running job is polled, ms (the brief: every 2 s). */
export const JOB_POLL_MS = 2_000;

/** Query key of a build's pattern; piece and bench keys of the same build sit beside it. */
export const patternQueryKey = (shopId: string, buildId: string) => ['shops', shopId, 'builds', buildId, 'pattern'] as const;

/** `/api/shops/:shopId/builds/:buildId` with both ids escaped. */
export const buildApiPath = (shopId: string, buildId: string) =>
  `/api/shops/${encodeURIComponent(shopId)}/builds/${encodeURIComponent(buildId)}`;

/**
 * GET /api/shops/:shopId/builds/:buildId/pattern → the newest pattern of the newest sculpt, or `null` when the
 * build has none yet. Polls every 2 s while the pattern job is queued or running, and stops once it is done or
 * failed. A 404 or 403 is not retried.
 */
export function usePattern(shopId: string, buildId: string) {
  return useQuery({
    queryKey: patternQueryKey(shopId, buildId),
    queryFn: async () => (await apiRequest('GET', `${buildApiPath(shopId, buildId)}/pattern`, patternEnvelopeSchema)).pattern,
    refetchInterval: (query) => (isJobActive(query.state.data?.status) ? JOB_POLL_MS : false),
    retry: (count, error) => count < 2 && !(error instanceof ApiError && (error.status === 404 || error.status === 403)),
  });
}

/** POST /api/shops/:shopId/builds/:buildId/pattern: flatten again from the current seams and piece settings. */
export function useRequeuePattern(shopId: string, buildId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async () => (await apiRequest('POST', `${buildApiPath(shopId, buildId)}/pattern`, patternQueuedSchema)).pattern,
    onSuccess: (pattern) => qc.setQueryData(patternQueryKey(shopId, buildId), pattern),
  });
}

/** The decoded faces file: for each face of the working mesh, its piece (index into `doc.pieces`, −1 none) and stretch %. */
export type PatternFaces = PatternFaceMaps;
export { decodePatternFaces };

/**
 * Fetches and decodes a pattern's faces file from `url` (a pattern's `facesUrl`); disabled while `url` is null.
 * The file never changes for one pattern id, so it is kept as long as it is used.
 */
export function usePatternFaces(url: string | null) {
  return useQuery({
    queryKey: ['pattern-faces', url ?? ''],
    enabled: url !== null,
    staleTime: Infinity,
    queryFn: (): Promise<PatternFaces> => fetchBytes(url!, decodePatternFaces, "The pattern's faces file"),
  });
}

/** The engine's stretch budget when a seam set names none, percent (geometry/pattern/build-pattern.ts default). */
export const DEFAULT_STRETCH_BUDGET_PCT = 3;

/**
 * The stretch budget of the sculpt's seam set (GET .../sculpts/:sculptId/seams, `stretchBudgetPct`), which decides
 * when a piece is "over budget". Until it loads, or when the seam set cannot be read, the engine's default 3 %.
 */
export function useStretchBudget(shopId: string, buildId: string, sculptId: string | null): number {
  const seams = useQuery({
    queryKey: ['shops', shopId, 'builds', buildId, 'sculpts', sculptId ?? '', 'seams'],
    enabled: sculptId !== null,
    retry: false,
    queryFn: async () =>
      (
        await apiRequest(
          'GET',
          `${buildApiPath(shopId, buildId)}/sculpts/${encodeURIComponent(sculptId!)}/seams`,
          z.object({ seams: z.object({ stretchBudgetPct: z.number().positive() }) }),
        )
      ).seams.stretchBudgetPct,
  });
  return seams.data ?? DEFAULT_STRETCH_BUDGET_PCT;
}
