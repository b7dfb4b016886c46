import { GeometryError } from '../errors';
import type { ImportedModel } from '../mesh/tri-mesh';
import { GrowableUint32 } from './growable-array';
import { checkNotBinary, DEFAULT_MAX_TRIANGLES, type ParseLimits } from './parse-limits';
import { latin1, TextScanner } from './text-scanner';
import { triangulatePolygon } from './triangulate-polygon';

type ScalarType = 'int8' | 'uint8' | 'int16' | 'uint16' | 'int32' | 'uint32' | 'float32' | 'float64';

/** PLY scalar type names, both the original and the sized spellings (Turk 1994, "The PLY Polygon File Format"). */
const TYPE_NAMES: Record<string, ScalarType> = {
  char: 'int8', int8: 'int8', uchar: 'uint8', uint8: 'uint8',
  short: 'int16', int16: 'int16', ushort: 'uint16', uint16: 'uint16',
  int: 'int32', int32: 'int32', uint: 'uint32', uint32: 'uint32',
  float: 'float32', float32: 'float32', double: 'float64', float64: 'float64',
};
const TYPE_SIZE: Record<ScalarType, number> = { int8: 1, uint8: 1, int16: 2, uint16: 2, int32: 4, uint32: 4, float32: 4, float64: 8 };

interface Property {
  name: string;
  type: ScalarType;
  /** For list properties, the type of the count that precedes the items. */
  countType: ScalarType | null;
}

interface Element {
  name: string;
  count: number;
  properties: Property[];
  line: number;
}

interface Header {
  format: 'ascii' | 'binary_little_endian' | 'binary_big_endian';
  elements: Element[];
  bodyStart: number;
  /** Line number of the first body line (for ASCII error messages). */
  bodyLine: number;
}

function headerError(line: number, message: string): never {
  throw new GeometryError('BAD_HEADER', `PLY line ${line}: ${message}`, { line });
}

function parseHeader(bytes: Uint8Array): Header {
  const magicOk = bytes[0] === 112 && bytes[1] === 108 && bytes[2] === 121 && (bytes[3] === 10 || bytes[3] === 13);
  if (!magicOk) headerError(1, 'a PLY file must start with the line "ply"');
  let p = 0;
  let line = 0;
  let format: Header['format'] | null = null;
  const elements: Element[] = [];
  const limit = Math.min(bytes.length, 1 << 20);
  for (;;) {
    if (p >= limit) headerError(line + 1, 'no "end_header" line within the first megabyte: the header is missing or cut short');
    let e = p;
    while (e < limit && bytes[e] !== 10) e++;
    line++;
    const text = latin1(bytes, p, e).replace(/\r$/, '').trim();
    p = e + 1;
    if (line === 1) continue;
    if (text === 'end_header') {
      if (!format) headerError(line, 'the header has no "format" line');
      return { format, elements, bodyStart: p, bodyLine: line + 1 };
    }
    const words = text.split(/\s+/);
    switch (words[0]) {
      case '':
      case 'comment':
      case 'obj_info':
        break;
      case 'format':
        if (words[1] !== 'ascii' && words[1] !== 'binary_little_endian' && words[1] !== 'binary_big_endian') {
          headerError(line, `unknown format "${words[1] ?? ''}" (expected ascii, binary_little_endian or binary_big_endian)`);
        }
        format = words[1];
        break;
      case 'element': {
        const count = Number(words[2]);
        if (words.length < 3 || !Number.isInteger(count) || count < 0) headerError(line, `element "${words[1] ?? ''}" needs a whole, non-negative count`);
        elements.push({ name: words[1], count, properties: [], line });
        break;
      }
      case 'property': {
        const el = elements[elements.length - 1];
        if (!el) headerError(line, 'a property before any element');
        if (words[1] === 'list') {
          const countType = TYPE_NAMES[words[2]];
          const type = TYPE_NAMES[words[3]];
          if (!countType || !type || !words[4]) headerError(line, `list property needs a count type, an item type and a name, got "${text}"`);
          if (countType === 'float32' || countType === 'float64') headerError(line, 'a list count must be an integer type');
          el.properties.push({ name: words[4], type, countType });
        } else {
          const type = TYPE_NAMES[words[1]];
          if (!type || !words[2]) headerError(line, `property needs a type and a name, got "${text}"`);
          el.properties.push({ name: words[2], type, countType: null });
        }
        break;
      }
      default:
        headerError(line, `unknown header keyword "${words[0].slice(0, 40)}"`);
    }
  }
}

/** Reads binary scalars with the file's byte order and checks the body does not run out. */
class BinaryReader {
  private readonly view: DataView;
  pos: number;
  private readonly little: boolean;
  private readonly length: number;

  constructor(bytes: Uint8Array, start: number, little: boolean) {
    this.view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    this.pos = start;
    this.little = little;
    this.length = bytes.byteLength;
  }

