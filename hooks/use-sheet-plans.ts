/**
 * A build's sheet plans: the pattern's pieces nested on the shop's stock sheets, made by a worker job.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { SheetPlan } from '../geometry/layout/plan-sheets';
import { ApiError, apiRequest } from './api-client';
import { JOB_POLL_MS, JOB_STATES, buildApiPath, isJobActive } from './use-pattern';

const id = z.union([z.string().min(1), z.number().int()]).transform(String);
const timestamp = z.string().refine((s) => !Number.isNaN(Date.parse(s)), 'expected an ISO 8601 date-time');

/** A finished plan as geometry/layout/plan-sheets.ts makes it; the parts the preview reads are checked. */
/** `currency` is the one the server priced the plan in (the shop's stock currency). */
export type StoredSheetPlan = SheetPlan & { currency?: string };

const sheetPlanDataSchema = z.custom<StoredSheetPlan>((v) => {
  if (!v || typeof v !== 'object') return false;
  const p = v as Partial<StoredSheetPlan>;
  return Array.isArray(p.sheets) && Array.isArray(p.placements) && Array.isArray(p.byThickness) && typeof p.totalCost === 'number';
}, 'expected a sheet plan with sheets, placements, byThickness and totalCost');

export const sheetPlanViewSchema = z.object({
  id,
  patternId: id,
  status: z.enum(JOB_STATES),
  progress: z.number().nullable().optional().transform((v) => v ?? null),
  stage: z.string().nullable().optional().transform((v) => v ?? null),
  error: z.string().nullable().optional().transform((v) => v ?? null),
  plan: sheetPlanDataSchema.nullable().optional().transform((v) => v ?? null),
  createdAt: timestamp,
  finishedAt: timestamp.nullable().optional().transform((v) => v ?? null),
});
export type SheetPlanView = z.infer<typeof sheetPlanViewSchema>;

export const sheetPlansQueryKey = (shopId: string, buildId: string) => ['shops', shopId, 'builds', buildId, 'sheet-plans'] as const;
const plansPath = (shopId: string, buildId: string) => `${buildApiPath(shopId, buildId)}/sheet-plans`;

/** GET .../sheet-plans, newest first; polls every 2 s while the newest plan is queued or running. */
export function useSheetPlans(shopId: string, buildId: string) {
  return useQuery({
    queryKey: sheetPlansQueryKey(shopId, buildId),
    queryFn: async () =>
      [...(await apiRequest('GET', plansPath(shopId, buildId), z.object({ sheetPlans: z.array(sheetPlanViewSchema) }))).sheetPlans].sort(
        (a, b) => Date.parse(b.createdAt) - Date.parse(a.createdAt),
      ),
    refetchInterval: (query) => (isJobActive(query.state.data?.[0]?.status) ? JOB_POLL_MS : false),
    retry: (count, error) => count < 2 && !(error instanceof ApiError && (error.status === 404 || error.status === 403)),
  });
}

/** POST .../sheet-plans `{ patternId, gapMm?, spares?, sparesFor? }` (db/validation-bench.ts sheetPlanCreateBody) → the queued plan, put at the head of the list. */
export function useCreateSheetPlan(shopId: string, buildId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: { patternId: string; gapMm?: number; spares?: number; sparesFor?: 'repeated' | 'all' }) =>
      (await apiRequest('POST', plansPath(shopId, buildId), z.object({ sheetPlan: sheetPlanViewSchema }), body)).sheetPlan,
    onSuccess: (plan) => {
      qc.setQueryData<SheetPlanView[]>(sheetPlansQueryKey(shopId, buildId), (old) => [plan, ...(old ?? []).filter((p) => p.id !== plan.id)]);
      return qc.invalidateQueries({ queryKey: sheetPlansQueryKey(shopId, buildId) });
    },
  });
}
