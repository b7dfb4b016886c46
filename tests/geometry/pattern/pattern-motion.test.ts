import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { buildPattern } from '../../../geometry/pattern/build-pattern';
import type { PatternDoc } from '../../../geometry/pattern/pattern-doc';
import { cone, transformMesh } from '../../../geometry/shapes';
import { rigidMotion, scaleFactor } from '../shapes/motion-arbitrary';
import { modelOf } from './pattern-fixtures';

// A cone cut along one generator plus a seam ring: two pieces, one seam between them with a real bevel, one
// self-seam, and a piece with non-zero stretch (the ring band is developable, the cap is a cone too, but the
// ring seam sits on a polygon, so the numbers are not trivial).
const seg = 32;
const rings = 4;
const base = cone(30, 40, seg, rings);
const generator = Array.from({ length: rings + 1 }, (_, k) => k * seg);
const ring = Array.from({ length: seg + 1 }, (_, s) => 2 * seg + (s % seg));

function measures(doc: PatternDoc): { lengths: number[]; angles: number[]; stretch: number[]; areas: number[] } {
  return {
    lengths: doc.seams.flatMap((s) => [s.length3d, ...s.lengths, ...s.stations.map((st) => st.at)]),
    angles: doc.seams.flatMap((s) => [s.dihedral.min, s.dihedral.mean, s.dihedral.max, s.bevel.mean]),
    stretch: doc.pieces.map((p) => p.stretch.maxPct),
    areas: doc.pieces.flatMap((p) => [p.area2d, p.area3d]),
  };
}

describe('buildPattern under rigid motion and scale (STYLE.md §10; fast-check, seeded)', () => {
  const reference = measures(buildPattern(modelOf(base, [generator, ring])));

  it('leaves every length, angle and stretch unchanged under a rigid motion', () => {
    expect(reference.lengths.length).toBeGreaterThan(4);
    fc.assert(
      fc.property(rigidMotion, (motion) => {
        const m = measures(buildPattern(modelOf(transformMesh(base, motion), [generator, ring])));
        // Isometries preserve lengths and angles (definition of a rigid motion); stretch is a ratio of lengths.
        m.lengths.forEach((v, i) => expect(v).toBeCloseTo(reference.lengths[i], 6));
        m.angles.forEach((v, i) => expect(v).toBeCloseTo(reference.angles[i], 6));
        m.stretch.forEach((v, i) => expect(Math.abs(v - reference.stretch[i])).toBeLessThan(1e-3));
        m.areas.forEach((v, i) => expect(v / reference.areas[i]).toBeCloseTo(1, 6));
      }),
      { seed: 20261201, numRuns: 8 },
    );
  });

  it('scales lengths by k, areas by k², and leaves angles and stretch unchanged', () => {
    fc.assert(
      fc.property(scaleFactor, (k) => {
        const m = measures(buildPattern(modelOf(transformMesh(base, { scale: k }), [generator, ring])));
        // Similarity: lengths scale by k, areas by k², angles and length ratios do not change.
        m.lengths.forEach((v, i) => expect(v / k).toBeCloseTo(reference.lengths[i], 5));
        m.angles.forEach((v, i) => expect(v).toBeCloseTo(reference.angles[i], 6));
        m.stretch.forEach((v, i) => expect(Math.abs(v - reference.stretch[i])).toBeLessThan(1e-3));
        m.areas.forEach((v, i) => expect(v / (k * k) / reference.areas[i]).toBeCloseTo(1, 6));
      }),
      { seed: 7, numRuns: 8 },
    );
  });
});
