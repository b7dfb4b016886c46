/**
 * Regression: automatic seams cut across the flat faces of hard-surface shapes (a cube, an L extrusion), so one
 * seam mixed 90° and 180° edges. Foam cannot take a sharp fold without a seam or a score line, and a maker cuts a
 * box at its edges (common practice), so sharp creases are now fixed chart borders (crease-borders.ts).
 */
import { describe, expect, it } from 'vitest';
import { importModel } from '../../../geometry/io/import-model';
import { buildPattern } from '../../../geometry/pattern/build-pattern';
import type { PatternDoc } from '../../../geometry/pattern/pattern-doc';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import { autoSeams } from '../../../geometry/seams/auto-seams';
import { CREASE_BORDER_DEG, cutAtCreases } from '../../../geometry/seams/crease-borders';
import { interiorDihedralDeg } from '../../../geometry/mesh/dihedral-angles';
import { platonicSolid, transformMesh } from '../../../geometry/shapes';
import { joinMeshes } from '../pattern/pattern-fixtures';
import { objFile } from '../../fixtures/reference/model-files';
import { lOutline, prismOver, type PolyShape } from '../../fixtures/reference/reference-shapes';

function autoPattern(shape: PolyShape, name: string): PatternDoc {
  return buildPattern(importModel(new TextEncoder().encode(objFile(shape, { triangulate: true })), `${name}.obj`), { seams: 'auto' });
}

/** Total piece count, copies included. */
const pieceCount = (doc: PatternDoc): number => doc.pieces.reduce((n, p) => n + p.quantity, 0);

describe('auto seams on hard-surface shapes follow the sharp edges', () => {
  it('cuts a closed cube into its six square faces along its twelve 90° edges', () => {
    const cube = platonicSolid('cube', 50);
    const shape: PolyShape = {
      positions: Array.from({ length: cube.positions.length / 3 }, (_, v) => [cube.positions[3 * v], cube.positions[3 * v + 1], cube.positions[3 * v + 2]]),
      faces: Array.from({ length: cube.triangles.length / 3 }, (_, f) => Array.from(cube.triangles.subarray(3 * f, 3 * f + 3))),
      lines: [],
    };
    const doc = autoPattern(shape, 'cube');
    // A cube has 6 faces and 12 edges, each a right angle (Coxeter, Regular Polytopes, Table I: {4,3}, 90°).
    expect(pieceCount(doc)).toBe(6);
    expect(doc.seams).toHaveLength(12);
    for (const s of doc.seams) {
      // Each seam is one whole cube edge: no flat (180°) stretch mixed in.
      expect(s.dihedral.min, `seam ${s.label}`).toBeCloseTo(90, 6);
      expect(s.dihedral.max, `seam ${s.label}`).toBeCloseTo(90, 6);
      expect(s.length3d).toBeCloseTo(50, 6);
    }
    for (const p of doc.pieces) {
      expect(p.area3d).toBeCloseTo(2500, 6);
      expect(p.stretch.maxPct).toBeLessThanOrEqual(3);
    }
  });

  it('cuts an L extrusion into its two caps and six sides, seams at 90° (outside) or 270° (inside) only', () => {
    // L of legs 60 mm and thickness 20 mm, 45 mm deep: 2 caps + 6 sides, 18 edges, of which the one edge at the
    // reflex corner is an inside corner (270°) and every other an outside right angle (elementary solid geometry).
    const doc = autoPattern(prismOver(lOutline(60, 20), 45), 'bracket');
    expect(pieceCount(doc)).toBe(8);
    expect(doc.seams).toHaveLength(18);
    const inside = doc.seams.filter((s) => s.dihedral.mean > 180);
    expect(inside).toHaveLength(1);
    for (const s of doc.seams) {
      const want = s.dihedral.mean > 180 ? 270 : 90;
      expect(s.dihedral.min, `seam ${s.label}`).toBeCloseTo(want, 6);
      expect(s.dihedral.max, `seam ${s.label}`).toBeCloseTo(want, 6);
    }
    // Areas: the L is 60·60 − 40·40 = 2000 mm² per cap; sides 45 × (60, 20, 40, 40, 20, 60) mm.
    const areas = doc.pieces.flatMap((p) => Array.from({ length: p.quantity }, () => p.area3d)).sort((a, b) => a - b);
    const want = [900, 900, 1800, 1800, 2000, 2000, 2700, 2700];
    areas.forEach((a, i) => expect(a).toBeCloseTo(want[i], 6));
    for (const p of doc.pieces) expect(p.stretch.maxPct).toBeLessThanOrEqual(3);
  });

  it('cuts long crease lines and leaves short runs of sharp edges (scan noise) linked', () => {
    // A 50 mm cube and a 2 mm cube 500 mm away: the big cube's edges form one 600 mm crease line, over a tenth of
    // the ~550 mm bounding-box diagonal; the small cube's 24 mm of edges are under it (CREASE_LINE_MIN_SHARE).
    const mesh = joinMeshes([platonicSolid('cube', 50), transformMesh(platonicSolid('cube', 2), { translation: [500, 0, 0] })]);
    const twin = buildTwins(mesh.triangles, mesh.positions.length / 3);
    const dihedral = interiorDihedralDeg(mesh.positions, mesh.triangles, twin);
    const cut = cutAtCreases(mesh, twin, dihedral, CREASE_BORDER_DEG);
    expect(cut.creaseEdges).toBe(12);
    const bigCubeFaces = platonicSolid('cube', 50).triangles.length / 3;
    for (let h = 0; h < twin.length; h++) {
      const sharp = twin[h] >= 0 && Math.abs(dihedral[h] - 180) > 45;
      // Unlinked exactly on the big cube's edges (interior 90°, 90° from flat).
      expect(cut.twin[h] < 0 && twin[h] >= 0, `half-edge ${h}`).toBe(sharp && h < 3 * bigCubeFaces);
    }
    // A threshold beyond 90° from flat finds no crease on a cube at all.
    expect(cutAtCreases(mesh, twin, dihedral, 91).creaseEdges).toBe(0);
  });

  it('rejects a crease border angle outside (0°, 180°]', () => {
    const cube = platonicSolid('cube', 10);
    const twin = buildTwins(cube.triangles, cube.positions.length / 3);
    expect(() => autoSeams(cube, twin, { creaseBorderDeg: 0 })).toThrow(/crease border angle must be more than 0° and at most 180°, got 0/);
    expect(() => autoSeams(cube, twin, { creaseBorderDeg: 200 })).toThrow(/got 200/);
  });
});
