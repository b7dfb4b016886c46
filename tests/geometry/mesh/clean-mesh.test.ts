import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { cleanMesh } from '../../../geometry/mesh/clean-mesh';
import { simplifyMesh } from '../../../geometry/mesh/simplify-mesh';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import { eulerCharacteristic } from '../../../geometry/mesh/euler-characteristic';
import { signedVolume, surfaceArea } from '../../../geometry/mesh/mesh-measures';
import { cone, helmetShell, icoSphere, platonicSolid, transformMesh, uvSphere } from '../../../geometry/shapes';
import { GeometryError } from '../../../geometry/errors';
import type { ImportedModel, TriMesh } from '../../../geometry/mesh/tri-mesh';
import { rigidMotion, scaleFactor } from '../shapes/motion-arbitrary';

const asModel = (mesh: TriMesh, extra: Partial<ImportedModel> = {}): ImportedModel => ({
  mesh,
  faceTags: new Uint32Array(mesh.triangles.length / 3),
  tagNames: [''],
  seamPolylines: [],
  cornerUVs: null,
  notes: [],
  ...extra,
});

/** Every triangle with its own three corners, as an STL file stores it. */
function unwelded(mesh: TriMesh): TriMesh {
  const src = mesh.positions;
  const tri = mesh.triangles;
  const positions = new Float64Array(3 * tri.length);
  for (let c = 0; c < tri.length; c++) positions.set(src.subarray(3 * tri[c], 3 * tri[c] + 3), 3 * c);
  return { positions, triangles: Uint32Array.from({ length: tri.length }, (_, i) => i) };
}

function concat(...meshes: TriMesh[]): TriMesh {
  const positions: number[] = [];
  const triangles: number[] = [];
  for (const m of meshes) {
    const base = positions.length / 3;
    positions.push(...m.positions);
    triangles.push(...Array.from(m.triangles, (i) => i + base));
  }
  return { positions: Float64Array.from(positions), triangles: Uint32Array.from(triangles) };
}

const allPaired = (m: TriMesh) => buildTwins(m.triangles, m.positions.length / 3).every((t) => t >= 0);

