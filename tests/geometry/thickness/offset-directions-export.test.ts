/**
 * Regression: the crease-aware offset directions were not exported from geometry/index.ts, so a caller of the
 * public API (the server, a worker, the browser) could not offset a sculpt the way the pattern does.
 */
import { describe, expect, it } from 'vitest';
import { offsetDirections, offsetSurface, platonicSolid, vertexNormals } from '../../../geometry';

describe('offsetDirections through the public API', () => {
  it('moves a cube corner a full thickness behind each of its three faces', () => {
    // A box of outside size a made of boards t thick is a − 2t inside (elementary solid geometry): every corner
    // of the 50 mm cube goes to the corner of the 38 mm cube inside it at t = 6.
    const a = 50;
    const t = 6;
    const cube = platonicSolid('cube', a);
    const dirs = offsetDirections(cube.positions, cube.triangles, vertexNormals(cube.positions, cube.triangles));
    const inner = offsetSurface(cube.positions, dirs, t);
    for (let v = 0; v < cube.positions.length / 3; v++) {
      for (let k = 0; k < 3; k++) {
        const x = cube.positions[3 * v + k];
        // Each coordinate moves t toward the centre.
        expect(Math.abs(inner[3 * v + k])).toBeCloseTo(Math.abs(x) - t, 9);
      }
    }
  });
});
