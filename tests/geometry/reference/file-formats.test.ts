/**
 * Outside checks on reading files: the same shape written as OBJ in many styles, ASCII and binary STL (in
 * centimetres) and ASCII and binary PLY with extra properties must give the same pattern; broken files must
 * stop the `pattern` command with one line that says what is wrong and on which line.
 */
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { PatternDoc } from '../../../geometry/pattern/pattern-doc';
import { objFile, plyFile, stlAscii, stlBinary, type ObjStyle } from '../../fixtures/reference/model-files';
import { lOutline, moved, prismOver, regularPolygon, tube, type PolyShape } from '../../fixtures/reference/reference-shapes';
import { expectPatternInvariants, patternOfFile, runPatternCommand } from './reference-checks';

const crease = { seams: { crease: 10 } } as const;

/**
 * What must not depend on the file format: pieces (corners, quantity, areas) and seams (length, angle), sorted,
 * numbers rounded to 1 part in 10⁵ — float32 files (STL, binary PLY here) carry about 7 significant digits.
 */
function summary(doc: PatternDoc): unknown {
  const r = (x: number): number => Number(x.toPrecision(5));
  return {
    pieces: doc.pieces
      .map((p) => ({ corners: p.outline.length, quantity: p.quantity, area3d: r(p.area3d), area2d: r(p.area2d), holes: p.holes.length }))
      .sort((a, b) => a.area3d - b.area3d || a.corners - b.corners),
    seams: doc.seams
      .map((s) => ({ pieces: s.pieces.length, length3d: r(s.length3d), dihedral: r(s.dihedral.mean), convex: s.convex }))
      .sort((a, b) => a.length3d - b.length3d || a.dihedral - b.dihedral),
  };
}

// An L-shaped bracket (non-convex n-gon caps, an inside corner) turned off the axes; and a hexagonal prism.
const shapes: Array<[string, PolyShape]> = [
  ['L bracket', moved(prismOver(lOutline(60, 20), 45), [0.2, 1, 0.3], 0.8, 1, [12, -7, 30])],
  ['hexagonal prism', prismOver(regularPolygon(6, 30), 55)],
];

describe('the same shape in every file format gives the same pattern', () => {
  for (const [name, shape] of shapes) {
    const reference = patternOfFile(objFile(shape), 'plain.obj', crease);
    const expected = summary(reference);
    it(`${name}: the plain OBJ pattern holds the invariants`, () => {
      expectPatternInvariants(reference);
      expect(reference.seams.length).toBeGreaterThan(0);
    });
    // Wavefront OBJ, Appendix B1: every style below describes the same polygons.
    const styles: Array<[string, ObjStyle]> = [
      ['negative (relative) indices', { negative: true }],
      ['CRLF line ends', { crlf: true }],
      ['g groups and an o name', { groups: 3 }],
      ['backslash continuation of face lines', { continuation: true }],
      ['v//vn faces', { normals: true }],
      ['v/vt/vn faces, negative, CRLF, continued, grouped, with comments and trailing spaces', {
        normals: true, texcoords: true, negative: true, crlf: true, continuation: true, groups: 2, noise: true,
      }],
      ['triangles only', { triangulate: true }],
    ];
    for (const [style, opts] of styles) {
      it(`${name}: OBJ with ${style}`, () => {
        expect(summary(patternOfFile(objFile(shape, opts), 'styled.obj', crease))).toEqual(expected);
      });
    }
    it(`${name}: ASCII and binary STL in centimetres (--units cm)`, () => {
      expect(summary(patternOfFile(stlAscii(shape, 10), 'part.stl', { ...crease, unit: 'cm' }))).toEqual(expected);
      expect(summary(patternOfFile(stlBinary(shape, 10), 'part.stl', { ...crease, unit: 'cm' }))).toEqual(expected);
    });
    it(`${name}: PLY ASCII and binary little-endian with normals, colours and a face flag`, () => {
      expect(summary(patternOfFile(plyFile(shape, 'ascii'), 'part.ply', crease))).toEqual(expected);
      expect(summary(patternOfFile(plyFile(shape, 'binary_little_endian'), 'part.ply', crease))).toEqual(expected);
      expect(summary(patternOfFile(plyFile(shape, 'binary_little_endian', 'int', 'uint'), 'part.ply', crease))).toEqual(expected);
      expect(summary(patternOfFile(plyFile(shape, 'ascii', 'int', 'int'), 'part.ply', crease))).toEqual(expected);
    });
  }
});

