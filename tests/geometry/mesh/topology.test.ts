import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cone, cylinder, helmetShell, icoSphere, platonicSolid, sphereGore, torus, transformMesh, uvSphere } from '../../../geometry/shapes';
import type { PlatonicKind } from '../../../geometry/shapes';
import { analyzeEdges, buildTwins, nonManifoldEdges } from '../../../geometry/mesh/half-edges';
import { boundaryLoops } from '../../../geometry/mesh/boundary-loops';
import { eulerCharacteristic, genusOfClosedSurface } from '../../../geometry/mesh/euler-characteristic';
import { interiorDihedralDeg } from '../../../geometry/mesh/dihedral-angles';
import { angleDefects } from '../../../geometry/mesh/angle-defect';
import { vertexNormals } from '../../../geometry/mesh/vertex-normals';
import { faceComponents, vertexSharingComponents } from '../../../geometry/mesh/connected-components';
import { boundingBoxDiagonal, meanEdgeLength } from '../../../geometry/mesh/mesh-measures';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { rigidMotion, scaleFactor } from '../shapes/motion-arbitrary';

const twinOf = (m: TriMesh) => buildTwins(m.triangles, m.positions.length / 3);
const sum = (a: Float64Array) => a.reduce((s, x) => s + x, 0);

/** Distinct non-flat dihedral values (fan diagonals inside squares/pentagons are 180°). */
function creaseAngles(m: TriMesh): number[] {
  const d = interiorDihedralDeg(m.positions, m.triangles, twinOf(m));
  return Array.from(d).filter((x) => Math.abs(x - 180) > 1e-6);
}

describe('half-edges', () => {
  it('pairs every half-edge of a closed mesh with a reverse twin', () => {
    const m = icoSphere(5, 2);
    const twin = twinOf(m);
    for (let h = 0; h < twin.length; h++) {
      expect(twin[twin[h]]).toBe(h);
      expect(m.triangles[twin[h]]).toBe(m.triangles[h - (h % 3) + ((h % 3) + 1) % 3]);
    }
  });
  it('leaves a three-face (non-manifold) edge unpaired and reports it', () => {
    // Three triangles hinged on edge 0–1 like pages of a book.
    const tris = Uint32Array.from([0, 1, 2, 1, 0, 3, 0, 1, 4]);
    const a = analyzeEdges(tris, 5);
    expect(Array.from(nonManifoldEdges(tris, 5))).toEqual([0, 1]);
    expect(a.twin[0]).toBe(-1);
    expect(a.twin[3]).toBe(-1);
    expect(a.twin[6]).toBe(-1);
  });
  it('reports two faces that run a shared edge the same way as misoriented, unpaired', () => {
    const a = analyzeEdges(Uint32Array.from([0, 1, 2, 0, 1, 3]), 4);
    expect(Array.from(a.misorientedEdges)).toEqual([0, 1]);
    expect(a.twin[0]).toBe(-1);
  });
  it('rejects an index past the vertex count with INDEX_OUT_OF_RANGE and the face', () => {
    expect(() => buildTwins(Uint32Array.from([0, 1, 2, 0, 2, 7]), 4)).toThrow(/triangle 1 uses vertex 7/);
  });
});

