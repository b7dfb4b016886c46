/**
 * The shop's stock sheets per foam thickness (sheet name, size in mm, price), which the sheet planner nests on.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
import type { StockReplaceBody } from '../db/validation-bench';
import { ApiError, apiErrorFromResponse, apiRequest } from './api-client';

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

/**
 * PUT /api/shops/:shopId/stock with the whole list (it replaces the shop's list). The app's request helper has
 * no PUT, so this one call is made here with the same error handling (ApiError from the server's error shape).
 */
export function useSaveStock(shopId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: async (body: StockReplaceBody) => {
      let res: Response;
      try {
        res = await fetch(stockPath(shopId), {
          method: 'PUT',
          credentials: 'same-origin',
          headers: { Accept: 'application/json', 'Content-Type': 'application/json' },
          body: JSON.stringify(body),
        });
      } catch {
        throw new ApiError(0, 'NETWORK', 'Cannot reach the Sheetsmith server. Check your connection and try again.');
      }
      let parsed: unknown;
      try {
        parsed = await res.json();
      } catch {
        parsed = undefined;
      }
      if (!res.ok) throw apiErrorFromResponse(res.status, parsed);
      const checked = stockListSchema.safeParse(parsed);
      if (!checked.success) throw new ApiError(res.status, 'BAD_RESPONSE', "The server's answer to saving the stock was not understood.");
      return checked.data.stock;
    },
    onSuccess: (stock) => qc.setQueryData(stockQueryKey(shopId), [...stock].sort((a, b) => a.thicknessMm - b.thicknessMm)),
  });
}
