import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { flattenPiece } from '../../../geometry/flatten/flatten-piece';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { splitPieces } from '../../../geometry/pieces/split-pieces';
import { autoSeams } from '../../../geometry/seams/auto-seams';
import { icoSphere, platonicSolid, torus } from '../../../geometry/shapes';

/** The public-domain scan of a rabbit figurine from the npm package `bunny` (positions and cells). */
function bunnyMesh(): TriMesh {
  const data = createRequire(import.meta.url)('bunny') as { positions: number[][]; cells: number[][] };
  // The package's units are arbitrary (about 8 units tall); scale to a 200 mm figure.
  return {
    positions: Float64Array.from(data.positions.flat().map((x) => x * 25)),
    triangles: Uint32Array.from(data.cells.flat()),
  };
}

/** Splits along the mask and flattens every piece on its own: the check does not trust autoSeams' bookkeeping. */
function piecesStretch(mesh: TriMesh, mask: Uint8Array): number[] {
  const twin = buildTwins(mesh.triangles, mesh.positions.length / 3);
  return splitPieces(mesh, twin, mask).map((p) => {
    const flat = flattenPiece({ positions: p.positions, triangles: p.triangles });
    expect(flat.flipped).toBe(0);
    return flat.stretch.maxPct;
  });
}

describe('autoSeams', () => {
  const cases: Array<[string, () => TriMesh, number]> = [
    ['a sphere', () => icoSphere(100, 3), 20],
    ['a torus', () => torus(100, 35, 48, 16), 24],
    ['the bunny scan', bunnyMesh, 80],
  ];
  for (const [name, make, maxPieces] of cases) {
    it(`cuts ${name} into pieces that each lie flat within the 3 % budget`, () => {
      const mesh = make();
      const twin = buildTwins(mesh.triangles, mesh.positions.length / 3);
      const mask = autoSeams(mesh, twin, { stretchBudgetPct: 3 });
      const stretch = piecesStretch(mesh, mask);
      // A closed surface cannot be flattened in one piece (it has no boundary), and a sphere or torus has
      // Gaussian curvature, so no single cut makes it developable (Gauss's Theorema Egregium).
      expect(stretch.length).toBeGreaterThan(1);
      // "As few pieces as possible": far fewer pieces than triangles (the ceiling is a regression bound
      // recorded on this implementation, not a published figure).
      expect(stretch.length).toBeLessThanOrEqual(maxPieces);
      for (const s of stretch) expect(s).toBeLessThanOrEqual(3);
      // Every seam edge has both half-edges marked (SeamMask convention).
      for (let h = 0; h < mask.length; h++) if (mask[h] && twin[h] >= 0) expect(mask[twin[h]]).toBe(1);
    });
  }

  it('puts the seams of a cube on its creases', () => {
    const mesh = platonicSolid('cube', 50);
    const twin = buildTwins(mesh.triangles, mesh.positions.length / 3);
    const mask = autoSeams(mesh, twin, { stretchBudgetPct: 3 });
    // The flat diagonals of the square faces (interior angle 180°) are never cut: seams sit on the 90° edges.
    const p = mesh.positions;
    const t = mesh.triangles;
    for (let h = 0; h < mask.length; h++) {
      if (!mask[h]) continue;
      const n = (f: number): number[] => {
        const a = 3 * t[3 * f], b = 3 * t[3 * f + 1], c = 3 * t[3 * f + 2];
        const u = [p[b] - p[a], p[b + 1] - p[a + 1], p[b + 2] - p[a + 2]];
        const v = [p[c] - p[a], p[c + 1] - p[a + 1], p[c + 2] - p[a + 2]];
        return [u[1] * v[2] - u[2] * v[1], u[2] * v[0] - u[0] * v[2], u[0] * v[1] - u[1] * v[0]];
      };
      const n1 = n((h / 3) | 0);
      const n2 = n((twin[h] / 3) | 0);
      expect(Math.abs(n1[0] * n2[0] + n1[1] * n2[1] + n1[2] * n2[2])).toBeLessThan(1e-9);
    }
    expect(piecesStretch(mesh, mask).every((s) => s <= 3)).toBe(true);
  });

  it('rejects a budget that is not a positive percentage', () => {
    const mesh = icoSphere(10, 1);
    const twin = buildTwins(mesh.triangles, mesh.positions.length / 3);
    expect(() => autoSeams(mesh, twin, { stretchBudgetPct: 0 })).toThrow(/stretch budget/);
    expect(() => autoSeams(mesh, twin, { stretchBudgetPct: Number.NaN })).toThrow(/stretch budget/);
  });
});
