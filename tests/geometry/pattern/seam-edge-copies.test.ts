import { describe, expect, it } from 'vitest';
import { buildPattern } from '../../../geometry/pattern/build-pattern';
import type { PatternDoc, PatternPiece, PieceSeamEdge, PointMm } from '../../../geometry/pattern/pattern-doc';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { platonicSolid, transformMesh } from '../../../geometry/shapes';
import { modelOf, polylineLength } from './pattern-fixtures';

/** Distance from p to segment ab. */
function segmentDistance(p: PointMm, a: PointMm, b: PointMm): number {
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const t = Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / (dx * dx + dy * dy || 1)));
  return Math.hypot(p[0] - a[0] - t * dx, p[1] - a[1] - t * dy);
}

/**
 * Where a seam edge's path lies on the template's outline: the largest distance from any path point to the
 * outline, and whether the path runs with the outline's counter-clockwise direction (+1) or against it (−1).
 */
function onOutline(piece: PatternPiece, edge: PieceSeamEdge): { gap: number; direction: number } {
  const o = piece.outline;
  let gap = 0;
  for (const p of edge.path) {
    let best = Infinity;
    for (let i = 0; i < o.length; i++) best = Math.min(best, segmentDistance(p, o[i], o[(i + 1) % o.length]));
    gap = Math.max(gap, best);
  }
  const [p, q] = [edge.path[0], edge.path[1]];
  const mid: PointMm = [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2];
  let nearest = 0;
  for (let i = 1; i < o.length; i++) {
    if (segmentDistance(mid, o[i], o[(i + 1) % o.length]) < segmentDistance(mid, o[nearest], o[(nearest + 1) % o.length])) nearest = i;
  }
  const a = o[nearest];
  const b = o[(nearest + 1) % o.length];
  return { gap, direction: Math.sign((q[0] - p[0]) * (b[0] - a[0]) + (q[1] - p[1]) * (b[1] - a[1])) };
}

/** Every (template, copy, seam edge) of the document. */
function allEdges(doc: PatternDoc): Array<{ piece: PatternPiece; edge: PieceSeamEdge }> {
  return doc.pieces.flatMap((piece) => (piece.seamEdges ?? []).map((edge) => ({ piece, edge })));
}

/**
 * A gable: two congruent, scalene quadrilateral plates that meet along a ridge on the y axis at an interior
 * angle of 120°, each the mirror image of the other in the plane x = 0. Invented for this test.
 */
function gable(): TriMesh {
  const tilt = (30 * Math.PI) / 180;
  // Plate coordinates (s along the ridge, t away from it); the quadrilateral has no symmetry of its own.
  const plate: Array<[number, number]> = [[0, 0], [80, 0], [95, 40], [10, 30]];
  const at = (s: number, t: number, side: number): number[] => [side * t * Math.cos(tilt), s, -t * Math.sin(tilt)];
  const positions = [
    ...at(0, 0, 1), ...at(80, 0, 1), // ridge: vertices 0 and 1, shared
    ...at(95, 40, 1), ...at(10, 30, 1), // plate on x > 0: vertices 2, 3
    ...at(95, 40, -1), ...at(10, 30, -1), // its mirror on x < 0: vertices 4, 5
  ];
  expect(plate).toHaveLength(4);
  // Outward normals point up (+z) on both plates: the x > 0 plate is wound one way, its mirror the other.
  const triangles = [0, 2, 1, 0, 3, 2, 0, 1, 4, 0, 4, 5];
  return { positions: Float64Array.from(positions), triangles: Uint32Array.from(triangles) };
}

