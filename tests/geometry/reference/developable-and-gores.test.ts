/**
 * Outside checks on curved shapes: the frustum of a cone (an annular sector), a tube in inches with foam
 * thickness, and sphere gores. Models are OBJ files with the seams as `l` lines, read through importModel →
 * buildPattern with `--seams obj`.
 */
import { describe, expect, it } from 'vitest';
import type { PatternDoc, PointMm } from '../../../geometry/pattern/pattern-doc';
import { objFile } from '../../fixtures/reference/model-files';
import { frustum, latLongSphere, moved, tube } from '../../fixtures/reference/reference-shapes';
import { expectPatternInvariants, patternOfFile } from './reference-checks';

const obj = { seams: 'obj' } as const;

/** Intersection of line p0→p1 with line q0→q1 (2D). */
function intersect(p0: PointMm, p1: PointMm, q0: PointMm, q1: PointMm): PointMm {
  const dx = p1[0] - p0[0], dy = p1[1] - p0[1];
  const ex = q1[0] - q0[0], ey = q1[1] - q0[1];
  const t = ((q0[0] - p0[0]) * ey - (q0[1] - p0[1]) * ex) / (dx * ey - dy * ex);
  return [p0[0] + t * dx, p0[1] + t * dy];
}

/** Width of the pattern across: the largest distance from any outline point to the line through a and b. */
function widthAcross(points: PointMm[], a: PointMm, b: PointMm): number {
  const l = Math.hypot(b[0] - a[0], b[1] - a[1]);
  return Math.max(...points.map((p) => Math.abs((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0])) / l));
}

