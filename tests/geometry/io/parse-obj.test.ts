import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import fc from 'fast-check';
import { createRequire } from 'node:module';
import { OBJLoader } from 'three/examples/jsm/loaders/OBJLoader.js';
import type { BufferGeometry, Mesh } from 'three';
import { parseObj } from '../../../geometry/io/parse-obj';
import { importModel } from '../../../geometry/io/import-model';
import { GeometryError } from '../../../geometry/errors';
import { surfaceArea } from '../../../geometry/mesh/mesh-measures';
import { cylinder, icoSphere, transformMesh } from '../../../geometry/shapes';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { writeObj } from './model-writers';
import { rigidMotion, scaleFactor } from '../shapes/motion-arbitrary';

// The bunny package ships no type declarations; load it untyped and describe its shape here.
const bunny = createRequire(import.meta.url)('bunny') as { positions: number[][]; cells: number[][] };
const enc = (s: string) => new TextEncoder().encode(s);
const fixture = (name: string) => new Uint8Array(readFileSync(join(__dirname, '../../fixtures/meshes', name)));

/** Per-corner positions three's OBJLoader produces (its output is not indexed). */
function threeCorners(text: string): Float32Array {
  const group = new OBJLoader().parse(text);
  const arrays = group.children.map((c) => ((c as Mesh).geometry as BufferGeometry).getAttribute('position').array as Float32Array);
  const all = new Float32Array(arrays.reduce((n, a) => n + a.length, 0));
  let o = 0;
  for (const a of arrays) {
    all.set(a, o);
    o += a.length;
  }
  return all;
}

function ourCorners(mesh: TriMesh): Float32Array {
  const out = new Float32Array(3 * mesh.triangles.length);
  for (let c = 0; c < mesh.triangles.length; c++) for (let a = 0; a < 3; a++) out[3 * c + a] = mesh.positions[3 * mesh.triangles[c] + a];
  return out;
}

function bunnyObj(): string {
  const b = bunny;
  const lines = ['# Stanford bunny (public domain) via the npm package "bunny"'];
  for (const p of b.positions) lines.push(`v ${p[0]} ${p[1]} ${p[2]}`);
  for (const c of b.cells) lines.push(`f ${c[0] + 1} ${c[1] + 1} ${c[2] + 1}`);
  return lines.join('\n') + '\n';
}

describe('parity with three OBJLoader (reference library)', () => {
  it('bunny: same triangle count and the same corner positions, corner by corner', () => {
    const text = bunnyObj();
    const ours = parseObj(enc(text));
    const ref = threeCorners(text);
    expect(ours.mesh.triangles.length).toBe(ref.length / 3);
    expect(ours.mesh.triangles.length / 3).toBe(3674);
    // OBJLoader keeps float32; our float64 values rounded to float32 must be the very same numbers.
    expect(Array.from(ourCorners(ours.mesh))).toEqual(Array.from(ref));
    // After merging its corners, OBJLoader has as many distinct positions as the file has vertices.
    const distinct = new Set<string>();
    for (let i = 0; i < ref.length; i += 3) distinct.add(`${ref[i]},${ref[i + 1]},${ref[i + 2]}`);
    expect(distinct.size).toBe(ours.mesh.positions.length / 3);
  });
  it('quads and ngons: same triangle count, vertex set and area as OBJLoader (convex planar polygons)', () => {
    // A cylinder's quads and two 8-gon caps, written as polygons.
    const tube = cylinder(15, 30, 8, 2);
    const lines: string[] = [];
    for (let i = 0; i < tube.positions.length; i += 3) lines.push(`v ${tube.positions[i]} ${tube.positions[i + 1]} ${tube.positions[i + 2]}`);
    for (let k = 0; k < 2; k++)
      for (let s = 0; s < 8; s++) {
        const a = k * 8 + s + 1;
        const b = k * 8 + ((s + 1) % 8) + 1;
        lines.push(`f ${a} ${b} ${b + 8} ${a + 8}`);
      }
    lines.push(`f ${[8, 7, 6, 5, 4, 3, 2, 1].join(' ')}`);
    lines.push(`f ${[17, 18, 19, 20, 21, 22, 23, 24].join(' ')}`);
    const text = lines.join('\n');
    const ours = parseObj(enc(text));
    const ref = threeCorners(text);
    expect(ours.mesh.triangles.length).toBe(ref.length / 3);
    const key = (a: ArrayLike<number>, i: number) => `${Math.fround(a[i])},${Math.fround(a[i + 1])},${Math.fround(a[i + 2])}`;
    const refSet = new Set<string>();
    for (let i = 0; i < ref.length; i += 3) refSet.add(key(ref, i));
    const ourSet = new Set<string>();
    for (let i = 0; i < ours.mesh.positions.length; i += 3) ourSet.add(key(ours.mesh.positions, i));
    expect(ourSet).toEqual(refSet);
    let refArea = 0;
    for (let i = 0; i < ref.length; i += 9) {
      const u = [ref[i + 3] - ref[i], ref[i + 4] - ref[i + 1], ref[i + 5] - ref[i + 2]];
      const v = [ref[i + 6] - ref[i], ref[i + 7] - ref[i + 1], ref[i + 8] - ref[i + 2]];
      refArea += 0.5 * Math.hypot(u[1] * v[2] - u[2] * v[1], u[2] * v[0] - u[0] * v[2], u[0] * v[1] - u[1] * v[0]);
    }
    expect(surfaceArea(ours.mesh)).toBeCloseTo(refArea, 3);
    expect(ours.notes.join(' ')).toMatch(/18 polygons/);
  });
});