describe('regression: a UTF-8 byte-order mark at the start of a text file', () => {
  // Editors on some systems begin a UTF-8 text file with U+FEFF encoded as EF BB BF (The Unicode Standard,
  // §23.8 "Specials", byte order mark; from memory). It was read as part of the first statement, so an OBJ lost
  // its first vertex and failed with a wrong "index out of range", and a PLY's magic line went unrecognised.
  const shape = prismOver(regularPolygon(5, 25), 30);
  const expected = summary(patternOfFile(objFile(shape), 'plain.obj', crease));
  const bom = (content: string | Uint8Array): Uint8Array => {
    const body = typeof content === 'string' ? new TextEncoder().encode(content) : content;
    const out = new Uint8Array(body.length + 3);
    out.set([0xef, 0xbb, 0xbf]);
    out.set(body, 3);
    return out;
  };
  it('OBJ, ASCII STL and ASCII PLY with a BOM read as without one', () => {
    expect(summary(patternOfFile(bom(objFile(shape)), 'bom.obj', crease))).toEqual(expected);
    expect(summary(patternOfFile(bom(objFile(shape, { crlf: true })), 'bom-crlf.obj', crease))).toEqual(expected);
    expect(summary(patternOfFile(bom(stlAscii(shape)), 'bom.stl', crease))).toEqual(expected);
    expect(summary(patternOfFile(bom(plyFile(shape, 'ascii')), 'bom.ply', crease))).toEqual(expected);
    expect(summary(patternOfFile(bom(plyFile(shape, 'binary_little_endian')), 'bom-binary.ply', crease))).toEqual(expected);
  });
  it('a binary STL whose header happens to start with those bytes keeps its exact size and reads whole', () => {
    const stl = stlBinary(shape);
    stl.set([0xef, 0xbb, 0xbf], 0);
    expect(summary(patternOfFile(stl, 'header.stl', crease))).toEqual(expected);
  });
});

describe('regression: a seam line that is not a mesh edge is reported once per step, naming its line once', () => {
  it('the warning reads "seam line 1: step 1: …", not "seam line 1: seam line 1, step 1: …"', () => {
    const shape = tube(30, 60, 24, 3);
    // From the bottom ring diagonally up to the next generator's ring vertex: not an edge of the quad mesh.
    shape.lines = [[0, 24 + 3, 48, 72]];
    const doc = patternOfFile(objFile(shape), 'diagonal.obj', { seams: 'obj' });
    const notes = doc.warnings.filter((w) => /share no edge/.test(w));
    expect(notes.length).toBeGreaterThan(0);
    for (const w of notes) {
      expect(w).toMatch(/^seam line 1: step \d+: /);
      expect(w.match(/seam line/g)).toHaveLength(1);
    }
  });
});

