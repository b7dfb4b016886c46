import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  cone, cylinder, helmetShell, icoSphere, platonicSolid, sphereGore, torus, transformMesh, uvSphere,
} from '../../../geometry/shapes';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import { boundaryLoops } from '../../../geometry/mesh/boundary-loops';
import { eulerCharacteristic } from '../../../geometry/mesh/euler-characteristic';
import { halfEdgeLengths, signedVolume, surfaceArea } from '../../../geometry/mesh/mesh-measures';
import { GeometryError } from '../../../geometry/errors';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { rigidMotion, scaleFactor } from './motion-arbitrary';

const V = (m: TriMesh) => m.positions.length / 3;
const topo = (m: TriMesh) => {
  const twin = buildTwins(m.triangles, V(m));
  return { twin, chi: eulerCharacteristic(m.triangles, twin), loops: boundaryLoops(m.triangles, twin).length };
};

describe('Platonic solids', () => {
  // Volumes and areas for edge a = 1: closed forms from the standard tables (e.g. CRC Standard Mathematical
  // Tables, "Polyhedra"; Coxeter, Regular Polytopes, Table I gives the same solids).
  const s5 = Math.sqrt(5);
  const table = {
    tetrahedron: { V: 4, F: 4, vol: 1 / (6 * Math.SQRT2), area: Math.sqrt(3) },
    cube: { V: 8, F: 6, vol: 1, area: 6 },
    octahedron: { V: 6, F: 8, vol: Math.SQRT2 / 3, area: 2 * Math.sqrt(3) },
    dodecahedron: { V: 20, F: 12, vol: (15 + 7 * s5) / 4, area: 3 * Math.sqrt(25 + 10 * s5) },
    icosahedron: { V: 12, F: 20, vol: (5 * (3 + s5)) / 12, area: 5 * Math.sqrt(3) },
  } as const;
  for (const [kind, t] of Object.entries(table) as [keyof typeof table, (typeof table)[keyof typeof table]][]) {
    it(`${kind}: vertex count, closed genus 0, volume and area match the closed forms, all edges equal`, () => {
      const edge = 37;
      const m = platonicSolid(kind, edge);
      expect(V(m)).toBe(t.V);
      const { chi, loops } = topo(m);
      expect(chi).toBe(2); // Euler's polyhedron formula V − E + F = 2
      expect(loops).toBe(0);
      expect(signedVolume(m)).toBeCloseTo(t.vol * edge ** 3, 6);
      expect(surfaceArea(m)).toBeCloseTo(t.area * edge ** 2, 6);
      // Every edge of a Platonic solid has the same length; fan diagonals are longer.
      const lengths = Array.from(halfEdgeLengths(m.positions, m.triangles));
      expect(Math.min(...lengths)).toBeCloseTo(edge, 9);
    });
  }
});

