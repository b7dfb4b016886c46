import { describe, expect, it } from 'vitest';
import { STYLE_PEN } from '../../../geometry/export/pdf-canvas';
import { SCREEN_PENS } from '../../../components/pieces/mark-styles';
import {
  MIN_TEXT_PX,
  boardScale,
  pieceAccessibleName,
  pieceSvgModel,
  readableTexts,
  svgPathData,
} from '../../../components/pieces/piece-svg-model';
import { helmetLikeDoc } from '../../fixtures/pattern-docs/shape-docs';

describe('svgPathData', () => {
  it('writes moveto/lineto/closepath commands (SVG 1.1 §8.3) with y turned down', () => {
    // SVG user space has y growing downwards (SVG 1.1 §7.3); the pattern's y grows upwards, so y changes sign.
    expect(svgPathData([[0, 0], [10, 0], [10, 5]], true)).toBe('M0 0 L10 0 L10 -5 Z');
    expect(svgPathData([[1.234, -2]], false)).toBe('M1.23 2');
  });
});

describe('pieceSvgModel', () => {
  const doc = helmetLikeDoc();

  it('frames the whole outline: the 220 × 160 mm crown A fits inside its viewBox with the margin', () => {
    // Piece A of the fixture is rectangle(220, 160) with corners (0,0) and (220,160).
    const m = pieceSvgModel(doc, 0, 4);
    const [x, y, w, h] = m.viewBox;
    expect(x).toBeLessThanOrEqual(-4);
    expect(y).toBeLessThanOrEqual(-160 - 4);
    expect(x + w).toBeGreaterThanOrEqual(224);
    expect(y + h).toBeGreaterThanOrEqual(4);
    expect(m.outlineD).toBe('M0 0 L220 0 L220 -160 L0 -160 Z');
  });

  it('draws the same match-mark ticks as the printed set: seam 1 is one short tick, seam 12 one long and two short', () => {
    // Convention of geometry/export/piece-drawing.ts (and the print set's legend): tens as long ticks, units as
    // short ticks. Ticks are the open 'match' lines; the number's frame is the closed one.
    const ticks = (d: ReturnType<typeof pieceSvgModel>) => d.lines.filter((l) => l.style === 'match' && !l.d.endsWith('Z')).length;
    const a = pieceSvgModel(doc, 0);
    expect(ticks(a)).toBe(1 + 2); // seam 1 and seam 2 on piece A
    const twelve = { ...doc, pieces: [{ ...doc.pieces[1], seamEdges: [{ ...doc.pieces[1].seamEdges![0], seam: '12' }] }] };
    expect(ticks(pieceSvgModel(twelve, 0))).toBe(3);
  });

  it('fills bevel triangles at an inside corner and leaves them hollow at an outside one', () => {
    // Fixture: seam 1 is convex (outside corner), seam 2 is not (inside corner); piece B only has seam 1,
    // piece C only seam 2.
    const b = pieceSvgModel(doc, 1).lines.filter((l) => l.style === 'bevel');
    const c = pieceSvgModel(doc, 2).lines.filter((l) => l.style === 'bevel');
    expect(b.length).toBeGreaterThan(0);
    expect(c.length).toBeGreaterThan(0);
    expect(b.every((l) => !l.filled)).toBe(true);
    expect(c.every((l) => l.filled)).toBe(true);
  });

  it('keeps the score line, the dart and their notes', () => {
    const a = pieceSvgModel(doc, 0);
    expect(a.lines.some((l) => l.style === 'score')).toBe(true);
    const f = pieceSvgModel(doc, 5);
    expect(f.lines.some((l) => l.style === 'dart')).toBe(true);
    expect(f.texts.some((t) => t.style === 'dart' && t.text.includes('1.5 %'))).toBe(true);
  });
});

describe('boardScale and readableTexts', () => {
  const doc = helmetLikeDoc();
  const models = doc.pieces.map((_, i) => pieceSvgModel(doc, i));

  it('sizes the largest piece to the cell', () => {
    const longest = Math.max(...models.map((m) => Math.max(m.viewBox[2], m.viewBox[3])));
    expect(boardScale(models, 180) * longest).toBeCloseTo(180, 9);
    expect(boardScale([], 180)).toBe(1);
  });

  it('keeps label, info and seam numbers at a readable size and drops notes too small to read', () => {
    const a = models[0];
    const pxPerMm = 0.5; // a 220 mm piece in a 110 px cell
    const shown = readableTexts(a.texts, pxPerMm);
    expect(shown.some((t) => t.style === 'label')).toBe(true);
    expect(shown.filter((t) => t.style === 'match').map((t) => t.text).sort()).toEqual(['1', '2']);
    for (const t of shown) expect(t.shownSizeMm * pxPerMm).toBeGreaterThanOrEqual(MIN_TEXT_PX - 1e-9);
    expect(shown.some((t) => t.style === 'bevel')).toBe(false);
    // At 1:1 on a 96 dpi screen (CSS px = 1/96 in, CSS Values 4 §6.2: 3.78 px per mm) bevel notes of 2.1 mm
    // are 7.9 px, still below the floor; at 5 px/mm they show.
    expect(readableTexts(a.texts, 5).some((t) => t.style === 'bevel')).toBe(true);
  });
});

describe('screen pens', () => {
  it('use the printed set colours for every mark, so paper and screen read alike', () => {
    for (const style of Object.keys(SCREEN_PENS) as Array<keyof typeof SCREEN_PENS>) {
      expect(SCREEN_PENS[style].color).toBe(STYLE_PEN[style].color);
      expect(Boolean(SCREEN_PENS[style].dash)).toBe(Boolean(STYLE_PEN[style].dash));
    }
  });
});

describe('pieceAccessibleName', () => {
  it('reads like the brief\'s example "Piece C, 6 mm, 2 copies"', () => {
    expect(pieceAccessibleName({ label: 'C', thickness: 6, quantity: 2, mirrored: false })).toBe('Piece C, 6 mm, 2 copies');
    expect(pieceAccessibleName({ label: 'A', thickness: 4.25, quantity: 1, mirrored: true, mirroredCopies: 1 })).toBe('Piece A, 4.3 mm, 1 copy, 1 mirrored');
  });
});
