/**
 * Regression: with --surface mid|inner the seams' 2D lengths followed the offset surface while length3d stayed on
 * the outer skin (a 100 mm box in 6 mm foam, inner surface: 88 mm on the pieces, 100 mm reported), so "both
 * sides' 2D lengths match the 3D length" (issue 3 point 7) failed. length3d is now measured on the surface the
 * pattern follows and length3dOuter keeps the skin's length. Reference: a box of boards t thick with outside size
 * a is a − 2t inside, its middle surface a − t (elementary solid geometry).
 */
import { describe, expect, it } from 'vitest';
import { objFile } from '../../fixtures/reference/model-files';
import { moved, prismOver } from '../../fixtures/reference/reference-shapes';
import { expectPatternInvariants, patternOfFile } from './reference-checks';

const t = 6;
const a = 100;
const cube = moved(prismOver([[0, 0], [a, 0], [a, a], [0, a]], a), [1, 1, 0], 0.5, 1, [40, -20, 5]);

describe('seam lengths on the surface the pattern follows', () => {
  for (const [surface, depth] of [['inner', t], ['mid', t / 2], ['outer', 0]] as const) {
    it(`a ${a} mm cube in ${t} mm foam, ${surface} surface: seams ${a - 2 * depth} mm on both sides and in 3D`, () => {
      const doc = patternOfFile(objFile(cube), 'box.obj', { seams: { crease: 10 }, thickness: t, surface });
      expect(doc.seams).toHaveLength(12);
      for (const s of doc.seams) {
        expect(s.length3d, `seam ${s.label}`).toBeCloseTo(a - 2 * depth, 6);
        for (const l of s.lengths) expect(l, `seam ${s.label}`).toBeCloseTo(s.length3d, 6);
        // Stations are measured along the same length: the last one sits at its end.
        expect(s.stations[s.stations.length - 1].at).toBeCloseTo(s.length3d, 9);
        if (surface === 'outer') expect(s.length3dOuter).toBeUndefined();
        else expect(s.length3dOuter, `seam ${s.label}`).toBeCloseTo(a, 6);
        // The angle is the sculpt's, whichever surface the pattern follows: a cube's 90° (Coxeter, Table I).
        expect(s.dihedral.mean).toBeCloseTo(90, 6);
      }
      expectPatternInvariants(doc);
      if (surface !== 'outer') {
        // The note names the change the choice of surface makes: 2·depth per seam.
        const note = doc.warnings.find((w) => w.includes('seams up to'));
        expect(note).toContain(`seams up to ${(2 * depth).toFixed(1)} mm shorter`);
      }
    });
  }
});
