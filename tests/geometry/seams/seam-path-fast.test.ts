import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { interiorDihedralDeg } from '../../../geometry/mesh/dihedral-angles';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { buildEdgeGraph, findEdge } from '../../../geometry/seams/edge-graph';
import { seamPath } from '../../../geometry/seams/seam-path';
import { seamPathFinder } from '../../../geometry/seams/seam-path-fast';
import { icoSphere, platonicSolid, torus, transformMesh } from '../../../geometry/shapes';
import { rigidMotion, scaleFactor } from '../shapes/motion-arbitrary';

const twinOf = (m: TriMesh) => buildTwins(m.triangles, m.positions.length / 3);
const pathLength = (m: TriMesh, p: ArrayLike<number>) => {
  let s = 0;
  for (let i = 0; i + 1 < p.length; i++) {
    const a = 3 * p[i];
    const b = 3 * p[i + 1];
    s += Math.hypot(m.positions[b] - m.positions[a], m.positions[b + 1] - m.positions[a + 1], m.positions[b + 2] - m.positions[a + 2]);
  }
  return s;
};

describe('seamPathFinder (A*)', () => {
  it('finds paths as short as Floyd–Warshall all-pairs distances (Cormen et al., Introduction to Algorithms, §25.2)', () => {
    const m = icoSphere(50, 1);
    const V = m.positions.length / 3;
    const twin = twinOf(m);
    const g = buildEdgeGraph(m, twin);
    const D = Array.from({ length: V }, (_, i) => Array.from({ length: V }, (_, j) => (i === j ? 0 : Infinity)));
    for (let v = 0; v < V; v++) for (let k = g.offset[v]; k < g.offset[v + 1]; k++) D[v][g.neighbor[k]] = g.length[k];
    for (let k = 0; k < V; k++) for (let i = 0; i < V; i++) for (let j = 0; j < V; j++) if (D[i][k] + D[k][j] < D[i][j]) D[i][j] = D[i][k] + D[k][j];
    const find = seamPathFinder(m, twin);
    fc.assert(
      fc.property(fc.nat(V - 1), fc.nat(V - 1), (a, b) => {
        const p = find(a, b)!;
        expect(p[0]).toBe(a);
        expect(p[p.length - 1]).toBe(b);
        for (let i = 0; i + 1 < p.length; i++) expect(findEdge(g, p[i], p[i + 1])).toBeGreaterThanOrEqual(0);
        expect(pathLength(m, p)).toBeCloseTo(D[a][b], 9);
      }),
      { numRuns: 200 },
    );
  });

  it('gives the same path lengths as Dijkstra seamPath on a torus, also after rotation, translation and scale', () => {
    fc.assert(
      fc.property(rigidMotion, scaleFactor, fc.nat(10_000), fc.nat(10_000), (motion, s, i, j) => {
        const m = transformMesh(torus(30, 10, 40, 16), { ...motion, scale: s });
        const V = m.positions.length / 3;
        const twin = twinOf(m);
        const find = seamPathFinder(m, twin);
        const a = i % V;
        const b = j % V;
        const fast = pathLength(m, find(a, b)!);
        const plain = pathLength(m, seamPath(m, twin, a, b)!);
        expect(Math.abs(fast - plain)).toBeLessThanOrEqual(1e-9 * Math.max(1, plain));
      }),
      { numRuns: 40 },
    );
  });

  it('with preferCreases matches seamPath with preferCreases: across a cube face it takes the two crease edges', () => {
    const m = platonicSolid('cube', 10);
    const twin = twinOf(m);
    const d = interiorDihedralDeg(m.positions, m.triangles, twin);
    const diag = Array.from(d.keys()).find((h) => twin[h] >= 0 && Math.abs(d[h] - 180) < 1e-9)!;
    const a = m.triangles[diag];
    const b = m.triangles[diag - (diag % 3) + ((diag % 3) + 1) % 3];
    expect(Array.from(seamPathFinder(m, twin)(a, b)!)).toEqual([a, b]);
    const bent = seamPathFinder(m, twin, { preferCreases: true })(a, b)!;
    // Cube of edge 10 mm: the two crease edges around a face corner are 10 + 10 mm.
    expect(bent).toHaveLength(3);
    expect(pathLength(m, bent)).toBeCloseTo(20, 9);
    expect(pathLength(m, seamPath(m, twin, a, b, { preferCreases: true })!)).toBeCloseTo(20, 9);
  });

  it('returns null between unconnected parts, [v] for v → v, and BAD_SEAM naming a vertex outside the mesh', () => {
    const a = platonicSolid('tetrahedron', 1);
    const two: TriMesh = {
      positions: Float64Array.from([...a.positions, ...transformMesh(a, { translation: [5, 0, 0] }).positions]),
      triangles: Uint32Array.from([...a.triangles, ...Array.from(a.triangles, (i) => i + 4)]),
    };
    const find = seamPathFinder(two, twinOf(two));
    expect(find(0, 5)).toBeNull();
    expect(Array.from(find(2, 2)!)).toEqual([2]);
    // After a failed search the scratch must not leak into the next one.
    expect(Array.from(find(0, 1)!)).toEqual([0, 1]);
    expect(() => find(0, 8)).toThrow(/seam end vertex 8 is not in the mesh \(0…7\)/);
    expect(() => find(-1, 0)).toThrow(/seam start vertex -1/);
  });
});
