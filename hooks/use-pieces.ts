/**
 * A build's pieces as the crew sees them: the maker's settings per piece (thickness, surface, quantity,
 * mirrored), the shared checklist (cut, shaped, glued) and notes. Settings changes re-flatten the pattern on the
 * server; checklist ticks are shown at once and rolled back when the server refuses them.
 */
import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ApiError, apiRequest } from './api-client';
import { buildApiPath, patternQueryKey } from './use-pattern';

const timestamp = z.string().refine((s) => !Number.isNaN(Date.parse(s)), 'expected an ISO 8601 date-time');
const id = z.union([z.string().min(1), z.number().int()]).transform(String);

export const PIECE_SURFACES = ['outer', 'mid', 'inner'] as const;
export type PieceSurface = (typeof PIECE_SURFACES)[number];

/** One piece's row (CONTRACTS.md PieceStateView); null settings mean "the pattern's default". */
export const pieceStateSchema = z.object({
  label: z.string(),
  thicknessMm: z.number().nullable(),
  surface: z.enum(PIECE_SURFACES).nullable(),
  quantity: z.number().int().nullable(),
  mirrored: z.boolean().nullable(),
  cut: z.boolean(),
  shaped: z.boolean(),
  glued: z.boolean(),
  stale: z.boolean().optional().default(false),
  updatedAt: timestamp.nullable().optional().transform((v) => v ?? null),
  updatedBy: z.string().nullable().optional().transform((v) => v ?? null),
  notes: z.number().int().optional().default(0),
});
export type PieceState = z.infer<typeof pieceStateSchema>;

const pieceListSchema = z.object({ pieces: z.array(pieceStateSchema) });
const pieceEnvelopeSchema = z.object({ piece: pieceStateSchema });

export const pieceNoteSchema = z.object({
  id,
  label: z.string().optional(),
  body: z.string(),
  authorName: z.string().nullable().optional().transform((v) => v ?? null),
  createdAt: timestamp,
});
export type PieceNote = z.infer<typeof pieceNoteSchema>;

/** The three checklist steps, in bench order. */
export const CHECKLIST_STEPS = ['cut', 'shaped', 'glued'] as const;
export type ChecklistStep = (typeof CHECKLIST_STEPS)[number];
export type ProgressPatch = Partial<Record<ChecklistStep, boolean>>;

export interface PieceSettingsPatch {
  thicknessMm?: number;
  surface?: PieceSurface;
  quantity?: number;
  mirrored?: boolean;
}

/** How often the bench asks for the crew's ticks, ms (the brief: another member's change shows within 10 s). */
export const BENCH_REFRESH_MS = 10_000;

export const piecesQueryKey = (shopId: string, buildId: string) => ['shops', shopId, 'builds', buildId, 'pieces'] as const;
const notesQueryKey = (shopId: string, buildId: string, label: string) => [...piecesQueryKey(shopId, buildId), label, 'notes'] as const;
const piecePath = (shopId: string, buildId: string, label: string) => `${buildApiPath(shopId, buildId)}/pieces/${encodeURIComponent(label)}`;

/**
 * Returns `pieces` with the checklist `patch` applied to piece `label` (a new array; other pieces and fields are
 * the same objects). A label that is not in the list leaves the list unchanged.
 */
export function applyProgress(pieces: readonly PieceState[], label: string, patch: ProgressPatch): PieceState[] {
  return pieces.map((p) => (p.label === label ? { ...p, ...patch } : p));
}

/**
 * GET /api/shops/:shopId/builds/:buildId/pieces. `refetchMs` keeps it fresh while the screen is open (the bench
 * passes BENCH_REFRESH_MS so other members' ticks appear).
 */
export function usePieces(shopId: string, buildId: string, refetchMs?: number) {
  return useQuery({
    queryKey: piecesQueryKey(shopId, buildId),
    queryFn: async () => (await apiRequest('GET', `${buildApiPath(shopId, buildId)}/pieces`, pieceListSchema)).pieces,
    refetchInterval: refetchMs ?? false,
    retry: (count, error) => count < 2 && !(error instanceof ApiError && (error.status === 404 || error.status === 403)),
  });
}

function refreshPieceData(qc: QueryClient, shopId: string, buildId: string) {
  return Promise.all([
    qc.invalidateQueries({ queryKey: piecesQueryKey(shopId, buildId) }),
    qc.invalidateQueries({ queryKey: patternQueryKey(shopId, buildId) }),
  ]);
}

/**
 * PATCH .../pieces/:label with new settings; the server re-queues the pattern, so the pieces and the pattern are
 * fetched again afterwards (the pattern then polls while it re-flattens).
 */
export function useUpdatePieceSettings(shopId: string, buildId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ label, patch }: { label: string; patch: PieceSettingsPatch }) => apiRequest('PATCH', piecePath(shopId, buildId, label), null, patch),
    onSettled: () => refreshPieceData(qc, shopId, buildId),
  });
}

/**
 * PATCH .../pieces/:label/progress: ticks or unticks checklist steps. The tick shows at once (optimistic update);
 * when the server refuses or cannot be reached the list goes back to what it was and the mutation's error says
 * why. The list is fetched again either way.
 */
export function usePieceProgress(shopId: string, buildId: string) {
  const qc = useQueryClient();
  const key = piecesQueryKey(shopId, buildId);
  return useMutation({
    mutationFn: async ({ label, patch }: { label: string; patch: ProgressPatch }) =>
      (await apiRequest('PATCH', `${piecePath(shopId, buildId, label)}/progress`, pieceEnvelopeSchema, patch)).piece,
    onMutate: async ({ label, patch }) => {
      await qc.cancelQueries({ queryKey: key });
      const before = qc.getQueryData<PieceState[]>(key);
      if (before) qc.setQueryData<PieceState[]>(key, applyProgress(before, label, patch));
      return { before };
    },
    onError: (_error, _vars, context) => {
      if (context?.before) qc.setQueryData(key, context.before);
    },
    onSuccess: (piece) => {
      const now = qc.getQueryData<PieceState[]>(key);
      if (now) qc.setQueryData<PieceState[]>(key, now.map((p) => (p.label === piece.label ? piece : p)));
    },
    onSettled: () => qc.invalidateQueries({ queryKey: key }),
  });
}

/** GET .../pieces/:label/notes, oldest first as the server sends them; disabled while `label` is null. */
export function usePieceNotes(shopId: string, buildId: string, label: string | null) {
  return useQuery({
    queryKey: notesQueryKey(shopId, buildId, label ?? ''),
    enabled: label !== null,
    queryFn: async () => (await apiRequest('GET', `${piecePath(shopId, buildId, label!)}/notes`, z.object({ notes: z.array(pieceNoteSchema) }))).notes,
    refetchInterval: BENCH_REFRESH_MS,
  });
}

/** POST .../pieces/:label/notes `{ body }`; the piece's notes and the piece list (note counts) are refreshed. */
export function useAddPieceNote(shopId: string, buildId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async ({ label, body }: { label: string; body: string }) =>
      (await apiRequest('POST', `${piecePath(shopId, buildId, label)}/notes`, z.object({ note: pieceNoteSchema }), { body })).note,
    onSuccess: (_note, { label }) =>
      Promise.all([
        qc.invalidateQueries({ queryKey: notesQueryKey(shopId, buildId, label) }),
        qc.invalidateQueries({ queryKey: piecesQueryKey(shopId, buildId), exact: true }),
      ]),
  });
}