describe('surfaces of revolution and the rest', () => {
  it('uvSphere is closed genus 0 and its volume approaches 4/3·πR³ from below', () => {
    const m = uvSphere(50, 64, 32);
    const { chi, loops } = topo(m);
    expect(chi).toBe(2);
    expect(loops).toBe(0);
    const exact = (4 / 3) * Math.PI * 50 ** 3; // Archimedes
    expect(signedVolume(m)).toBeLessThan(exact);
    expect(signedVolume(m) / exact).toBeGreaterThan(0.99);
  });
  it('icoSphere has 20·4^k faces and 10·4^k + 2 vertices (geodesic subdivision counts)', () => {
    for (const k of [0, 1, 2, 3]) {
      const m = icoSphere(10, k);
      expect(m.triangles.length / 3).toBe(20 * 4 ** k);
      expect(V(m)).toBe(10 * 4 ** k + 2);
      expect(topo(m).chi).toBe(2);
      for (let v = 0; v < V(m); v++) expect(Math.hypot(m.positions[3 * v], m.positions[3 * v + 1], m.positions[3 * v + 2])).toBeCloseTo(10, 9);
    }
  });
  it('torus has χ = 0 and volume near 2π²Rr² (Pappus centroid theorem)', () => {
    const m = torus(60, 20, 96, 48);
    expect(topo(m).chi).toBe(0);
    expect(topo(m).loops).toBe(0);
    expect(signedVolume(m) / (2 * Math.PI ** 2 * 60 * 20 ** 2)).toBeGreaterThan(0.99);
  });
  it('cylinder is an open tube: χ = 0, two boundary loops, lateral area near 2πrh', () => {
    const m = cylinder(30, 80, 128, 3);
    expect(topo(m)).toMatchObject({ chi: 0, loops: 2 });
    expect(surfaceArea(m) / (2 * Math.PI * 30 * 80)).toBeGreaterThan(0.999);
    expect(signedVolume(m)).toBeGreaterThan(0); // outward: the open tube still encloses positive volume about its axis
  });
  it('cone is a disc (χ = 1, one loop) with lateral area near πrs (s = slant height)', () => {
    const m = cone(30, 40, 128, 4);
    expect(topo(m)).toMatchObject({ chi: 1, loops: 1 });
    expect(surfaceArea(m) / (Math.PI * 30 * 50)).toBeGreaterThan(0.999);
    expect(surfaceArea(m) / (Math.PI * 30 * 50)).toBeLessThan(1);
  });
  it('sphereGore is a disc with area near 4πR²/N (one lune of N)', () => {
    const m = sphereGore(100, 8, 64, 8);
    expect(topo(m)).toMatchObject({ chi: 1, loops: 1 });
    expect(surfaceArea(m) / ((4 * Math.PI * 100 ** 2) / 8)).toBeGreaterThan(0.99);
  });
  it('helmetShell is one open disc with its crown on top', () => {
    const m = helmetShell();
    expect(topo(m)).toMatchObject({ chi: 1, loops: 1 });
    let top = -Infinity;
    for (let v = 0; v < V(m); v++) top = Math.max(top, m.positions[3 * v + 2]);
    expect(top).toBe(150);
  });
  it('every bad size or count is a BAD_OPTION GeometryError naming the argument', () => {
    const bad: [() => unknown, string][] = [
      [() => cone(-1, 1, 8, 1), 'radiusMm'],
      [() => cylinder(1, 1, 2, 1), 'segments'],
      [() => uvSphere(1, 8, 1), 'rings'],
      [() => icoSphere(1, 1.5), 'subdivisions'],
      [() => torus(1, 2, 8, 8), 'majorRadiusMm'],
      [() => sphereGore(1, 1, 8, 2), 'gores'],
      [() => platonicSolid('cube', Number.NaN), 'edgeMm'],
      [() => helmetShell({ brimDropMm: -1 }), 'brimDropMm'],
      [() => transformMesh(cone(1, 1, 8, 1), { scale: 0 }), 'scale'],
    ];
    for (const [fn, name] of bad) {
      expect(fn).toThrow(GeometryError);
      expect(fn).toThrow(name);
    }
  });
});

describe('transformMesh', () => {
  it('a rigid motion keeps every edge length and the volume; a scale k multiplies lengths by k (property)', () => {
    const m = icoSphere(20, 1);
    const before = halfEdgeLengths(m.positions, m.triangles);
    const vol = signedVolume(m);
    fc.assert(
      fc.property(rigidMotion, scaleFactor, (motion, k) => {
        const moved = transformMesh(m, { ...motion, scale: k });
        const after = halfEdgeLengths(moved.positions, moved.triangles);
        for (let i = 0; i < after.length; i++) expect(after[i] / (k * before[i])).toBeCloseTo(1, 9);
        expect(signedVolume(moved) / (k ** 3 * vol)).toBeCloseTo(1, 9);
      }),
      { numRuns: 50 },
    );
  });
  it('a mirror keeps the triangles outward (positive volume) by reversing the winding', () => {
    const m = transformMesh(uvSphere(10, 12, 6), { scale: [-1, 1, 1] });
    expect(signedVolume(m)).toBeGreaterThan(0);
  });
  it('a 90° quaternion about z maps x to y (right-hand rule)', () => {
    const s = Math.SQRT1_2;
    const m = transformMesh({ positions: Float64Array.from([1, 0, 0]), triangles: new Uint32Array(0) }, { rotation: [0, 0, s, s] });
    expect(m.positions[0]).toBeCloseTo(0, 12);
    expect(m.positions[1]).toBeCloseTo(1, 12);
  });
});
