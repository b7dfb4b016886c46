/**
 * The pattern faces file (`faces.bin`) the 3D view colours a sculpt with: little-endian u32 face count F, then
 * F int32 piece indices (into the pattern document's `pieces`, −1 for none), then F float32 stretch values in
 * percent. Every block is 4-byte aligned.
 */
import { GeometryError } from '../errors';
import type { PatternFaceMaps } from './build-pattern';

/** Returns the faces-file bytes of `faces` (both arrays of length F). Throws BAD_OPTION when the lengths differ. */
export function encodePatternFaces(faces: PatternFaceMaps): Uint8Array {
  const F = faces.pieceIndex.length;
  if (faces.stretchPct.length !== F) {
    throw new GeometryError('BAD_OPTION', `faces file: ${F} piece indices but ${faces.stretchPct.length} stretch values`);
  }
  const out = new Uint8Array(4 + 8 * F);
  const view = new DataView(out.buffer);
  view.setUint32(0, F, true);
  for (let f = 0; f < F; f++) {
    view.setInt32(4 + 4 * f, faces.pieceIndex[f], true);
    view.setFloat32(4 + 4 * F + 4 * f, faces.stretchPct[f], true);
  }
  return out;
}

/**
 * Reads a faces file. Throws GeometryError TRUNCATED when it is too short for its header, BAD_HEADER when its
 * length does not match the face count in its header, NON_FINITE (naming the face) when a stretch is not a number.
 * The messages name the lengths found and needed, for the maker's screen as much as for a log.
 */
export function decodePatternFaces(bytes: Uint8Array): PatternFaceMaps {
  if (bytes.byteLength < 4) {
    throw new GeometryError('TRUNCATED', `The faces file is ${bytes.byteLength} bytes long; it needs at least 4 bytes for the face count.`);
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const F = view.getUint32(0, true);
  const expected = 4 + 8 * F;
  if (bytes.byteLength !== expected) {
    throw new GeometryError('BAD_HEADER', `The faces file is ${bytes.byteLength} bytes long but its header names ${F} faces, which need ${expected} bytes.`);
  }
  const pieceIndex = new Int32Array(F);
  const stretchPct = new Float32Array(F);
  for (let f = 0; f < F; f++) {
    pieceIndex[f] = view.getInt32(4 + 4 * f, true);
    const s = view.getFloat32(4 + 4 * F + 4 * f, true);
    if (!Number.isFinite(s)) throw new GeometryError('NON_FINITE', `The faces file gives face ${f} a stretch that is not a number.`, { face: f });
    stretchPct[f] = s;
  }
  return { pieceIndex, stretchPct };
}