describe('broken files stop the command with one line naming the problem and the line', () => {
  const work = mkdtempSync(join(tmpdir(), 'reference-broken-'));
  afterAll(() => rmSync(work, { recursive: true, force: true }));
  const good = objFile(prismOver(regularPolygon(4, 20), 10)).split('\n');
  const withLine = (line: number, text: string): string => [...good.slice(0, line - 1), text, ...good.slice(line - 1)].join('\n');

  // [file name, content, expected 1-based line or null for binary formats, what the message must say]
  const cases: Array<[string, string | Uint8Array, number | null, RegExp]> = [
    ['index.obj', withLine(12, 'f 1 2 99'), 12, /index 99.*out of range/i],
    ['zero-index.obj', withLine(12, 'f 0 1 2'), 12, /index 0|start at 1/i],
    ['nan.obj', withLine(3, 'v 1 nan 2'), 3, /number|finite/i],
    ['inf.obj', withLine(3, 'v 1 2 1e999'), 3, /number|finite/i],
    ['two-corners.obj', withLine(12, 'f 1 2'), 12, /at least 3/i],
    ['short-vertex.obj', withLine(4, 'v 1 2'), 4, /x, y and z/i],
    ['short-line.obj', withLine(12, 'l 3'), 12, /at least 2/i],
    ['garbage.obj', withLine(6, 'v 1 2 \u0000\u0001\u0002'), 6, /binary/i],
    // Continued lines: an error after a `\` continuation names the physical line where the bad token sits.
    ['continued.obj', withLine(12, 'f 1 2 \\\n 99'), 13, /index 99/i],
    // CRLF files count lines the same way.
    ['crlf.obj', withLine(12, 'f 1 2 99').replace(/\n/g, '\r\n'), 12, /index 99/i],
    ['facet-outside.stl', 'solid x\n  vertex 0 0 0\nendsolid x\n', 2, /vertex.*outside a facet/i],
    ['facet-unclosed.stl', 'solid x\nfacet normal 0 0 1\n outer loop\n  vertex 0 0 0\n  vertex 1 0 0\n  vertex 0 1 0\n endloop\nendsolid x\n', null, /never closed|cut short|endsolid|unexpected/i],
    ['facet-four.stl', 'solid x\nfacet normal 0 0 1\nouter loop\nvertex 0 0 0\nvertex 1 0 0\nvertex 1 1 0\nvertex 0 1 0\nendloop\nendfacet\nendsolid x\n', 2, /4 vertices/i],
    ['bad-header.ply', 'ply\nformat ascii 1.0\nelement vertex 3\nproperty flaot x\nend_header\n', 4, /flaot|type/i],
    ['ply-index.ply', 'ply\nformat ascii 1.0\nelement vertex 3\nproperty float x\nproperty float y\nproperty float z\nelement face 1\nproperty list uchar int vertex_indices\nend_header\n0 0 0\n1 0 0\n0 1 0\n3 0 1 7\n', 13, /index 7.*out of range/i],
    ['ply-nan.ply', 'ply\nformat ascii 1.0\nelement vertex 3\nproperty float x\nproperty float y\nproperty float z\nelement face 1\nproperty list uchar int vertex_indices\nend_header\n0 0 0\n1 nan 0\n0 1 0\n3 0 1 2\n', 11, /number|finite/i],
    ['empty.obj', '', null, /empty/i],
    ['short.stl', new Uint8Array(40), null, /84-byte|cut short|STL/i],
    ['cut.stl', stlBinary(prismOver(regularPolygon(4, 20), 10)).subarray(0, 84 + 50 * 3 + 10), null, /cut short|room/i],
    ['cut.ply', plyFile(prismOver(regularPolygon(4, 20), 10), 'binary_little_endian').subarray(0, 400), null, /cut short|ends early|truncat/i],
  ];
  for (const [file, content, line, what] of cases) {
    it(`${file}: exit ≠ 0, one stderr line${line ? `, line ${line}` : ''}, no stack trace`, () => {
      const path = join(work, file);
      writeFileSync(path, content);
      const r = runPatternCommand([path, '--out', join(work, `${file}-out`), '--seams', 'crease:10']);
      expect(r.status).not.toBe(0);
      expect(r.status).not.toBeNull();
      const lines = r.stderr.split('\n').filter((l) => l.length > 0);
      expect(lines, r.stderr).toHaveLength(1);
      expect(r.stderr).not.toMatch(/\n\s+at |internal error/);
      expect(lines[0]).toContain(file);
      expect(lines[0]).toMatch(what);
      if (line !== null) {
        // Compiler style "file:line: message" (common practice), the line named once — regression: the parsers'
        // own "OBJ line 12:" prefix used to follow the "file:12:" one.
        expect(lines[0]).toContain(`${file}:${line}: `);
        expect(lines[0]).not.toMatch(/line \d+:/i);
      }
    });
  }
});
