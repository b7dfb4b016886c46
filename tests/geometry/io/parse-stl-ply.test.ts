import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { parseStl } from '../../../geometry/io/parse-stl';
import { parsePly } from '../../../geometry/io/parse-ply';
import { importModel, detectModelFormat } from '../../../geometry/io/import-model';
import { GeometryError } from '../../../geometry/errors';
import { icoSphere, torus, transformMesh } from '../../../geometry/shapes';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { writeAsciiStl, writeBinaryStl, writeObj, writePly } from './model-writers';
import { rigidMotion } from '../shapes/motion-arbitrary';

const enc = (s: string) => new TextEncoder().encode(s);

/** Corner-by-corner positions of a mesh (what STL stores). */
function corners(mesh: TriMesh): number[] {
  const out: number[] = [];
  const { positions, triangles } = mesh;
  for (let c = 0; c < triangles.length; c++) for (let a = 0; a < 3; a++) out.push(positions[3 * triangles[c] + a]);
  return out;
}

function codeOf(fn: () => unknown): { code: string; line?: number; face?: number } {
  try {
    fn();
  } catch (e) {
    if (e instanceof GeometryError) return { code: e.code, line: e.line, face: e.face };
    throw e;
  }
  throw new Error('expected a GeometryError');
}

describe('STL (3D Systems, StereoLithography Interface Specification, 1989)', () => {
  const mesh = torus(40, 12, 12, 8);
  it('binary round trip keeps every corner to float32 precision', () => {
    const back = parseStl(writeBinaryStl(mesh));
    expect(back.mesh.triangles.length).toBe(mesh.triangles.length);
    expect(corners(back.mesh)).toEqual(corners(mesh).map(Math.fround));
  });
  it('ASCII round trip keeps every corner exactly (shortest round-trip decimal)', () => {
    const back = parseStl(enc(writeAsciiStl(mesh)));
    expect(corners(back.mesh)).toEqual(corners(mesh));
  });
  it('round trips hold under any rigid motion (property)', () => {
    fc.assert(
      fc.property(rigidMotion, (motion) => {
        const m = transformMesh(mesh, motion);
        expect(corners(parseStl(enc(writeAsciiStl(m))).mesh)).toEqual(corners(m));
      }),
      { numRuns: 10 },
    );
  });
  it('errors: truncated binary, NaN corner (face index), facet with 2 vertices (line), bad word (line)', () => {
    const bin = writeBinaryStl(mesh);
    expect(codeOf(() => parseStl(bin.subarray(0, bin.length - 7)))).toMatchObject({ code: 'TRUNCATED' });
    const nan = bin.slice();
    new DataView(nan.buffer).setFloat32(84 + 50 * 5 + 12, Number.NaN, true);
    expect(codeOf(() => parseStl(nan))).toMatchObject({ code: 'NON_FINITE', face: 5 });
    const two = 'solid x\nfacet normal 0 0 1\nouter loop\nvertex 0 0 0\nvertex 1 0 0\nendloop\nendfacet\nendsolid x\n';
    expect(codeOf(() => parseStl(enc(two)))).toMatchObject({ code: 'FACE_TOO_SMALL', line: 2 });
    const word = 'solid x\nfacet normal 0 0 1\nouter loop\nvertx 0 0 0\n';
    expect(codeOf(() => parseStl(enc(word)))).toMatchObject({ code: 'BAD_HEADER', line: 4 });
    expect(codeOf(() => parseStl(enc('solid x\nendsolid x\n')))).toMatchObject({ code: 'NO_FACES' });
    expect(codeOf(() => parseStl(enc('solid x\nfacet normal 0 0 1\nouter loop\nvertex 0 inf 0\n')))).toMatchObject({ code: 'NON_FINITE', line: 4 });
    expect(codeOf(() => parseStl(writeBinaryStl(mesh), { maxTriangles: 10 }))).toMatchObject({ code: 'TOO_MANY_TRIANGLES' });
  });
});

