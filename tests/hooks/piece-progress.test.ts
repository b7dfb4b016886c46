import { QueryClient } from '@tanstack/react-query';
import { describe, expect, it } from 'vitest';
import { applyProgress, piecesQueryKey, type PieceState } from '../../hooks/use-pieces';

const row = (label: string, over: Partial<PieceState> = {}): PieceState => ({
  label,
  thicknessMm: 6,
  surface: 'outer',
  quantity: 1,
  mirrored: false,
  cut: false,
  shaped: false,
  glued: false,
  stale: false,
  updatedAt: null,
  updatedBy: null,
  notes: 0,
  ...over,
});

describe('applyProgress (the optimistic tick)', () => {
  it('changes only the named piece and only the fields sent, leaving the input untouched', () => {
    const before = [row('A'), row('B', { cut: true })];
    const after = applyProgress(before, 'B', { glued: true });
    expect(after.map((p) => [p.label, p.cut, p.shaped, p.glued])).toEqual([
      ['A', false, false, false],
      ['B', true, false, true],
    ]);
    expect(after[0]).toBe(before[0]);
    expect(before[1].glued).toBe(false);
  });

  it('leaves the list as it was for a label it does not have', () => {
    const before = [row('A')];
    expect(applyProgress(before, 'Z', { cut: true })).toEqual(before);
  });

  it('round-trips through the query cache under the pieces key, so a rollback restores the exact list', () => {
    // The snapshot taken before the optimistic write is what usePieceProgress puts back on error; the cache then
    // holds the same content (TanStack Query's structural sharing may hand back equal, not identical, objects).
    const qc = new QueryClient();
    const key = piecesQueryKey('s1', 'b1');
    const before = [row('A')];
    qc.setQueryData(key, before);
    qc.setQueryData(key, applyProgress(before, 'A', { cut: true }));
    expect(qc.getQueryData<PieceState[]>(key)![0].cut).toBe(true);
    qc.setQueryData(key, before);
    expect(qc.getQueryData(key)).toEqual(before);
  });
});
