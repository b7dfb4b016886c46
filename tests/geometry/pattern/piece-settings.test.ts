/**
 * Per-piece settings and the per-face maps: a piece set to the inner face of its foam is flattened on that
 * surface while the others keep theirs; counts replace the engine's; the faces file round-trips.
 */
import { describe, expect, it } from 'vitest';
import { decodePatternFaces, encodePatternFaces } from '../../../geometry/pattern/pattern-faces-file';
import { patternWithPieceSettings } from '../../../geometry/pattern/piece-settings';
import { preparePieces } from '../../../geometry/pattern/prepare-pieces';
import { cylinder, platonicSolid, transformMesh } from '../../../geometry/shapes';
import { extent, joinMeshes, modelOf, polylineLength } from './pattern-fixtures';
import { signedAreaMm2 } from '../../../geometry/layout/outline-measure';

function ringPerimeter(ring: [number, number][]): number {
  return polylineLength([...ring, ring[0]]);
}

const chordFactor = (n: number): number => (n * Math.sin(Math.PI / n)) / Math.PI;

/** The 12 edges of platonicSolid('cube') as two-vertex seam lines (vertex pairs one edge length apart). */
function cubeEdges(positions: Float64Array, edge: number): number[][] {
  const lines: number[][] = [];
  const V = positions.length / 3;
  for (let a = 0; a < V; a++) {
    for (let b = a + 1; b < V; b++) {
      const d = Math.hypot(positions[3 * b] - positions[3 * a], positions[3 * b + 1] - positions[3 * a + 1], positions[3 * b + 2] - positions[3 * a + 2]);
      if (Math.abs(d - edge) < 1e-6) lines.push([a, b]);
    }
  }
  return lines;
}

