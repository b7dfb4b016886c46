import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { addSeamEdge, emptySeamMask, isSeamEdge, removeSeamEdge, seamEdgeCount, seamEdgesOf, symmetricSeamMask, unionSeamMasks } from '../../../geometry/seams/seam-mask';
import { creaseSeams } from '../../../geometry/seams/crease-seams';
import { seamPath } from '../../../geometry/seams/seam-path';
import { seamsFromPolylines } from '../../../geometry/seams/seams-from-polylines';
import { findSymmetryPlane, mirrorSeams } from '../../../geometry/seams/mirror-seams';
import { buildEdgeGraph, findEdge } from '../../../geometry/seams/edge-graph';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import { interiorDihedralDeg } from '../../../geometry/mesh/dihedral-angles';
import { cylinder, helmetShell, icoSphere, platonicSolid, transformMesh, uvSphere } from '../../../geometry/shapes';
import type { PlatonicKind } from '../../../geometry/shapes';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { rigidMotion, scaleFactor } from '../shapes/motion-arbitrary';

const twinOf = (m: TriMesh) => buildTwins(m.triangles, m.positions.length / 3);
const dist = (m: TriMesh, a: number, b: number) =>
  Math.hypot(m.positions[3 * a] - m.positions[3 * b], m.positions[3 * a + 1] - m.positions[3 * b + 1], m.positions[3 * a + 2] - m.positions[3 * b + 2]);
const pathLength = (m: TriMesh, p: Uint32Array) => {
  let s = 0;
  for (let i = 0; i + 1 < p.length; i++) s += dist(m, p[i], p[i + 1]);
  return s;
};

describe('seam mask helpers', () => {
  it('adds, tests and removes both half-edges of an edge; lists one half-edge per seam edge', () => {
    const m = platonicSolid('tetrahedron', 1);
    const twin = twinOf(m);
    const mask = emptySeamMask(4);
    addSeamEdge(mask, twin, 0);
    expect(mask[0]).toBe(1);
    expect(mask[twin[0]]).toBe(1);
    expect(isSeamEdge(mask, twin, twin[0])).toBe(true);
    expect(Array.from(seamEdgesOf(mask, twin))).toEqual([Math.min(0, twin[0])]);
    const oneSided = new Uint8Array(12);
    oneSided[twin[0]] = 1;
    expect(Array.from(symmetricSeamMask(oneSided, twin))).toEqual(Array.from(mask));
    expect(seamEdgeCount(unionSeamMasks(mask, addSeamEdge(emptySeamMask(4), twin, 1)), twin)).toBe(2);
    removeSeamEdge(mask, twin, twin[0]);
    expect(mask.every((x) => x === 0)).toBe(true);
    expect(() => addSeamEdge(mask, twin, 12)).toThrow(expect.objectContaining({ code: 'BAD_SEAM' }));
  });
});

describe('creaseSeams', () => {
  // Coxeter, Regular Polytopes, Table I: edges E and dihedral angles of the five solids. At a threshold below
  // 180° − θ every real edge is a seam; above it none is (the fan diagonals are flat and never are).
  const table: Record<PlatonicKind, [number, number]> = {
    tetrahedron: [6, 70.5288], cube: [12, 90], octahedron: [12, 109.4712], dodecahedron: [30, 116.5651], icosahedron: [30, 138.1897],
  };
  for (const [kind, [edges, theta]] of Object.entries(table) as [PlatonicKind, [number, number]][]) {
    it(`${kind}: all ${edges} edges at crease:${(180 - theta - 0.01).toFixed(2)}, none at crease:${(180 - theta + 0.01).toFixed(2)}, under motion and scale`, () => {
      fc.assert(
        fc.property(rigidMotion, scaleFactor, (motion, k) => {
          const m = transformMesh(platonicSolid(kind, 20), { ...motion, scale: k });
          const twin = twinOf(m);
          expect(seamEdgeCount(creaseSeams(m.positions, m.triangles, twin, 180 - theta - 0.01), twin)).toBe(edges);
          expect(seamEdgeCount(creaseSeams(m.positions, m.triangles, twin, 180 - theta + 0.01), twin)).toBe(0);
        }),
        { numRuns: 10 },
      );
    });
  }
  it('catches inside corners too, and rejects a threshold outside (0, 180]', () => {
    const m = platonicSolid('cube', 10);
    const inverted = { positions: m.positions, triangles: Uint32Array.from(m.triangles).reverse() };
    const twin = twinOf(inverted);
    expect(seamEdgeCount(creaseSeams(inverted.positions, inverted.triangles, twin, 45), twin)).toBe(12);
    expect(() => creaseSeams(m.positions, m.triangles, twin, 0)).toThrow(expect.objectContaining({ code: 'BAD_OPTION' }));
    expect(() => creaseSeams(m.positions, m.triangles, twin, 181)).toThrow(expect.objectContaining({ code: 'BAD_OPTION' }));
  });
});

