/**
 * The working-mesh file: the cleaned, reduced mesh a sculpt's processing job stores and the studio downloads.
 * Little-endian bytes: ASCII "SSWM", u32 version (1), u32 vertexCount V, u32 triangleCount T, then V·3 float32
 * positions in millimetres, then T·3 u32 vertex indices (counter-clockwise from outside, as TriMesh). Every
 * block is 4-byte aligned, so a reader on a little-endian machine can view the arrays without parsing.
 */
import { GeometryError } from '../errors';

const MAGIC = 'SSWM';
/** The only version written and read so far. */
export const WORKING_MESH_VERSION = 1;
const HEADER_BYTES = 16;

const littleEndianHost = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

/** A decoded working mesh: positions Float32Array(3V) in mm, triangles Uint32Array(3T). */
export interface WorkingMesh {
  positions: Float32Array;
  triangles: Uint32Array;
}

/**
 * Returns the working-mesh bytes of a mesh. `positionsMm` is (Float64|Float32)Array(3V) in millimetres (stored
 * as float32, about 7 significant digits, i.e. 0.1 µm on a 1 m part); `triangles` is Uint32Array(3T) with every
 * index < V. Throws GeometryError BAD_OPTION when an array length is not a multiple of 3, NON_FINITE for a
 * NaN or infinite coordinate (with the vertex), INDEX_OUT_OF_RANGE for a bad index (with the face).
 */
export function encodeWorkingMesh(positionsMm: Float64Array | Float32Array, triangles: Uint32Array): Uint8Array {
  if (positionsMm.length % 3 !== 0) {
    throw new GeometryError('BAD_OPTION', `working mesh: positions length ${positionsMm.length} is not a multiple of 3`);
  }
  if (triangles.length % 3 !== 0) {
    throw new GeometryError('BAD_OPTION', `working mesh: triangle index length ${triangles.length} is not a multiple of 3`);
  }
  const V = positionsMm.length / 3;
  const T = triangles.length / 3;
  for (let i = 0; i < positionsMm.length; i++) {
    if (!Number.isFinite(positionsMm[i]) || !Number.isFinite(Math.fround(positionsMm[i]))) {
      const vertex = Math.floor(i / 3);
      throw new GeometryError('NON_FINITE', `working mesh: vertex ${vertex} has a coordinate that is not a finite float32 (${positionsMm[i]})`, { vertex });
    }
  }
  for (let i = 0; i < triangles.length; i++) {
    if (triangles[i] >= V) {
      const face = Math.floor(i / 3);
      throw new GeometryError('INDEX_OUT_OF_RANGE', `working mesh: triangle ${face} uses vertex ${triangles[i]} but there are only ${V} vertices`, { face });
    }
  }
  const out = new Uint8Array(HEADER_BYTES + 12 * V + 12 * T);
  const view = new DataView(out.buffer);
  for (let i = 0; i < 4; i++) out[i] = MAGIC.charCodeAt(i);
  view.setUint32(4, WORKING_MESH_VERSION, true);
  view.setUint32(8, V, true);
  view.setUint32(12, T, true);
  let p = HEADER_BYTES;
  if (littleEndianHost) {
    new Float32Array(out.buffer, p, 3 * V).set(positionsMm);
    p += 12 * V;
    new Uint32Array(out.buffer, p, 3 * T).set(triangles);
  } else {
    for (let i = 0; i < 3 * V; i++, p += 4) view.setFloat32(p, positionsMm[i], true);
    for (let i = 0; i < 3 * T; i++, p += 4) view.setUint32(p, triangles[i], true);
  }
  return out;
}

/**
 * Reads working-mesh bytes (any byte offset) into fresh arrays: positions Float32Array(3V) in mm and
 * triangles Uint32Array(3T). Throws GeometryError: TRUNCATED when the bytes are shorter than the header or
 * than the counts say (naming both sizes), BAD_HEADER for a wrong magic, an unknown version or bytes left over
 * after the arrays, NON_FINITE for a NaN/infinite coordinate (with the vertex), INDEX_OUT_OF_RANGE for a
 * triangle index ≥ V (with the face).
 */
export function decodeWorkingMesh(bytes: Uint8Array): WorkingMesh {
  if (bytes.length < HEADER_BYTES) {
    throw new GeometryError('TRUNCATED', `working mesh: ${bytes.length} bytes is shorter than the ${HEADER_BYTES}-byte header`);
  }
  const magic = String.fromCharCode(bytes[0], bytes[1], bytes[2], bytes[3]);
  if (magic !== MAGIC) {
    throw new GeometryError('BAD_HEADER', `working mesh: the file does not start with "${MAGIC}" (found bytes ${hex(bytes.subarray(0, 4))})`);
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const version = view.getUint32(4, true);
  if (version !== WORKING_MESH_VERSION) {
    throw new GeometryError('BAD_HEADER', `working mesh: version ${version} is not supported (this reader knows version ${WORKING_MESH_VERSION})`);
  }
  const V = view.getUint32(8, true);
  const T = view.getUint32(12, true);
  const expected = HEADER_BYTES + 12 * V + 12 * T;
  if (bytes.length < expected) {
    throw new GeometryError(
      'TRUNCATED',
      `working mesh: the header promises ${V} vertices and ${T} triangles (${expected} bytes) but there are only ${bytes.length} bytes`,
    );
  }
  if (bytes.length > expected) {
    throw new GeometryError(
      'BAD_HEADER',
      `working mesh: ${bytes.length - expected} bytes follow the ${V} vertices and ${T} triangles the header promises; the file is corrupt`,
    );
  }
  const posStart = bytes.byteOffset + HEADER_BYTES;
  const triStart = posStart + 12 * V;
  // slice copies, so the result owns aligned buffers whatever the input's offset.
  const positions = littleEndianHost ? new Float32Array(bytes.buffer.slice(posStart, triStart)) : new Float32Array(3 * V);
  const triangles = littleEndianHost ? new Uint32Array(bytes.buffer.slice(triStart, triStart + 12 * T)) : new Uint32Array(3 * T);
  if (!littleEndianHost) {
    for (let i = 0; i < 3 * V; i++) positions[i] = view.getFloat32(HEADER_BYTES + 4 * i, true);
    for (let i = 0; i < 3 * T; i++) triangles[i] = view.getUint32(HEADER_BYTES + 12 * V + 4 * i, true);
  }
  for (let i = 0; i < positions.length; i++) {
    if (!Number.isFinite(positions[i])) {
      const vertex = Math.floor(i / 3);
      throw new GeometryError('NON_FINITE', `working mesh: vertex ${vertex} has a coordinate that is not finite (${positions[i]})`, { vertex });
    }
  }
  for (let i = 0; i < triangles.length; i++) {
    if (triangles[i] >= V) {
      const face = Math.floor(i / 3);
      throw new GeometryError('INDEX_OUT_OF_RANGE', `working mesh: triangle ${face} uses vertex ${triangles[i]} but there are only ${V} vertices`, { face });
    }
  }
  return { positions, triangles };
}

function hex(b: Uint8Array): string {
  return Array.from(b, (x) => x.toString(16).padStart(2, '0')).join(' ');
}
