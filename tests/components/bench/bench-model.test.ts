import { describe, expect, it } from 'vitest';
import { benchStations, copiesText, formatBevel, lookUpSeam, normaliseSeamQuery, piecesByThickness } from '../../../components/bench/bench-model';
import { helmetLikeDoc } from '../../fixtures/pattern-docs/shape-docs';

// Expected values are read off the fixture's documented contents (tests/fixtures/pattern-docs/shape-docs.ts,
// helmetLikeDoc): A 6 mm, B 6 mm, C 6 mm ×2 mirrored, D 2 mm ×3, E 10 mm, F 4 mm; seam 1 joins A and B at an
// outside corner with a bevel running 30° → 15° (each edge cut at 22.5° on the inner face); seam 2 joins A and
// C at an inside corner, 20° on the outer face.
const doc = helmetLikeDoc();

describe('piecesByThickness', () => {
  it('groups thinnest first with copy counts and the crew\'s ticks', () => {
    const groups = piecesByThickness(doc, [
      { label: 'A', cut: true, shaped: true, glued: true, notes: 2 },
      { label: 'C', cut: true, shaped: false, glued: false, notes: 0 },
      { label: 'Z', cut: true, shaped: true, glued: true, notes: 0 },
    ]);
    expect(groups.map((g) => [g.thicknessMm, g.pieces.map((p) => p.label).join(''), g.copies, g.done])).toEqual([
      [2, 'D', 3, 0],
      [4, 'F', 1, 0],
      [6, 'ABC', 4, 1],
      [10, 'E', 1, 0],
    ]);
    const six = groups[2].pieces;
    // Spares (from the server's bench view) add to the copies to cut: D ×3 with 1 spare makes 4 in 2 mm.
    const withSpares = piecesByThickness(doc, [], new Map([['D', 1]]));
    expect([withSpares[0].copies, withSpares[0].pieces[0].spares]).toEqual([4, 1]);
    expect(six[0]).toMatchObject({ label: 'A', cut: true, notes: 2 });
    expect(six[2]).toMatchObject({ label: 'C', cut: true, shaped: false, mirroredCopies: 1, quantity: 2 });
  });
});

describe('lookUpSeam', () => {
  it('gives both pieces and the bevel each side, outside corner, varying', () => {
    const s = lookUpSeam(doc, '1')!;
    expect(s.sides).toEqual([
      { piece: 'A', bevelDeg: 22.5, face: 'inner' },
      { piece: 'B', bevelDeg: 22.5, face: 'inner' },
    ]);
    expect(s.corner).toBe('outside');
    expect(s.varies).toBe(true);
  });

  it('reads "#02", " seam 2 " and "2" alike; an inside corner cut on the outer face', () => {
    for (const typed of ['#02', ' seam 2 ', '2']) {
      const s = lookUpSeam(doc, typed)!;
      expect(s.seam.label).toBe('2');
      expect(s.corner).toBe('inside');
      expect(s.sides.map((x) => [x.piece, x.bevelDeg, x.face])).toEqual([
        ['A', 20, 'outer'],
        ['C', 20, 'outer'],
      ]);
      expect(s.varies).toBe(false);
    }
  });

  it('answers null for a number the pattern does not have, or for nothing typed', () => {
    expect(lookUpSeam(doc, '7')).toBeNull();
    expect(lookUpSeam(doc, '   ')).toBeNull();
    expect(normaliseSeamQuery('#')).toBeNull();
  });

  it('lists a tube\'s self-seam piece on both sides, with the seam\'s mean bevel when the piece carries no edge', () => {
    const tube = { ...doc, seams: [{ ...doc.seams[0], label: '9', pieces: ['E'] }] };
    const s = lookUpSeam(tube, '9')!;
    expect(s.sides.map((x) => x.piece)).toEqual(['E', 'E']);
    expect(s.sides[0].bevelDeg).toBe(22.5); // mean of 30 and 15
  });
});

describe('benchStations and formatBevel', () => {
  it('lists stations where the bevel moves by a degree or more, ends included', () => {
    // Fixture seam 1: stations at 0 (30°), 110 (22.5°), 220 (15°), all ≥ 1° apart.
    expect(benchStations(doc.seams[0])).toEqual([
      { atMm: 0, bevelDeg: 30 },
      { atMm: 110, bevelDeg: 22.5 },
      { atMm: 220, bevelDeg: 15 },
    ]);
    const flat = { ...doc.seams[1], stations: [{ at: 0, bevel: 20 }, { at: 50, bevel: 20.4 }, { at: 150, bevel: 20.2 }] };
    expect(benchStations(flat)).toEqual([
      { atMm: 0, bevelDeg: 20 },
      { atMm: 150, bevelDeg: 20.2 },
    ]);
  });

  it('rounds to the half degree a blade guide can be set to', () => {
    expect([formatBevel(29.9), formatBevel(22.4), formatBevel(22.76), formatBevel(0)]).toEqual(['30°', '22.5°', '23°', '0°']);
  });
});

describe('copiesText', () => {
  it('counts spares into the copies to cut and says how many are spares', () => {
    expect([copiesText(1, 0), copiesText(3, 0), copiesText(3, 1), copiesText(4, 2)]).toEqual(['1 copy', '3 copies', '4 copies (3 + 1 spare)', '6 copies (4 + 2 spares)']);
  });
});
