import { describe, expect, it } from 'vitest';
import { buildPattern } from '../../../geometry/pattern/build-pattern';
import type { PatternDoc, PointMm } from '../../../geometry/pattern/pattern-doc';
import { signedAreaMm2 } from '../../../geometry/layout/outline-measure';
import { cone, cylinder, helmetShell, icoSphere, platonicSolid, sphereGore, transformMesh } from '../../../geometry/shapes';
import type { PlatonicKind } from '../../../geometry/shapes';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { extent, fanPlate, hinge, joinMeshes, modelOf, polylineLength } from './pattern-fixtures';

const deg = (r: number): number => (r * 180) / Math.PI;

/** Interior angle of a CCW polygon at vertex i, degrees in (0, 360). */
function interiorAngleDeg(poly: PointMm[], i: number): number {
  const v = poly[i];
  const p = poly[(i + poly.length - 1) % poly.length];
  const n = poly[(i + 1) % poly.length];
  const ax = n[0] - v[0], ay = n[1] - v[1];
  const bx = p[0] - v[0], by = p[1] - v[1];
  let a = deg(Math.atan2(ax * by - ay * bx, ax * bx + ay * by));
  if (a < 0) a += 360;
  return a;
}

/** Chord factor of a regular n-gon: its perimeter over the circumscribed circle's (elementary geometry). */
const chordFactor = (n: number): number => (n * Math.sin(Math.PI / n)) / Math.PI;

describe('buildPattern: Platonic solids with every edge a seam', () => {
  // Schläfli symbols {p, q}, face and edge counts (Coxeter, Regular Polytopes, Table I).
  const solids: Array<[PlatonicKind, number, number, number, number]> = [
    ['tetrahedron', 3, 3, 4, 6],
    ['cube', 4, 3, 6, 12],
    ['octahedron', 3, 4, 8, 12],
    ['dodecahedron', 5, 3, 12, 30],
    ['icosahedron', 3, 5, 20, 30],
  ];
  for (const [kind, p, q, faces, edges] of solids) {
    it(`${kind}: dihedral, bevel, convexity and seam lengths`, () => {
      const edge = 40;
      const doc = buildPattern(modelOf(platonicSolid(kind, edge)), { seams: { crease: 10 } });
      // Dihedral angle: sin(θ/2) = cos(π/q)/sin(π/p) (Coxeter, Regular Polytopes, Table I).
      const theta = 2 * deg(Math.asin(Math.cos(Math.PI / q) / Math.sin(Math.PI / p)));
      expect(doc.seams).toHaveLength(edges);
      // All faces are congruent regular polygons: one template cut `faces` times.
      expect(doc.pieces).toHaveLength(1);
      expect(doc.pieces[0].quantity).toBe(faces);
      expect(doc.pieces[0].mirrored).toBe(false);
      expect(doc.pieces[0].outline).toHaveLength(p);
      expect(doc.pieces[0].stretch.maxPct).toBeLessThan(1e-6);
      for (const s of doc.seams) {
        expect(s.dihedral.min).toBeCloseTo(theta, 6);
        expect(s.dihedral.max).toBeCloseTo(theta, 6);
        // Bevel (180° − θ)/2 from square for a symmetric joint (common joinery practice).
        expect(s.bevel.mean).toBeCloseTo((180 - theta) / 2, 6);
        expect(s.convex).toBe(true);
        expect(s.bevelFace).toBe('inner');
        expect(s.length3d).toBeCloseTo(edge, 9);
        // Both 2D sides match the 3D length (issue 3 point 7).
        expect(s.lengths).toHaveLength(2);
        for (const l of s.lengths) expect(l).toBeCloseTo(edge, 6);
        expect(s.pieces).toEqual(['A', 'A']);
      }
      // The representative (copy 0) carries a seam edge along each of its p sides, and so does every other copy:
      // 2·edges = p·faces entries in all (each edge borders two faces).
      expect(doc.pieces[0].seamEdges!.filter((e) => (e.copy ?? 0) === 0)).toHaveLength(p);
      expect(doc.pieces[0].seamEdges).toHaveLength(2 * edges);
      for (const e of doc.pieces[0].seamEdges!) expect(polylineLength(e.path)).toBeCloseTo(edge, 6);
    });
  }
});

