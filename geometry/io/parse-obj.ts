import { GeometryError } from '../errors';
import type { ImportedModel } from '../mesh/tri-mesh';
import { GrowableFloat64, GrowableInt32, GrowableUint32 } from './growable-array';
import { checkNotBinary, DEFAULT_MAX_TRIANGLES, isBinaryByte, type ParseLimits } from './parse-limits';
import { TextScanner } from './text-scanner';
import { triangulatePolygon } from './triangulate-polygon';

const LF = 10;
const HASH = 35;
const SPACE = 32;
const TAB = 9;
const CR = 13;
const SLASH = 47;

const isBlank = (c: number) => c === SPACE || c === TAB || c === CR;

/**
 * Parses Wavefront OBJ text (as bytes) into an ImportedModel: `v` positions (extra w or colour values are
 * ignored), `vt` texture coordinates (kept per corner when faces use them), `vn` normals (checked, then
 * dropped: the engine recomputes normals), `f` faces in all four index forms (v, v/vt, v//vn, v/vt/vn) with
 * 1-based or negative (relative) indices and any number of corners (triangulated, see triangulatePolygon),
 * `o`/`g` names as face tags, `l` polylines as seam polylines, `#` comments, CRLF line ends, trailing spaces
 * and `\` line continuations. Other statements (materials, smoothing groups, free-form surfaces) are skipped.
 * Follows the Wavefront OBJ file format description (Appendix B1 of the Advanced Visualizer manual).
 *
 * Reads the bytes in place (no per-line strings, no regular expressions) into growing typed arrays.
 * Throws GeometryError with the 1-based line for: binary content, a malformed or non-finite number, an index
 * of 0 or out of range, a face with fewer than 3 corners, more triangles than `limits.maxTriangles`;
 * EMPTY_FILE, TOO_FEW_VERTICES or NO_FACES for a file without a usable mesh.
 */
