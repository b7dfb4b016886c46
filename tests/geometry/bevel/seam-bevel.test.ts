import { describe, expect, it } from 'vitest';
import { seamBevel, bevelFromDihedralDeg, STATION_SPACING_MM } from '../../../geometry/bevel/seam-bevel';
import { seamChains } from '../../../geometry/bevel/seam-chains';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import { interiorDihedralDeg } from '../../../geometry/mesh/dihedral-angles';
import { cylinder, platonicSolid } from '../../../geometry/shapes';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { hinge as makeHinge } from '../pattern/pattern-fixtures';

// The interior dihedral of the hinge is 180° − tilt; a tilt falling linearly from 60° to 0° makes it run from
// 120° to 180° along the seam.
function hinge(L: number, width: number, steps: number): { mesh: TriMesh; pieceOfFace: Int32Array } {
  const h = makeHinge(L, width, steps, (x) => 60 * (1 - x / L));
  return { mesh: h.mesh, pieceOfFace: h.strip };
}

function seamMaskBetween(triangles: Uint32Array, twin: Int32Array, pieceOfFace: Int32Array): Uint8Array {
  const mask = new Uint8Array(triangles.length);
  for (let h = 0; h < triangles.length; h++) {
    if (twin[h] >= 0 && pieceOfFace[(h / 3) | 0] !== pieceOfFace[(twin[h] / 3) | 0]) mask[h] = 1;
  }
  return mask;
}