describe('numbers', () => {
  it('reads every double exactly as JavaScript parseFloat does (ECMA-262 StringToNumber), in all spellings', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 0, max: 3 }), (x, style) => {
        const spelled = [String(x), x.toExponential(), x.toFixed(6), x.toPrecision(9)][style];
        if (!Number.isFinite(Number(spelled))) return;
        const m = parseObj(enc(`v ${spelled} 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 3\n`));
        expect(Object.is(m.mesh.positions[0], parseFloat(spelled)) || (m.mesh.positions[0] === 0 && parseFloat(spelled) === 0)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });
  it('accepts the forms exporters write: +1, .5, 5., 1E3, 1e-3', () => {
    const m = parseObj(enc('v +1 .5 5.\nv 1E3 1e-3 -0.25\nv 0 0 1\nf 1 2 3\n'));
    expect(Array.from(m.mesh.positions.slice(0, 6))).toEqual([1, 0.5, 5, 1000, 0.001, -0.25]);
  });
});

describe('OBJ features (fixtures in tests/fixtures/meshes)', () => {
  it('CRLF line ends and trailing spaces', () => {
    const m = parseObj(fixture('crlf-line-ends.obj'));
    expect(m.mesh.positions.length / 3).toBe(4);
    expect(Array.from(m.mesh.triangles)).toEqual([0, 1, 2, 0, 2, 3]);
  });
  it('backslash continuation joins a vertex and a face across lines', () => {
    const m = parseObj(fixture('backslash-continuation.obj'));
    expect(Array.from(m.mesh.positions.slice(6, 9))).toEqual([10, 10, 0]);
    expect(m.mesh.triangles.length / 3).toBe(2);
  });
  it('counts continuation lines in error line numbers', () => {
    try {
      parseObj(fixture('continuation-line-count.obj'));
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(GeometryError);
      expect((e as GeometryError).code).toBe('INDEX_OUT_OF_RANGE');
      expect((e as GeometryError).line).toBe(11);
    }
  });
  it('negative (relative) indices refer back from the latest vertex', () => {
    const m = parseObj(fixture('negative-indices.obj'));
    expect(m.mesh.triangles.length / 3).toBe(4);
    expect(surfaceArea(m.mesh)).toBeCloseTo(200, 12);
    expect(Array.from(m.mesh.triangles.slice(0, 6))).toEqual([0, 1, 2, 0, 2, 3]);
  });
  it('a non-convex, tilted polygon triangulates to its true area (earcut on the Newell plane)', () => {
    const m = parseObj(fixture('nonconvex-polygon.obj'));
    expect(m.mesh.triangles.length / 3).toBe(4);
    expect(surfaceArea(m.mesh)).toBeCloseTo(300, 9); // L-shape: 20×20 − 10×10 (see the fixture)
    // Every triangle keeps the polygon's orientation: normal along +(0, −0.8, 0.6) like the corner order.
    const P = m.mesh.positions;
    for (let f = 0; f < 4; f++) {
      const tri = m.mesh.triangles;
      const [a, b, c] = [0, 1, 2].map((k) => 3 * tri[3 * f + k]);
      const u = [P[b] - P[a], P[b + 1] - P[a + 1], P[b + 2] - P[a + 2]];
      const v = [P[c] - P[a], P[c + 1] - P[a + 1], P[c + 2] - P[a + 2]];
      const ny = u[2] * v[0] - u[0] * v[2];
      const nz = u[0] * v[1] - u[1] * v[0];
      expect(-0.8 * ny + 0.6 * nz).toBeGreaterThan(0);
    }
  });
  it('o/g become face tags, l lines become seam polylines, all four index forms and vt per corner', () => {
    const m = parseObj(fixture('groups-and-seams.obj'));
    expect(m.tagNames).toEqual(['', 'strip', 'left', 'right side']);
    expect(Array.from(m.faceTags)).toEqual([2, 2, 2, 2, 3, 3, 3, 3]);
    expect(m.seamPolylines.map((l) => Array.from(l))).toEqual([[2, 7], [0, 1, 2, 3, 4]]);
    expect(m.cornerUVs).not.toBeNull();
    expect(Array.from(m.cornerUVs!.slice(0, 6))).toEqual([0, 0, 1, 0, 1, 1]);
    expect(m.notes.join(' ')).toMatch(/no texture coordinate/);
  });
});