describe('frustum of a right circular cone, cut along one generator', () => {
  // Radial-line development of a truncated right cone (descriptive geometry; the standard sheet-metal layout):
  // an annular sector about the apex of the full cone, outer radius L = s·R/(R − r) with s the frustum's slant
  // height, inner radius L·r/R, sector angle 360°·R/L. The polyhedral frustum with n generators develops to
  // a fan of n chords, so its angle is n·2·asin((R/L)·sin(π/n)) (chord of the same triangle, elementary geometry).
  const cases: Array<[string, number, number, number, number]> = [
    ['R 80, r 30, h 60 (lamp-shade proportions)', 80, 30, 60, 64],
    ['R 40, r 36, h 90 (nearly a cylinder: apex far away)', 40, 36, 90, 48],
  ];
  for (const [name, R, r, h, n] of cases) {
    it(name, () => {
      const shape = moved(frustum(R, r, h, n, 3), [1, -0.4, 0.7], 1.1, 1, [300, -120, 45]);
      const doc = patternOfFile(objFile(shape), 'frustum.obj', obj);
      expectPatternInvariants(doc);
      expect(doc.pieces).toHaveLength(1);
      expect(doc.seams).toHaveLength(1);
      const piece = doc.pieces[0];
      const seam = doc.seams[0];
      expect(seam.pieces).toEqual([piece.label]);
      // The quads span two generators through the apex, so the surface is exactly developable.
      expect(piece.stretch.maxPct).toBeLessThan(0.05);
      const s = Math.hypot(R - r, h);
      const L = (s * R) / (R - r);
      expect(seam.length3d).toBeCloseTo(s, 6);
      const edges = piece.seamEdges!.filter((e) => e.seam === seam.label);
      expect(edges).toHaveLength(2);
      // The two cut edges are generators: extended, they meet at the developed apex.
      const [e0, e1] = edges.map((e) => e.path);
      const apex = intersect(e0[0], e0[e0.length - 1], e1[0], e1[e1.length - 1]);
      const dist = piece.outline.map((p) => Math.hypot(p[0] - apex[0], p[1] - apex[1]));
      const outer = dist.filter((d) => Math.abs(d - L) < 0.01 * L);
      const inner = dist.filter((d) => Math.abs(d - (L * r) / R) < 0.01 * L);
      expect(outer).toHaveLength(n + 1);
      expect(inner).toHaveLength(n + 1);
      for (const d of outer) expect(d / L).toBeCloseTo(1, 3);
      for (const d of inner) expect(d / ((L * r) / R)).toBeCloseTo(1, 3);
      // Sector angle: the angle the outer arc sweeps about the apex.
      const arc = piece.outline.filter((_, i) => Math.abs(dist[i] - L) < 0.01 * L);
      const heading = arc.map((p) => Math.atan2(p[1] - apex[1], p[0] - apex[0]));
      let swept = 0;
      for (let i = 0; i + 1 < heading.length; i++) {
        let d = heading[i + 1] - heading[i];
        if (d > Math.PI) d -= 2 * Math.PI;
        if (d < -Math.PI) d += 2 * Math.PI;
        swept += d;
      }
      const expectedDeg = (n * 2 * Math.asin((R / L) * Math.sin(Math.PI / n)) * 180) / Math.PI;
      expect(Math.abs((swept * 180) / Math.PI)).toBeCloseTo(expectedDeg, 1);
      expect(Math.abs(expectedDeg - (360 * R) / L)).toBeLessThan(0.5);
      // The cut runs along a facet edge: the angle there is the one between the two neighbouring planar quads,
      // 180° minus the angle between their outward normals (elementary solid geometry), here from the model.
      const quadNormal = (i: number): [number, number, number] => {
        const [a, b, c] = [shape.faces[i][0], shape.faces[i][1], shape.faces[i][3]].map((v) => shape.positions[v]);
        const u = [b[0] - a[0], b[1] - a[1], b[2] - a[2]];
        const w = [c[0] - a[0], c[1] - a[1], c[2] - a[2]];
        const nx = u[1] * w[2] - u[2] * w[1], ny = u[2] * w[0] - u[0] * w[2], nz = u[0] * w[1] - u[1] * w[0];
        const l = Math.hypot(nx, ny, nz);
        return [nx / l, ny / l, nz / l];
      };
      const [n0, n1] = [quadNormal(0), quadNormal(n - 1)];
      const facetDeg = 180 - (Math.acos(n0[0] * n1[0] + n0[1] * n1[1] + n0[2] * n1[2]) * 180) / Math.PI;
      expect(seam.dihedral.mean).toBeCloseTo(facetDeg, 6);
      expect(seam.bevel.mean).toBeCloseTo((180 - facetDeg) / 2, 6); // common joinery practice
      expect(seam.convex).toBe(true);
    });
  }
});

describe('a tube modelled in inches, with foam thickness', () => {
  // Development of a right circular cylinder: a rectangle of the girth by the height (descriptive geometry).
  // The n-sided tube's girth is n·2ρ·sin(π/n) for vertex radius ρ; 1 in = 25.4 mm exactly (international inch,
  // 1959). Offsetting the outer skin inward by d along the (radial) vertex normals leaves radius ρ − d.
  const rIn = 2.5, hIn = 4, n = 60;
  const rMm = rIn * 25.4;
  const girth = (rho: number): number => n * 2 * rho * Math.sin(Math.PI / n);
  const file = objFile(tube(rIn, hIn, n, 2));
  const cases: Array<['outer' | 'mid' | 'inner', number]> = [
    ['outer', 0],
    ['mid', 3],
    ['inner', 6],
  ];
  for (const [surface, depth] of cases) {
    it(`--units in --thickness 6 --surface ${surface}: width 2π(r − ${depth}) mm`, () => {
      const doc = patternOfFile(file, 'tube.obj', { ...obj, unit: 'in', thickness: 6, surface });
      expectPatternInvariants(doc);
      expect(doc.pieces).toHaveLength(1);
      const piece = doc.pieces[0];
      expect(piece.thickness).toBe(6);
      expect(piece.stretch.maxPct).toBeLessThan(0.05);
      const edges = piece.seamEdges!.map((e) => e.path);
      expect(edges).toHaveLength(2);
      // Height along the cut and width between the two cut edges.
      for (const e of edges) expect(Math.hypot(e[e.length - 1][0] - e[0][0], e[e.length - 1][1] - e[0][1])).toBeCloseTo(hIn * 25.4, 3);
      const width = widthAcross(edges[1], edges[0][0], edges[0][edges[0].length - 1]);
      expect(width).toBeCloseTo(girth(rMm - depth), 2);
      expect(piece.area2d).toBeCloseTo(girth(rMm - depth) * hIn * 25.4, 1);
      // The outline shrinks by 2·n·2·d·sin(π/n) around (top and bottom rims), and the document says so.
      expect(piece.perimeterChangeMm ?? 0).toBeCloseTo(-2 * (girth(rMm) - girth(rMm - depth)), 3);
    });
  }
});