describe('patternWithPieceSettings', () => {
  it('flattens a cube piece set to the inner face of 6 mm foam as an 88 mm square, the default as 100 mm', () => {
    const cube = platonicSolid('cube', 100);
    const prepared = preparePieces(modelOf(cube, cubeEdges(cube.positions, 100)), { seams: 'obj' });
    const plain = patternWithPieceSettings(prepared, {}, {});
    // Six congruent squares grouped as one template cut six times (a cube has 6 faces: Coxeter, Table I).
    expect(plain.doc.pieces).toHaveLength(1);
    expect(plain.doc.pieces[0].quantity).toBe(6);
    // A square's pose in the plane is arbitrary (its principal axes are not unique), so area and perimeter are checked.
    expect(signedAreaMm2(plain.doc.pieces[0].outline)).toBeCloseTo(100 * 100, 4);
    expect(ringPerimeter(plain.doc.pieces[0].outline)).toBeCloseTo(400, 6);
    // The inner face of a 100 mm cube shell of thickness t is the face of the (100 − 2t) mm cube inside it
    // (elementary solid geometry): 88 mm at t = 6.
    const inner = patternWithPieceSettings(prepared, {}, { A: { surface: 'inner', thicknessMm: 6 } });
    expect(signedAreaMm2(inner.doc.pieces[0].outline)).toBeCloseTo(88 * 88, 4);
    expect(ringPerimeter(inner.doc.pieces[0].outline)).toBeCloseTo(4 * 88, 6);
    expect(inner.doc.pieces[0].surface).toBe('inner');
    expect(inner.doc.warnings.some((w) => w.startsWith('piece A follows the inner face of 6 mm foam'))).toBe(true);
  });

  it('sets one piece of two to the inner face and leaves the other on the outer skin (2π(r − t) vs 2πr)', () => {
    const r = 40, h = 60, seg = 64, t = 6;
    const line = Array.from({ length: 4 }, (_, k) => k * seg);
    const wide = cylinder(r, h, seg, 3);
    // A second, distinct tube (radius 25, moved away) so the two do not group as one template.
    const narrow = transformMesh(cylinder(25, h, seg, 3), { translation: [200, 0, 0] });
    const V = wide.positions.length / 3;
    const prepared = preparePieces(modelOf(joinMeshes([wide, narrow]), [line, line.map((v) => v + V)]), { seams: 'obj' });
    const base = patternWithPieceSettings(prepared, {}, {});
    const labelOfWide = base.doc.pieces.find((p) => Math.abs(Math.max(extent(p.outline).w, extent(p.outline).h) - 2 * Math.PI * r * chordFactor(seg)) < 0.01)!.label;
    const set = patternWithPieceSettings(prepared, {}, { [labelOfWide]: { surface: 'inner', thicknessMm: t } });
    const len = (label: string) => {
      const e = extent(set.doc.pieces.find((p) => p.label === label)!.outline);
      return Math.max(e.w, e.h);
    };
    // Offsetting a circle of radius r inward by t gives radius r − t (the polygon keeps its chord factor).
    expect(len(labelOfWide)).toBeCloseTo(2 * Math.PI * (r - t) * chordFactor(seg), 3);
    const other = set.doc.pieces.find((p) => p.label !== labelOfWide)!;
    expect(len(other.label)).toBeCloseTo(2 * Math.PI * 25 * chordFactor(seg), 3);
    expect(other.surface).toBe('outer');
  });

  it('replaces quantity and mirrored copies and drops seam edges of copies past the quantity', () => {
    const cube = platonicSolid('cube', 50);
    const prepared = preparePieces(modelOf(cube, cubeEdges(cube.positions, 50)), { seams: 'obj' });
    const { doc } = patternWithPieceSettings(prepared, {}, { A: { quantity: 4, mirrored: true } });
    const piece = doc.pieces[0];
    expect(piece.quantity).toBe(4);
    expect(piece.mirrored).toBe(true);
    expect(piece.mirroredCopies).toBe(2);
    expect(piece.seamEdges!.every((edge) => (edge.copy ?? 0) < 4)).toBe(true);
    // Each square has 4 seam sides; copies 0–3 keep theirs (4 × 4 = 16 edges).
    expect(piece.seamEdges).toHaveLength(16);
  });

  it('refuses a setting out of range, naming the piece and the field', () => {
    const cube = platonicSolid('cube', 50);
    const prepared = preparePieces(modelOf(cube, cubeEdges(cube.positions, 50)), { seams: 'obj' });
    expect(() => patternWithPieceSettings(prepared, {}, { A: { quantity: 0 } })).toThrow(/piece A: quantity must be a whole number/);
    expect(() => patternWithPieceSettings(prepared, {}, { A: { thicknessMm: -2 } })).toThrow(/piece A: thickness must be more than 0/);
  });

  it('maps every face to its piece and stretch, and the faces file round-trips at 4 + 8F bytes', () => {
    const r = 30, h = 50, seg = 32;
    const line = Array.from({ length: 3 }, (_, k) => k * seg);
    const mesh = cylinder(r, h, seg, 2);
    const { faces } = patternWithPieceSettings(preparePieces(modelOf(mesh, [line]), { seams: 'obj' }), {}, {});
    const F = mesh.triangles.length / 3;
    expect(faces.pieceIndex).toHaveLength(F);
    expect([...faces.pieceIndex].every((p) => p === 0)).toBe(true);
    // A cylinder is developable (zero Gaussian curvature), so every triangle unrolls without stretch.
    expect(Math.max(...faces.stretchPct)).toBeLessThan(0.01);
    const bytes = encodePatternFaces(faces);
    expect(bytes.byteLength).toBe(4 + 8 * F);
    const back = decodePatternFaces(bytes);
    expect([...back.pieceIndex]).toEqual([...faces.pieceIndex]);
    expect([...back.stretchPct]).toEqual([...faces.stretchPct]);
    expect(() => decodePatternFaces(bytes.subarray(0, 10))).toThrow(`header names ${F} faces`);
  });
});
