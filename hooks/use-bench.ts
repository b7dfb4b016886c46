/**
 * The bench view's data: the pattern (pieces, seams, cautions), the crew's piece rows kept fresh so other
 * members' ticks appear within BENCH_REFRESH_MS, and the spare copies the server's bench view counts from the
 * newest sheet plan.
 */
import { useQuery } from '@tanstack/react-query';
import { useMemo } from 'react';
import { z } from 'zod';
import { piecesByThickness } from '../components/bench/bench-model';
import { apiRequest } from './api-client';
import { buildApiPath, usePattern } from './use-pattern';
import { BENCH_REFRESH_MS, usePieces } from './use-pieces';

const benchSparesSchema = z.object({
  bench: z.object({
    thicknesses: z.array(z.object({ pieces: z.array(z.object({ label: z.string(), spares: z.number().int().min(0) })) })),
  }),
});

/**
 * GET .../bench, read only for the spare copies per piece label. The bench works without it (no spares shown),
 * so a failure here is not retried.
 */
function useBenchSpares(shopId: string, buildId: string) {
  return useQuery({
    queryKey: ['shops', shopId, 'builds', buildId, 'bench-spares'],
    retry: false,
    queryFn: async () => {
      const { bench } = await apiRequest('GET', `${buildApiPath(shopId, buildId)}/bench`, benchSparesSchema);
      return new Map(bench.thicknesses.flatMap((t) => t.pieces.map((p) => [p.label, p.spares] as const)));
    },
  });
}

/**
 * Returns the pattern query, the pieces query (refetched every 10 s) and the pieces grouped by thickness with
 * their checklist and spares (empty until both have loaded and the pattern has a document).
 */
export function useBench(shopId: string, buildId: string) {
  const pattern = usePattern(shopId, buildId);
  const pieces = usePieces(shopId, buildId, BENCH_REFRESH_MS);
  const spares = useBenchSpares(shopId, buildId);
  const doc = pattern.data?.doc ?? null;
  const groups = useMemo(() => (doc ? piecesByThickness(doc, pieces.data ?? [], spares.data) : []), [doc, pieces.data, spares.data]);
  return { pattern, pieces, doc, groups };
}
