/**
 * Opening another shop (a person may run or join several).
 */
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ShopCreateBody } from '../db/validation';
import { apiRequest } from './api-client';
import { shopCreatedSchema } from './api-types';
import { meQueryKey } from './use-me';

/** POST /api/shops; afterwards `me` is refetched so the new membership appears. Resolves to `{ shop, role }`. */
export function useCreateShop() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: ShopCreateBody) => apiRequest('POST', '/api/shops', shopCreatedSchema, body),
    onSuccess: () => qc.invalidateQueries({ queryKey: meQueryKey }),
  });
}
