import { describe, expect, it } from 'vitest';
import { formatMoney, readStockRows, ringLabelPoint, sheetRingPath, suggestedStockRows } from '../../../components/sheets/sheet-plan-model';

describe('formatMoney', () => {
  it('uses the currency\'s own symbol and minor units (ISO 4217: EUR and USD have 2, JPY has 0)', () => {
    expect(formatMoney(12.5, 'EUR', 'en-GB')).toBe('€12.50');
    expect(formatMoney(12.5, 'USD', 'en-US')).toBe('$12.50');
    expect(formatMoney(1200, 'JPY', 'en-US')).toBe('¥1,200');
  });
  it('falls back to amount and code for a code Intl does not accept', () => {
    expect(formatMoney(3, 'E1', 'en-GB')).toBe('3.00 E1');
  });
});

describe('sheet drawing paths', () => {
  it('turns sheet y (up) into SVG y (down, SVG 1.1 §7.3)', () => {
    expect(sheetRingPath([[0, 0], [100, 0], [100, 50]], 500)).toBe('M0 500 L100 500 L100 450 Z');
    expect(ringLabelPoint([[0, 0], [100, 0], [100, 50], [0, 50]], 500)).toEqual([50, 475]);
  });
});

describe('suggestedStockRows', () => {
  it('suggests the engine\'s common sheet size for each missing thickness (12×18 in = 457.2 × 304.8 mm for 2 mm)', () => {
    // 12 in × 25.4 mm = 304.8 mm and 18 in × 25.4 = 457.2 mm (the inch is exactly 25.4 mm, NIST SP 811 B.8).
    const rows = suggestedStockRows([6, 2, 6, 10], [10], 'EUR');
    expect(rows.map((r) => [r.thicknessMm, r.widthMm, r.heightMm])).toEqual([
      ['2', '457', '305'],
      ['6', '1000', '500'],
    ]);
    // 8 mm is not a listed stock; the nearest listed size (6 or 10 mm) is offered.
    expect(['1000', '600']).toContain(suggestedStockRows([8], [], 'EUR')[0].widthMm);
  });
});

describe('readStockRows', () => {
  const good = { thicknessMm: '6', name: '6 mm sheet', widthMm: '1000', heightMm: '500', price: '9,50', currency: 'eur' };
  it('reads numbers (decimal comma too) and upper-cases the currency', () => {
    const r = readStockRows([good]);
    expect(r).toEqual({ ok: true, body: { sheets: [{ thicknessMm: 6, name: '6 mm sheet', widthMm: 1000, heightMm: 500, price: 9.5, currency: 'EUR' }] } });
  });
  it('names the sheet and field that is wrong', () => {
    const r = readStockRows([good, { ...good, widthMm: 'wide', price: '-1', currency: 'euro' }]);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.errors['1.widthMm']).toBe('Sheet 2 width: "wide" is not a number.');
    expect(r.errors['1.price']).toMatch(/^Sheet 2 price: must be 0 or more/);
    expect(r.errors['1.currency']).toMatch(/^Sheet 2 currency: must be a three-letter currency code/);
    expect(Object.keys(r.errors).some((k) => k.startsWith('0.'))).toBe(false);
  });
});
