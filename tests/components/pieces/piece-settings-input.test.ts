import { describe, expect, it } from 'vitest';
import { MAX_PIECE_QUANTITY, MAX_PIECE_THICKNESS_MM } from '../../../geometry/pattern/piece-settings';
import { MAX_QUANTITY, MAX_THICKNESS_MM, parseQuantity, parseThickness, stretchVerdict } from '../../../components/pieces/piece-settings-input';

describe('piece setting limits', () => {
  it('are the engine\'s limits, so the form refuses exactly what the pattern job would', () => {
    expect(MAX_THICKNESS_MM).toBe(MAX_PIECE_THICKNESS_MM);
    expect(MAX_QUANTITY).toBe(MAX_PIECE_QUANTITY);
  });
});

describe('parseThickness', () => {
  it('reads decimal point and decimal comma (ISO 80000-1 allows either)', () => {
    expect(parseThickness('5.5')).toEqual({ ok: true, value: 5.5 });
    expect(parseThickness(' 5,5 ')).toEqual({ ok: true, value: 5.5 });
  });
  it('says what is wrong with an empty, non-numeric or out-of-range value', () => {
    expect(parseThickness('')).toMatchObject({ ok: false, error: expect.stringMatching(/Type a thickness/) });
    expect(parseThickness('thick')).toMatchObject({ ok: false, error: expect.stringMatching(/"thick" is not a number/) });
    expect(parseThickness('0')).toMatchObject({ ok: false, error: expect.stringMatching(/more than 0 and at most 100 mm; 0 mm/) });
    expect(parseThickness('150')).toMatchObject({ ok: false, error: expect.stringMatching(/150 mm is outside/) });
  });
});

describe('parseQuantity', () => {
  it('takes whole numbers from 1 to 999 only', () => {
    expect(parseQuantity('3')).toEqual({ ok: true, value: 3 });
    expect(parseQuantity('2.5')).toMatchObject({ ok: false, error: expect.stringMatching(/whole number.*"2.5" is not/) });
    expect(parseQuantity('0')).toMatchObject({ ok: false, error: expect.stringMatching(/0 is outside/) });
    expect(parseQuantity('1000')).toMatchObject({ ok: false, error: expect.stringMatching(/1000 is outside/) });
  });
});

describe('stretchVerdict', () => {
  it('is within budget at or under it (the engine warns only above: geometry/pattern/build-pattern.ts)', () => {
    expect(stretchVerdict({ stretch: { maxPct: 3, rmsPct: 1 } }, 3)).toMatchObject({ over: false });
  });
  it('over budget names the dart and what it leaves, or advises a seam when there is no dart', () => {
    const withDart = stretchVerdict({ stretch: { maxPct: 5.24, rmsPct: 2 }, darts: [{ path: [[0, 0], [1, 1]], stretchAfterPct: 1.96 }] }, 3);
    expect(withDart.over).toBe(true);
    expect(withDart.dartLeavesPct).toBe(1.96);
    expect(withDart.message).toMatch(/max 5\.2 %.*over the 3 % budget.*leaves 2\.0 % stretch/);
    expect(stretchVerdict({ stretch: { maxPct: 4, rmsPct: 1 } }, 3).message).toMatch(/Add a seam/);
  });
});
