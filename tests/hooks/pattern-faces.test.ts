import { describe, expect, it } from 'vitest';
import { decodePatternFaces, isJobActive } from '../../hooks/use-pattern';

// The byte layout is the one CONTRACTS.md fixes for GET .../patterns/:patternId/faces: u32 count, Int32 × F,
// Float32 × F, little-endian. The bytes below are written by hand with DataView (ECMAScript's own typed-array
// encoder, independent of the decoder's loop), so a wrong offset or endianness in the decoder fails here.
function facesFile(pieces: number[], stretch: number[]): Uint8Array {
  const bytes = new Uint8Array(4 + pieces.length * 8);
  const v = new DataView(bytes.buffer);
  v.setUint32(0, pieces.length, true);
  pieces.forEach((p, i) => v.setInt32(4 + i * 4, p, true));
  stretch.forEach((s, i) => v.setFloat32(4 + pieces.length * 4 + i * 4, s, true));
  return bytes;
}

describe('decodePatternFaces', () => {
  it('reads piece indices (−1 = no piece) and stretch percentages in face order', () => {
    const out = decodePatternFaces(facesFile([0, 2, -1], [0.5, 3.25, 0]));
    expect(Array.from(out.pieceIndex)).toEqual([0, 2, -1]);
    // 0.5 and 3.25 are exact in binary32 (IEEE 754-2019 §3.4), so equality holds.
    expect(Array.from(out.stretchPct)).toEqual([0.5, 3.25, 0]);
  });

  it('reads a file that sits at an offset inside a larger buffer', () => {
    const inner = facesFile([1], [2]);
    const outer = new Uint8Array(inner.length + 3);
    outer.set(inner, 3);
    const out = decodePatternFaces(outer.subarray(3));
    expect(out.pieceIndex[0]).toBe(1);
    expect(out.stretchPct[0]).toBe(2);
  });

  it('says how long the file is and how long it should be when cut short or padded', () => {
    const file = facesFile([0, 1], [1, 1]);
    expect(() => decodePatternFaces(file.subarray(0, file.length - 1))).toThrow(/19 bytes long but its header names 2 faces, which need 20 bytes/);
    expect(() => decodePatternFaces(new Uint8Array(2))).toThrow(/2 bytes long; it needs at least 4/);
  });

  it('names the face whose stretch is not a number', () => {
    expect(() => decodePatternFaces(facesFile([0, 0], [1, Number.NaN]))).toThrow(/face 1/);
  });
});

describe('isJobActive', () => {
  it('keeps polling only while queued or running', () => {
    expect([isJobActive('queued'), isJobActive('running'), isJobActive('done'), isJobActive('failed'), isJobActive(null)]).toEqual([
      true,
      true,
      false,
      false,
      false,
    ]);
  });
});