  read(type: ScalarType, where: string): number {
    const size = TYPE_SIZE[type];
    if (this.pos + size > this.length) {
      throw new GeometryError('TRUNCATED', `PLY body ends early, inside ${where}: the file is cut short`);
    }
    const v = this.view;
    const p = this.pos;
    this.pos = p + size;
    switch (type) {
      case 'int8': return v.getInt8(p);
      case 'uint8': return v.getUint8(p);
      case 'int16': return v.getInt16(p, this.little);
      case 'uint16': return v.getUint16(p, this.little);
      case 'int32': return v.getInt32(p, this.little);
      case 'uint32': return v.getUint32(p, this.little);
      case 'float32': return v.getFloat32(p, this.little);
      default: return v.getFloat64(p, this.little);
    }
  }
}

/**
 * Parses a PLY file (Turk 1994, "The PLY Polygon File Format"): ASCII, binary little-endian and binary
 * big-endian bodies; the `vertex` element's x, y, z (any scalar type) and the `face` element's
 * `vertex_indices` (or `vertex_index`) list, polygons triangulated as in OBJ. Other elements and properties
 * are read past and ignored. Throws GeometryError: BAD_HEADER (with line) for a malformed header, BAD_NUMBER /
 * NON_FINITE (with line for ASCII, vertex index for binary), INDEX_OUT_OF_RANGE, FACE_TOO_SMALL, TRUNCATED,
 * TOO_FEW_VERTICES, NO_FACES, TOO_MANY_TRIANGLES.
 */
