/**
 * Outside checks on polyhedra the engine's own tests do not use: regular prisms, the square pyramid J1, an
 * L-shaped extrusion with an inside corner, and the regular tetrahedron and octahedron at odd scales and turns.
 * Each model is written as an OBJ file (quads and n-gons as such) and read through importModel → buildPattern
 * with seams on creases, as `--seams crease:10` does.
 */
import { describe, expect, it } from 'vitest';
import type { PatternDoc } from '../../../geometry/pattern/pattern-doc';
import { objFile } from '../../fixtures/reference/model-files';
import {
  lOutline,
  moved,
  octahedron,
  prismOver,
  regularPolygon,
  squarePyramid,
  tetrahedron,
  type PolyShape,
} from '../../fixtures/reference/reference-shapes';
import { expectPatternInvariants, interiorAngleDeg, pathLength, patternOfFile } from './reference-checks';

const DEG = 180 / Math.PI;
const crease = { seams: { crease: 10 } } as const;

function creasePattern(shape: PolyShape, extra: Parameters<typeof patternOfFile>[2] = {}): PatternDoc {
  const doc = patternOfFile(objFile(shape), 'shape.obj', { ...crease, ...extra });
  expectPatternInvariants(doc);
  return doc;
}

describe('regular prisms with crease seams', () => {
  for (const n of [3, 6, 8]) {
    it(`${n}-sided prism: side–side dihedral 180° − 360°/n, side–cap 90°, bevels, seam lengths`, () => {
      const rho = 35;
      const h = 70;
      const edge = 2 * rho * Math.sin(Math.PI / n); // side of a regular n-gon of circumradius ρ (elementary geometry)
      const doc = creasePattern(prismOver(regularPolygon(n, rho), h));
      // Interior angle of a regular n-gon is 180° − 360°/n (Euclid I.32 corollary), which is the angle between
      // neighbouring side faces of the right prism; side faces stand square to the caps.
      const sideSide = 180 - 360 / n;
      expect(doc.seams).toHaveLength(3 * n);
      const lateral = doc.seams.filter((s) => Math.abs(s.dihedral.mean - sideSide) < 1e-6);
      const capEdges = doc.seams.filter((s) => Math.abs(s.dihedral.mean - 90) < 1e-6);
      expect(lateral).toHaveLength(n);
      expect(capEdges).toHaveLength(2 * n);
      for (const s of lateral) {
        expect(s.length3d).toBeCloseTo(h, 9);
        // Bevel (180° − θ)/2 from square (common joinery practice, the mitre rule) = 180°/n.
        expect(s.bevel.mean).toBeCloseTo(180 / n, 6);
        expect(s.convex).toBe(true);
        expect(s.bevelFace).toBe('inner');
      }
      for (const s of capEdges) {
        expect(s.length3d).toBeCloseTo(edge, 9);
        expect(s.bevel.mean).toBeCloseTo(45, 6);
        expect(s.convex).toBe(true);
      }
      for (const s of doc.seams) for (const l of s.lengths) expect(l).toBeCloseTo(s.length3d, 6);
      // n congruent side rectangles and two congruent caps (a regular polygon is its own mirror image).
      const sides = doc.pieces.find((p) => p.outline.length === 4 && Math.abs(p.area3d - edge * h) < 1e-6)!;
      expect(sides.quantity).toBe(n);
      const caps = doc.pieces.find((p) => p.outline.length === n && p !== sides)!;
      // Area of a regular n-gon: (n/2)·ρ²·sin(2π/n) (elementary geometry).
      expect(caps.area2d).toBeCloseTo((n / 2) * rho * rho * Math.sin((2 * Math.PI) / n), 6);
      expect(caps.quantity).toBe(2);
      expect(doc.pieces.reduce((q, p) => q + p.quantity, 0)).toBe(n + 2);
      for (let i = 0; i < n; i++) expect(interiorAngleDeg(caps.outline, i)).toBeCloseTo(sideSide, 6);
      for (const p of doc.pieces) expect(p.stretch.maxPct).toBeLessThan(1e-6);
    });
  }
});