describe('PLY (Turk 1994, "The PLY Polygon File Format")', () => {
  const mesh = icoSphere(30, 2);
  for (const format of ['ascii', 'binary_little_endian', 'binary_big_endian'] as const) {
    it(`${format}: round trip keeps indices and positions exactly; extra properties and elements are skipped`, () => {
      const back = parsePly(writePly(mesh, format));
      expect(Array.from(back.mesh.triangles)).toEqual(Array.from(mesh.triangles));
      expect(Array.from(back.mesh.positions)).toEqual(Array.from(mesh.positions));
    });
  }
  it('reads float x/y/z and a polygon list (a quad becomes two triangles)', () => {
    const text = 'ply\nformat ascii 1.0\nelement vertex 4\nproperty float x\nproperty float y\nproperty float z\nelement face 1\nproperty list uchar uint vertex_index\nend_header\n0 0 0\n2 0 0\n2 3 0\n0 3 0\n4 0 1 2 3\n';
    const m = parsePly(enc(text));
    expect(Array.from(m.mesh.triangles)).toEqual([0, 1, 2, 0, 2, 3]);
    expect(m.notes.join(' ')).toMatch(/1 polygons/);
  });
  it('errors with codes and lines', () => {
    const head = 'ply\nformat ascii 1.0\nelement vertex 3\nproperty float x\nproperty float y\nproperty float z\nelement face 1\nproperty list uchar int vertex_indices\nend_header\n';
    expect(codeOf(() => parsePly(enc(head + '0 0 0\n1 0 0\n0 1 0\n3 0 1 5\n')))).toMatchObject({ code: 'INDEX_OUT_OF_RANGE', line: 13 });
    expect(codeOf(() => parsePly(enc(head + '0 0 0\n1 nan 0\n0 1 0\n3 0 1 2\n')))).toMatchObject({ code: 'NON_FINITE', line: 11 });
    expect(codeOf(() => parsePly(enc(head + '0 0 0\n1 0 0\n0 1 0\n2 0 1\n')))).toMatchObject({ code: 'FACE_TOO_SMALL', line: 13 });
    expect(codeOf(() => parsePly(enc(head + '0 0 0\n1 0 0\n')))).toMatchObject({ code: 'TRUNCATED' });
    expect(codeOf(() => parsePly(enc(head.replace('format ascii', 'format text'))))).toMatchObject({ code: 'BAD_HEADER', line: 2 });
    expect(codeOf(() => parsePly(enc(head.replace('property float z\n', ''))))).toMatchObject({ code: 'BAD_HEADER', line: 3 });
    expect(codeOf(() => parsePly(enc(head.replace('vertex 3', 'vertex 2'))))).toMatchObject({ code: 'TOO_FEW_VERTICES' });
    expect(codeOf(() => parsePly(enc(head.replace('face 1', 'face 0'))))).toMatchObject({ code: 'NO_FACES' });
    const bin = writePly(mesh, 'binary_little_endian');
    expect(codeOf(() => parsePly(bin.subarray(0, bin.length - 20)))).toMatchObject({ code: 'TRUNCATED' });
    expect(codeOf(() => parsePly(enc('ply\nformat ascii 1.0\nelement vertex 99999999999\nproperty float x\nproperty float y\nproperty float z\nelement face 1\nproperty list uchar int vertex_indices\nend_header\n0 0 0\n')))).toMatchObject({ code: 'TRUNCATED' });
  });
});

describe('importModel', () => {
  const mesh = icoSphere(10, 1);
  it('dispatches by extension and by content (a mislabelled binary STL still reads)', () => {
    expect(detectModelFormat(writeBinaryStl(mesh), 'part.obj')).toBe('stl');
    expect(detectModelFormat(writePly(mesh, 'ascii'), 'part.stl')).toBe('ply');
    expect(detectModelFormat(enc(writeObj(mesh)), 'part.OBJ')).toBe('obj');
    expect(detectModelFormat(enc(writeObj(mesh)), 'noext')).toBe('obj');
    expect(detectModelFormat(enc(writeAsciiStl(mesh)), 'noext')).toBe('stl');
    expect(detectModelFormat(enc(writeAsciiStl(mesh)), 'mislabelled.obj')).toBe('stl');
    expect(detectModelFormat(enc('\u00ff\u00fe garbage'), 'noext')).toBeNull();
    expect(importModel(writeBinaryStl(mesh), 'part.obj').mesh.triangles.length).toBe(mesh.triangles.length);
  });
  it('scales model units to millimetres (1 in = 25.4 mm exactly, international inch 1959)', () => {
    const m = importModel(enc(writeObj(mesh)), 'a.obj', { unit: 'in' });
    expect(m.mesh.positions[0]).toBeCloseTo(mesh.positions[0] * 25.4, 12);
    expect(importModel(enc(writeObj(mesh)), 'a.obj', { unit: 'cm' }).mesh.positions[0]).toBeCloseTo(mesh.positions[0] * 10, 12);
  });
  it('errors: empty, over the size limit, unknown format, bad option', () => {
    expect(codeOf(() => importModel(new Uint8Array(0), 'a.obj'))).toMatchObject({ code: 'EMPTY_FILE' });
    expect(codeOf(() => importModel(enc(writeObj(mesh)), 'a.obj', { maxBytes: 100 }))).toMatchObject({ code: 'FILE_TOO_LARGE' });
    expect(codeOf(() => importModel(enc('\u00ff\u00fe garbage'), 'a.dat'))).toMatchObject({ code: 'UNKNOWN_FORMAT' });
    expect(codeOf(() => importModel(enc(writeObj(mesh)), 'a.obj', { unit: 'ft' as never }))).toMatchObject({ code: 'BAD_OPTION' });
  });
  it('random bytes under every extension only ever raise GeometryError', () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 3000 }), fc.constantFrom('a.obj', 'a.stl', 'a.ply', 'a.bin'), (b, name) => {
        try {
          importModel(b, name);
        } catch (e) {
          if (!(e instanceof GeometryError)) throw e;
        }
      }),
      { numRuns: 800 },
    );
    // Random bodies behind valid PLY and STL headers reach the body readers.
    const plyHead = enc('ply\nformat binary_little_endian 1.0\nelement vertex 4\nproperty float x\nproperty float y\nproperty float z\nelement face 2\nproperty list uchar int vertex_indices\nend_header\n');
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 200 }), fc.boolean(), (body, ply) => {
        const stl = new Uint8Array(84 + body.length);
        stl.set(body, 84);
        new DataView(stl.buffer).setUint32(80, Math.floor(body.length / 50), true);
        const bytes = ply ? new Uint8Array([...plyHead, ...body]) : stl;
        try {
          importModel(bytes, ply ? 'a.ply' : 'a.stl');
        } catch (e) {
          if (!(e instanceof GeometryError)) throw e;
        }
      }),
      { numRuns: 800 },
    );
  });
});