describe('seam bevels', () => {
  it('gives stations every 25 mm and at both ends where the dihedral runs from 120° to 180°', () => {
    const L = 110;
    const { mesh, pieceOfFace } = hinge(L, 30, 44);
    const twin = buildTwins(mesh.triangles, mesh.positions.length / 3);
    const dihedral = interiorDihedralDeg(mesh.positions, mesh.triangles, twin);
    const chains = seamChains(mesh.triangles, twin, seamMaskBetween(mesh.triangles, twin, pieceOfFace), pieceOfFace);
    expect(chains).toHaveLength(1);
    const chain = chains[0];
    expect(chain.pieces).toEqual([0, 1]);
    const edgeDihedral = Float64Array.from(chain.halfEdges, (h) => dihedral[h]);
    const bevel = seamBevel(mesh.positions, chain.vertices, edgeDihedral);
    expect(bevel.length3d).toBeCloseTo(L, 9);
    // Stations: 0, 25, 50, 75, 100 and the far end (issue 3 point 7: every 25 mm and at each end).
    expect(bevel.stations.map((s) => s.at)).toEqual([0, 25, 50, 75, 100, L].map((v) => expect.closeTo(v, 9)));
    expect(STATION_SPACING_MM).toBe(25);
    // The chain may run either way along x; the bevel at distance s is 30°·(1 − x/L) (common joinery practice:
    // (180° − θ)/2 with θ = 180° − φ), within one step of the 44-segment triangulation
    // (60°/44 of dihedral, 0.68° of bevel, since each edge's triangle reaches to the next vertex's tilt).
    const startX = mesh.positions[3 * chain.vertices[0]];
    for (const s of bevel.stations) {
      const x = startX < L / 2 ? s.at : L - s.at;
      expect(Math.abs(s.bevel - 30 * (1 - x / L))).toBeLessThan(0.8);
    }
    expect(bevel.convex).toBe(true);
    expect(bevel.bevelFace).toBe('inner');
    expect(bevel.dihedral.min).toBeGreaterThan(119);
    expect(bevel.dihedral.max).toBeLessThanOrEqual(180 + 1e-9);
    // Length-weighted mean of a linear ramp from 120° to 180° is 150° (to the triangulation's step).
    expect(Math.abs(bevel.dihedral.mean - 150)).toBeLessThan(1);
  });

  it('reports an inside corner as not convex with the bevel taken off the outer face', () => {
    // Flip each triangle: the outward normal becomes −z and B now folds toward it.
    const { mesh, pieceOfFace } = hinge(60, 20, 12);
    const p = mesh.positions;
    const t = mesh.triangles.slice();
    for (let f = 0; f < t.length; f += 3) [t[f + 1], t[f + 2]] = [t[f + 2], t[f + 1]];
    const twin = buildTwins(t, p.length / 3);
    const dihedral = interiorDihedralDeg(p, t, twin);
    const [chain] = seamChains(t, twin, seamMaskBetween(t, twin, pieceOfFace), pieceOfFace);
    const bevel = seamBevel(p, chain.vertices, Float64Array.from(chain.halfEdges, (h) => dihedral[h]));
    // Interior angle 180° + φ on the far side (DESIGN.md convention); the bevel magnitude is the same.
    expect(bevel.dihedral.max).toBeGreaterThan(230);
    expect(bevel.convex).toBe(false);
    expect(bevel.bevelFace).toBe('outer');
    expect(bevel.bevel.max).toBeLessThan(30.01);
  });

  it('splits the seams of a cube at its corners: 12 seams, 90° dihedral, 45° bevel', () => {
    const mesh = platonicSolid('cube', 40);
    const twin = buildTwins(mesh.triangles, mesh.positions.length / 3);
    // One piece per square face: faces are grouped by their normal direction.
    const dihedral = interiorDihedralDeg(mesh.positions, mesh.triangles, twin);
    const F = mesh.triangles.length / 3;
    const pieceOfFace = new Int32Array(F).fill(-1);
    let next = 0;
    for (let f = 0; f < F; f++) {
      if (pieceOfFace[f] >= 0) continue;
      pieceOfFace[f] = next;
      for (let k = 0; k < 3; k++) {
        const t = twin[3 * f + k];
        if (t >= 0 && Math.abs(dihedral[3 * f + k] - 180) < 1e-6) pieceOfFace[(t / 3) | 0] = next;
      }
      next++;
    }
    expect(next).toBe(6);
    const chains = seamChains(mesh.triangles, twin, seamMaskBetween(mesh.triangles, twin, pieceOfFace), pieceOfFace);
    // A cube has 12 edges (Euler: V − E + F = 2 with V = 8, F = 6) and each corner joins three seams.
    expect(chains).toHaveLength(12);
    for (const c of chains) {
      expect(c.pieces[0]).toBeLessThan(c.pieces[1]);
      const b = seamBevel(mesh.positions, c.vertices, Float64Array.from(c.halfEdges, (h) => dihedral[h]));
      expect(b.length3d).toBeCloseTo(40, 9);
      // Cube dihedral 90° (Coxeter, Regular Polytopes, Table I); bevel (180° − 90°)/2 = 45° (common joinery practice).
      expect(b.dihedral.mean).toBeCloseTo(90, 9);
      expect(b.bevel.mean).toBeCloseTo(45, 9);
      expect(b.stations).toHaveLength(2);
    }
  });

  it('keeps a seam that runs all the way round as one closed loop', () => {
    const r = 30;
    const seg = 24;
    const mesh = cylinder(r, 40, seg, 2);
    const twin = buildTwins(mesh.triangles, mesh.positions.length / 3);
    const F = mesh.triangles.length / 3;
    const pieceOfFace = new Int32Array(F);
    for (let f = 0; f < F; f++) {
      let z = 0;
      for (let k = 0; k < 3; k++) z += mesh.positions[3 * mesh.triangles[3 * f + k] + 2];
      pieceOfFace[f] = z / 3 > 20 ? 1 : 0;
    }
    const chains = seamChains(mesh.triangles, twin, seamMaskBetween(mesh.triangles, twin, pieceOfFace), pieceOfFace);
    expect(chains).toHaveLength(1);
    expect(chains[0].closed).toBe(true);
    expect(chains[0].vertices[0]).toBe(chains[0].vertices[seg]);
    const dihedral = interiorDihedralDeg(mesh.positions, mesh.triangles, twin);
    const b = seamBevel(mesh.positions, chains[0].vertices, Float64Array.from(chains[0].halfEdges, (h) => dihedral[h]));
    // Perimeter of a regular 24-gon inscribed in radius r: 24·2r·sin(π/24) (elementary geometry).
    expect(b.length3d).toBeCloseTo(seg * 2 * r * Math.sin(Math.PI / seg), 9);
    expect(b.bevelFace).toBe('none');
  });

  it('takes the mitre rule (180° − θ)/2 for the bevel (common joinery practice)', () => {
    expect(bevelFromDihedralDeg(90)).toBe(45);
    expect(bevelFromDihedralDeg(120)).toBe(30);
    expect(bevelFromDihedralDeg(180)).toBe(0);
    expect(bevelFromDihedralDeg(240)).toBe(30);
  });
});
