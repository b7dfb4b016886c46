import { describe, expect, it } from 'vitest';
import { boundsOf } from '../../../geometry/layout/outline-transform';
import { rasterizeRingCentres } from '../../../geometry/layout/raster-mask';
import type { PointMm } from '../../../geometry/pattern/pattern-doc';
import { irregularPolygon, lShape, rectangle, seededRandom, star } from '../../fixtures/pattern-docs/shape-docs';

const turn = (ring: PointMm[], deg: number, k = 1): PointMm[] => {
  const a = (deg * Math.PI) / 180;
  return ring.map(([x, y]) => [k * (Math.cos(a) * x - Math.sin(a) * y), k * (Math.sin(a) * x + Math.cos(a) * y)]);
};
const toOrigin = (ring: PointMm[]): PointMm[] => {
  const b = boundsOf(ring);
  return ring.map(([x, y]) => [x - b.minX, y - b.minY]);
};

/** Independent reference: even-odd ray casting (Jordan curve theorem) at every cell centre. */
function insideByRayCasting(ring: PointMm[], x: number, y: number): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > y !== yj > y && x < xi + ((y - yi) * (xj - xi)) / (yj - yi)) inside = !inside;
  }
  return inside;
}

describe('rasterizeRingCentres', () => {
  it('sets exactly the cells whose centre a ray-casting test puts inside, for stars, L-shapes and random polygons turned and scaled', () => {
    const rand = seededRandom(5);
    const shapes = [star(7, 40, 15), lShape(60, 45, 12), irregularPolygon(rand, 35, 17), irregularPolygon(rand, 20, 9)];
    for (const shape of shapes) {
      for (const [deg, k, cell] of [[0, 1, 1], [27, 1, 1], [141, 0.2, 0.25], [300, 8, 5]] as const) {
        const ring = toOrigin(turn(shape, deg, k));
        const mask = rasterizeRingCentres(ring, cell);
        const b = boundsOf(ring);
        expect(mask.widthCells).toBe(Math.ceil(b.maxX / cell - 1e-9));
        expect(mask.heightCells).toBe(Math.ceil(b.maxY / cell - 1e-9));
        let counted = 0;
        for (let r = 0; r < mask.heightCells; r++) {
          const set = new Set<number>();
          const runs = mask.rows[r];
          for (let i = 0; i < runs.length; i += 2) for (let c = runs[i]; c <= runs[i + 1]; c++) set.add(c);
          counted += set.size;
          for (let c = 0; c < mask.widthCells; c++) expect(set.has(c)).toBe(insideByRayCasting(ring, (c + 0.5) * cell, (r + 0.5) * cell));
        }
        expect(mask.cellCount).toBe(counted);
      }
    }
  });

  it('gives a 10 × 5 mm rectangle exactly 50 cells of 1 mm (area / cell², grid-aligned)', () => {
    const mask = rasterizeRingCentres(rectangle(10, 5), 1);
    expect([mask.widthCells, mask.heightCells, mask.cellCount]).toEqual([10, 5, 50]);
  });
});
