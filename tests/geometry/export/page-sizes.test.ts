import { describe, expect, it } from 'vitest';
import { pageSize } from '../../../geometry/export/page-sizes';
import { mm, mmToPt } from '../../../geometry/units';

describe('pageSize', () => {
  it('gives ISO 216 A4 and A3 and ANSI/ASME Y14.1 Letter and Tabloid in mm', () => {
    // ISO 216: A4 210×297 mm, A3 297×420 mm.
    expect(pageSize('a4')).toMatchObject({ widthMm: 210, heightMm: 297 });
    expect(pageSize('A3')).toMatchObject({ widthMm: 297, heightMm: 420 });
    // ANSI/ASME Y14.1: size A (Letter) 8.5×11 in = 215.9×279.4 mm; size B (Tabloid) 11×17 in = 279.4×431.8 mm.
    expect(pageSize('letter').widthMm).toBeCloseTo(215.9, 9);
    expect(pageSize('letter').heightMm).toBeCloseTo(279.4, 9);
    expect(pageSize('tabloid').widthMm).toBeCloseTo(279.4, 9);
    expect(pageSize('tabloid').heightMm).toBeCloseTo(431.8, 9);
  });

  it('swaps width and height for landscape', () => {
    expect(pageSize('a4', 'landscape')).toMatchObject({ widthMm: 297, heightMm: 210 });
  });

  it('converts A4 to 595.28×841.89 pt (ISO 32000-1 §8.3.2.3: 1 unit = 1/72 in)', () => {
    const a4 = pageSize('a4');
    expect(mmToPt(mm(a4.widthMm))).toBeCloseTo(595.28, 2);
    expect(mmToPt(mm(a4.heightMm))).toBeCloseTo(841.89, 2);
  });

  it('rejects an unknown size naming it and the known ones', () => {
    expect(() => pageSize('b5')).toThrow(/unknown page size "b5": use one of a4, letter, a3, tabloid/);
    try {
      pageSize('legal');
    } catch (e) {
      expect((e as { code: string }).code).toBe('BAD_OPTION');
    }
    expect(() => pageSize('a4', 'sideways' as 'portrait')).toThrow(/orientation/);
  });
});