describe('a prism over a scalene triangle', () => {
  it('three different side templates, and the two caps as one template cut twice, once mirrored', () => {
    // Sides 50, √(35² + 30²) and √(15² + 30²) (Pythagoras). Seen from outside, the bottom cap is the top cap
    // turned over: congruent only by a reflection, as a scalene triangle has no mirror line (elementary geometry).
    const doc = creasePattern(prismOver([[0, 0], [50, 0], [15, 30]], 40));
    const sides = doc.pieces.filter((p) => p.outline.length === 4);
    expect(sides.map((p) => p.area2d / 40).sort((a, b) => a - b).map((x) => Number(x.toFixed(6)))).toEqual(
      [Math.hypot(15, 30), Math.hypot(35, 30), 50].map((x) => Number(x.toFixed(6))),
    );
    for (const p of sides) expect(p.quantity).toBe(1);
    const cap = doc.pieces.find((p) => p.outline.length === 3)!;
    expect(cap.area2d).toBeCloseTo((50 * 30) / 2, 6);
    expect(cap.quantity).toBe(2);
    expect(cap.mirrored).toBe(true);
    expect(cap.mirroredCopies).toBe(1);
  });
});

describe('the square pyramid J1 (all edges equal)', () => {
  // Dihedral angles from the square pyramid J1 table of Johnson solids: triangle–triangle arccos(−1/3) =
  // 109.4712°, triangle–square arctan(√2) = 54.7356°.
  const triTri = Math.acos(-1 / 3) * DEG;
  const triSquare = Math.atan(Math.SQRT2) * DEG;
  const turns: Array<[string, [number, number, number], number, number, [number, number, number]]> = [
    ['as built', [0, 0, 1], 0, 1, [0, 0, 0]],
    ['turned 37° about a skew axis, scaled 3.7, moved far off', [1, 2, -0.5], 0.65, 3.7, [1e4, -2e4, 5e3]],
  ];
  for (const [name, axis, angle, k, t] of turns) {
    it(`${name}: dihedrals, bevels, pieces`, () => {
      const a = 50;
      const doc = creasePattern(moved(squarePyramid(a), axis, angle, k, t));
      expect(doc.seams).toHaveLength(8);
      const tt = doc.seams.filter((s) => Math.abs(s.dihedral.mean - triTri) < 1e-6);
      const ts = doc.seams.filter((s) => Math.abs(s.dihedral.mean - triSquare) < 1e-6);
      expect(tt).toHaveLength(4);
      expect(ts).toHaveLength(4);
      for (const s of tt) expect(s.bevel.mean).toBeCloseTo((180 - triTri) / 2, 6); // common joinery practice
      for (const s of ts) expect(s.bevel.mean).toBeCloseTo((180 - triSquare) / 2, 6);
      for (const s of doc.seams) expect(s.length3d).toBeCloseTo(k * a, 7);
      const tri = doc.pieces.find((p) => p.outline.length === 3)!;
      const sq = doc.pieces.find((p) => p.outline.length === 4)!;
      expect(tri.quantity).toBe(4);
      expect(sq.quantity).toBe(1);
      // Equilateral triangle area (√3/4)a² and square a² (elementary geometry).
      expect(tri.area2d).toBeCloseTo((Math.sqrt(3) / 4) * (k * a) ** 2, 5);
      expect(sq.area2d).toBeCloseTo((k * a) ** 2, 5);
      for (let i = 0; i < 3; i++) expect(interiorAngleDeg(tri.outline, i)).toBeCloseTo(60, 6);
      for (let i = 0; i < 4; i++) expect(interiorAngleDeg(sq.outline, i)).toBeCloseTo(90, 6);
    });
  }
});

