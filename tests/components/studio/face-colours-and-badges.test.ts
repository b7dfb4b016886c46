/**
 * Colours of the 3D view (our own ramp and piece palette: checked against their defining stops and the golden-angle
 * hue step, (Vogel 1979) spacing) and where seam badges go (on the border between the seam's two pieces; a flat
 * grid split down its middle line makes the expected point and normal exact by construction).
 */
import { describe, expect, it } from 'vitest';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import type { PatternDoc } from '../../../geometry/pattern/pattern-doc';
import { fillFaceColours, pieceColour, STRETCH_RAMP, stretchColour } from '../../../components/studio/face-colours';
import { seamBadges } from '../../../components/studio/seam-badges';

describe('stretch and piece colours', () => {
  it('meets the ramp stops at 0, the budget and twice the budget, and clamps beyond', () => {
    expect(stretchColour(0, 3)).toEqual(STRETCH_RAMP[0][1]);
    expect(stretchColour(3, 3).map((x) => +x.toFixed(9))).toEqual(STRETCH_RAMP[2][1]);
    expect(stretchColour(6, 3).map((x) => +x.toFixed(9))).toEqual(STRETCH_RAMP[4][1]);
    expect(stretchColour(60, 3)).toEqual(stretchColour(6, 3));
    // Compression reads like stretch of the same size.
    expect(stretchColour(-1.5, 3)).toEqual(stretchColour(1.5, 3));
  });
  it('gives the first 24 pieces 24 different colours', () => {
    const keys = new Set(Array.from({ length: 24 }, (_, i) => pieceColour(i).map((x) => x.toFixed(2)).join(',')));
    expect(keys.size).toBe(24);
  });
  it('writes three equal corners per face and fades pieces other than the selected one', () => {
    const faces = { pieceIndex: Int32Array.of(0, 1), stretchPct: Float32Array.of(0, 9) };
    const out = new Float32Array(18);
    fillFaceColours(out, 2, 'pieces', faces, 3, 0);
    expect(Array.from(out.slice(0, 3))).toEqual(Array.from(out.slice(6, 9)));
    expect(Array.from(out.slice(0, 3)).map((x) => +x.toFixed(5))).toEqual(pieceColour(0).map((x) => +Math.fround(x).toFixed(5)));
    expect(Math.min(...out.slice(9, 12))).toBeGreaterThan(Math.min(...pieceColour(1)));
    fillFaceColours(out, 2, 'stretch', faces, 3, null);
    expect(Array.from(out.slice(9, 12)).map((x) => +x.toFixed(5))).toEqual(STRETCH_RAMP[4][1].map((x) => +Math.fround(x).toFixed(5)));
  });
});

describe('seam badges', () => {
  it('sit on the border between the two pieces a seam joins, with the surface normal there', () => {
    const n = 10;
    const positions: number[] = [];
    const tris: number[] = [];
    for (let j = 0; j <= n; j++) for (let i = 0; i <= n; i++) positions.push(i, j, 0);
    const id = (i: number, j: number) => i + (n + 1) * j;
    const piece: number[] = [];
    for (let j = 0; j < n; j++) {
      for (let i = 0; i < n; i++) {
        tris.push(id(i, j), id(i + 1, j), id(i + 1, j + 1), id(i, j), id(i + 1, j + 1), id(i, j + 1));
        piece.push(i < 5 ? 0 : 1, i < 5 ? 0 : 1);
      }
    }
    const triangles = Uint32Array.from(tris);
    const twin = buildTwins(triangles, positions.length / 3);
    const seam = { pieces: ['A', 'B'], length3d: 10, lengths: [10, 10], dihedral: { min: 180, mean: 180, max: 180 }, stations: [] };
    const doc = {
      units: 'mm',
      pieces: [{ label: 'A' }, { label: 'B' }],
      seams: [
        { ...seam, label: '1', bevel: { min: 0, mean: 0, max: 0 }, convex: true },
        { ...seam, label: '2', bevel: { min: 20, mean: 22, max: 24 }, convex: false },
        { ...seam, label: '3', pieces: ['A'], bevel: { min: 0, mean: 0, max: 0 }, convex: true },
      ],
      warnings: [],
    } as unknown as PatternDoc;
    const badges = seamBadges(doc, Float64Array.from(positions), triangles, twin, Int32Array.from(piece));
    // Seam 3 closes piece A onto itself: no badge. Seams 1 and 2 share the border x = 5 and take turns along it.
    expect(badges.map((b) => b.label)).toEqual(['1', '2']);
    for (const b of badges) {
      expect(b.at[0]).toBe(5);
      expect(b.normal).toEqual([0, 0, 1]);
    }
    expect(badges[0].at[1]).toBeLessThan(badges[1].at[1]);
    expect(badges[1]).toMatchObject({ bevelDeg: 22, convex: false });
  });
});