describe('seam edges on every copy of a template', () => {
  it('cube: every seam number sits on exactly two (copy, edge) places of the one template, with matching lengths', () => {
    const edge = 40;
    // A cube has 6 square faces and 12 edges, each edge shared by two faces (Coxeter, Regular Polytopes, Table I).
    const doc = buildPattern(modelOf(platonicSolid('cube', edge)), { seams: { crease: 10 } });
    expect(doc.pieces).toHaveLength(1);
    const template = doc.pieces[0];
    expect(template.quantity).toBe(6);
    expect(doc.seams).toHaveLength(12);
    const edges = allEdges(doc);
    expect(edges).toHaveLength(24);
    for (const seam of doc.seams) {
      const places = edges.filter((e) => e.edge.seam === seam.label);
      expect(places).toHaveLength(2);
      // Two different faces of the cube, so two different copies.
      expect(places[0].edge.copy).not.toBe(places[1].edge.copy);
      expect(places.map((e) => e.edge.side).sort()).toEqual([0, 1]);
      for (const { edge: e } of places) {
        // Lengths match the seam's own (issue 3 point 7: both sides' lengths equal the 3D length).
        expect(polylineLength(e.path)).toBeCloseTo(seam.length3d, 6);
        expect(polylineLength(e.path)).toBeCloseTo(edge, 6);
      }
    }
    // Each copy has its four sides marked, and every mark lies on the template's outline: the copy's frame was
    // carried onto the template's by a rigid motion. Side 0 runs with the piece's own counter-clockwise
    // boundary (it is the face's own half-edge), side 1 against it.
    for (let copy = 0; copy < 6; copy++) {
      const mine = edges.filter((e) => (e.edge.copy ?? 0) === copy);
      expect(mine).toHaveLength(4);
      for (const { piece, edge: e } of mine) {
        const where = onOutline(piece, e);
        expect(where.gap).toBeLessThan(1e-6 * edge);
        expect(where.direction).toBe(e.side === 0 ? 1 : -1);
      }
    }
  });

  it('gable: the mirrored copy is carried through the mirror, so both sides of the ridge land on the same edge', () => {
    const doc = buildPattern(modelOf(gable()), { seams: { crease: 10 } });
    expect(doc.pieces).toHaveLength(1);
    const template = doc.pieces[0];
    expect(template.quantity).toBe(2);
    expect(template.mirrored).toBe(true);
    expect(doc.seams).toHaveLength(1);
    const ridge = template.seamEdges ?? [];
    expect(ridge).toHaveLength(2);
    const plain = ridge.find((e) => (e.copy ?? 0) === 0)!;
    const mirrored = ridge.find((e) => e.copy === 1)!;
    expect(plain.side).not.toBe(mirrored.side);
    // The mirror in x = 0 fixes every ridge point, so the mirrored copy's ridge, carried through the reflection
    // into the template's frame, is the template's ridge point for point, in the seam's direction.
    expect(mirrored.path).toHaveLength(plain.path.length);
    plain.path.forEach((p, k) => {
      expect(mirrored.path[k][0]).toBeCloseTo(p[0], 6);
      expect(mirrored.path[k][1]).toBeCloseTo(p[1], 6);
    });
    // The ridge is 80 mm long (plate coordinates above).
    expect(polylineLength(plain.path)).toBeCloseTo(80, 6);
  });

  it('keeps every mark on the template under a rotation, translation and scale of the sculpt (STYLE.md §10)', () => {
    const motion = { rotation: [0.3, -0.5, 0.2, 0.8], translation: [120, -40, 7], scale: 3.7 };
    const cube = buildPattern(modelOf(transformMesh(platonicSolid('cube', 40), motion)), { seams: { crease: 10 } });
    const edges = allEdges(cube);
    expect(edges).toHaveLength(24);
    for (const { piece, edge: e } of edges) {
      expect(onOutline(piece, e).gap).toBeLessThan(1e-6 * 148);
      expect(polylineLength(e.path)).toBeCloseTo(40 * 3.7, 6);
    }
    const roof = buildPattern(modelOf(transformMesh(gable(), motion)), { seams: { crease: 10 } });
    const [plain, mirrored] = [0, 1].map((c) => roof.pieces[0].seamEdges!.find((e) => (e.copy ?? 0) === c)!);
    plain.path.forEach((p, k) => expect(Math.hypot(mirrored.path[k][0] - p[0], mirrored.path[k][1] - p[1])).toBeLessThan(1e-6 * 296));
    expect(polylineLength(plain.path)).toBeCloseTo(80 * 3.7, 6);
  });
});
