/**
 * Regression: end stations took the end edge's angle, not the angle at the end point, so a hinge opening from 90°
 * to flat read a 42.75° bevel at its 90° end instead of 45°. The angle is now interpolated between edge middles
 * and extrapolated to the ends.
 */
import { describe, expect, it } from 'vitest';
import { seamBevel } from '../../../geometry/bevel/seam-bevel';
import { seamChains } from '../../../geometry/bevel/seam-chains';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import { interiorDihedralDeg } from '../../../geometry/mesh/dihedral-angles';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';

/**
 * A hinge along the x axis, length L in `steps` edges: strip A flat (z = 0, y < 0, outward normal +z); strip B
 * tilted down from the axis by tiltDeg(x). Each axis edge's B triangle reaches to a point above the edge's
 * middle, so the plane through that edge holds the axis and makes the angle tiltDeg(x_mid) with strip A: the
 * interior dihedral there is exactly 180° − tiltDeg(x_mid) (two half-planes on one edge, elementary solid
 * geometry). Faces: 0 for A, 1 for B.
 */
function midHinge(L: number, width: number, steps: number, tiltDeg: (x: number) => number): { mesh: TriMesh; side: Int32Array } {
  const pos: number[] = [];
  const tri: number[] = [];
  const side: number[] = [];
  const rib = (x: number): number[] => {
    const phi = (tiltDeg(x) * Math.PI) / 180;
    return [x, width * Math.cos(phi), -width * Math.sin(phi)];
  };
  // Per station i: axis a = 4i, A's edge 4i+1, B's rib 4i+2, and (i < steps) B's mid point 4i+3.
  for (let i = 0; i <= steps; i++) {
    const x = (L * i) / steps;
    pos.push(x, 0, 0, x, -width, 0, ...rib(x), ...rib(x + L / (2 * steps)));
  }
  for (let i = 0; i < steps; i++) {
    const [a0, e0, b0, m] = [4 * i, 4 * i + 1, 4 * i + 2, 4 * i + 3];
    const [a1, e1, b1] = [4 * i + 4, 4 * i + 5, 4 * i + 6];
    tri.push(e0, e1, a1, e0, a1, a0);
    side.push(0, 0);
    tri.push(a0, a1, m, a0, m, b0, a1, b1, m);
    side.push(1, 1, 1);
  }
  return { mesh: { positions: Float64Array.from(pos), triangles: Uint32Array.from(tri) }, side: Int32Array.from(side) };
}

function hingeSeam(L: number, steps: number, tiltDeg: (x: number) => number) {
  const { mesh, side } = midHinge(L, 30, steps, tiltDeg);
  const twin = buildTwins(mesh.triangles, mesh.positions.length / 3);
  const mask = new Uint8Array(mesh.triangles.length);
  for (let h = 0; h < mask.length; h++) if (twin[h] >= 0 && side[(h / 3) | 0] !== side[(twin[h] / 3) | 0]) mask[h] = 1;
  const chains = seamChains(mesh.triangles, twin, mask, side);
  expect(chains).toHaveLength(1);
  const dihedral = interiorDihedralDeg(mesh.positions, mesh.triangles, twin);
  const chain = chains[0];
  const bevel = seamBevel(mesh.positions, chain.vertices, Float64Array.from(chain.halfEdges, (h) => dihedral[h]));
  // Which way the chain runs along x.
  const startX = mesh.positions[3 * chain.vertices[0]];
  return { bevel, xAt: (s: number): number => (startX < L / 2 ? s : L - s) };
}

describe('bevel stations at the ends of a seam', () => {
  it('reads 45° of bevel at the end of a hinge opening from 90° to flat, and the exact angle at every station', () => {
    const L = 100;
    const tilt = (x: number): number => 90 * (1 - x / L);
    const { bevel, xAt } = hingeSeam(L, 20, tilt);
    // Interior dihedral 180° − tilt (elementary solid geometry); bevel (180° − θ)/2 from square (common joinery
    // practice): 45° at x = 0 (a right-angle fold), 0° at x = L (flat).
    expect(bevel.stations.map((s) => s.at)).toEqual([0, 25, 50, 75, 100].map((v) => expect.closeTo(v, 9)));
    for (const st of bevel.stations) {
      const x = xAt(st.at);
      expect(st.dihedral, `dihedral at x = ${x}`).toBeCloseTo(180 - tilt(x), 9);
      expect(st.bevel, `bevel at x = ${x}`).toBeCloseTo(45 * (1 - x / L), 9);
    }
    // The range along the seam includes its ends: 90° to 180° exactly.
    expect(bevel.dihedral.min).toBeCloseTo(90, 9);
    expect(bevel.dihedral.max).toBeCloseTo(180, 9);
    expect(bevel.bevel.max).toBeCloseTo(45, 9);
  });

  it('reproduces a linear angle at the ends on a coarse seam of three edges too', () => {
    const L = 60;
    const tilt = (x: number): number => 30 + 40 * (x / L);
    const { bevel, xAt } = hingeSeam(L, 3, tilt);
    for (const st of bevel.stations) expect(st.dihedral).toBeCloseTo(180 - tilt(xAt(st.at)), 9);
  });

  it('keeps a constant angle constant, and limits the reach at an end to the step between the end edges', () => {
    // Straight seam on the x axis in four 10 mm edges.
    const positions = Float64Array.from([0, 0, 0, 10, 0, 0, 20, 0, 0, 30, 0, 0, 40, 0, 0]);
    const vertices = Uint32Array.from([0, 1, 2, 3, 4]);
    const flat = seamBevel(positions, vertices, Float64Array.from([90, 90, 90, 90]));
    expect(flat.stations.map((s) => s.dihedral)).toEqual([90, 90]);
    expect([flat.dihedral.min, flat.dihedral.max]).toEqual([90, 90]);
    // 100°, 90°, 90°, 90°: the line through the first two middles gives 105° at the start, within the 10° step.
    const kink = seamBevel(positions, vertices, Float64Array.from([100, 90, 90, 90]));
    expect(kink.stations[0].dihedral).toBeCloseTo(105, 9);
    expect(kink.stations[kink.stations.length - 1].dihedral).toBeCloseTo(90, 9);
    // Uneven edges: 2 mm end edge then a 20 mm edge; the line would reach 1/11 of the step, well inside it.
    const uneven = seamBevel(Float64Array.from([0, 0, 0, 2, 0, 0, 22, 0, 0]), Uint32Array.from([0, 1, 2]), Float64Array.from([100, 90]));
    expect(uneven.stations[0].dihedral).toBeCloseTo(100 + 10 * (1 / 11), 9);
    // A seam closing from 170° to flat: the line would run on to 185°, an inside corner; it stops at flat.
    const closing = seamBevel(positions, vertices, Float64Array.from([150, 160, 170, 180]));
    expect(closing.stations[closing.stations.length - 1].dihedral).toBe(180);
    expect(closing.stations[0].dihedral).toBeCloseTo(145, 9);
  });
});