describe('buildPattern: developable and doubly curved surfaces', () => {
  it('develops a cone cut along one generator into a sector of radius s and angle 360°·r/s', () => {
    const r = 30, h = 40, seg = 96, rings = 6;
    const s = Math.hypot(r, h); // slant height 50
    const generator = Array.from({ length: rings + 1 }, (_, k) => k * seg);
    const doc = buildPattern(modelOf(cone(r, h, seg, rings), [generator]));
    expect(doc.pieces).toHaveLength(1);
    const piece = doc.pieces[0];
    expect(piece.stretch.maxPct).toBeLessThan(0.1);
    // Sector angle 360°·r/s = 216° (descriptive geometry: development of a right circular cone). The polyhedral
    // cone's fan angles sum to seg·2·asin((r/s)·sin(π/seg)), within 0.01° of that for 96 segments.
    const expected = (360 * r) / s;
    const apexSide = doc.seams[0].stations; // seam runs apex ↔ base
    expect(apexSide.length).toBeGreaterThanOrEqual(2);
    const [side0, side1] = piece.seamEdges!;
    const ends = [0, side0.path.length - 1];
    const apexIndex = ends.find((k) => Math.hypot(side0.path[k][0] - side1.path[k][0], side0.path[k][1] - side1.path[k][1]) < 1e-6)!;
    expect(apexIndex).toBeDefined();
    const apex = side0.path[apexIndex];
    const i = piece.outline.findIndex((pt) => Math.hypot(pt[0] - apex[0], pt[1] - apex[1]) < 1e-6);
    expect(interiorAngleDeg(piece.outline, i)).toBeCloseTo(expected, 1);
    // Every base-circle vertex lies at the slant height from the apex (radius s).
    const far = piece.outline.map((pt) => Math.hypot(pt[0] - apex[0], pt[1] - apex[1]));
    expect(Math.max(...far)).toBeCloseTo(s, 2);
    expect(doc.seams[0].length3d).toBeCloseTo(s, 9);
  });

  it('develops a cylinder cut along one line into a 2πr × h rectangle', () => {
    const r = 40, h = 100, seg = 96;
    const line = Array.from({ length: 5 }, (_, k) => k * seg);
    const doc = buildPattern(modelOf(cylinder(r, h, seg, 4), [line]));
    const piece = doc.pieces[0];
    // Development of a cylinder: a rectangle 2πr × h (descriptive geometry); the 96-gon's perimeter is
    // 2πr times its chord factor.
    const { w, h: hh } = extent(piece.outline);
    expect(Math.max(w, hh)).toBeCloseTo(2 * Math.PI * r * chordFactor(seg), 3);
    expect(Math.min(w, hh)).toBeCloseTo(h, 3);
    expect(piece.stretch.maxPct).toBeLessThan(0.01);
    // A tube closed onto itself lists its piece once, with both sides' lengths.
    expect(doc.seams).toHaveLength(1);
    expect(doc.seams[0].pieces).toEqual(['A']);
    expect(doc.seams[0].lengths[0]).toBeCloseTo(h, 6);
    expect(doc.seams[0].lengths[1]).toBeCloseTo(h, 6);
    expect(signedAreaMm2(piece.outline)).toBeGreaterThan(0);
  });

  it('flattens a sphere gore to length πR and equator width 2πR/N with non-zero stretch', () => {
    const R = 100;
    for (const N of [6, 12]) {
      const doc = buildPattern(modelOf(sphereGore(R, N, 48, 8)), { seams: 'obj', stretchBudgetPct: 100 });
      const piece = doc.pieces[0];
      // Sinusoidal projection gores (Snyder, Map Projections — A Working Manual, USGS PP 1395): length πR,
      // equator width 2πR/N. A least-stretch flattening may spread the stretch, so each length holds to within
      // the reported max stretch plus the chord error of the 48/8 segment polygon (< 0.2 %).
      const tol = piece.stretch.maxPct / 100 + 0.002;
      const { w, h } = extent(piece.outline);
      expect(Math.abs(Math.max(w, h) - Math.PI * R) / (Math.PI * R)).toBeLessThan(tol);
      expect(Math.abs(Math.min(w, h) - (2 * Math.PI * R) / N) / ((2 * Math.PI * R) / N)).toBeLessThan(tol);
      // A doubly curved gore cannot be developed (Gauss's Theorema Egregium): stretch is not zero.
      expect(piece.stretch.maxPct).toBeGreaterThan(0.1);
    }
    const wide = buildPattern(modelOf(sphereGore(R, 6, 48, 8)), { seams: 'obj', stretchBudgetPct: 100 }).pieces[0].stretch.maxPct;
    const narrow = buildPattern(modelOf(sphereGore(R, 12, 48, 8)), { seams: 'obj', stretchBudgetPct: 100 }).pieces[0].stretch.maxPct;
    // More gores, each narrower, stretch less (Snyder: the sinusoidal gore's distortion grows with its width).
    expect(narrow).toBeLessThan(wide);
  });
});

