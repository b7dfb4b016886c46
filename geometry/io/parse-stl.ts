import { GeometryError } from '../errors';
import type { ImportedModel } from '../mesh/tri-mesh';
import { GrowableFloat64 } from './growable-array';
import { checkNotBinary, DEFAULT_MAX_TRIANGLES, type ParseLimits } from './parse-limits';
import { TextScanner } from './text-scanner';

/**
 * True when `bytes` is a binary STL by size: 80-byte header, uint32 count n (little-endian), n × 50-byte
 * records, exactly filling the file (the STL definition in 3D Systems' "StereoLithography Interface
 * Specification", 1989). ASCII STL files starting with "solid" never satisfy this by accident in practice.
 */
export function looksLikeBinaryStl(bytes: Uint8Array): boolean {
  if (bytes.length < 84) return false;
  const n = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength).getUint32(80, true);
  return 84 + 50 * n === bytes.length;
}

function startsWithSolid(bytes: Uint8Array): boolean {
  let p = 0;
  while (p < bytes.length && (bytes[p] === 32 || bytes[p] === 9 || bytes[p] === 13 || bytes[p] === 10)) p++;
  const word = 'solid';
  for (let i = 0; i < 5; i++) if ((bytes[p + i] | 0x20) !== word.charCodeAt(i)) return false;
  return true;
}

function modelFrom(positions: Float64Array, notes: string[]): ImportedModel {
  const V = positions.length / 3;
  const triangles = new Uint32Array(V);
  for (let i = 0; i < V; i++) triangles[i] = i;
  notes.push('STL stores every triangle with its own corners; coincident corners are welded when the sculpt is cleaned');
  return { mesh: { positions, triangles }, faceTags: new Uint32Array(V / 3), tagNames: [''], seamPolylines: [], cornerUVs: null, notes };
}

/**
 * Parses a binary STL (80-byte header, uint32 triangle count, then per triangle a normal and three corners as
 * float32 little-endian plus a 2-byte attribute). The stored normals are ignored (the corner order decides
 * the side). Throws GeometryError: TRUNCATED when the file is shorter than its count says, NON_FINITE (with
 * the face index) for NaN/Inf corners, NO_FACES for a count of 0, TOO_MANY_TRIANGLES over the limit.
 */