describe('seamPath', () => {
  it('matches Floyd–Warshall all-pairs shortest distances on the edge graph (Cormen et al., Introduction to Algorithms, §25.2)', () => {
    const m = icoSphere(50, 1);
    const V = m.positions.length / 3;
    const twin = twinOf(m);
    const g = buildEdgeGraph(m, twin);
    const D = Array.from({ length: V }, (_, i) => Array.from({ length: V }, (_, j) => (i === j ? 0 : Infinity)));
    for (let v = 0; v < V; v++) for (let k = g.offset[v]; k < g.offset[v + 1]; k++) D[v][g.neighbor[k]] = g.length[k];
    for (let k = 0; k < V; k++) for (let i = 0; i < V; i++) for (let j = 0; j < V; j++) if (D[i][k] + D[k][j] < D[i][j]) D[i][j] = D[i][k] + D[k][j];
    fc.assert(
      fc.property(fc.nat(V - 1), fc.nat(V - 1), (a, b) => {
        const p = seamPath(m, twin, a, b, { graph: g })!;
        expect(p[0]).toBe(a);
        expect(p[p.length - 1]).toBe(b);
        for (let i = 0; i + 1 < p.length; i++) expect(findEdge(g, p[i], p[i + 1])).toBeGreaterThanOrEqual(0);
        expect(pathLength(m, p)).toBeCloseTo(D[a][b], 9);
      }),
      { numRuns: 200 },
    );
  });
  it('with preferCreases a path across a cube face takes the two crease edges instead of the flat diagonal', () => {
    const m = platonicSolid('cube', 10);
    const twin = twinOf(m);
    const d = interiorDihedralDeg(m.positions, m.triangles, twin);
    const flat = d.findIndex((x) => Math.abs(x - 180) < 1e-9);
    const a = m.triangles[flat];
    const b = m.triangles[flat - (flat % 3) + ((flat % 3) + 1) % 3];
    expect(Array.from(seamPath(m, twin, a, b)!)).toEqual([a, b]);
    const bent = seamPath(m, twin, a, b, { preferCreases: true })!;
    expect(bent).toHaveLength(3);
    expect(pathLength(m, bent)).toBeCloseTo(20, 9);
  });
  it('returns null between unconnected parts, [v] for v → v, and BAD_SEAM for a vertex outside the mesh', () => {
    const a = platonicSolid('tetrahedron', 1);
    const two: TriMesh = {
      positions: Float64Array.from([...a.positions, ...transformMesh(a, { translation: [5, 0, 0] }).positions]),
      triangles: Uint32Array.from([...a.triangles, ...Array.from(a.triangles, (i) => i + 4)]),
    };
    const twin = twinOf(two);
    expect(seamPath(two, twin, 0, 5)).toBeNull();
    expect(Array.from(seamPath(two, twin, 2, 2)!)).toEqual([2]);
    expect(() => seamPath(two, twin, 0, 8)).toThrow(expect.objectContaining({ code: 'BAD_SEAM' }));
  });
});

describe('seamsFromPolylines', () => {
  it('marks polyline steps that are edges, routes and reports steps that are not, reports bad vertices', () => {
    const m = cylinder(10, 30, 12, 3);
    const twin = twinOf(m);
    // Ring 1 is vertices 12…23. Step 12→13 is an edge; 14→17 is not (three edges along the ring).
    const { mask, problems } = seamsFromPolylines(m, twin, [Uint32Array.from([12, 13, 14, 17]), Uint32Array.from([0, 999])]);
    expect(seamEdgeCount(mask, twin)).toBe(5);
    expect(problems.map((p) => p.kind)).toEqual(['not-an-edge', 'bad-vertex']);
    expect(Array.from(problems[0].path!)).toEqual([14, 15, 16, 17]);
    expect(problems[0].message).toMatch(/share no edge/);
    expect(problems[1].message).toMatch(/vertex 999 is not in the mesh/);
  });
});

