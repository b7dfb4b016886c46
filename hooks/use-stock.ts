/**
 * The shop's stock sheets per foam thickness (sheet name, size in mm, price), which the sheet planner nests on.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { StockReplaceBody } from '../db/validation-bench';
import { apiRequest } from './api-client';

export const stockSheetSchema = z.object({
  thicknessMm: z.number(),
  name: z.string(),
  widthMm: z.number(),
  heightMm: z.number(),
  price: z.number(),
  currency: z.string(),
});
export type StockSheet = z.infer<typeof stockSheetSchema>;

const stockListSchema = z.object({ stock: z.array(stockSheetSchema.extend({ source: z.enum(['shop', 'default']).optional() })) });

export const stockQueryKey = (shopId: string) => ['shops', shopId, 'stock'] as const;
const stockPath = (shopId: string) => `/api/shops/${encodeURIComponent(shopId)}/stock`;

/** GET /api/shops/:shopId/stock, ordered by thickness. */
export function useStock(shopId: string) {
  return useQuery({
    queryKey: stockQueryKey(shopId),
    queryFn: async () => [...(await apiRequest('GET', stockPath(shopId), stockListSchema)).stock].sort((a, b) => a.thicknessMm - b.thicknessMm),
  });
}

/** PUT /api/shops/:shopId/stock with the whole list (it replaces the shop's list); resolves to the saved list. */
export function useSaveStock(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: StockReplaceBody) => (await apiRequest('PUT', stockPath(shopId), stockListSchema, body)).stock,
    onSuccess: (stock) => qc.setQueryData(stockQueryKey(shopId), [...stock].sort((a, b) => a.thicknessMm - b.thicknessMm)),
  });
}