export function parseBinaryStl(bytes: Uint8Array, limits: ParseLimits = {}): ImportedModel {
  const maxTriangles = limits.maxTriangles ?? DEFAULT_MAX_TRIANGLES;
  if (bytes.length < 84) {
    throw new GeometryError('TRUNCATED', `binary STL is ${bytes.length} bytes; even an empty one has an 84-byte header`);
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  const n = view.getUint32(80, true);
  if (n === 0) throw new GeometryError('NO_FACES', 'binary STL says it holds 0 triangles');
  // Size before count: random bytes read as a header give a huge count, and "cut short or not an STL"
  // is the true problem there, not the triangle limit.
  if (84 + 50 * n > bytes.length) {
    const room = Math.floor((bytes.length - 84) / 50);
    throw new GeometryError('TRUNCATED', `binary STL header says ${n} triangles but the file only has room for ${room}: it is cut short or is not an STL file`, { face: room });
  }
  if (n > maxTriangles) {
    throw new GeometryError('TOO_MANY_TRIANGLES', `binary STL holds ${n} triangles, more than the limit of ${maxTriangles}; reduce the model first`);
  }
  const positions = new Float64Array(9 * n);
  for (let f = 0; f < n; f++) {
    const base = 84 + 50 * f + 12;
    for (let k = 0; k < 9; k++) {
      const x = view.getFloat32(base + 4 * k, true);
      if (!Number.isFinite(x)) {
        throw new GeometryError('NON_FINITE', `binary STL triangle ${f + 1} (0-based ${f}) has a corner coordinate that is not a finite number`, { face: f });
      }
      positions[9 * f + k] = x;
    }
  }
  const notes: string[] = [];
  if (84 + 50 * n < bytes.length) notes.push(`${bytes.length - 84 - 50 * n} bytes after the last STL triangle were ignored`);
  return modelFrom(positions, notes);
}

/**
 * Parses an ASCII STL: `solid name`, then `facet normal nx ny nz / outer loop / vertex x y z` ×3 `/ endloop /
 * endfacet`, …, `endsolid` (3D Systems, StereoLithography Interface Specification, 1989). Keywords are
 * matched case-insensitively; several solids in one file are read one after another. Throws GeometryError
 * with the line for a malformed number, NaN/Inf, a facet without exactly 3 vertices (FACE_TOO_SMALL or
 * UNSUPPORTED), an unexpected word (BAD_HEADER), and NO_FACES when there is no facet.
 */
export function parseAsciiStl(bytes: Uint8Array, limits: ParseLimits = {}): ImportedModel {
  const maxTriangles = limits.maxTriangles ?? DEFAULT_MAX_TRIANGLES;
  checkNotBinary(bytes, 'STL');
  const s = new TextScanner(bytes, 'STL', false);
  const positions = new GrowableFloat64(Math.max(1024, bytes.length / 20));
  let inFacet = false;
  let corners = 0;
  let facetLine = 0;
  let triangles = 0;
  const skipSpace = () => {
    for (;;) {
      s.skipInlineSpace();
      if (s.pos < s.end && s.bytes[s.pos] === 10) {
        s.pos++;
        s.line++;
      } else return;
    }
  };
  for (;;) {
    skipSpace();
    if (s.pos >= s.end) break;
    const line = s.line;
    const word = s.word().toLowerCase();
    switch (word) {
      case 'solid':
      case 'endsolid':
        s.skipLine();
        break;
      case 'facet':
        if (inFacet) throw new GeometryError('BAD_HEADER', `STL line ${line}: "facet" before the previous facet's "endfacet"`, { line });
        inFacet = true;
        corners = 0;
        facetLine = line;
        s.skipLine();
        break;
      case 'outer':
      case 'endloop':
        s.skipLine();
        break;
      case 'vertex': {
        if (!inFacet) throw new GeometryError('BAD_HEADER', `STL line ${line}: "vertex" outside a facet`, { line });
        const xyz = [0, 0, 0];
        for (let k = 0; k < 3; k++) {
          s.skipInlineSpace();
          if (s.atStatementEnd()) throw new GeometryError('BAD_NUMBER', `STL line ${line}: a vertex needs x, y and z`, { line });
          xyz[k] = s.number('vertex coordinate');
        }
        if (corners < 3) positions.push3(xyz[0], xyz[1], xyz[2]);
        corners++;
        s.skipLine();
        break;
      }
      case 'endfacet':
        if (!inFacet) throw new GeometryError('BAD_HEADER', `STL line ${line}: "endfacet" without a facet`, { line });
        if (corners < 3) {
          throw new GeometryError('FACE_TOO_SMALL', `STL line ${facetLine}: facet has ${corners} vertices, it needs 3`, { line: facetLine });
        }
        if (corners > 3) {
          throw new GeometryError('UNSUPPORTED', `STL line ${facetLine}: facet has ${corners} vertices; STL facets are triangles`, { line: facetLine });
        }
        inFacet = false;
        if (++triangles > maxTriangles) {
          throw new GeometryError('TOO_MANY_TRIANGLES', `STL line ${line}: more than ${maxTriangles} triangles; reduce the model first`, { line });
        }
        s.skipLine();
        break;
      default:
        throw new GeometryError('BAD_HEADER', `STL line ${line}: unexpected word "${word.slice(0, 40)}" in an ASCII STL`, { line });
    }
  }
  if (inFacet) throw new GeometryError('TRUNCATED', `STL line ${facetLine}: facet is never closed with "endfacet"; the file is cut short`, { line: facetLine });
  if (triangles === 0) throw new GeometryError('NO_FACES', 'ASCII STL file has no facets');
  return modelFrom(positions.toArray(), []);
}

/**
 * Parses an STL file, binary or ASCII: binary when the size matches the binary layout exactly, ASCII when it
 * starts with "solid", otherwise binary (which then reports why it does not fit). See parseBinaryStl and
 * parseAsciiStl for the errors.
 */
export function parseStl(bytes: Uint8Array, limits: ParseLimits = {}): ImportedModel {
  if (bytes.length === 0) throw new GeometryError('EMPTY_FILE', 'STL file is empty');
  if (looksLikeBinaryStl(bytes)) return parseBinaryStl(bytes, limits);
  if (startsWithSolid(bytes)) return parseAsciiStl(bytes, limits);
  return parseBinaryStl(bytes, limits);
}
