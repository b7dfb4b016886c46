import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { splitPieces } from '../../../geometry/pieces/split-pieces';
import { pieceIndexOfLabel, pieceLabel } from '../../../geometry/pieces/label-pieces';
import { creaseSeams } from '../../../geometry/seams/crease-seams';
import { addSeamEdge, emptySeamMask } from '../../../geometry/seams/seam-mask';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import { boundaryLoops } from '../../../geometry/mesh/boundary-loops';
import { eulerCharacteristic } from '../../../geometry/mesh/euler-characteristic';
import { surfaceArea } from '../../../geometry/mesh/mesh-measures';
import { cone, cylinder, platonicSolid, transformMesh, uvSphere } from '../../../geometry/shapes';
import type { PlatonicKind } from '../../../geometry/shapes';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { rigidMotion, scaleFactor } from '../shapes/motion-arbitrary';

const twinOf = (m: TriMesh) => buildTwins(m.triangles, m.positions.length / 3);

/** Marks every edge whose both ends satisfy `pick`. */
function seamWhere(m: TriMesh, twin: Int32Array, pick: (v: number) => boolean): Uint8Array {
  const mask = emptySeamMask(m.triangles.length / 3);
  for (let h = 0; h < m.triangles.length; h++) {
    if (pick(m.triangles[h]) && pick(m.triangles[h - (h % 3) + ((h % 3) + 1) % 3])) addSeamEdge(mask, twin, h);
  }
  return mask;
}

describe('splitPieces', () => {
  // Face counts of the Platonic solids {p,q} (Coxeter, Regular Polytopes, Table I): every face becomes one
  // piece when every crease is a seam.
  const faces: Record<PlatonicKind, number> = { tetrahedron: 4, cube: 6, octahedron: 8, dodecahedron: 12, icosahedron: 20 };
  for (const [kind, n] of Object.entries(faces) as [PlatonicKind, number][]) {
    it(`${kind} cut at every crease falls into ${n} flat faces, each a disc, under any motion and scale`, () => {
      const check = (m: TriMesh) => {
        const twin = twinOf(m);
        const pieces = splitPieces(m, twin, creaseSeams(m.positions, m.triangles, twin, 10));
        expect(pieces).toHaveLength(n);
        for (const p of pieces) {
          const lt = buildTwins(p.triangles, p.positions.length / 3);
          expect(eulerCharacteristic(p.triangles, lt)).toBe(1);
          expect(boundaryLoops(p.triangles, lt)).toHaveLength(1);
        }
        expect(pieces.reduce((s, p) => s + surfaceArea(p), 0) / surfaceArea(m)).toBeCloseTo(1, 12);
      };
      check(platonicSolid(kind, 30));
      fc.assert(fc.property(rigidMotion, scaleFactor, (motion, k) => check(transformMesh(platonicSolid(kind, 30), { ...motion, scale: k }))), { numRuns: 5 });
    });
  }
  it('a tube cut along one line stays one piece and opens into a disc (the seam becomes boundary on both sides)', () => {
    const m = cylinder(20, 50, 24, 4);
    const twin = twinOf(m);
    // The line at azimuth 0: vertex index ≡ 0 (mod 24).
    const mask = seamWhere(m, twin, (v) => v % 24 === 0);
    const pieces = splitPieces(m, twin, mask);
    expect(pieces).toHaveLength(1);
    const p = pieces[0];
    expect(p.positions.length / 3).toBe(m.positions.length / 3 + 5); // the 5 seam vertices are doubled
    const lt = buildTwins(p.triangles, p.positions.length / 3);
    expect(eulerCharacteristic(p.triangles, lt)).toBe(1);
    const loops = boundaryLoops(p.triangles, lt);
    expect(loops).toHaveLength(1);
    expect(loops[0].length).toBe(2 * 24 + 2 * 4);
  });
  it('a dart (a seam from the rim that stops inside) opens on both sides and keeps its tip as one vertex', () => {
    const m = cone(30, 40, 16, 4);
    const twin = twinOf(m);
    // Rings 0, 1 and 2 at azimuth 0: vertices 0, 16, 32 — a seam from the rim two bands up.
    const mask = seamWhere(m, twin, (v) => v === 0 || v === 16 || v === 32);
    const pieces = splitPieces(m, twin, mask);
    expect(pieces).toHaveLength(1);
    expect(pieces[0].positions.length / 3).toBe(m.positions.length / 3 + 2);
    const lt = buildTwins(pieces[0].triangles, pieces[0].positions.length / 3);
    expect(boundaryLoops(pieces[0].triangles, lt)[0].length).toBe(16 + 4);
  });
  it('links back to the whole: faceIds ascending and covering every face once; vertexIds give the same positions', () => {
    const m = uvSphere(40, 16, 8);
    const twin = twinOf(m);
    const pieces = splitPieces(m, twin, seamWhere(m, twin, (v) => Math.abs(m.positions[3 * v + 2]) < 1e-9 || m.positions[3 * v] > 20));
    const seen = new Uint8Array(m.triangles.length / 3);
    let lastFirst = -1;
    for (const p of pieces) {
      expect(p.faceIds[0]).toBeGreaterThan(lastFirst);
      lastFirst = p.faceIds[0];
      for (let i = 0; i < p.faceIds.length; i++) {
        if (i > 0) expect(p.faceIds[i]).toBeGreaterThan(p.faceIds[i - 1]);
        seen[p.faceIds[i]]++;
        for (let k = 0; k < 3; k++) expect(p.vertexIds[p.triangles[3 * i + k]]).toBe(m.triangles[3 * p.faceIds[i] + k]);
      }
      for (let v = 0; v < p.vertexIds.length; v++) {
        for (let a = 0; a < 3; a++) expect(p.positions[3 * v + a]).toBe(m.positions[3 * p.vertexIds[v] + a]);
      }
    }
    expect(seen.every((x) => x === 1)).toBe(true);
    expect(pieces.length).toBeGreaterThan(1);
  });
  it('with no seams a closed sphere is one closed piece; a wrong mask length is BAD_SEAM', () => {
    const m = uvSphere(10, 8, 4);
    const twin = twinOf(m);
    const pieces = splitPieces(m, twin, emptySeamMask(m.triangles.length / 3));
    expect(pieces).toHaveLength(1);
    expect(buildTwins(pieces[0].triangles, pieces[0].positions.length / 3).every((t) => t >= 0)).toBe(true);
    expect(() => splitPieces(m, twin, new Uint8Array(3))).toThrow(expect.objectContaining({ code: 'BAD_SEAM' }));
  });
});

describe('pieceLabel', () => {
  it('counts A…Z, AA…AZ, BA…, ZZ, AAA like spreadsheet columns (bijective base 26)', () => {
    expect([0, 1, 25, 26, 27, 51, 52, 701, 702].map(pieceLabel)).toEqual(['A', 'B', 'Z', 'AA', 'AB', 'AZ', 'BA', 'ZZ', 'AAA']);
    fc.assert(fc.property(fc.nat(1_000_000), (i) => pieceIndexOfLabel(pieceLabel(i)) === i));
    expect(pieceIndexOfLabel('a1')).toBeNull();
    expect(() => pieceLabel(-1)).toThrow(expect.objectContaining({ code: 'BAD_OPTION' }));
    expect(() => pieceLabel(1.5)).toThrow(expect.objectContaining({ code: 'BAD_OPTION' }));
  });
});
