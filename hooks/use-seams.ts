/**
 * A sculpt's seam set on the server (GET and PUT .../sculpts/:sculptId/seams, CONTRACTS.md): read it, and save
 * it naming the revision the edit started from so that two people editing at once never overwrite each other.
 */
import { useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import type { SeamPutResult } from '../components/studio/seam-saver';
import type { SeamSetDraft } from '../components/studio/seam-set-edits';
import { ApiError, apiRequest } from './api-client';
import { sculptsPath } from './use-sculpts';

const vertexList = z.array(z.number().int().min(0));

export const seamSetViewSchema = z.object({
  sculptId: z.union([z.string().min(1), z.number().int()]).transform(String),
  revision: z.number().int().min(0),
  seams: z.array(
    z.object({
      id: z.string().min(1),
      picks: vertexList,
      path: vertexList,
      source: z.enum(['picked', 'crease', 'auto', 'mirror', 'carried']),
    }),
  ),
  symmetry: z.object({ normal: z.tuple([z.number(), z.number(), z.number()]), offsetMm: z.number() }).nullable(),
  stretchBudgetPct: z.number().positive(),
  updatedAt: z.string().nullable(),
  updatedBy: z.union([z.string(), z.number()]).nullable(),
});
/** SeamSetView of CONTRACTS.md. */
export type SeamSetView = z.infer<typeof seamSetViewSchema>;

const envelope = z.object({ seams: seamSetViewSchema });
const conflictEnvelope = z.object({ current: seamSetViewSchema });

/** Path of a sculpt's seams. */
export const seamsPath = (shopId: string, buildId: string, sculptId: string) =>
  `${sculptsPath(shopId, buildId)}/${encodeURIComponent(sculptId)}/seams`;

export const seamsQueryKey = (shopId: string, buildId: string, sculptId: string) => ['shops', shopId, 'builds', buildId, 'seams', sculptId] as const;

/** GET .../seams: the sculpt's seam set; disabled while `sculptId` is null. Not refetched behind the editor's back. */
export function useSeams(shopId: string, buildId: string, sculptId: string | null) {
  return useQuery({
    queryKey: seamsQueryKey(shopId, buildId, sculptId ?? ''),
    enabled: sculptId !== null && shopId !== '',
    staleTime: Infinity,
    refetchOnWindowFocus: false,
    queryFn: async () => (await apiRequest('GET', seamsPath(shopId, buildId, sculptId!), envelope)).seams,
  });
}

/**
 * PUT .../seams with `{ baseRevision, seams, symmetry, stretchBudgetPct }`. Resolves `{ ok: true }` with the saved
 * view, or `{ ok: false }` with the server's current view on 409 SEAMS_CHANGED; rejects with an ApiError (whose
 * message says what is wrong) for any other failure.
 */
export async function putSeams(path: string, baseRevision: number, draft: SeamSetDraft): Promise<SeamPutResult<SeamSetView>> {
  const body = { baseRevision, seams: draft.seams, symmetry: draft.symmetry, stretchBudgetPct: draft.stretchBudgetPct };
  try {
    const saved = await apiRequest('PUT', path, envelope, body);
    return { ok: true, revision: saved.seams.revision, view: saved.seams };
  } catch (err) {
    if (err instanceof ApiError && err.status === 409) {
      const conflict = conflictEnvelope.safeParse(err.body);
      if (conflict.success) return { ok: false, current: conflict.data.current, revision: conflict.data.current.revision };
    }
    throw err;
  }
}