describe('findSymmetryPlane and mirrorSeams', () => {
  it('finds the mirror plane of a shape with one symmetry plane, wherever it is moved (property)', () => {
    // A uvSphere squashed into an egg with a bulge on +x only: symmetric in y = 0 and nothing else. The
    // segment count is even so the vertex set is mirror-symmetric in y.
    const base = uvSphere(40, 24, 12);
    const P = Float64Array.from(base.positions);
    for (let v = 0; v < P.length / 3; v++) {
      const x = P[3 * v];
      P[3 * v] = x > 0 ? 1.6 * x : x;
      P[3 * v + 2] *= 1 + 0.3 * (P[3 * v + 2] > 0 ? 1 : 0);
    }
    const egg = { positions: P, triangles: base.triangles };
    fc.assert(
      fc.property(rigidMotion, (motion) => {
        const moved = transformMesh(egg, motion);
        const plane = findSymmetryPlane(moved)!;
        expect(plane).not.toBeNull();
        // The expected normal is the moved y axis.
        const yAxis = transformMesh({ positions: Float64Array.from([0, 0, 0, 0, 1, 0]), triangles: new Uint32Array(0) }, motion).positions;
        const ny = [yAxis[3] - yAxis[0], yAxis[4] - yAxis[1], yAxis[5] - yAxis[2]];
        expect(Math.abs(plane.normal[0] * ny[0] + plane.normal[1] * ny[1] + plane.normal[2] * ny[2])).toBeGreaterThan(1 - 1e-9);
        // The plane passes through the moved origin.
        expect(Math.abs(plane.normal[0] * yAxis[0] + plane.normal[1] * yAxis[1] + plane.normal[2] * yAxis[2] - plane.offset)).toBeLessThan(1e-6 * (1 + Math.abs(plane.offset)));
        expect(plane.error).toBeLessThan(1e-6);
      }),
      { numRuns: 8 },
    );
  });
  it('returns null for a lopsided shape with no mirror plane', () => {
    const m = icoSphere(30, 2);
    const P = Float64Array.from(m.positions);
    for (let v = 0; v < P.length / 3; v++) {
      const [x, y, z] = [P[3 * v], P[3 * v + 1], P[3 * v + 2]];
      const s = 1 + 0.35 * Math.sin(2.1 * x / 30 + 0.7) * Math.cos(1.3 * y / 30 - 0.4) + 0.25 * Math.sin(3.7 * z / 30 + 1.1 * x / 30);
      P[3 * v] *= s * 1.4;
      P[3 * v + 1] *= s * 0.8;
      P[3 * v + 2] *= s;
    }
    expect(findSymmetryPlane({ positions: P, triangles: m.triangles })).toBeNull();
  });
  it('mirrors a seam on one side of the helmet onto the other side, edge for edge', () => {
    const m = helmetShell({ segments: 32, rings: 8 });
    const twin = twinOf(m);
    const plane = findSymmetryPlane(m)!;
    expect(plane).not.toBeNull();
    // A seam along the meridian at azimuth step 3 (vertices 3, 35, 67, … down from the crown ring).
    const mask = emptySeamMask(m.triangles.length / 3);
    const g = buildEdgeGraph(m, twin);
    for (let k = 0; k + 1 < 8; k++) addSeamEdge(mask, twin, findEdge(g, 32 * k + 3, 32 * (k + 1) + 3));
    const out = mirrorSeams(m, twin, mask, plane);
    expect(seamEdgeCount(out, twin)).toBe(2 * 7);
    // Every original seam edge stays, and each has a mirrored partner whose ends mirror its ends.
    const n = plane.normal;
    const mirror = (v: number) => {
      const d = 2 * (n[0] * m.positions[3 * v] + n[1] * m.positions[3 * v + 1] + n[2] * m.positions[3 * v + 2] - plane.offset);
      return [0, 1, 2].map((k) => m.positions[3 * v + k] - d * n[k]);
    };
    for (const h of seamEdgesOf(mask, twin)) {
      expect(isSeamEdge(out, twin, h)).toBe(true);
      const a = mirror(m.triangles[h]);
      const b = mirror(m.triangles[h - (h % 3) + ((h % 3) + 1) % 3]);
      const match = Array.from(seamEdgesOf(out, twin)).some((e) => {
        const p = m.triangles[e];
        const q = m.triangles[e - (e % 3) + ((e % 3) + 1) % 3];
        const close = (v: number, t: number[]) => Math.hypot(m.positions[3 * v] - t[0], m.positions[3 * v + 1] - t[1], m.positions[3 * v + 2] - t[2]) < 1e-6;
        return (close(p, a) && close(q, b)) || (close(p, b) && close(q, a));
      });
      expect(match).toBe(true);
    }
  });
});
