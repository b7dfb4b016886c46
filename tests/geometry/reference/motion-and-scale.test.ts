/**
 * Rigid motion and uniform scale (issue 3, "Property tests"; STYLE.md principle 10): moving a model changes
 * nothing in its pattern, and scaling it by k multiplies every length by k and every area by k², leaving angles,
 * bevels, stretch, piece counts and quantities unchanged — the development of a surface is intrinsic to it
 * (isometry invariance of the first fundamental form, elementary differential geometry).
 */
import { describe, expect, it } from 'vitest';
import type { PatternDoc } from '../../../geometry/pattern/pattern-doc';
import { objFile } from '../../fixtures/reference/model-files';
import {
  frustum,
  latLongSphere,
  lOutline,
  moved,
  prismOver,
  squarePyramid,
  type PolyShape,
  type Vec3,
} from '../../fixtures/reference/reference-shapes';
import { expectPatternInvariants, patternOfFile } from './reference-checks';

const shapes: Array<[string, PolyShape, { crease: number } | 'obj']> = [
  ['L bracket, crease seams', prismOver(lOutline(60, 20), 45), { crease: 10 }],
  ['square pyramid J1, crease seams', squarePyramid(50), { crease: 10 }],
  ['frustum cut along a generator', frustum(70, 25, 50, 40, 3), 'obj'],
  ['eight sphere gores', latLongSphere(90, 48, 16, 8), 'obj'],
];

const motions: Array<[string, Vec3, number, number, Vec3]> = [
  ['turned 123° about (1, −2, 0.5) and moved 10 m', [1, -2, 0.5], (123 * Math.PI) / 180, 1, [1e4, -3e3, 2e3]],
  ['scaled by 1/250', [0.3, 0.3, 1], 0.4, 1 / 250, [0, 0, 0]],
  ['scaled by 40 and turned', [0, 1, 0], 2.5, 40, [5, 5, 5]],
];

function pieceKey(doc: PatternDoc, k: number): string[] {
  return doc.pieces
    .map((p) => `${p.outline.length}/${p.quantity}/${p.mirrored}/${(p.area3d / (k * k)).toPrecision(6)}`)
    .sort();
}

describe('rigid motion and uniform scale', () => {
  for (const [name, shape, seams] of shapes) {
    const base = patternOfFile(objFile(shape), 'base.obj', { seams });
    for (const [how, axis, angle, k, t] of motions) {
      it(`${name}, ${how}`, () => {
        const doc = patternOfFile(objFile(moved(shape, axis, angle, k, t)), 'moved.obj', { seams });
        expectPatternInvariants(doc);
        expect(pieceKey(doc, k)).toEqual(pieceKey(base, 1));
        expect(doc.seams).toHaveLength(base.seams.length);
        const bySeam = (d: PatternDoc, scale: number) =>
          d.seams
            .map((s) => ({ l: s.length3d / scale, d: s.dihedral.mean, b: s.bevel.mean, c: s.convex, sides: s.lengths.map((x) => x / scale) }))
            .sort((a, b) => Number(a.l.toPrecision(6)) - Number(b.l.toPrecision(6)) || a.d - b.d);
        const got = bySeam(doc, k);
        const want = bySeam(base, 1);
        got.forEach((g, i) => {
          expect(g.l).toBeCloseTo(want[i].l, 6);
          expect(g.d).toBeCloseTo(want[i].d, 6);
          expect(g.b).toBeCloseTo(want[i].b, 6);
          expect(g.c).toBe(want[i].c);
          for (let j = 0; j < 2; j++) expect(g.sides[j] / want[i].sides[j]).toBeCloseTo(1, 4);
        });
        const stretch = (d: PatternDoc) => d.pieces.map((p) => [p.stretch.maxPct, p.stretch.rmsPct]).sort((a, b) => a[0] - b[0]);
        stretch(doc).forEach(([mx, rms], i) => {
          expect(mx).toBeCloseTo(stretch(base)[i][0], 3);
          expect(rms).toBeCloseTo(stretch(base)[i][1], 3);
        });
        // Stations sit every 25 mm of the scaled seam, so only their ends scale with k.
        for (const s of doc.seams) expect(s.stations[s.stations.length - 1].at).toBeCloseTo(s.length3d, 9);
      });
    }
  }
});
