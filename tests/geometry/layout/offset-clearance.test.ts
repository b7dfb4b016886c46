import { describe, expect, it } from 'vitest';
import { OffsetClearance } from '../../../geometry/layout/offset-clearance';
import { offsetRingUm } from '../../../geometry/layout/offset-ring';
import type { PointMm } from '../../../geometry/pattern/pattern-doc';
import { rectangle } from '../../fixtures/pattern-docs/shape-docs';

const um = (mm: number) => Math.round(mm * 1000);
const turn = (ring: PointMm[], deg: number): PointMm[] => {
  const a = (deg * Math.PI) / 180;
  return ring.map(([x, y]) => [Math.cos(a) * x - Math.sin(a) * y, Math.sin(a) * x + Math.cos(a) * y]);
};

// A 3 mm cutting gap (issue 4's default): each outline is grown by 1.5 mm.
const half = 1.5;

describe('OffsetClearance', () => {
  it('keeps the offset inside the sheet: a piece may come to half the gap from the edge (+ 20 µm), not closer', () => {
    const sheet = new OffsetClearance(um(100), um(100));
    const sq = offsetRingUm(rectangle(20, 20), half);
    expect(sheet.fits(sq, um(1.52), um(1.52))).toBe(true);
    expect(sheet.fits(sq, um(1.48), um(40))).toBe(false);
    expect(sheet.fits(sq, um(40), um(1.48))).toBe(false);
    // Right and top edges: the square's far side at 100 − 1.52 mm is fine, at 100 − 1.48 mm is not.
    expect(sheet.fits(sq, um(100 - 21.52), um(100 - 21.52))).toBe(true);
    expect(sheet.fits(sq, um(100 - 21.48), um(40))).toBe(false);
  });

  it('accepts neighbours side by side at 3.05 mm and refuses them at 2.95 mm', () => {
    const sheet = new OffsetClearance(um(200), um(200));
    const sq = offsetRingUm(rectangle(20, 20), half);
    sheet.add(sq, um(10), um(10));
    expect(sheet.fits(sq, um(10 + 20 + 3.05), um(10))).toBe(true);
    expect(sheet.fits(sq, um(10 + 20 + 2.95), um(10))).toBe(false);
    expect(sheet.fits(sq, um(10), um(10 + 20 + 2.95))).toBe(false);
    // Overlapping outlines are refused too (the classic no-fit case).
    expect(sheet.fits(sq, um(15), um(15))).toBe(false);
  });

  it('measures the gap as a true distance at corners (round joins): corner to corner 3.05 mm fits, 2.95 mm does not', () => {
    // Two squares corner to corner along the diagonal: the corners' distance is d·√2 for an offset d in x and y.
    // A square (mitred) offset would reach 1.5·√2 mm out at the corner and refuse 3.05 mm; the true offset
    // (Minkowski sum with a disc) reaches 1.5 mm in every direction.
    const sheet = new OffsetClearance(um(200), um(200));
    const sq = offsetRingUm(rectangle(20, 20), half);
    sheet.add(sq, um(10), um(10));
    const at = (gap: number) => 10 + 20 + gap / Math.SQRT2;
    expect(sheet.fits(sq, um(at(3.05)), um(at(3.05)))).toBe(true);
    expect(sheet.fits(sq, um(at(2.95)), um(at(2.95)))).toBe(false);
  });

  it('gives the same answers for a turned piece (rotation invariance of the distance test)', () => {
    const sheet = new OffsetClearance(um(300), um(300));
    const a = offsetRingUm(turn(rectangle(40, 10), 30), half);
    sheet.add(a, um(100), um(100));
    // The long side's outward normal is (−sin 30°, cos 30°); moving the same piece 10 + gap along it
    // leaves exactly `gap` between the two long sides.
    const n: PointMm = [-Math.sin(Math.PI / 6), Math.cos(Math.PI / 6)];
    const move = (gap: number) => [um(100 + n[0] * (10 + gap)), um(100 + n[1] * (10 + gap))] as const;
    expect(sheet.fits(a, ...move(3.05))).toBe(true);
    expect(sheet.fits(a, ...move(2.95))).toBe(false);
  });
});
