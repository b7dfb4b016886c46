import { describe, expect, it } from 'vitest';
import { declutterTexts } from '../../../geometry/export/declutter-texts';
import { pieceDrawing } from '../../../geometry/export/piece-drawing';
import { textBox } from '../../../geometry/export/text-box';
import { sharedAreaMm2 } from '../../../geometry/layout/clipper-paths';
import type { PatternDoc, PatternSeam, PieceSeamEdge, PointMm } from '../../../geometry/pattern/pattern-doc';
import { irregularPolygon, piece, seededRandom } from '../../fixtures/pattern-docs/shape-docs';

/**
 * A scan-like piece: a ragged 26-corner plate whose every edge is its own short seam, with bevels
 * changing along each (three stations), the case where ticks, numbers and notes used to pile up
 * (W1 brief item 3: the bunny scan's 55 pieces and 146 seams).
 */
function raggedDoc(): PatternDoc {
  const rand = seededRandom(3);
  const ring = irregularPolygon(rand, 70, 26);
  const edges: PieceSeamEdge[] = [];
  const seams: PatternSeam[] = [];
  ring.forEach((p, i) => {
    const q = ring[(i + 1) % ring.length];
    const label = String(100 + i);
    const len = Math.hypot(q[0] - p[0], q[1] - p[1]);
    edges.push({ seam: label, side: 0, path: [p, q], bevelDeg: 12.5, bevelFace: 'inner' });
    seams.push({
      label, pieces: ['R'], length3d: len, lengths: [len],
      dihedral: { min: 150, mean: 155, max: 160 }, bevel: { min: 10, mean: 12.5, max: 15 }, convex: true,
      stations: [{ at: 0, bevel: 10 }, { at: len / 2, bevel: 12.5 }, { at: len, bevel: 15 }],
    });
  });
  return { units: 'mm', pieces: [piece('R', ring, { seamEdges: edges, scoreLines: [{ path: [[-20, 0], [20, 0]], foldDeg: 150 }] })], seams, warnings: [] };
}

describe('declutterTexts (greedy placement by priority, after Christensen et al. 1995)', () => {
  const doc = raggedDoc();
  const raw = pieceDrawing(doc.pieces[0], doc, { mirrored: false, rotationDeg: 0, x: 0, y: 0 });
  const [tidy] = declutterTexts([raw]);

  it('keeps the piece label and every seam number', () => {
    const texts = tidy.texts.map((t) => t.text);
    expect(texts).toContain('R');
    for (const s of doc.seams) expect(texts).toContain(s.label);
  });

  it('leaves no text that may be dropped overlapping any other text (clipper intersection area 0, Vatti 1992)', () => {
    const boxes = tidy.texts.map((t) => ({ t, box: textBox(t) }));
    let checked = 0;
    for (let i = 0; i < boxes.length; i++) {
      for (let j = i + 1; j < boxes.length; j++) {
        if (boxes[i].t.keep && boxes[j].t.keep) continue;
        checked++;
        expect(sharedAreaMm2(boxes[i].box, boxes[j].box)).toBe(0);
      }
    }
    expect(checked).toBeGreaterThan(0);
  });

  it('drops clashing notes and their station bars rather than piling them up', () => {
    const count = (d: typeof raw, style: string) => d.texts.filter((t) => t.style === style).length;
    expect(count(tidy, 'bevel') + count(tidy, 'station')).toBeLessThan(count(raw, 'bevel') + count(raw, 'station'));
    // A station bar is drawn only with its angle.
    expect(tidy.lines.filter((l) => l.style === 'station').length).toBe(count(tidy, 'station'));
  });

  it('keeps placed edge notes inside their own piece (box fully within the outline by clipper area)', () => {
    const outline = tidy.lines[0].points as PointMm[];
    for (const t of tidy.texts.filter((x) => x.style === 'bevel' || x.style === 'station')) {
      const box = textBox(t);
      expect(sharedAreaMm2(box, outline)).toBeCloseTo(sharedAreaMm2(box, box), 3);
    }
  });

  it('gives the same choices when the drawing is turned and moved with its text (rigid-motion invariance)', () => {
    const turned = pieceDrawing(doc.pieces[0], doc, { mirrored: false, rotationDeg: 30, x: 400, y: -120 });
    const [t2] = declutterTexts([turned]);
    expect(t2.texts.map((t) => t.text).sort()).toEqual(tidy.texts.map((t) => t.text).sort());
  });
});