describe('OBJ errors: code and 1-based line', () => {
  const cases: [string, string, string, number | undefined][] = [
    ['empty (comments only)', '# nothing\n\n', 'EMPTY_FILE', undefined],
    ['binary garbage', 'v 1 2 3\nv \u0000\u0001\u0002\n', 'BINARY_GARBAGE', 2],
    ['index out of range', readFileSync(join(__dirname, '../../fixtures/meshes/bad-index.obj'), 'utf8'), 'INDEX_OUT_OF_RANGE', 5],
    ['index 0', 'v 0 0 0\nv 1 0 0\nv 0 1 0\nf 0 1 2\n', 'INDEX_OUT_OF_RANGE', 4],
    ['negative index too far back', 'v 0 0 0\nv 1 0 0\nv 0 1 0\nf -1 -2 -4\n', 'INDEX_OUT_OF_RANGE', 4],
    ['texture index out of range', 'v 0 0 0\nv 1 0 0\nv 0 1 0\nvt 0 0\nf 1/1 2/2 3/1\n', 'INDEX_OUT_OF_RANGE', 5],
    ['NaN coordinate', 'v 0 0 0\nv nan 0 0\n', 'NON_FINITE', 2],
    ['infinite coordinate', 'v 0 0 0\nv 1 0 0\nv 0 1e999 0\n', 'NON_FINITE', 3],
    ['malformed number', 'v 0 0 0\n\nv 1.2.3 0 0\n', 'BAD_NUMBER', 3],
    ['vertex with two coordinates', 'v 0 0\n', 'BAD_NUMBER', 1],
    ['too few vertices', 'v 0 0 0\nv 1 0 0\n', 'TOO_FEW_VERTICES', undefined],
    ['face with two corners', 'v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2\n', 'FACE_TOO_SMALL', 4],
    ['no faces', 'v 0 0 0\nv 1 0 0\nv 0 1 0\n', 'NO_FACES', undefined],
    ['l with one vertex', 'v 0 0 0\nv 1 0 0\nv 0 1 0\nf 1 2 3\nl 1\n', 'BAD_SEAM', 5],
  ];
  for (const [name, text, code, line] of cases) {
    it(`${name} → ${code}${line ? ` at line ${line}` : ''}`, () => {
      try {
        parseObj(enc(text));
        expect.unreachable();
      } catch (e) {
        expect(e).toBeInstanceOf(GeometryError);
        expect((e as GeometryError).code).toBe(code);
        expect((e as GeometryError).line).toBe(line);
        if (line) expect((e as GeometryError).message).toContain(`line ${line}`);
      }
    });
  }
  it('too many triangles → TOO_MANY_TRIANGLES at the line that crosses the limit', () => {
    const text = 'v 0 0 0\nv 1 0 0\nv 0 1 0\nv 1 1 0\nf 1 2 3\nf 2 4 3\nf 1 2 4 3\n';
    expect(() => parseObj(enc(text), { maxTriangles: 2 })).toThrow(expect.objectContaining({ code: 'TOO_MANY_TRIANGLES', line: 7 }));
  });
});

describe('OBJ round trips and robustness', () => {
  it('a written mesh reads back with the same positions, under any rigid motion and scale (property)', () => {
    const base = icoSphere(25, 1);
    fc.assert(
      fc.property(rigidMotion, scaleFactor, (motion, k) => {
        const m = transformMesh(base, { ...motion, scale: k });
        const back = parseObj(enc(writeObj(m)));
        expect(Array.from(back.mesh.positions)).toEqual(Array.from(m.positions));
        expect(Array.from(back.mesh.triangles)).toEqual(Array.from(m.triangles));
      }),
      { numRuns: 30 },
    );
  });
  it('random bytes and mutated OBJ text only ever raise GeometryError, and return promptly', () => {
    const valid = writeObj(icoSphere(5, 0));
    const check = (bytes: Uint8Array) => {
      const t = performance.now();
      try {
        importModel(bytes, 'fuzz.obj');
      } catch (e) {
        if (!(e instanceof GeometryError)) throw e;
      }
      expect(performance.now() - t).toBeLessThan(1000);
    };
    fc.assert(fc.property(fc.uint8Array({ maxLength: 2000 }), (b) => check(b)), { numRuns: 500 });
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.nat(valid.length), fc.constantFrom(...'vfolg/\\#-.e 0123456789\n\r\t'.split('')))), (edits) => {
        const chars = valid.split('');
        for (const [at, ch] of edits) chars.splice(at, 0, ch);
        check(enc(chars.join('')));
      }),
      { numRuns: 500 },
    );
  });
});