describe('cleanMesh', () => {
  it('welds an STL-style triangle soup back to the closed sphere: V = 10·4^k + 2, χ = 2 (Euler), one part', () => {
    const soup = unwelded(icoSphere(40, 2));
    const { model, report } = cleanMesh(asModel(soup));
    expect(model.mesh.positions.length / 3).toBe(162);
    expect(report.weldedVertices).toBe(soup.positions.length / 3 - 162);
    const twin = buildTwins(model.mesh.triangles, 162);
    expect(eulerCharacteristic(model.mesh.triangles, twin)).toBe(2);
    expect(report.components).toBe(1);
    expect(report.boundaryLoops).toBe(0);
  });
  it('counts are the same after any rigid motion and scale of the input (property)', () => {
    const soup = unwelded(icoSphere(40, 1));
    fc.assert(
      fc.property(rigidMotion, scaleFactor, (motion, k) => {
        const { report } = cleanMesh(asModel(transformMesh(soup, { ...motion, scale: k })));
        expect(report.verticesOut).toBe(42);
        expect(report.facesOut).toBe(80);
        expect(report.flippedFaces).toBe(0);
      }),
      { numRuns: 20 },
    );
  });
  it('welds within the tolerance and not beyond it (relative to the bounding-box diagonal)', () => {
    const m = platonicSolid('cube', 100);
    const diag = 100 * Math.sqrt(3);
    const jitter = (d: number) => {
      const s = unwelded(m);
      // Deterministic pseudo-random offsets in [−d, d] per coordinate (Knuth's multiplicative hash).
      for (let i = 0; i < s.positions.length; i++) s.positions[i] += (((Math.imul(i + 1, 2654435761) >>> 0) % 2001) / 1000 - 1) * d;
      return s;
    };
    // Copies differ by at most 2d·√3 ≈ 0.69e-6·diag < 1e-6·diag: all weld.
    expect(cleanMesh(asModel(jitter(0.2e-6 * diag))).report.verticesOut).toBe(8);
    expect(cleanMesh(asModel(jitter(0.3e-3 * diag)), { weldTolerance: 1e-6 }).report.verticesOut).toBeGreaterThan(8);
    expect(cleanMesh(asModel(jitter(0.3e-3 * diag)), { weldTolerance: 1e-2 }).report.verticesOut).toBe(8);
  });
  it('drops degenerate and duplicate faces and says how many', () => {
    const m = platonicSolid('octahedron', 10);
    const tris = [...m.triangles, m.triangles[0], m.triangles[0], m.triangles[1], ...m.triangles.slice(3, 6), m.triangles[5], m.triangles[4], m.triangles[3]];
    const { model, report } = cleanMesh(asModel({ positions: m.positions, triangles: Uint32Array.from(tris) }));
    expect(report.degenerateFaces).toBe(1);
    expect(report.duplicateFaces).toBe(2);
    expect(model.mesh.triangles.length / 3).toBe(8);
    expect(report.notes.join('\n')).toMatch(/1 degenerate/);
  });
  it('makes random winding consistent and the closed shell outward (positive signed volume)', () => {
    const base = uvSphere(30, 16, 8);
    fc.assert(
      fc.property(fc.uint8Array({ minLength: base.triangles.length / 3, maxLength: base.triangles.length / 3 }), (coin) => {
        const tris = Uint32Array.from(base.triangles);
        for (let f = 0; f < coin.length; f++) if (coin[f] & 1) [tris[3 * f + 1], tris[3 * f + 2]] = [tris[3 * f + 2], tris[3 * f + 1]];
        const { model } = cleanMesh(asModel({ positions: base.positions, triangles: tris }));
        expect(allPaired(model.mesh)).toBe(true);
        expect(signedVolume(model.mesh)).toBeCloseTo(signedVolume(base), 6);
      }),
      { numRuns: 30 },
    );
  });
  it('on an open sheet (the helmet) keeps the side most faces had, however a minority was flipped', () => {
    const base = helmetShell({ segments: 24, rings: 6 });
    const F = base.triangles.length / 3;
    fc.assert(
      fc.property(fc.uint8Array({ minLength: F, maxLength: F, min: 60 }), (coin) => {
        const tris = Uint32Array.from(base.triangles);
        let flipped = 0;
        for (let f = 0; f < F; f++) {
          if (coin[f] < 100) {
            [tris[3 * f + 1], tris[3 * f + 2]] = [tris[3 * f + 2], tris[3 * f + 1]];
            flipped++;
          }
        }
        fc.pre(2 * flipped < F);
        const { model, report } = cleanMesh(asModel({ positions: base.positions, triangles: tris }));
        expect(Array.from(model.mesh.triangles)).toEqual(Array.from(base.triangles));
        expect(report.flippedFaces).toBe(flipped);
      }),
      { numRuns: 30 },
    );
  });
  it('turns an inside-out shell outward and reports it', () => {
    const base = icoSphere(10, 1);
    const inside = { positions: base.positions, triangles: Uint32Array.from(base.triangles).reverse() };
    const { model, report } = cleanMesh(asModel(inside));
    expect(report.shellsTurnedOutward).toBe(1);
    expect(signedVolume(model.mesh)).toBeGreaterThan(0);
  });
  it('splits two cubes that share one edge (4 faces on it) into two closed parts and locates the edge', () => {
    const a = platonicSolid('cube', 10);
    const b = transformMesh(a, { translation: [10, 10, 0] });
    const { model, report } = cleanMesh(asModel(concat(a, b)));
    expect(report.nonManifoldEdges).toHaveLength(1);
    expect(report.nonManifoldEdges[0].faceCount).toBe(4);
    expect(report.nonManifoldEdges[0].at[0]).toBeCloseTo(5, 9);
    expect(report.nonManifoldEdges[0].at[1]).toBeCloseTo(5, 9);
    expect(report.nonManifoldVertices).toHaveLength(2);
    expect(report.components).toBe(2);
    expect(model.mesh.positions.length / 3).toBe(16);
    expect(allPaired(model.mesh)).toBe(true);
    expect(report.notes.join('\n')).toMatch(/non-manifold edge between vertices .* at \(5\.00, 5\.00, 0\.00\) mm, shared by 4 faces/);
  });
  it('splits two cones touching apex to apex (a bow tie vertex)', () => {
    const up = cone(10, 10, 12, 2);
    const down = transformMesh(up, { rotation: [1, 0, 0, 0], translation: [0, 0, 20] });
    const { model, report } = cleanMesh(asModel(concat(up, down)));
    expect(report.nonManifoldVertices).toHaveLength(1);
    expect(report.nonManifoldVertices[0].fans).toBe(2);
    expect(report.nonManifoldVertices[0].at[2]).toBeCloseTo(10, 9);
    expect(model.mesh.positions.length / 3).toBe(2 * (12 * 2 + 1));
    expect(report.components).toBe(2);
  });
  it('carries face tags, UVs (reordered with flipped faces) and seam polylines through', () => {
    const m = platonicSolid('tetrahedron', 10);
    const soup = unwelded(m);
    const tris = Uint32Array.from(soup.triangles);
    [tris[1], tris[2]] = [tris[2], tris[1]]; // face 0 reversed
    const uvs = Float64Array.from({ length: 24 }, (_, i) => i);
    const { model, report } = cleanMesh(asModel({ positions: soup.positions, triangles: tris }, {
      faceTags: Uint32Array.from([1, 1, 2, 2]),
      tagNames: ['', 'a', 'b'],
      cornerUVs: uvs,
      seamPolylines: [Uint32Array.from([0, 3, 4])],
    }));
    expect(report.flippedFaces).toBe(1);
    expect(Array.from(model.faceTags)).toEqual([1, 1, 2, 2]);
    expect(Array.from(model.cornerUVs!.slice(0, 6))).toEqual([0, 1, 4, 5, 2, 3]);
    // Soup vertices 0, 3 and 4 are corners of the tetrahedron; 3 and 4 are distinct points.
    expect(model.seamPolylines).toHaveLength(1);
    expect(model.seamPolylines[0].length).toBeGreaterThanOrEqual(2);
    for (const v of model.seamPolylines[0]) expect(v).toBeLessThan(4);
  });
  it('bad input: negative tolerance → BAD_OPTION; all faces degenerate → NO_FACES', () => {
    const m = platonicSolid('cube', 1);
    expect(() => cleanMesh(asModel(m), { weldTolerance: -1 })).toThrow(expect.objectContaining({ code: 'BAD_OPTION' }));
    const flat = { positions: Float64Array.from([0, 0, 0, 1, 0, 0, 2, 0, 0]), triangles: Uint32Array.from([0, 1, 2]) };
    expect(() => cleanMesh(asModel(flat))).toThrow(GeometryError);
  });
});

