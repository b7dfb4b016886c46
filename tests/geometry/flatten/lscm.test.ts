import { describe, expect, it } from 'vitest';
import { lscm } from '../../../geometry/flatten/lscm';
import { signedAreas } from '../../../geometry/flatten/signed-area';
import { annulusPiece, gridPiece } from './test-meshes';

describe('lscm', () => {
  it('reproduces a flat piece exactly when pinned at two of its own points', () => {
    // The identity is conformal, so it has zero conformal energy and is the unique minimiser once two
    // vertices are pinned (Lévy et al. 2002, §3.3: two pins make the LSCM system full rank).
    const piece = gridPiece(12, 7.5);
    const uv = lscm(piece.positions, piece.triangles, { vertex: [0, 168], uv: [0, 0, 90, 90] });
    for (let v = 0; v < piece.positions.length / 3; v++) {
      expect(uv[2 * v]).toBeCloseTo(piece.positions[3 * v], 9);
      expect(uv[2 * v + 1]).toBeCloseTo(piece.positions[3 * v + 1], 9);
    }
  });

  it('maps a flat piece by a similarity when the pins are moved (rotated 90° and scaled 2×)', () => {
    // Conformal maps of the plane fixing two points are similarities (Lévy et al. 2002, §3.3).
    const piece = gridPiece(6, 10);
    const uv = lscm(piece.positions, piece.triangles, { vertex: [0, 6], uv: [5, 5, 5, 125] });
    for (let v = 0; v < piece.positions.length / 3; v++) {
      const x = piece.positions[3 * v];
      const y = piece.positions[3 * v + 1];
      expect(uv[2 * v]).toBeCloseTo(5 - 2 * y, 9);
      expect(uv[2 * v + 1]).toBeCloseTo(5 + 2 * x, 9);
    }
  });

  it('handles a piece with a hole: a flat annulus comes back similar to itself, counter-clockwise', () => {
    // The area term sums over every boundary loop (hole loops run clockwise), so holes need no special case
    // (Desbrun et al. 2002, "Intrinsic parameterizations", §4: the area is a boundary integral).
    const piece = annulusPiece(20, 50, 48, 6);
    const uv = lscm(piece.positions, piece.triangles);
    const areas = signedAreas(uv, piece.triangles);
    const pieceAreas = signedAreas(
      Float64Array.from({ length: (piece.positions.length / 3) * 2 }, (_, i) => piece.positions[3 * (i >> 1) + (i & 1)]),
      piece.triangles,
    );
    // Default pins are placed at their 3D distance apart, so the similarity has scale 1 here.
    for (let f = 0; f < areas.length; f++) expect(areas[f] / pieceAreas[f]).toBeCloseTo(1, 8);
  });

  it('refuses bad pins with a message saying which', () => {
    const piece = gridPiece(3, 1);
    expect(() => lscm(piece.positions, piece.triangles, { vertex: [0], uv: [0, 0] })).toThrow(/at least two vertices/);
    expect(() => lscm(piece.positions, piece.triangles, { vertex: [0, 99], uv: [0, 0, 1, 1] })).toThrow(
      /pin 1: vertex 99 is out of range/,
    );
    expect(() => lscm(piece.positions, piece.triangles, { vertex: [0, 1], uv: [0, 0, NaN, 1] })).toThrow(
      /pin 1: coordinates of vertex 1 are not finite/,
    );
    expect(() => lscm(piece.positions, piece.triangles, { vertex: [0, 1], uv: [0, 0, 0, 0] })).not.toThrow();
  });
});