export function parseObj(bytes: Uint8Array, limits: ParseLimits = {}): ImportedModel {
  const maxTriangles = limits.maxTriangles ?? DEFAULT_MAX_TRIANGLES;
  checkNotBinary(bytes, 'OBJ');
  const s = new TextScanner(bytes, 'OBJ', true);
  const b = bytes;
  const positions = new GrowableFloat64(Math.max(1024, bytes.length / 10));
  const uvs = new GrowableFloat64(16);
  let normalCount = 0;
  const triangles = new GrowableUint32(Math.max(1024, bytes.length / 8));
  const cornerUv = new GrowableInt32(16);
  let anyUv = false;
  // Face tags are kept as runs (first triangle, tag) and expanded at the end: tags change rarely.
  const tagRunStart: number[] = [];
  const tagRunTag: number[] = [];
  const tagNames: string[] = [''];
  const tagIndex = new Map<string, number>([['', 0]]);
  let currentTag = 0;
  const seamPolylines: Uint32Array[] = [];
  let polygonsTriangulated = 0;
  let degeneratePolygons = 0;
  let statements = 0;
  let polyV = new Int32Array(64);
  let polyT = new Int32Array(64);

  const pushTriangle = (a: number, c2: number, c3: number, ta: number, tb: number, tc: number) => {
    if (triangles.length / 3 >= maxTriangles) {
      throw new GeometryError('TOO_MANY_TRIANGLES', `OBJ line ${s.line}: more than ${maxTriangles} triangles; reduce the model first`, { line: s.line });
    }
    triangles.push3(a, c2, c3);
    if (anyUv) {
      cornerUv.push(ta);
      cornerUv.push(tb);
      cornerUv.push(tc);
    }
  };

  const plural: Record<string, string> = { vertex: 'vertices', 'texture coordinate': 'texture coordinates', normal: 'normals' };
  const resolve = (raw: number, count: number, kind: string): number => {
    const idx = raw > 0 ? raw - 1 : count + raw;
    if (raw === 0 || idx < 0 || idx >= count) {
      const why = raw === 0 ? 'OBJ indices start at 1' : `only ${count} ${count === 1 ? kind : plural[kind] ?? kind} defined so far`;
      throw new GeometryError('INDEX_OUT_OF_RANGE', `OBJ line ${s.line}: ${kind} index ${raw} is out of range (${why})`, { line: s.line });
    }
    return idx;
  };

  while (s.pos < s.end) {
    const c = b[s.pos];
    if (isBlank(c)) {
      s.skipInlineSpace();
      continue;
    }
    if (c === LF) {
      s.pos++;
      s.line++;
      continue;
    }
    if (c === HASH) {
      s.skipLine();
      continue;
    }
    const next = b[s.pos + 1];
    const after = b[s.pos + 2];
    const sep1 = next === SPACE || next === TAB;
    if (c === 118 && sep1) {
      // v x y z
      s.pos++;
      s.skipInlineSpace();
      const x = s.number('vertex x');
      s.skipInlineSpace();
      if (s.atStatementEnd()) throw new GeometryError('BAD_NUMBER', `OBJ line ${s.line}: a vertex needs x, y and z`, { line: s.line });
      const y = s.number('vertex y');
      s.skipInlineSpace();
      if (s.atStatementEnd()) throw new GeometryError('BAD_NUMBER', `OBJ line ${s.line}: a vertex needs x, y and z`, { line: s.line });
      const z = s.number('vertex z');
      positions.push3(x, y, z);
      statements++;
      s.skipInlineSpace();
      if (!s.atStatementEnd()) {
        // Optional w or per-vertex colour: validate as numbers, then drop.
        while (!s.atStatementEnd()) {
          s.number('vertex value');
          s.skipInlineSpace();
        }
      }
      if (s.pos < s.end && b[s.pos] === HASH) s.skipLine();
      continue;
    }
    if (c === 102 && sep1) {
      // f a b c …
      s.pos++;
      s.skipInlineSpace();
      const vCount = positions.length / 3;
      const tCount = uvs.length / 2;
      let n = 0;
      let usesUv = false;
      while (!s.atStatementEnd()) {
        if (n === polyV.length) {
          const bigger = new Int32Array(2 * n);
          bigger.set(polyV);
          polyV = bigger;
          const biggerT = new Int32Array(2 * n);
          biggerT.set(polyT);
          polyT = biggerT;
        }
        const raw = s.integer('face index');
        polyV[n] = raw > 0 && raw <= vCount ? raw - 1 : resolve(raw, vCount, 'vertex');
        polyT[n] = -1;
        if (b[s.pos] === SLASH) {
          s.pos++;
          if (b[s.pos] !== SLASH) {
            polyT[n] = resolve(s.integer('texture index'), tCount, 'texture coordinate');
            usesUv = true;
          }
          if (b[s.pos] === SLASH) {
            s.pos++;
            resolve(s.integer('normal index'), normalCount, 'normal');
          }
        }
        n++;
        s.skipInlineSpace();
      }
      if (n < 3) {
        throw new GeometryError('FACE_TOO_SMALL', `OBJ line ${s.line}: a face needs at least 3 corners, this one has ${n}`, { line: s.line });
      }
      if (usesUv && !anyUv) {
        anyUv = true;
        for (let i = 0; i < triangles.length; i++) cornerUv.push(-1);
      }
      if (n === 3 && !anyUv && triangles.length < 3 * maxTriangles) {
        triangles.push3(polyV[0], polyV[1], polyV[2]);
      } else if (n === 3) {
        pushTriangle(polyV[0], polyV[1], polyV[2], polyT[0], polyT[1], polyT[2]);
      } else {
        polygonsTriangulated++;
        // Triangulate on positions; map each output corner back to its polygon slot for the UV.
        const posArr = positions.data;
        const slot = new Map<number, number>();
        for (let i = 0; i < n; i++) {
          if (!slot.has(polyV[i])) slot.set(polyV[i], i);
        }
        const ok = triangulatePolygon(posArr, polyV, n, (p, q, r) => {
          pushTriangle(p, q, r, polyT[slot.get(p)!], polyT[slot.get(q)!], polyT[slot.get(r)!]);
        });
        if (!ok) degeneratePolygons++;
      }
      statements++;
      if (s.pos < s.end && b[s.pos] === HASH) s.skipLine();
      continue;
    }
    if (c === 118 && next === 116 && (after === SPACE || after === TAB)) {
      s.pos += 2;
      s.skipInlineSpace();
      const u = s.number('texture u');
      s.skipInlineSpace();
      const v = s.atStatementEnd() ? 0 : s.number('texture v');
      uvs.push(u);
      uvs.push(v);
      s.skipStatement();
      continue;
    }
    if (c === 118 && next === 110 && (after === SPACE || after === TAB)) {
      s.pos += 2;
      for (let k = 0; k < 3; k++) {
        s.skipInlineSpace();
        if (s.atStatementEnd()) throw new GeometryError('BAD_NUMBER', `OBJ line ${s.line}: a normal needs x, y and z`, { line: s.line });
        s.number('normal component');
      }
      normalCount++;
      s.skipStatement();
      continue;
    }
    if ((c === 111 || c === 103) && (sep1 || next === LF || next === CR || s.pos + 1 >= s.end)) {
      s.pos++;
      s.skipInlineSpace();
      const name = s.restOfStatement();
      let idx = tagIndex.get(name);
      if (idx === undefined) {
        idx = tagNames.length;
        tagNames.push(name);
        tagIndex.set(name, idx);
      }
      if (idx !== currentTag) {
        tagRunStart.push(triangles.length / 3);
        tagRunTag.push(idx);
      }
      currentTag = idx;
      s.skipLine();
      continue;
    }
    if (c === 108 && sep1) {
      s.pos++;
      s.skipInlineSpace();
      const vCount = positions.length / 3;
      const line: number[] = [];
      while (!s.atStatementEnd()) {
        line.push(resolve(s.integer('polyline index'), vCount, 'vertex'));
        if (b[s.pos] === SLASH) {
          s.pos++;
          resolve(s.integer('texture index'), uvs.length / 2, 'texture coordinate');
        }
        s.skipInlineSpace();
      }
      if (line.length < 2) {
        throw new GeometryError('BAD_SEAM', `OBJ line ${s.line}: an l polyline needs at least 2 vertices, this one has ${line.length}`, { line: s.line });
      }
      seamPolylines.push(Uint32Array.from(line));
      if (s.pos < s.end && b[s.pos] === HASH) s.skipLine();
      continue;
    }
    if (isBinaryByte(c)) {
      throw new GeometryError('BINARY_GARBAGE', `OBJ line ${s.line}: the file contains binary data (byte ${c} at offset ${s.pos}); is it the right file?`, { line: s.line });
    }
    // Anything else (mtllib, usemtl, s, vp, curv, …) carries nothing the pattern needs.
    s.skipStatement();
  }

  const vertexCount = positions.length / 3;
  if (statements === 0 && vertexCount === 0) {
    throw new GeometryError('EMPTY_FILE', 'OBJ file has no vertices or faces (only blank lines, comments or unknown statements)');
  }
  if (vertexCount < 3) {
    throw new GeometryError('TOO_FEW_VERTICES', `OBJ file has ${vertexCount} vertices; a surface needs at least 3`);
  }
  if (triangles.length === 0) {
    throw new GeometryError('NO_FACES', `OBJ file has ${vertexCount} vertices but no f (face) lines`);
  }
  const notes: string[] = [];
  if (polygonsTriangulated > 0) notes.push(`${polygonsTriangulated} polygons with more than 3 corners were triangulated`);
  if (degeneratePolygons > 0) notes.push(`${degeneratePolygons} polygons were degenerate or self-crossing and were split as a fan`);
  const F = triangles.length / 3;
  let cornerUVs: Float64Array | null = null;
  if (anyUv) {
    cornerUVs = new Float64Array(6 * F);
    const idx = cornerUv.data;
    const uvData = uvs.data;
    let missing = 0;
    for (let k = 0; k < 3 * F; k++) {
      const t = idx[k];
      if (t < 0) {
        missing++;
        continue;
      }
      cornerUVs[2 * k] = uvData[2 * t];
      cornerUVs[2 * k + 1] = uvData[2 * t + 1];
    }
    if (missing > 0) notes.push(`${missing} face corners had no texture coordinate; they were set to (0, 0)`);
  }
  const faceTags = new Uint32Array(F);
  for (let r = 0; r < tagRunStart.length; r++) {
    faceTags.fill(tagRunTag[r], tagRunStart[r], r + 1 < tagRunStart.length ? tagRunStart[r + 1] : F);
  }
  return {
    mesh: { positions: positions.toArray(), triangles: triangles.toArray() },
    faceTags,
    tagNames,
    seamPolylines,
    cornerUVs,
    notes,
  };
}