describe('boundary loops and Euler characteristic', () => {
  it('a tube has two loops of `segments` vertices, running opposite ways', () => {
    const m = cylinder(10, 20, 16, 2);
    const loops = boundaryLoops(m.triangles, twinOf(m));
    expect(loops.map((l) => l.length)).toEqual([16, 16]);
    // Boundary half-edges keep the surface on their left seen from outside, so on an outward tube the
    // bottom rim (z = 0) runs counter-clockwise seen from +z and the top rim clockwise.
    const ang = (v: number) => Math.atan2(m.positions[3 * v + 1], m.positions[3 * v]);
    const turning = (l: Uint32Array) => {
      let turn = 0;
      for (let i = 0; i < l.length; i++) {
        let d = ang(l[(i + 1) % l.length]) - ang(l[i]);
        if (d > Math.PI) d -= 2 * Math.PI;
        if (d < -Math.PI) d += 2 * Math.PI;
        turn += d;
      }
      return turn;
    };
    const bottom = loops.find((l) => m.positions[3 * l[0] + 2] === 0)!;
    const top = loops.find((l) => m.positions[3 * l[0] + 2] === 20)!;
    expect(turning(bottom)).toBeCloseTo(2 * Math.PI, 9);
    expect(turning(top)).toBeCloseTo(-2 * Math.PI, 9);
  });
  it('two fans touching at one vertex give two loops, not one figure eight', () => {
    // Two triangles sharing only vertex 0 (a bow tie).
    const tris = Uint32Array.from([0, 1, 2, 0, 3, 4]);
    const loops = boundaryLoops(tris, buildTwins(tris, 5));
    expect(loops.map((l) => l.length)).toEqual([3, 3]);
  });
  it('χ = 2 − 2g: sphere 2, torus 0 (genus 1), disc 1, tube 0 (Euler–Poincaré)', () => {
    expect(eulerCharacteristic(uvSphere(1, 8, 4).triangles, twinOf(uvSphere(1, 8, 4)))).toBe(2);
    const t = torus(3, 1, 12, 8);
    expect(genusOfClosedSurface(eulerCharacteristic(t.triangles, twinOf(t)))).toBe(1);
    expect(eulerCharacteristic(cone(1, 1, 8, 2).triangles, twinOf(cone(1, 1, 8, 2)))).toBe(1);
    expect(eulerCharacteristic(cylinder(1, 1, 8, 2).triangles, twinOf(cylinder(1, 1, 8, 2)))).toBe(0);
  });
});

describe('dihedral angles', () => {
  // Coxeter, Regular Polytopes (1973), Table I: sin(θ/2) = cos(π/q)/sin(π/p) for the solid {p, q}.
  const schlafli: Record<PlatonicKind, [number, number, number]> = {
    tetrahedron: [3, 3, 70.5288],
    cube: [4, 3, 90],
    octahedron: [3, 4, 109.4712],
    dodecahedron: [5, 3, 116.5651],
    icosahedron: [3, 5, 138.1897],
  };
  for (const [kind, [p, q, table]] of Object.entries(schlafli) as [PlatonicKind, [number, number, number]][]) {
    it(`${kind} {${p},${q}}: every crease is ${table}° and convex, also after any rigid motion and scale`, () => {
      const closed = (2 * Math.asin(Math.cos(Math.PI / q) / Math.sin(Math.PI / p)) * 180) / Math.PI;
      expect(closed).toBeCloseTo(table, 4);
      const base = platonicSolid(kind, 25);
      const angles = creaseAngles(base);
      expect(angles.length).toBeGreaterThan(0);
      for (const a of angles) expect(a).toBeCloseTo(closed, 9);
      fc.assert(
        fc.property(rigidMotion, scaleFactor, (motion, k) => {
          for (const a of creaseAngles(transformMesh(base, { ...motion, scale: k }))) expect(a).toBeCloseTo(closed, 7);
        }),
        { numRuns: 20 },
      );
    });
  }
  it('an inverted (inside-out) cube reads 270° at every crease: an inside corner', () => {
    const m = transformMesh(platonicSolid('cube', 10), { scale: 1 });
    const flipped = { positions: m.positions, triangles: Uint32Array.from(m.triangles).reverse() };
    for (const a of creaseAngles(flipped)) expect(a).toBeCloseTo(270, 9);
  });
  it('writes 180 on boundary half-edges and never NaN, even with a zero-area triangle', () => {
    const positions = Float64Array.from([0, 0, 0, 1, 0, 0, 2, 0, 0, 0, 1, 0]);
    const tris = Uint32Array.from([0, 1, 2, 0, 3, 1]); // first triangle is collinear
    const d = interiorDihedralDeg(positions, tris, buildTwins(tris, 4));
    expect(Array.from(d).every((x) => x === 180)).toBe(true);
  });
});

