/**
 * A build's print sets (tiled PDF, SVG, DXF and bench card, rendered by a worker job) and the request for a new
 * one from a stored pattern.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import { ApiError, apiRequest } from './api-client';
import { JOB_POLL_MS, JOB_STATES, buildApiPath, isJobActive } from './use-pattern';

const id = z.union([z.string().min(1), z.number().int()]).transform(String);
const timestamp = z.string().refine((s) => !Number.isNaN(Date.parse(s)), 'expected an ISO 8601 date-time');

/** Page sizes of a tiled print (ISO 216 A4 and A3, ANSI Letter and Tabloid), as the print-set job names them. */
export const PRINT_PAGES = ['a4', 'letter', 'a3', 'tabloid'] as const;
export type PrintPage = (typeof PRINT_PAGES)[number];
export const PRINT_MODES = ['tiled', 'piece-per-page', 'stock-sheet'] as const;
export type PrintMode = (typeof PRINT_MODES)[number];
export const PRINT_FORMATS = ['pdf', 'svg', 'dxf'] as const;
export type PrintFormat = (typeof PRINT_FORMATS)[number];

export const printSetViewSchema = z.object({
  id,
  name: z.string(),
  status: z.enum(JOB_STATES),
  formats: z.array(z.string()),
  page: z.string(),
  mode: z.string(),
  pieceCount: z.number().int(),
  files: z.array(z.object({ name: z.string(), sizeBytes: z.number(), contentType: z.string(), url: z.string() })),
  error: z.string().nullable(),
  createdAt: timestamp,
  finishedAt: timestamp.nullable(),
});
export type PrintSetView = z.infer<typeof printSetViewSchema>;

export const printSetsQueryKey = (shopId: string, buildId: string) => ['shops', shopId, 'builds', buildId, 'print-sets'] as const;
const setsPath = (shopId: string, buildId: string) => `${buildApiPath(shopId, buildId)}/print-sets`;

/** GET .../print-sets, newest first; polls every 2 s while any is queued or running. */
export function usePrintSets(shopId: string, buildId: string) {
  return useQuery({
    queryKey: printSetsQueryKey(shopId, buildId),
    queryFn: async () =>
      [...(await apiRequest('GET', setsPath(shopId, buildId), z.object({ printSets: z.array(printSetViewSchema) }))).printSets].sort(
        (a, b) => Date.parse(b.createdAt) - Date.parse(a.createdAt),
      ),
    refetchInterval: (query) => (query.state.data?.some((p) => isJobActive(p.status)) ? JOB_POLL_MS : false),
    retry: (count, error) => count < 2 && !(error instanceof ApiError && (error.status === 404 || error.status === 403)),
  });
}

/** POST .../print-sets `{ patternId, formats, page, mode }` → the queued print set, put at the head of the list. */
export function useCreatePrintSet(shopId: string, buildId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: { patternId: string; formats: PrintFormat[]; page: PrintPage; mode: PrintMode }) =>
      (await apiRequest('POST', setsPath(shopId, buildId), z.object({ printSet: printSetViewSchema }), body)).printSet,
    onSuccess: (set) => {
      qc.setQueryData<PrintSetView[]>(printSetsQueryKey(shopId, buildId), (old) => [set, ...(old ?? []).filter((p) => p.id !== set.id)]);
      return qc.invalidateQueries({ queryKey: printSetsQueryKey(shopId, buildId) });
    },
  });
}
