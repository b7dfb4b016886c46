/**
 * The bench view's data: the pattern (pieces, seams, cautions) and the crew's piece rows, kept fresh so other
 * members' ticks appear within BENCH_REFRESH_MS.
 */
import { useMemo } from 'react';
import { piecesByThickness } from '../components/bench/bench-model';
import { usePattern } from './use-pattern';
import { BENCH_REFRESH_MS, usePieces } from './use-pieces';

/**
 * Returns the pattern query, the pieces query (refetched every 10 s) and the pieces grouped by thickness with
 * their checklist (empty until both have loaded and the pattern has a document).
 */
export function useBench(shopId: string, buildId: string) {
  const pattern = usePattern(shopId, buildId);
  const pieces = usePieces(shopId, buildId, BENCH_REFRESH_MS);
  const doc = pattern.data?.doc ?? null;
  const groups = useMemo(() => (doc ? piecesByThickness(doc, pieces.data ?? []) : []), [doc, pieces.data]);
  return { pattern, pieces, doc, groups };
}