describe('buildPattern: thickness', () => {
  const r = 40, h = 60, seg = 96, t = 6;
  const line = Array.from({ length: 4 }, (_, k) => k * seg);
  const width = (surface: 'outer' | 'mid' | 'inner'): { w: number; doc: PatternDoc } => {
    const doc = buildPattern(modelOf(cylinder(r, h, seg, 3), [line]), { thickness: t, surface });
    const e = extent(doc.pieces[0].outline);
    return { w: Math.max(e.w, e.h), doc };
  };
  it('follows the inner face (2π(r − t)) or the middle (2π(r − t/2)) of the sheet', () => {
    // Offsetting a circle of radius r inward by d gives the concentric circle of radius r − d (exact for a
    // cylinder; the polygon keeps its chord factor).
    const cf = chordFactor(seg);
    expect(width('outer').w).toBeCloseTo(2 * Math.PI * r * cf, 3);
    expect(width('mid').w).toBeCloseTo(2 * Math.PI * (r - t / 2) * cf, 3);
    const inner = width('inner');
    expect(inner.w).toBeCloseTo(2 * Math.PI * (r - t) * cf, 3);
    // The perimeter change reported: both rims shrink by 2πt each, the two seam sides keep their length h.
    expect(inner.doc.pieces[0].perimeterChangeMm).toBeCloseTo(-2 * 2 * Math.PI * t * cf, 3);
    expect(inner.doc.pieces[0].surface).toBe('inner');
    expect(inner.doc.pieces[0].thickness).toBe(t);
    expect(inner.doc.warnings.some((w) => w.includes('inner face of 6 mm foam'))).toBe(true);
  });
});