describe('simplifyMesh (meshoptimizer quadric simplifier)', () => {
  it('reduces a geodesic sphere, keeps it round and keeps a locked seam edge for edge', async () => {
    const R = 100;
    const m = icoSphere(R, 5);
    const F = m.triangles.length / 3;
    // Seam: every edge whose both ends lie within 0.5 mm of the z = 0 plane (the equator).
    const mask = new Uint8Array(m.triangles.length);
    const near = (v: number) => Math.abs(m.positions[3 * v + 2]) < 0.5;
    let seamEdges = 0;
    for (let h = 0; h < m.triangles.length; h++) {
      const a = m.triangles[h];
      const b = m.triangles[h - (h % 3) + ((h % 3) + 1) % 3];
      if (near(a) && near(b)) {
        mask[h] = 1;
        seamEdges++;
      }
    }
    expect(seamEdges).toBeGreaterThan(0);
    const res = await simplifyMesh(asModel(m), 2000, mask);
    const out = res.model.mesh;
    expect(out.triangles.length / 3).toBeLessThanOrEqual(2000);
    expect(out.triangles.length / 3).toBeGreaterThan(1000);
    expect(out.triangles.length / 3).toBeLessThan(F);
    expect(res.seamEdgesLost).toBe(0);
    expect(res.seamMask!.reduce((s, x) => s + x, 0)).toBe(seamEdges);
    // Sphere area 4πR² (Archimedes); the coarser mesh stays within 1 %.
    expect(surfaceArea(out) / (4 * Math.PI * R * R)).toBeGreaterThan(0.99);
    for (let v = 0; v < out.positions.length / 3; v++) {
      expect(Math.hypot(out.positions[3 * v], out.positions[3 * v + 1], out.positions[3 * v + 2])).toBeCloseTo(R, 6);
    }
    expect(allPaired(out)).toBe(true);
  });
  it('rejects a target below 4 and a mask of the wrong size', async () => {
    const m = icoSphere(1, 1);
    await expect(simplifyMesh(asModel(m), 2, null)).rejects.toMatchObject({ code: 'BAD_OPTION' });
    await expect(simplifyMesh(asModel(m), 10, new Uint8Array(5))).rejects.toMatchObject({ code: 'BAD_OPTION' });
  });
});

describe('cleanMesh on a real scan (the Stanford bunny, public domain, npm package "bunny")', () => {
  it('gives a manifold, consistently wound mesh on which discrete Gauss–Bonnet holds: Σ defect = 2πχ (Crane 2013)', async () => {
    const { createRequire } = await import('node:module');
    const bunny = createRequire(import.meta.url)('bunny') as { positions: number[][]; cells: number[][] };
    const mesh: TriMesh = { positions: Float64Array.from(bunny.positions.flat()), triangles: Uint32Array.from(bunny.cells.flat()) };
    const { angleDefects } = await import('../../../geometry/mesh/angle-defect');
    const check = (m: TriMesh) => {
      const { model, report } = cleanMesh(asModel(m));
      const V = model.mesh.positions.length / 3;
      const twin = buildTwins(model.mesh.triangles, V);
      const chi = eulerCharacteristic(model.mesh.triangles, twin);
      const total = angleDefects(model.mesh.positions, model.mesh.triangles, twin).reduce((s, x) => s + x, 0);
      expect(total).toBeCloseTo(2 * Math.PI * chi, 6);
      expect(report.nonOrientableFaces).toBe(0);
      return report;
    };
    const base = check(mesh);
    expect(base.facesOut).toBeGreaterThan(3600);
    fc.assert(
      fc.property(rigidMotion, scaleFactor, (motion, k) => {
        const r = check(transformMesh(mesh, { ...motion, scale: k }));
        expect(r.facesOut).toBe(base.facesOut);
        expect(r.boundaryLoops).toBe(base.boundaryLoops);
      }),
      { numRuns: 5 },
    );
  });
});
