/**
 * The shop's stock sheets per foam thickness (sheet name, size in mm, price), which the sheet planner nests on.
 */
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { z } from 'zod';
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

const stockListSchema = z.object({ stock: z.array(stockSheetSchema.passthrough()) });

/** Largest sheet side accepted, mm: 5 m, beyond any roll sold for props (common practice); a bigger number is a typo. */
export const MAX_SHEET_SIDE_MM = 5_000;

/**
 * The stock form's rules, one sheet: thickness over 0 and at most 100 mm (the engine's piece limit), a name, sides
 * from 50 mm to MAX_SHEET_SIDE_MM, a price of 0 or more, and a three-letter currency code (ISO 4217 form).
 */
export const stockSheetInput = z.object({
  thicknessMm: z.number({ error: 'thickness must be a number of millimetres' }).gt(0, 'thickness must be more than 0 mm').max(100, 'thickness must be at most 100 mm'),
  name: z.string().trim().min(1, 'give the sheet a name, e.g. "6 mm roll 1 m × 2 m"').max(80, 'keep the name under 80 characters'),
  widthMm: z.number({ error: 'width must be a number of millimetres' }).min(50, 'width must be at least 50 mm').max(MAX_SHEET_SIDE_MM, `width must be at most ${MAX_SHEET_SIDE_MM} mm`),
  heightMm: z.number({ error: 'height must be a number of millimetres' }).min(50, 'height must be at least 50 mm').max(MAX_SHEET_SIDE_MM, `height must be at most ${MAX_SHEET_SIDE_MM} mm`),
  price: z.number({ error: 'price must be a number' }).min(0, 'price cannot be negative'),
  currency: z.string().trim().regex(/^[A-Z]{3}$/, 'currency must be a three-letter code such as EUR or USD'),
});
export const stockInput = z
  .object({ sheets: z.array(stockSheetInput).max(50, 'keep the list under 50 sheets') })
  .refine((s) => new Set(s.sheets.map((x) => x.thicknessMm)).size === s.sheets.length, {
    message: 'list each thickness once: the planner buys one kind of sheet per thickness',
    path: ['sheets'],
  });
export type StockInput = z.infer<typeof stockInput>;

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
    mutationFn: async (body: StockInput) => {
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