describe('sphere gores (sinusoidal projection)', () => {
  // Gores of a globe in the sinusoidal projection (Snyder, Map Projections — A Working Manual, USGS Professional
  // Paper 1395, 1987): each of N gores is πR long along its central meridian and 2πR/N wide at the equator. A
  // doubly curved gore cannot lie flat, so its stretch is above zero, and it falls as the gores narrow.
  const R = 100;
  const gores = (N: number): PatternDoc => {
    const doc = patternOfFile(objFile(latLongSphere(R, 72, 24, N)), `globe-${N}.obj`, obj);
    expectPatternInvariants(doc);
    return doc;
  };
  const docs = new Map<number, PatternDoc>([6, 12].map((N) => [N, gores(N)]));
  for (const N of [6, 12]) {
    it(`N = ${N}: N identical gores, length πR, equator width 2πR/N, non-zero stretch`, () => {
      const doc = docs.get(N)!;
      expect(doc.pieces).toHaveLength(1);
      const gore = doc.pieces[0];
      expect(gore.quantity).toBe(N);
      expect(doc.seams).toHaveLength(N);
      for (const s of doc.seams) expect(s.pieces).toEqual([gore.label, gore.label]);
      // Length: the tips are the farthest-apart outline points; πR within the gore's own reported stretch (a
      // least-stretch flattening shares the stretch out, so the central meridian need not keep its length).
      let length = 0;
      for (const p of gore.outline) for (const q of gore.outline) length = Math.max(length, Math.hypot(p[0] - q[0], p[1] - q[1]));
      expect(Math.abs(length - Math.PI * R) / (Math.PI * R)).toBeLessThan(gore.stretch.maxPct / 100);
      // Equator width: across the gore, at right angles to its length, at the middle.
      const tips = (() => {
        let best: [PointMm, PointMm] = [gore.outline[0], gore.outline[0]];
        let d = -1;
        for (const p of gore.outline) for (const q of gore.outline) {
          const e = Math.hypot(p[0] - q[0], p[1] - q[1]);
          if (e > d) [d, best] = [e, [p, q]];
        }
        return best;
      })();
      const width = widthAcross(gore.outline, tips[0], tips[1]) * 2;
      expect(Math.abs(width - (2 * Math.PI * R) / N) / ((2 * Math.PI * R) / N)).toBeLessThan(0.03);
      expect(gore.stretch.maxPct).toBeGreaterThan(0.1);
      // Both sides of each seam are meridians, πR long (chordal: 24·2R·sin(π/48)).
      for (const s of doc.seams) expect(s.length3d).toBeCloseTo(24 * 2 * R * Math.sin(Math.PI / 48), 6);
    });
  }
  it('stretch falls as the gores narrow (N = 6 → 12)', () => {
    expect(docs.get(12)!.pieces[0].stretch.maxPct).toBeLessThan(docs.get(6)!.pieces[0].stretch.maxPct);
    expect(docs.get(12)!.pieces[0].stretch.rmsPct).toBeLessThan(docs.get(6)!.pieces[0].stretch.rmsPct);
  });
});
