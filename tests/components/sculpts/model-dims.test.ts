/**
 * Measuring a model before upload (components/sculpts/model-dims.ts). Expected values are closed forms: an
 * axis-aligned box's bounding box is its edge lengths; its section at half height is a rectangle whose
 * circumference estimate is the Ramanujan perimeter of the ellipse spanning it (geometry/mesh/wearer-scale.ts);
 * inches convert at exactly 25.4 mm (NIST SP 811, appendix B.8).
 */
import { describe, expect, it } from 'vitest';
import { measureModel } from '../../../components/sculpts/model-dims';
import { ellipsePerimeterMm } from '../../../geometry/mesh/wearer-scale';

/** An OBJ box from (0,0,0) to (w,h,d) as 12 triangles. */
function boxObj(w: number, h: number, d: number): Uint8Array {
  const v = [[0, 0, 0], [w, 0, 0], [w, h, 0], [0, h, 0], [0, 0, d], [w, 0, d], [w, h, d], [0, h, d]];
  const f = [[1, 3, 2], [1, 4, 3], [5, 6, 7], [5, 7, 8], [1, 2, 6], [1, 6, 5], [2, 3, 7], [2, 7, 6], [3, 4, 8], [3, 8, 7], [4, 1, 5], [4, 5, 8]];
  const text = v.map((p) => `v ${p.join(' ')}`).join('\n') + '\n' + f.map((t) => `f ${t.join(' ')}`).join('\n') + '\n';
  return new TextEncoder().encode(text);
}

describe('measureModel', () => {
  it('gives the box size, counts and the half-height section in millimetres', () => {
    const d = measureModel(boxObj(200, 300, 100), 'box.obj', 'mm');
    expect(d.sizeMm).toEqual([200, 300, 100]);
    expect(d.triangles).toBe(12);
    expect(d.vertices).toBe(8);
    expect(d.section!.heightMm).toBeCloseTo(300, 9);
    expect(d.section!.circumferenceMm).toBeCloseTo(ellipsePerimeterMm(100, 50), 6);
  });

  it('converts inches at 25.4 mm', () => {
    expect(measureModel(boxObj(10, 12, 8), 'box.obj', 'in').sizeMm.map((v) => Number(v.toFixed(9)))).toEqual([254, 304.8, 203.2]);
  });

  it('passes on the parser’s message with the line number for a broken file', () => {
    const bad = new TextEncoder().encode('v 0 0 0\nv 1 0 0\nf 1 2 9\n');
    expect(() => measureModel(bad, 'bad.obj', 'mm')).toThrow(/line 3/);
  });
});
