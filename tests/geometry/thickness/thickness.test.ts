import { describe, expect, it } from 'vitest';
import { interiorDihedralDeg } from '../../../geometry/mesh/dihedral-angles';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import { vertexNormals } from '../../../geometry/mesh/vertex-normals';
import { icoSphere } from '../../../geometry/shapes';
import { offsetSurface, surfaceOffsetMm } from '../../../geometry/thickness/offset-surface';
import { scoreLines } from '../../../geometry/thickness/score-lines';

describe('offsetSurface', () => {
  it('moves a sphere of radius R to the concentric sphere of radius R − d', () => {
    // Offset of a sphere along its normals is the concentric sphere (elementary differential geometry: the
    // normal of a sphere is radial). An icosphere's vertices lie on the sphere and, by symmetry of each vertex
    // star under the icosahedral subdivision, the angle-weighted normal is radial to rounding.
    const R = 50;
    const d = 6;
    const mesh = icoSphere(R, 2);
    const out = offsetSurface(mesh.positions, vertexNormals(mesh.positions, mesh.triangles), d);
    for (let v = 0; v < out.length / 3; v++) {
      expect(Math.hypot(out[3 * v], out[3 * v + 1], out[3 * v + 2])).toBeCloseTo(R - d, 1);
    }
  });

  it('offsets by 0, t/2 and t for the outer skin, the middle and the inner face', () => {
    expect(surfaceOffsetMm('outer', 6)).toBe(0);
    expect(surfaceOffsetMm('mid', 6)).toBe(3);
    expect(surfaceOffsetMm('inner', 6)).toBe(6);
  });
});

describe('scoreLines', () => {
  /**
   * A square of 2×2 cells (3×3 vertices, 20 mm spacing) folded along its middle row of edges y = 20 so that the
   * interior angle there is `foldDeg`; `uv` is the square laid flat.
   */
  function foldedSquare(foldDeg: number): { positions: Float64Array; triangles: Uint32Array; uv: Float64Array } {
    const uv: number[] = [];
    const pos: number[] = [];
    const phi = ((180 - foldDeg) * Math.PI) / 180;
    for (let j = 0; j < 3; j++) {
      for (let i = 0; i < 3; i++) {
        const x = 20 * i;
        const y = 20 * j;
        uv.push(x, y);
        // The half y > 20 turns down about the line y = 20 by 180° − fold.
        const dy = Math.max(0, y - 20);
        pos.push(x, Math.min(y, 20) + dy * Math.cos(phi), -dy * Math.sin(phi));
      }
    }
    const tri: number[] = [];
    for (let j = 0; j < 2; j++) {
      for (let i = 0; i < 2; i++) {
        const a = 3 * j + i;
        tri.push(a, a + 1, a + 4, a, a + 4, a + 3);
      }
    }
    return { positions: Float64Array.from(pos), triangles: Uint32Array.from(tri), uv: Float64Array.from(uv) };
  }

  it('finds one score line along a 90° fold and none on a 170° bend', () => {
    const sharp = foldedSquare(90);
    const twin = buildTwins(sharp.triangles, 9);
    const lines = scoreLines(sharp.triangles, twin, interiorDihedralDeg(sharp.positions, sharp.triangles, twin), sharp.uv);
    expect(lines).toHaveLength(1);
    // Interior angle of the fold: 90° by construction; the line runs the full 40 mm width at y = 20.
    expect(lines[0].foldDeg).toBeCloseTo(90, 9);
    expect(lines[0].path.map((p) => p[1])).toEqual([20, 20, 20]);
    const xs = lines[0].path.map((p) => p[0]).sort((a, b) => a - b);
    expect(xs).toEqual([0, 20, 40]);
    const gentle = foldedSquare(170);
    const tw2 = buildTwins(gentle.triangles, 9);
    // A 10° bend is under the 25° threshold (common practice): no score line.
    expect(scoreLines(gentle.triangles, tw2, interiorDihedralDeg(gentle.positions, gentle.triangles, tw2), gentle.uv)).toHaveLength(0);
  });
});