describe('regular tetrahedron and octahedron at odd scales and turns', () => {
  // Dihedral angles: tetrahedron arccos(1/3) = 70.5288°, octahedron arccos(−1/3) = 109.4712° (Coxeter,
  // Regular Polytopes, Table I).
  const cases: Array<[string, PolyShape, number, number, 'mm' | 'm']> = [
    ['tetrahedron, edge 0.001 m (--units m)', tetrahedron(0.001), Math.acos(1 / 3) * DEG, 4, 'm'],
    ['tetrahedron, edge 1e4 mm', moved(tetrahedron(1e4), [0.3, -1, 0.2], 2.1, 1, [-3e4, 0, 7e3]), Math.acos(1 / 3) * DEG, 4, 'mm'],
    ['octahedron, edge 0.001 m (--units m), turned', moved(octahedron(0.001), [1, 1, 1], 0.9, 1, [2, 3, -1]), Math.acos(-1 / 3) * DEG, 8, 'm'],
    ['octahedron, edge 1e4 mm', octahedron(1e4), Math.acos(-1 / 3) * DEG, 8, 'mm'],
  ];
  for (const [name, shape, theta, faces, unit] of cases) {
    it(name, () => {
      const edgeMm = unit === 'm' ? 1 : 1e4;
      const doc = patternOfFile(objFile(shape), 'solid.obj', { ...crease, unit });
      expectPatternInvariants(doc);
      expect(doc.pieces).toHaveLength(1);
      expect(doc.pieces[0].quantity).toBe(faces);
      expect(doc.seams).toHaveLength((3 * faces) / 2);
      for (const s of doc.seams) {
        expect(s.dihedral.mean).toBeCloseTo(theta, 6);
        expect(s.bevel.mean).toBeCloseTo((180 - theta) / 2, 6); // common joinery practice
        expect(s.length3d / edgeMm).toBeCloseTo(1, 9);
        for (const l of s.lengths) expect(l / edgeMm).toBeCloseTo(1, 9);
        expect(s.stations[s.stations.length - 1].at / edgeMm).toBeCloseTo(1, 9);
      }
      expect(doc.pieces[0].area2d / edgeMm ** 2).toBeCloseTo(Math.sqrt(3) / 4, 9);
      expect(pathLength([...doc.pieces[0].outline, doc.pieces[0].outline[0]]) / edgeMm).toBeCloseTo(3, 9);
    });
  }
});

describe('an L-shaped extrusion: one inside corner', () => {
  it('reports the inside corner as 270°, not convex, bevel taken off the outer face; the rest as outside corners', () => {
    const a = 60, b = 20, h = 45;
    const doc = creasePattern(prismOver(lOutline(a, b), h));
    // Six side faces, two L caps: 6 lateral seams + 12 cap seams.
    expect(doc.seams).toHaveLength(18);
    const inside = doc.seams.filter((s) => !s.convex);
    // The L's reflex corner: the side faces meet at 270° (360° − 90°, elementary geometry), an inside corner.
    expect(inside).toHaveLength(1);
    expect(inside[0].dihedral.mean).toBeCloseTo(270, 6);
    expect(inside[0].bevel.mean).toBeCloseTo(45, 6);
    expect(inside[0].bevelFace).toBe('outer');
    expect(inside[0].length3d).toBeCloseTo(h, 9);
    for (const s of doc.seams.filter((x) => x.convex)) {
      expect(s.dihedral.mean).toBeCloseTo(90, 6);
      expect(s.bevelFace).toBe('inner');
    }
    // Caps: one L-shaped template, cut twice (top and bottom are mirror images of each other only by turning
    // over, which an L allows as it has a mirror line), area a² − (a − b)².
    const cap = doc.pieces.find((p) => p.outline.length === 6)!;
    expect(cap.area2d).toBeCloseTo(a * a - (a - b) * (a - b), 6);
    expect(cap.quantity).toBe(2);
    const angles = cap.outline.map((_, i) => interiorAngleDeg(cap.outline, i)).sort((x, y) => x - y);
    for (let i = 0; i < 5; i++) expect(angles[i]).toBeCloseTo(90, 6);
    expect(angles[5]).toBeCloseTo(270, 6);
    // The seam along the reflex edge: each side piece's edge carries the bevel on the outer face.
    const sidesOnInside = doc.pieces.flatMap((p) => (p.seamEdges ?? []).filter((e) => e.seam === inside[0].label));
    expect(sidesOnInside.length).toBeGreaterThanOrEqual(1);
    for (const e of sidesOnInside) expect(e.bevelFace).toBe('outer');
  });
});
