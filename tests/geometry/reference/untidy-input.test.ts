/**
 * Outside checks on untidy files: the same surface written carelessly — unwelded corners, some faces wound the
 * wrong way, the whole model inside out, a repeated face, a stray vertex no face uses — must give the pattern
 * of the tidy file. A surface's development depends only on the surface (common practice for mesh cleaning:
 * weld, orient, drop duplicates), so any difference is the engine's.
 */
import { describe, expect, it } from 'vitest';
import type { PatternDoc } from '../../../geometry/pattern/pattern-doc';
import { objFile } from '../../fixtures/reference/model-files';
import { lOutline, prismOver, type PolyShape, type Vec3 } from '../../fixtures/reference/reference-shapes';
import { expectPatternInvariants, patternOfFile } from './reference-checks';

const crease = { seams: { crease: 10 } } as const;

function summary(doc: PatternDoc): string[] {
  return [
    ...doc.pieces.map((p) => `piece ${p.outline.length} corners ×${p.quantity} ${p.area2d.toFixed(3)} mm²`).sort(),
    ...doc.seams.map((s) => `seam ${s.length3d.toFixed(3)} mm at ${s.dihedral.mean.toFixed(3)}°`).sort(),
  ];
}

// An L bracket with a 1 mm lip: small features are what a wrongly large weld distance destroys first.
const bracket = prismOver(lOutline(60, 1), 45);
const tidy = patternOfFile(objFile(bracket), 'tidy.obj', crease);

function unwelded(shape: PolyShape): PolyShape {
  const out: PolyShape = { positions: [], faces: [], lines: [] };
  for (const f of shape.faces) {
    const o = out.positions.length;
    for (const v of f) out.positions.push([...shape.positions[v]] as Vec3);
    out.faces.push(f.map((_, i) => o + i));
  }
  return out;
}

const variants: Array<[string, PolyShape]> = [
  ['every face with its own corners (unwelded)', unwelded(bracket)],
  ['every third face wound the wrong way', { ...bracket, faces: bracket.faces.map((f, i) => (i % 3 === 0 ? [...f].reverse() : f)) }],
  ['the whole model inside out', { ...bracket, faces: bracket.faces.map((f) => [...f].reverse()) }],
  ['one face written twice', { ...bracket, faces: [...bracket.faces, bracket.faces[2]] }],
  // Regression: the weld distance was taken relative to the bounding box of all vertices, so one unused vertex
  // 1000 m away made it 1.7 mm and welded the 1 mm lip away.
  ['a stray vertex no face uses, 1000 m away', { ...bracket, positions: [...bracket.positions, [1e6, -1e6, 1e6]] }],
  ['a stray vertex no face uses, 10 m away', { ...bracket, positions: [[1e4, 0, 0], ...bracket.positions], faces: bracket.faces.map((f) => f.map((v) => v + 1)) }],
];

describe('untidy files give the tidy pattern', () => {
  it('the tidy bracket: 1 mm lip kept, invariants hold', () => {
    expectPatternInvariants(tidy);
    // Sides 60, 1, 59, 59, 1, 60 mm long by 45 mm (L outline): the 1 mm lips are pieces of 1 × 45 mm.
    expect(tidy.pieces.some((p) => Math.abs(p.area2d - 1 * 45) < 1e-6)).toBe(true);
  });
  for (const [name, shape] of variants) {
    it(name, () => {
      const doc = patternOfFile(objFile(shape), 'untidy.obj', crease);
      expectPatternInvariants(doc);
      expect(summary(doc)).toEqual(summary(tidy));
    });
  }
});
