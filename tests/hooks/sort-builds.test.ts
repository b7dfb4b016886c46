import { describe, expect, it } from 'vitest';
import type { Build } from '../../hooks/api-types';
import { sortBuildsNewestFirst } from '../../hooks/use-builds';

// The brief asks for the builds list "newest first". Times are ISO 8601 / RFC 3339 strings; offsets must be
// honoured, so 10:00+02:00 (08:00 UTC) is older than 09:00Z.

const b = (id: string, name: string, createdAt: string): Build => ({ id, shopId: '1', name, createdAt, updatedAt: createdAt });

describe('sortBuildsNewestFirst', () => {
  it('orders by creation time, newest first, honouring time-zone offsets', () => {
    const sorted = sortBuildsNewestFirst([
      b('1', 'Vambrace', '2026-03-04T10:00:00+02:00'),
      b('2', 'Gorget', '2026-03-04T09:00:00Z'),
      b('3', 'Tasset', '2026-03-05T00:00:00Z'),
    ]);
    expect(sorted.map((x) => x.id)).toEqual(['3', '2', '1']);
  });

  it('breaks ties by name and leaves the input untouched', () => {
    const input = [b('1', 'Spaulder', '2026-01-01T00:00:00Z'), b('2', 'Bracer', '2026-01-01T00:00:00Z')];
    expect(sortBuildsNewestFirst(input).map((x) => x.name)).toEqual(['Bracer', 'Spaulder']);
    expect(input.map((x) => x.name)).toEqual(['Spaulder', 'Bracer']);
  });
});
