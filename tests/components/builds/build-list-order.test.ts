/**
 * Tests of the builds list's filter and sort (components/builds/build-list-order.ts). The name order follows
 * the Unicode Collation Algorithm at primary strength with numeric ordering (Intl.Collator, ECMA-402 §10),
 * so "Helm 2" sorts before "Helm 10" and case and accents do not change the order.
 */
import { describe, expect, it } from 'vitest';
import { defaultDirection, filterBuilds, sortBuilds } from '../../../components/builds/build-list-order';

const summary = (progressPct: number) => ({
  stage: 'at-the-bench' as const, sculptVersion: 1, sculptStatus: 'done' as const, sculptProgress: 100, patternStatus: 'done' as const, pieceCount: 4, progressPct,
});
const b = (id: string, name: string, updatedAt: string, pct: number) => ({ id, shopId: 's', name, createdAt: updatedAt, updatedAt, summary: summary(pct) });

const list = [
  b('1', 'Helm 10', '2026-03-01T10:00:00.000Z', 50),
  b('2', 'helm 2', '2026-03-03T10:00:00.000Z', 10),
  b('3', 'Épaulière gauche', '2026-03-02T10:00:00.000Z', 90),
  b('4', 'Gorget', '2026-03-02T10:00:00.000Z', 10),
];

describe('filterBuilds', () => {
  it('matches every word in any order, ignoring case and accents', () => {
    expect(filterBuilds(list, 'HELM').map((x) => x.id)).toEqual(['1', '2']);
    expect(filterBuilds(list, 'gauche epaul').map((x) => x.id)).toEqual(['3']);
    expect(filterBuilds(list, 'helm gorget')).toEqual([]);
  });
  it('keeps everything for a blank query', () => {
    expect(filterBuilds(list, '   ').map((x) => x.id)).toEqual(['1', '2', '3', '4']);
  });
});

describe('sortBuilds', () => {
  it('sorts names with numbers read as numbers and case ignored', () => {
    expect(sortBuilds(list, 'name', 'asc').map((x) => x.name)).toEqual(['Épaulière gauche', 'Gorget', 'helm 2', 'Helm 10']);
    expect(sortBuilds(list, 'name', 'desc').map((x) => x.name)).toEqual(['Helm 10', 'helm 2', 'Gorget', 'Épaulière gauche']);
  });
  it('sorts by last change and by progress, ties broken by newest change then id', () => {
    // Builds 3 and 4 changed at the same time: the id breaks the tie in both directions.
    expect(sortBuilds(list, 'updated', 'desc').map((x) => x.id)).toEqual(['2', '3', '4', '1']);
    expect(sortBuilds(list, 'updated', 'asc').map((x) => x.id)).toEqual(['1', '3', '4', '2']);
    // 10 % twice: build 2 changed later than build 4, so it comes first.
    expect(sortBuilds(list, 'progress', 'desc').map((x) => x.id)).toEqual(['3', '1', '2', '4']);
    expect(sortBuilds(list, 'progress', 'asc').map((x) => x.id)).toEqual(['2', '4', '1', '3']);
  });
  it('does not change its input', () => {
    const before = list.map((x) => x.id);
    sortBuilds(list, 'name', 'asc');
    expect(list.map((x) => x.id)).toEqual(before);
  });
  it('starts names A to Z and numbers highest first', () => {
    expect([defaultDirection('name'), defaultDirection('updated'), defaultDirection('progress')]).toEqual(['asc', 'desc', 'desc']);
  });
});