describe('buildPattern: stations, score lines, grouping, darts, closed shells', () => {
  it('gives stations every 25 mm where the bevel changes along a seam (dihedral 120° → 180°)', () => {
    const L = 100;
    const { mesh, axis } = hinge(L, 30, 40, (x) => 60 * (1 - x / L));
    const doc = buildPattern(modelOf(mesh, [axis]));
    expect(doc.seams).toHaveLength(1);
    const seam = doc.seams[0];
    expect(seam.stations.map((s) => s.at)).toEqual([0, 25, 50, 75, 100].map((v) => expect.closeTo(v, 6)));
    // Bevel (180° − θ)/2 with θ = 180° − 60°(1 − x/L) (common joinery practice), within one 2.5 mm step.
    // The seam may run either way along x; it starts at x = 0 when its first station has the larger bevel.
    const fromStart = seam.stations[0].bevel > seam.stations[seam.stations.length - 1].bevel;
    for (const st of seam.stations) {
      const x = fromStart ? st.at : L - st.at;
      expect(Math.abs(st.bevel - 30 * (1 - x / L))).toBeLessThan(0.8);
    }
    expect(seam.dihedral.min).toBeLessThan(122);
    expect(seam.dihedral.max).toBeGreaterThan(178);
    expect(seam.lengths[0]).toBeCloseTo(L, 6);
    expect(seam.lengths[1]).toBeCloseTo(L, 6);
  });

  it('puts a score line on a sharp fold inside one piece', () => {
    const L = 80;
    const { mesh } = hinge(L, 30, 16, () => 90);
    const doc = buildPattern(modelOf(mesh), { seams: 'obj' });
    expect(doc.pieces).toHaveLength(1);
    const lines = doc.pieces[0].scoreLines!;
    expect(lines).toHaveLength(1);
    // The fold is a right angle (interior 90°) along the whole 80 mm axis; folding does not stretch (isometry).
    expect(lines[0].foldDeg).toBeCloseTo(90, 6);
    expect(polylineLength(lines[0].path)).toBeCloseTo(L, 6);
    expect(doc.pieces[0].stretch.maxPct).toBeLessThan(1e-6);
  });

  it('lists identical and mirror-image pieces once with a quantity', () => {
    const L: [number, number][] = [[0, 0], [60, 0], [60, 20], [20, 20], [20, 50], [0, 50]];
    const plate = fanPlate(L);
    const moved = (m: TriMesh, angle: number, dx: number, mirror: boolean): TriMesh => {
      const p = new Float64Array(m.positions.length);
      for (let i = 0; i < p.length; i += 3) {
        const x = mirror ? -m.positions[i] : m.positions[i];
        const y = m.positions[i + 1];
        p[i] = Math.cos(angle) * x - Math.sin(angle) * y + dx;
        p[i + 1] = Math.sin(angle) * x + Math.cos(angle) * y;
        p[i + 2] = 0;
      }
      const t = m.triangles.slice();
      if (mirror) for (let f = 0; f < t.length; f += 3) [t[f + 1], t[f + 2]] = [t[f + 2], t[f + 1]];
      return { positions: p, triangles: t };
    };
    const rect = fanPlate([[0, 0], [60, 0], [60, 20], [0, 20]]);
    const mesh = joinMeshes([plate, moved(plate, 1.1, 200, false), moved(plate, -0.4, 400, true), moved(rect, 0, 600, false)]);
    const doc = buildPattern(modelOf(mesh), { seams: 'obj' });
    expect(doc.pieces.map((p) => [p.label, p.quantity, p.mirrored])).toEqual([
      ['A', 3, true],
      ['B', 1, false],
    ]);
    expect(doc.pieces[0].mirroredCopies).toBe(1);
    // Shoelace area of the L: 60·20 + 20·30 = 1800 mm².
    expect(doc.pieces[0].area2d).toBeCloseTo(1800, 6);
  });

  it('warns about a piece over budget and suggests a dart that lowers its stretch', () => {
    const sphere = icoSphere(100, 3);
    const F = sphere.triangles.length / 3;
    const keep: number[] = [];
    for (let f = 0; f < F; f++) {
      let z = 0;
      for (let k = 0; k < 3; k++) z += sphere.positions[3 * sphere.triangles[3 * f + k] + 2];
      if (z / 3 > 30) keep.push(f);
    }
    const triangles = Uint32Array.from(keep.flatMap((f) => [0, 1, 2].map((k) => sphere.triangles[3 * f + k])));
    const doc = buildPattern(modelOf({ positions: sphere.positions, triangles }), { seams: 'obj', stretchBudgetPct: 1 });
    const piece = doc.pieces[0];
    expect(piece.stretch.maxPct).toBeGreaterThan(1);
    expect(doc.warnings.some((w) => w.startsWith('piece A stretches up to'))).toBe(true);
    expect(piece.darts).toHaveLength(1);
    const dart = piece.darts![0];
    // A cap of a sphere has positive Gaussian curvature; a cut from the edge lets it open (common practice).
    expect(dart.stretchAfterPct).toBeLessThan(piece.stretch.maxPct);
    const start = dart.path[0];
    expect(piece.outline.some((p) => Math.hypot(p[0] - start[0], p[1] - start[1]) < 1e-9)).toBe(true);
  });

  it('opens a closed shell with automatic seams and keeps every piece within the budget', () => {
    const doc = buildPattern(modelOf(icoSphere(80, 2)), { seams: { crease: 30 } });
    expect(doc.warnings.some((w) => w.includes('closed shell'))).toBe(true);
    expect(doc.pieces.length).toBeGreaterThan(1);
    for (const p of doc.pieces) expect(p.stretch.maxPct).toBeLessThanOrEqual(3);
    // Descartes: total area is kept piece by piece; each seam has two sides of equal 2D length within budget.
    for (const s of doc.seams) for (const l of s.lengths) expect(Math.abs(l - s.length3d) / s.length3d).toBeLessThan(0.03);
  });

  it('cuts a model without seam lines automatically within the budget by default', () => {
    // No `l` lines and no seam option: automatic seams (scripts/pattern.ts documents this default).
    const doc = buildPattern(modelOf(icoSphere(80, 2)));
    expect(doc.pieces.length).toBeGreaterThan(1);
    expect(doc.warnings.some((w) => w.includes('closed shell'))).toBe(false);
    for (const p of doc.pieces) expect(p.stretch.maxPct).toBeLessThanOrEqual(3);
  });

  it('warns about a non-manifold edge it repaired and about a seam line that is not a mesh edge', () => {
    // Three triangles on one edge (0–1): a non-manifold edge, which cleaning separates and reports.
    const fin: TriMesh = {
      positions: Float64Array.from([0, 0, 0, 10, 0, 0, 5, 8, 0, 5, -8, 0, 5, 0, 8]),
      triangles: Uint32Array.from([0, 1, 2, 1, 0, 3, 0, 1, 4]),
    };
    const doc = buildPattern(modelOf(fin), { seams: 'obj' });
    expect(doc.warnings.some((w) => w.startsWith('non-manifold edge'))).toBe(true);
    // A seam line from one corner of a square plate to the opposite one, which is not an edge of its fan: the
    // seam follows the shortest edge path instead, and the maker is told.
    const plate = fanPlate([[0, 0], [40, 0], [40, 40], [20, 50], [0, 40]]);
    const cut = buildPattern(modelOf(plate, [[1, 3]]), { seams: 'obj' });
    expect(cut.warnings.some((w) => w.startsWith('seam line 1:'))).toBe(true);
  });

  it('cuts a mirror-modelled sculpt into mirror pairs: one template per pair, cut twice', () => {
    // Half of the demo helmet (faces with y > 0; its triangulation has a loop of edges in y = 0) joined to its
    // mirror image, as a sculpt modelled with a mirror is. Cleaning welds the shared centre line.
    const h = helmetShell();
    const F = h.triangles.length / 3;
    const keep: number[] = [];
    for (let f = 0; f < F; f++) {
      let y = 0;
      for (let k = 0; k < 3; k++) y += h.positions[3 * h.triangles[3 * f + k] + 1];
      if (y > 0) keep.push(f);
    }
    const half: TriMesh = { positions: h.positions, triangles: Uint32Array.from(keep.flatMap((f) => [0, 1, 2].map((k) => h.triangles[3 * f + k]))) };
    const doc = buildPattern(modelOf(joinMeshes([half, transformMesh(half, { scale: [1, -1, 1] })])));
    expect(doc.pieces.length).toBeGreaterThan(1);
    for (const p of doc.pieces) {
      // Every template is cut twice, once turned over (the mirror image) unless the half is its own mirror image
      // (the brim's half ring, symmetric front to back, matches its partner by a turn in the plane), and stays
      // within the 3 % budget.
      expect(p.quantity).toBe(2);
      if (p.mirrored) expect(p.mirroredCopies).toBe(1);
      expect(p.stretch.maxPct).toBeLessThanOrEqual(3);
    }
    expect(doc.pieces.filter((p) => p.mirrored).length).toBeGreaterThan(doc.pieces.length / 2);
  });

  it('carries the shop cautions and rejects bad options by name', () => {
    const doc = buildPattern(modelOf(platonicSolid('cube', 10)));
    expect(doc.cautions!.some((c) => c.includes("safety data sheet"))).toBe(true);
    expect(() => buildPattern(modelOf(platonicSolid('cube', 10)), { thickness: -1 })).toThrow(/thickness/);
    expect(() => buildPattern(modelOf(platonicSolid('cube', 10)), { seams: { crease: 200 } })).toThrow(/crease angle/);
    expect(() => buildPattern(modelOf(platonicSolid('cube', 10)), { stretchBudgetPct: 0 })).toThrow(/stretch budget/);
  });
});
