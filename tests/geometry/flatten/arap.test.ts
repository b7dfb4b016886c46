import { describe, expect, it } from 'vitest';
import { arapFlatten } from '../../../geometry/flatten/arap';
import { signedAreas } from '../../../geometry/flatten/signed-area';
import { gridPiece, worstEdgeRatio } from './test-meshes';

describe('arapFlatten', () => {
  it('recovers the isometric layout of a flat piece from a stretched and sheared start', () => {
    // A developable piece has ARAP energy 0 at its development, and local/global rounds never increase
    // the energy (Liu et al. 2008, §3.2), so they converge to a rigid copy of the piece.
    const piece = gridPiece(10, 5);
    const nv = piece.positions.length / 3;
    const start = new Float64Array(2 * nv);
    for (let v = 0; v < nv; v++) {
      const x = piece.positions[3 * v];
      const y = piece.positions[3 * v + 1];
      start[2 * v] = 1.3 * x + 0.2 * y;
      start[2 * v + 1] = 0.8 * y;
    }
    expect(worstEdgeRatio(piece, start)).toBeGreaterThan(0.2);
    const uv = arapFlatten(piece.positions, piece.triangles, start, { iterations: 400, tolerance: 1e-14 });
    expect(worstEdgeRatio(piece, uv)).toBeLessThan(1e-6);
  });

  it('keeps the start when asked for no rounds, and validates its options', () => {
    const piece = gridPiece(3, 1);
    const start = new Float64Array(32).map((_, i) => (i % 2 ? Math.floor(i / 8) : (i >> 1) % 4));
    expect(Array.from(arapFlatten(piece.positions, piece.triangles, start, { iterations: 0 }))).toEqual(Array.from(start));
    expect(() => arapFlatten(piece.positions, piece.triangles, new Float64Array(3))).toThrow(/has 3 values, need 32/);
    expect(() => arapFlatten(piece.positions, piece.triangles, start, { iterations: -1 })).toThrow(/non-negative integer/);
    const nan = Float64Array.from(start);
    nan[7] = NaN;
    expect(() => arapFlatten(piece.positions, piece.triangles, nan)).toThrow(/vertex 3 is not finite/);
  });

  it('never ends with more inverted triangles than it started with', () => {
    // A start with one vertex pushed across its neighbours inverts a few triangles; the flip guard
    // (halving the step toward the new solve) may only reduce their number.
    const piece = gridPiece(8, 10, (x, y) => 0.02 * (x - 40) * (y - 40));
    const nv = piece.positions.length / 3;
    const start = new Float64Array(2 * nv);
    for (let v = 0; v < nv; v++) {
      start[2 * v] = piece.positions[3 * v];
      start[2 * v + 1] = piece.positions[3 * v + 1];
    }
    start[2 * 40] += 14; // interior vertex (4, 4) dragged past its right-hand neighbour
    const inverted = (uv: Float64Array): number => signedAreas(uv, piece.triangles).filter((a) => a <= 0).length;
    expect(inverted(start)).toBeGreaterThan(0);
    const uv = arapFlatten(piece.positions, piece.triangles, start);
    expect(inverted(uv)).toBeLessThanOrEqual(inverted(start));
    expect(inverted(uv)).toBe(0);
  });
});
