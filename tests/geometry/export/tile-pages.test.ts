import { describe, expect, it } from 'vitest';
import { arrangeTemplates } from '../../../geometry/export/arrange-templates';
import { drawingToPage, tilePages, type TileGrid } from '../../../geometry/export/tile-pages';
import type { PointMm } from '../../../geometry/pattern/pattern-doc';
import { placeRing } from '../../../geometry/layout/outline-transform';
import { helmetLikeDoc } from '../../fixtures/pattern-docs/shape-docs';

/**
 * Reassembles pages the way a maker does: start from page R1·C1 and place each neighbour so that the
 * alignment marks both pages print coincide. Returns each tile's offset (page mm) in R1·C1's frame,
 * found only from the printed mark positions.
 */
function reassemble(grid: TileGrid): Map<string, PointMm> {
  const key = (r: number, c: number) => `${r},${c}`;
  const printed = new Map<string, Map<string, PointMm>>();
  for (const t of grid.tiles) printed.set(key(t.row, t.col), new Map(t.marks.map((m) => [m.id, drawingToPage(grid, t, m.at)])));
  const offset = new Map<string, PointMm>([[key(0, 0), [0, 0]]]);
  const queue = [grid.tiles[0]];
  while (queue.length) {
    const t = queue.shift()!;
    const here = printed.get(key(t.row, t.col))!;
    const o = offset.get(key(t.row, t.col))!;
    for (const n of grid.tiles) {
      const nk = key(n.row, n.col);
      if (offset.has(nk)) continue;
      const there = printed.get(nk)!;
      const shared = [...here.keys()].filter((id) => there.has(id));
      if (shared.length < 2) continue;
      const a = here.get(shared[0])!;
      const b = there.get(shared[0])!;
      // The second shared mark must agree with the first (a pure shift, no scale or turn).
      const a2 = here.get(shared[1])!;
      const b2 = there.get(shared[1])!;
      expect(Math.hypot(a2[0] - b2[0] - (a[0] - b[0]), a2[1] - b2[1] - (a[1] - b[1]))).toBeLessThan(1e-9);
      offset.set(nk, [o[0] + a[0] - b[0], o[1] + a[1] - b[1]]);
      queue.push(n);
    }
  }
  return offset;
}

describe('tilePages', () => {
  it('reassembled by the alignment marks, every outline point lands within 0.1 mm of the untiled layout (issue 4)', () => {
    const doc = helmetLikeDoc();
    for (const page of ['a4', 'letter', 'a3', 'tabloid']) {
      const arr = arrangeTemplates(doc, page);
      const grid = arr.grid;
      expect(grid.rows * grid.cols).toBeGreaterThan(1);
      const offset = reassemble(grid);
      expect(offset.size).toBe(grid.tiles.length);
      const origin = grid.tiles[0];
      let checked = 0;
      for (const it of arr.items) {
        for (const p of placeRing(it.piece.outline, it.transform)) {
          const untiled = drawingToPage(grid, origin, p);
          for (const t of grid.tiles) {
            const onPage = drawingToPage(grid, t, p);
            const w = grid.window;
            if (onPage[0] < w.left || onPage[0] > w.left + w.width || onPage[1] < w.top || onPage[1] > w.top + w.height) continue;
            const o = offset.get(`${t.row},${t.col}`)!;
            expect(Math.hypot(onPage[0] + o[0] - untiled[0], onPage[1] + o[1] - untiled[1])).toBeLessThan(0.1);
            checked++;
          }
        }
      }
      expect(checked).toBeGreaterThan(100);
    }
  });

  it('keeps a strip for the check squares clear of the drawing window, and still reassembles', () => {
    // A4 portrait (ISO 216, 210×297 mm) with 6 mm margins and a 9 mm header: window 198×276 mm; a
    // 110 mm strip leaves 198×166 mm and sits right under the window.
    const g = tilePages({ widthMm: 700, heightMm: 600 }, 'a4', { reserveMm: 110, orientation: 'portrait' });
    expect(g.window.height).toBeCloseTo(276 - 110, 9);
    expect(g.reserved).toEqual({ left: 6, top: 15 + 166, width: 198, height: 110 });
    expect(g.reserved!.top + g.reserved!.height).toBeCloseTo(297 - 6, 9);
    const land = tilePages({ widthMm: 700, heightMm: 600 }, 'a4', { reserveMm: 110, orientation: 'landscape' });
    expect(land.window.width).toBeCloseTo(285 - 110, 9);
    expect(reassemble(g).size).toBe(g.tiles.length);
    expect(() => tilePages({ widthMm: 100, heightMm: 100 }, 'a4', { reserveMm: 280, orientation: 'portrait' })).toThrow(/no room to draw.*280 mm strip for the check squares/);
  });

  it('puts every alignment mark inside the overlap band of both pages that print it', () => {
    const grid = tilePages({ widthMm: 700, heightMm: 600 }, 'a4');
    const seen = new Map<string, number>();
    for (const t of grid.tiles) {
      for (const m of t.marks) {
        seen.set(m.id, (seen.get(m.id) ?? 0) + 1);
        const [x, y] = drawingToPage(grid, t, m.at);
        const w = grid.window;
        const inVerticalBand = x - w.left < grid.overlapMm || w.left + w.width - x < grid.overlapMm;
        const inHorizontalBand = y - w.top < grid.overlapMm || w.top + w.height - y < grid.overlapMm;
        expect(inVerticalBand || inHorizontalBand).toBe(true);
      }
    }
    for (const n of seen.values()) expect(n).toBe(2);
  });

  it('chooses the orientation that needs fewer pages', () => {
    // A4 with 6 mm margins, 9 mm header, 10 mm overlap: portrait window 198×276, landscape 285×189.
    // A 560×180 mm strip: portrait needs ceil(550/188)=3 columns × 1 row; landscape ceil(550/275)=2 × 1.
    const g = tilePages({ widthMm: 560, heightMm: 180 }, 'a4');
    expect(g.page.orientation).toBe('landscape');
    expect(g.rows * g.cols).toBe(2);
    expect(tilePages({ widthMm: 560, heightMm: 180 }, 'a4', { orientation: 'portrait' }).cols).toBe(3);
  });

  it('rejects an unknown page size and an empty area', () => {
    expect(() => tilePages({ widthMm: 100, heightMm: 100 }, 'foolscap')).toThrow(/unknown page size "foolscap"/);
    expect(() => tilePages({ widthMm: 0, heightMm: 100 }, 'a4')).toThrow(/drawing area must be positive/);
  });
});
