import { describe, expect, it } from 'vitest';
import { pieceSeamRows } from '../../../components/pieces/piece-seams';
import { helmetLikeDoc } from '../../fixtures/pattern-docs/shape-docs';

// Fixture (tests/fixtures/pattern-docs/shape-docs.ts helmetLikeDoc): A carries seam 1 (to B, outside corner,
// 22.5° on the inner face) and seam 2 (to C, inside corner, 20° on the outer face); C carries seam 2 only.
describe('pieceSeamRows', () => {
  const doc = helmetLikeDoc();
  it('lists each seam of the piece with the other piece, its bevel and the corner', () => {
    expect(pieceSeamRows(doc, 'A')).toEqual([
      { seam: '1', joins: 'B', bevelDeg: 22.5, face: 'inner', corner: 'outside' },
      { seam: '2', joins: 'C', bevelDeg: 20, face: 'outer', corner: 'inside' },
    ]);
    expect(pieceSeamRows(doc, 'C').map((r) => [r.seam, r.joins])).toEqual([['2', 'A']]);
  });
  it('orders seam 10 after seam 9 and skips later copies\' edges', () => {
    const a = doc.pieces[0];
    const edges = [
      { ...a.seamEdges![0], seam: '10' },
      { ...a.seamEdges![0], seam: '9' },
      { ...a.seamEdges![0], seam: '9', copy: 1 },
    ];
    const d = { ...doc, pieces: [{ ...a, seamEdges: edges }, ...doc.pieces.slice(1)], seams: [{ ...doc.seams[0], label: '9' }, { ...doc.seams[0], label: '10' }] };
    expect(pieceSeamRows(d, 'A').map((r) => r.seam)).toEqual(['9', '10']);
  });
  it('gives nothing for a piece that is not there', () => {
    expect(pieceSeamRows(doc, 'Q')).toEqual([]);
  });
});
