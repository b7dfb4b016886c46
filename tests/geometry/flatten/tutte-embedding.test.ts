import { describe, expect, it } from 'vitest';
import { arapFlatten } from '../../../geometry/flatten/arap';
import { boundaryLoops } from '../../../geometry/flatten/boundary-loops';
import { pieceTopology } from '../../../geometry/flatten/piece-topology';
import { signedAreas } from '../../../geometry/flatten/signed-area';
import { tutteEmbedding } from '../../../geometry/flatten/tutte-embedding';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { helmetShell, icoSphere } from '../../../geometry/shapes';
import { annulusPiece } from './test-meshes';

/** The mesh without the triangles whose three corners all pass `drop`, unused vertices removed. */
function without(mesh: TriMesh, drop: (z: number) => boolean): TriMesh {
  const keep: number[] = [];
  for (let f = 0; f < mesh.triangles.length / 3; f++) {
    const c = [0, 1, 2].map((k) => mesh.triangles[3 * f + k]);
    if (!c.every((v) => drop(mesh.positions[3 * v + 2]))) keep.push(...c);
  }
  const index = new Int32Array(mesh.positions.length / 3).fill(-1);
  for (const v of keep) index[v] = 0;
  let k = 0;
  for (let v = 0; v < index.length; v++) if (index[v] === 0) index[v] = k++;
  const positions = new Float64Array(3 * k);
  for (let v = 0; v < index.length; v++) if (index[v] >= 0) positions.set(mesh.positions.subarray(3 * v, 3 * v + 3), 3 * index[v]);
  return { positions, triangles: Uint32Array.from(keep, (v) => index[v]) };
}

function inverted(uv: Float64Array, triangles: Uint32Array): number {
  return signedAreas(uv, triangles).filter((a) => !(a > 0)).length;
}

describe('boundaryLoops', () => {
  it('finds the outer loop (counter-clockwise, longest first) and the hole (clockwise) of an annulus', () => {
    const piece = annulusPiece(20, 50, 36, 4);
    const topo = pieceTopology(piece.positions, piece.triangles);
    const loops = boundaryLoops(piece.positions, piece.triangles, topo.boundary);
    expect(loops.length).toBe(2);
    expect(topo.loops).toBe(2);
    expect(loops[0].length).toBe(36);
    expect(loops[1].length).toBe(36);
    const shoelace = (loop: Int32Array): number => {
      let s = 0;
      for (let i = 0; i < loop.length; i++) {
        const a = loop[i];
        const b = loop[(i + 1) % loop.length];
        s += piece.positions[3 * a] * piece.positions[3 * b + 1] - piece.positions[3 * b] * piece.positions[3 * a + 1];
      }
      return s / 2;
    };
    // Area of a regular 36-gon of circumradius r: ½·36·r²·sin(2π/36) (any geometry handbook).
    const polygon = (r: number): number => 18 * r * r * Math.sin((2 * Math.PI) / 36);
    expect(shoelace(loops[0])).toBeCloseTo(polygon(50), 8);
    expect(shoelace(loops[1])).toBeCloseTo(-polygon(20), 8);
  });
});

describe('tutteEmbedding', () => {
  it('puts the hub of a wheel at the centre of the rim circle, whose circumference is the rim length', () => {
    // A 7-spoke pyramid: hub above the centre of a regular heptagon of circumradius 30.
    const n = 7;
    const positions = new Float64Array(3 * (n + 1));
    const triangles = new Uint32Array(3 * n);
    for (let k = 0; k < n; k++) {
      positions.set([30 * Math.cos((2 * Math.PI * k) / n), 30 * Math.sin((2 * Math.PI * k) / n), 0], 3 * k);
      triangles.set([k, (k + 1) % n, n], 3 * k);
    }
    positions.set([0, 0, 25], 3 * n);
    const topo = pieceTopology(positions, triangles);
    const outer = boundaryLoops(positions, triangles, topo.boundary)[0];
    const uv = tutteEmbedding(positions, triangles, topo.twin, outer);
    // Barycentric: the hub is the mean of its 7 neighbours, equally spaced on a circle, i.e. its centre
    // (Tutte 1963); the rim's length 7·2·30·sin(π/7) becomes the circumference.
    expect(uv[2 * n]).toBeCloseTo(0, 10);
    expect(uv[2 * n + 1]).toBeCloseTo(0, 10);
    const radius = (n * 2 * 30 * Math.sin(Math.PI / n)) / (2 * Math.PI);
    for (let k = 0; k < n; k++) expect(Math.hypot(uv[2 * k], uv[2 * k + 1])).toBeCloseTo(radius, 10);
  });

  it.each([
    ['a hemisphere', () => without(icoSphere(100, 3), (z) => z < -1e-9)],
    ['a sphere with a small cap removed', () => without(icoSphere(100, 3), (z) => z > 97)],
    ['the demo helmet shell', () => helmetShell()],
  ])('lays %s flat without an inverted triangle, and ARAP from there keeps none', (_, make) => {
    // Floater 1997 (CAGD 14), Tutte's theorem for triangulated disks: convex boundary and positive weights
    // give an embedding; the flip guard of arapFlatten never adds inversions (Liu et al. 2008 rounds,
    // shortened as needed).
    const piece = make();
    const topo = pieceTopology(piece.positions, piece.triangles);
    const outer = boundaryLoops(piece.positions, piece.triangles, topo.boundary)[0];
    const uv = tutteEmbedding(piece.positions, piece.triangles, topo.twin, outer);
    expect(inverted(uv, piece.triangles)).toBe(0);
    const relaxed = arapFlatten(piece.positions, piece.triangles, uv, { iterations: 10 });
    expect(inverted(relaxed, piece.triangles)).toBe(0);
  });

  it('needs an outer loop of at least three vertices', () => {
    const piece = annulusPiece(20, 50, 12, 2);
    const topo = pieceTopology(piece.positions, piece.triangles);
    expect(() => tutteEmbedding(piece.positions, piece.triangles, topo.twin, Int32Array.of(0, 1))).toThrow(/need at least 3/);
  });
});