describe('angle defect (discrete Gaussian curvature)', () => {
  // Descartes' theorem / discrete Gauss–Bonnet: Σ defect = 2πχ (Crane, "Discrete Differential Geometry:
  // An Applied Introduction", 2013 notes, §5). Boundary vertices use π − Σθ (geodesic curvature).
  const cases: [string, TriMesh, number][] = [
    ['tetrahedron', platonicSolid('tetrahedron', 3), 2],
    ['cube', platonicSolid('cube', 3), 2],
    ['octahedron', platonicSolid('octahedron', 3), 2],
    ['dodecahedron', platonicSolid('dodecahedron', 3), 2],
    ['icosahedron', platonicSolid('icosahedron', 3), 2],
    ['uvSphere', uvSphere(40, 24, 12), 2],
    ['icoSphere', icoSphere(40, 3), 2],
    ['torus', torus(40, 10, 32, 16), 0],
    ['cone (disc)', cone(20, 30, 24, 3), 1],
    ['tube', cylinder(20, 30, 24, 3), 0],
    ['sphere gore (disc)', sphereGore(50, 6, 24, 4), 1],
    ['helmet (disc)', helmetShell({ segments: 24, rings: 8 }), 1],
  ];
  for (const [name, m, chi] of cases) {
    it(`${name}: total defect = 2π·${chi}, unchanged by rigid motion and scale`, () => {
      expect(sum(angleDefects(m.positions, m.triangles, twinOf(m)))).toBeCloseTo(2 * Math.PI * chi, 9);
      fc.assert(
        fc.property(rigidMotion, scaleFactor, (motion, k) => {
          const moved = transformMesh(m, { ...motion, scale: k });
          expect(sum(angleDefects(moved.positions, moved.triangles, twinOf(moved)))).toBeCloseTo(2 * Math.PI * chi, 7);
        }),
        { numRuns: 10 },
      );
    });
  }
  it('a cube corner carries π/2 (three right angles meet: 2π − 3π/2)', () => {
    const m = platonicSolid('cube', 7);
    for (const d of angleDefects(m.positions, m.triangles, twinOf(m))) expect(d).toBeCloseTo(Math.PI / 2, 12);
  });
});

describe('vertex normals', () => {
  it('on a geodesic sphere every normal is the radial direction (within the faceting error)', () => {
    const m = icoSphere(30, 3);
    const n = vertexNormals(m.positions, m.triangles);
    for (let v = 0; v < m.positions.length / 3; v++) {
      const dot = (n[3 * v] * m.positions[3 * v] + n[3 * v + 1] * m.positions[3 * v + 1] + n[3 * v + 2] * m.positions[3 * v + 2]) / 30;
      expect(dot).toBeGreaterThan(0.999);
    }
  });
  it('at a cube corner the angle-weighted normal is the body diagonal, whatever the face split (Thürmer & Wüthrich 1998)', () => {
    const m = platonicSolid('cube', 2);
    const n = vertexNormals(m.positions, m.triangles);
    for (let v = 0; v < 8; v++) for (let k = 0; k < 3; k++) expect(Math.abs(n[3 * v + k])).toBeCloseTo(1 / Math.sqrt(3), 12);
  });
});

describe('components and measures', () => {
  it('counts separate shells and separates faces at non-manifold edges', () => {
    const a = icoSphere(1, 1);
    const b = transformMesh(a, { translation: [5, 0, 0] });
    const V = a.positions.length / 3;
    const tris = new Uint32Array(a.triangles.length * 2);
    tris.set(a.triangles);
    tris.set(b.triangles.map((i) => i + V), a.triangles.length);
    const positions = new Float64Array(2 * a.positions.length);
    positions.set(a.positions);
    positions.set(b.positions, a.positions.length);
    expect(faceComponents(buildTwins(tris, 2 * V)).count).toBe(2);
    const book = Uint32Array.from([0, 1, 2, 1, 0, 3, 0, 1, 4]);
    expect(faceComponents(buildTwins(book, 5)).count).toBe(3);
    expect(vertexSharingComponents(book, 5).count).toBe(1);
    expect(boundingBoxDiagonal(positions)).toBeGreaterThan(5);
  });
  it('mean edge length of a unit-edge octahedron is 1', () => {
    const m = platonicSolid('octahedron', 1);
    expect(meanEdgeLength(m.positions, m.triangles)).toBeCloseTo(1, 12);
  });
});
