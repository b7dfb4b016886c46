import { describe, expect, it } from 'vitest';
import { decodeWorkingMesh, encodeWorkingMesh } from '../../../geometry/io/working-mesh';
import { GeometryError } from '../../../geometry/errors';
import { icoSphere, torus } from '../../../geometry/shapes';

function errorOf(fn: () => unknown): GeometryError {
  try {
    fn();
  } catch (e) {
    if (e instanceof GeometryError) return e;
    throw e;
  }
  throw new Error('expected a GeometryError');
}

describe('working mesh bytes (format in CONTRACTS.md)', () => {
  it('lays out one triangle exactly as specified, float32 bit patterns from IEEE 754-2008 binary32', () => {
    const bytes = encodeWorkingMesh(new Float64Array([0, 0, 0, 1, 0, 0, 0, 2, -1]), new Uint32Array([0, 1, 2]));
    expect(bytes.length).toBe(16 + 36 + 12);
    expect(String.fromCharCode(...bytes.subarray(0, 4))).toBe('SSWM');
    expect(Array.from(bytes.subarray(4, 16))).toEqual([1, 0, 0, 0, 3, 0, 0, 0, 1, 0, 0, 0]);
    // IEEE 754 binary32: 1.0 = 0x3F800000, 2.0 = 0x40000000, -1.0 = 0xBF800000, stored little-endian.
    expect(Array.from(bytes.subarray(16 + 12, 16 + 16))).toEqual([0x00, 0x00, 0x80, 0x3f]);
    expect(Array.from(bytes.subarray(16 + 28, 16 + 32))).toEqual([0x00, 0x00, 0x00, 0x40]);
    expect(Array.from(bytes.subarray(16 + 32, 16 + 36))).toEqual([0x00, 0x00, 0x80, 0xbf]);
    expect(Array.from(bytes.subarray(52))).toEqual([0, 0, 0, 0, 1, 0, 0, 0, 2, 0, 0, 0]);
  });

  it('round-trips a sphere and a torus: indices exact, positions rounded to float32 (Math.fround, ECMA-262)', () => {
    for (const mesh of [icoSphere(95.3, 3), torus(120, 33.3, 24, 12)]) {
      const back = decodeWorkingMesh(encodeWorkingMesh(mesh.positions, mesh.triangles));
      expect(Array.from(back.triangles)).toEqual(Array.from(mesh.triangles));
      expect(Array.from(back.positions)).toEqual(Array.from(mesh.positions, Math.fround));
    }
  });

  it('reads from a Uint8Array at an odd byte offset inside a larger buffer', () => {
    const mesh = icoSphere(10, 1);
    const bytes = encodeWorkingMesh(mesh.positions, mesh.triangles);
    const host = new Uint8Array(bytes.length + 3);
    host.set(bytes, 1);
    const back = decodeWorkingMesh(host.subarray(1, 1 + bytes.length));
    expect(Array.from(back.triangles)).toEqual(Array.from(mesh.triangles));
  });

  it('keeps an empty mesh (0 vertices, 0 triangles) as a 16-byte header', () => {
    const back = decodeWorkingMesh(encodeWorkingMesh(new Float32Array(0), new Uint32Array(0)));
    expect(back.positions.length).toBe(0);
    expect(back.triangles.length).toBe(0);
  });

  it('refuses truncated bytes, naming the sizes', () => {
    const mesh = icoSphere(10, 1);
    const bytes = encodeWorkingMesh(mesh.positions, mesh.triangles);
    const short = errorOf(() => decodeWorkingMesh(bytes.subarray(0, 10)));
    expect(short.code).toBe('TRUNCATED');
    expect(short.message).toContain('10 bytes');
    const cut = errorOf(() => decodeWorkingMesh(bytes.subarray(0, bytes.length - 4)));
    expect(cut.code).toBe('TRUNCATED');
    expect(cut.message).toContain(`${mesh.positions.length / 3} vertices`);
    expect(cut.message).toContain(`only ${bytes.length - 4} bytes`);
  });

  it('refuses a wrong magic, an unknown version and trailing bytes', () => {
    const mesh = icoSphere(10, 0);
    const bytes = encodeWorkingMesh(mesh.positions, mesh.triangles);
    const png = Uint8Array.from(bytes);
    png.set([0x89, 0x50, 0x4e, 0x47]);
    const magic = errorOf(() => decodeWorkingMesh(png));
    expect(magic.code).toBe('BAD_HEADER');
    expect(magic.message).toContain('89 50 4e 47');
    const v2 = Uint8Array.from(bytes);
    v2[4] = 2;
    expect(errorOf(() => decodeWorkingMesh(v2)).message).toContain('version 2');
    const long = new Uint8Array(bytes.length + 4);
    long.set(bytes);
    expect(errorOf(() => decodeWorkingMesh(long)).message).toContain('4 bytes follow');
  });

  it('refuses a corrupt index or a NaN coordinate, naming the face or vertex', () => {
    const mesh = icoSphere(10, 0);
    const bytes = encodeWorkingMesh(mesh.positions, mesh.triangles);
    const V = mesh.positions.length / 3;
    const badIndex = Uint8Array.from(bytes);
    new DataView(badIndex.buffer).setUint32(16 + 12 * V + 4 * 7, 999, true);
    const e1 = errorOf(() => decodeWorkingMesh(badIndex));
    expect(e1.code).toBe('INDEX_OUT_OF_RANGE');
    expect(e1.face).toBe(2);
    expect(e1.message).toContain('triangle 2 uses vertex 999');
    const nan = Uint8Array.from(bytes);
    new DataView(nan.buffer).setFloat32(16 + 4 * 10, NaN, true);
    const e2 = errorOf(() => decodeWorkingMesh(nan));
    expect(e2.code).toBe('NON_FINITE');
    expect(e2.vertex).toBe(3);
  });

  it('refuses to encode bad arrays with a message', () => {
    expect(errorOf(() => encodeWorkingMesh(new Float64Array(4), new Uint32Array(0))).code).toBe('BAD_OPTION');
    expect(errorOf(() => encodeWorkingMesh(new Float64Array(9), new Uint32Array([0, 1, 3]))).message).toContain('vertex 3');
    // 1e39 overflows binary32 (largest finite about 3.4028235e38, IEEE 754-2008 Table 3.5).
    expect(errorOf(() => encodeWorkingMesh(new Float64Array([0, 0, 1e39]), new Uint32Array(0))).code).toBe('NON_FINITE');
  });
});
