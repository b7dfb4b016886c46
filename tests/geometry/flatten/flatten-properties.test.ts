import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { flattenPiece } from '../../../geometry/flatten/flatten-piece';
import { sphereGore, transformMesh } from '../../../geometry/shapes';
import { gridPiece, length2 } from './test-meshes';

// Stretch and 2D lengths are intrinsic: built only from 3D edge lengths and angles, so a rigid motion
// of the input cannot change them, and a uniform scale k multiplies every length by k and leaves the
// singular values alone (Sander et al. 2001 define stretch from the Jacobian, which is scale-free).
// Tolerances: the only source of difference is rounding in the solves plus ARAP's relative stopping rule
// (1e-6 on the energy), measured below 1e-7 relative; 1e-5 relative on lengths, 1e-4 points on percents.
const pieces = [
  { name: 'a 1/6 sphere gore', mesh: sphereGore(60, 6, 12, 4) },
  { name: 'a saddle-shaped sheet', mesh: gridPiece(7, 9, (x, y) => 0.01 * (x - 30) * (y - 30)) },
];

const rotation = fc.tuple(
  fc.double({ min: -1, max: 1, noNaN: true }),
  fc.double({ min: -1, max: 1, noNaN: true }),
  fc.double({ min: -1, max: 1, noNaN: true }),
  fc.double({ min: -1, max: 1, noNaN: true }),
).filter((q) => Math.hypot(...q) > 0.1);
const translation = fc.tuple(
  fc.double({ min: -5000, max: 5000, noNaN: true }),
  fc.double({ min: -5000, max: 5000, noNaN: true }),
  fc.double({ min: -5000, max: 5000, noNaN: true }),
);

function edgeLengths(uv: Float64Array, triangles: Uint32Array): number[] {
  const out: number[] = [];
  for (let h = 0; h < triangles.length; h++) out.push(length2(uv, triangles[h], triangles[h - (h % 3) + ((h % 3) + 1) % 3]));
  return out;
}

describe.each(pieces)('flattenPiece on $name under rigid motion and scale (fast-check, seeded)', ({ mesh }) => {
  const base = flattenPiece(mesh);
  const baseLengths = edgeLengths(base.uv, mesh.triangles);

  it('a rigid motion leaves stretch and every 2D edge length unchanged', () => {
    fc.assert(
      fc.property(rotation, translation, (q, t) => {
        const moved = transformMesh(mesh, { rotation: q, translation: t });
        const flat = flattenPiece(moved);
        expect(flat.flipped).toBe(0);
        expect(Math.abs(flat.stretch.maxPct - base.stretch.maxPct)).toBeLessThan(1e-4);
        expect(Math.abs(flat.stretch.rmsPct - base.stretch.rmsPct)).toBeLessThan(1e-4);
        const lengths = edgeLengths(flat.uv, moved.triangles);
        for (let i = 0; i < lengths.length; i++) expect(Math.abs(lengths[i] / baseLengths[i] - 1)).toBeLessThan(1e-5);
      }),
      { seed: 20261201, numRuns: 12 },
    );
  });

  it('scaling the piece by k scales the pattern by k and keeps the stretch', () => {
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e3, noNaN: true }), (k) => {
        const flat = flattenPiece(transformMesh(mesh, { scale: k }));
        expect(flat.flipped).toBe(0);
        expect(Math.abs(flat.stretch.maxPct - base.stretch.maxPct)).toBeLessThan(1e-4);
        expect(Math.abs(flat.area2d / (k * k * base.area2d) - 1)).toBeLessThan(1e-5);
        let size = 0;
        for (const c of base.uv) size = Math.max(size, Math.abs(c));
        for (let i = 0; i < flat.uv.length; i++) expect(Math.abs(flat.uv[i] - k * base.uv[i])).toBeLessThan(1e-5 * k * size);
      }),
      { seed: 7, numRuns: 12 },
    );
  });
});

describe('flattenPiece at extreme scales', () => {
  it.each([1e-6, 1e6])('a gore scaled by %s keeps its stretch and scales its pattern (no relative threshold breaks)', (k) => {
    // Same intrinsic argument as above; every tolerance inside the engine is relative to the piece size.
    const mesh = sphereGore(60, 6, 12, 4);
    const base = flattenPiece(mesh);
    const flat = flattenPiece(transformMesh(mesh, { scale: k, translation: [3 * k, -2 * k, 5 * k] }));
    expect(flat.flipped).toBe(0);
    expect(Math.abs(flat.stretch.maxPct - base.stretch.maxPct)).toBeLessThan(1e-4);
    expect(Math.abs(flat.area3d / (k * k * base.area3d) - 1)).toBeLessThan(1e-9);
    const a = edgeLengths(base.uv, mesh.triangles);
    const b = edgeLengths(flat.uv, mesh.triangles);
    for (let i = 0; i < a.length; i++) expect(Math.abs(b[i] / (k * a[i]) - 1)).toBeLessThan(1e-5);
  });
});