export function parsePly(bytes: Uint8Array, limits: ParseLimits = {}): ImportedModel {
  const maxTriangles = limits.maxTriangles ?? DEFAULT_MAX_TRIANGLES;
  if (bytes.length === 0) throw new GeometryError('EMPTY_FILE', 'PLY file is empty');
  const header = parseHeader(bytes);
  const vertexEl = header.elements.find((e) => e.name === 'vertex');
  const faceEl = header.elements.find((e) => e.name === 'face');
  if (!vertexEl) throw new GeometryError('BAD_HEADER', 'PLY header declares no "vertex" element');
  const axis = ['x', 'y', 'z'].map((n) => vertexEl.properties.findIndex((p) => p.name === n && p.countType === null));
  if (axis.some((i) => i < 0)) headerError(vertexEl.line, 'the vertex element needs scalar properties x, y and z');
  if (vertexEl.count < 3) throw new GeometryError('TOO_FEW_VERTICES', `PLY file has ${vertexEl.count} vertices; a surface needs at least 3`);
  if (!faceEl || faceEl.count === 0) throw new GeometryError('NO_FACES', 'PLY file has no faces (no "face" element or a count of 0)');
  const listIdx = faceEl.properties.findIndex((p) => p.countType !== null && (p.name === 'vertex_indices' || p.name === 'vertex_index'));
  if (listIdx < 0) headerError(faceEl.line, 'the face element needs a list property "vertex_indices"');
  if (faceEl.count > maxTriangles) {
    throw new GeometryError('TOO_MANY_TRIANGLES', `PLY file has ${faceEl.count} faces, more than the limit of ${maxTriangles} triangles; reduce the model first`);
  }

  // Each element needs a minimum number of body bytes; checking this first stops a corrupt count from
  // allocating gigabytes before the read fails.
  const bodyBytes = bytes.length - header.bodyStart;
  let needed = 0;
  for (const el of header.elements) {
    const per = el.properties.reduce((sum, p) => sum + (header.format === 'ascii' ? 2 : TYPE_SIZE[p.countType ?? p.type]), 0);
    needed += per * el.count;
  }
  if (needed > bodyBytes) {
    throw new GeometryError('TRUNCATED', `PLY header declares ${header.elements.map((e) => `${e.count} ${e.name}`).join(', ')} but the body is only ${bodyBytes} bytes: the file is cut short`);
  }
  const positions = new Float64Array(3 * vertexEl.count);
  const triangles = new GrowableUint32(3 * faceEl.count);
  let polygons = 0;
  let degenerate = 0;
  let corners = new Int32Array(16);
  const V = vertexEl.count;

  const emitFace = (n: number, faceIndex: number, line: number | undefined) => {
    const where = line !== undefined ? `PLY line ${line}` : `PLY face ${faceIndex}`;
    if (n < 3) throw new GeometryError('FACE_TOO_SMALL', `${where}: a face needs at least 3 corners, this one has ${n}`, { line, face: faceIndex });
    for (let i = 0; i < n; i++) {
      if (!Number.isInteger(corners[i]) || corners[i] < 0 || corners[i] >= V) {
        throw new GeometryError('INDEX_OUT_OF_RANGE', `${where}: vertex index ${corners[i]} is out of range (0…${V - 1})`, { line, face: faceIndex });
      }
    }
    if (n === 3) triangles.push3(corners[0], corners[1], corners[2]);
    else {
      polygons++;
      if (!triangulatePolygon(positions, corners, n, (a, b, c) => triangles.push3(a, b, c))) degenerate++;
    }
    if (triangles.length / 3 > maxTriangles) {
      throw new GeometryError('TOO_MANY_TRIANGLES', `${where}: more than ${maxTriangles} triangles; reduce the model first`, { line, face: faceIndex });
    }
  };
  const ensureCorners = (n: number) => {
    if (n > corners.length) corners = new Int32Array(Math.max(n, 2 * corners.length));
  };

  // Faces are triangulated against positions, so all vertices are read first; PLY lists vertex before face
  // in practice, and the body is walked in the header's element order regardless.
  const pendingFaces: { n: number; list: Int32Array; line?: number }[] = [];
  const vertexBeforeFace = header.elements.indexOf(vertexEl) < header.elements.indexOf(faceEl);

  if (header.format === 'ascii') {
    checkNotBinary(bytes.subarray(header.bodyStart), 'PLY body');
    const s = new TextScanner(bytes, 'PLY', false, header.bodyStart);
    s.line = header.bodyLine;
    const nextToken = () => {
      for (;;) {
        s.skipInlineSpace();
        if (s.pos < s.end && s.bytes[s.pos] === 10) {
          s.pos++;
          s.line++;
          continue;
        }
        if (s.pos >= s.end) throw new GeometryError('TRUNCATED', `PLY line ${s.line}: the body ends before all ${header.elements.map((e) => `${e.count} ${e.name}`).join(', ')} were read`, { line: s.line });
        return;
      }
    };
    for (const el of header.elements) {
      for (let i = 0; i < el.count; i++) {
        let faceLine = 0;
        for (let k = 0; k < el.properties.length; k++) {
          const prop = el.properties[k];
          nextToken();
          if (prop.countType === null) {
            const x = s.number(`${el.name} ${prop.name}`);
            if (el === vertexEl) {
              const a = axis.indexOf(k);
              if (a >= 0) positions[3 * i + a] = x;
            }
            continue;
          }
          const line = s.line;
          const n = s.integer(`${el.name} ${prop.name} count`);
          if (n < 0 || 2 * n > s.end - s.pos) {
            throw new GeometryError(n < 0 ? 'BAD_NUMBER' : 'TRUNCATED', `PLY line ${line}: list length ${n} is ${n < 0 ? 'negative' : 'longer than the rest of the file'}`, { line });
          }
          if (el === faceEl && k === listIdx) ensureCorners(n);
          for (let j = 0; j < n; j++) {
            nextToken();
            const x = s.number(`${el.name} ${prop.name} item`);
            if (el === faceEl && k === listIdx) corners[j] = x;
          }
          if (el === faceEl && k === listIdx) {
            faceLine = line;
            if (vertexBeforeFace) emitFace(n, i, line);
            else pendingFaces.push({ n, list: corners.slice(0, n), line });
          }
        }
        if (el === faceEl && faceLine === 0) throw new GeometryError('BAD_HEADER', 'PLY face element has no vertex list');
      }
    }
  } else {
    const r = new BinaryReader(bytes, header.bodyStart, header.format === 'binary_little_endian');
    for (const el of header.elements) {
      for (let i = 0; i < el.count; i++) {
        for (let k = 0; k < el.properties.length; k++) {
          const prop = el.properties[k];
          const where = `${el.name} ${i} (${prop.name})`;
          if (prop.countType === null) {
            const x = r.read(prop.type, where);
            if (el === vertexEl) {
              const a = axis.indexOf(k);
              if (a >= 0) {
                if (!Number.isFinite(x)) {
                  throw new GeometryError('NON_FINITE', `PLY vertex ${i}: coordinate ${prop.name} is not a finite number`, { vertex: i });
                }
                positions[3 * i + a] = x;
              }
            }
            continue;
          }
          const n = r.read(prop.countType, where);
          if (n * TYPE_SIZE[prop.type] > bytes.length - r.pos) {
            throw new GeometryError('TRUNCATED', `PLY ${el.name} ${i}: list of ${n} items runs past the end of the file`, { face: el === faceEl ? i : undefined });
          }
          if (el === faceEl && k === listIdx) ensureCorners(n);
          for (let j = 0; j < n; j++) {
            const x = r.read(prop.type, where);
            if (el === faceEl && k === listIdx) corners[j] = x;
          }
          if (el === faceEl && k === listIdx) {
            if (vertexBeforeFace) emitFace(n, i, undefined);
            else pendingFaces.push({ n, list: corners.slice(0, n) });
          }
        }
      }
    }
  }
  for (let i = 0; i < pendingFaces.length; i++) {
    const pf = pendingFaces[i];
    ensureCorners(pf.n);
    corners.set(pf.list);
    emitFace(pf.n, i, pf.line);
  }
  const notes: string[] = [];
  if (polygons > 0) notes.push(`${polygons} polygons with more than 3 corners were triangulated`);
  if (degenerate > 0) notes.push(`${degenerate} polygons were degenerate or self-crossing and were split as a fan`);
  const tris = triangles.toArray();
  return { mesh: { positions, triangles: tris }, faceTags: new Uint32Array(tris.length / 3), tagNames: [''], seamPolylines: [], cornerUVs: null, notes };
}
