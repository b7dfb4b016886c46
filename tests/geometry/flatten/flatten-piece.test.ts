import { describe, expect, it } from 'vitest';
import { isGeometryError } from '../../../geometry/errors';
import { flattenPiece } from '../../../geometry/flatten/flatten-piece';
import { signedAreas } from '../../../geometry/flatten/signed-area';
import { triangleStretch } from '../../../geometry/flatten/triangle-stretch';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { cone, cylinder, helmetShell, icoSphere, sphereGore } from '../../../geometry/shapes';
import { cutOpenAtAzimuthZero } from './cut-open';
import { annulusPiece, gridPiece, length2, length3, worstEdgeRatio } from './test-meshes';

/**
 * Tolerances. A cone or cylinder mesh is a polyhedral developable surface (its faces are planar strips
 * between generators), so its exact development exists; what the flattener returns differs from it only
 * by solver rounding and ARAP's stopping rule, measured at < 1e-8 relative — 1e-6 leaves room. The smooth
 * formulas differ from the polygonal mesh by the chord/arc ratio N·sin(π/N)/π = 1 − π²/(6N²) + O(N⁻⁴)
 * (Taylor series of sin), which is the tolerance against them.
 */
const SOLVER_REL = 1e-6;
const chordDeficit = (n: number): number => (Math.PI * Math.PI) / (6 * n * n);

function polylineLength2(uv: Float64Array, path: number[]): number {
  let s = 0;
  for (let i = 0; i + 1 < path.length; i++) s += length2(uv, path[i], path[i + 1]);
  return s;
}
function polylineLength3(p: Float64Array, path: number[]): number {
  let s = 0;
  for (let i = 0; i + 1 < path.length; i++) s += length3(p, path[i], path[i + 1]);
  return s;
}
/** The piece without the vertices no triangle uses, and where each old vertex went (−1 if dropped). */
function dropUnusedVertices(mesh: TriMesh): { piece: TriMesh; newIndex: Int32Array } {
  const nv = mesh.positions.length / 3;
  const newIndex = new Int32Array(nv).fill(-1);
  for (const v of mesh.triangles) newIndex[v] = 0;
  let k = 0;
  for (let v = 0; v < nv; v++) if (newIndex[v] === 0) newIndex[v] = k++;
  const positions = new Float64Array(3 * k);
  for (let v = 0; v < nv; v++) if (newIndex[v] >= 0) positions.set(mesh.positions.subarray(3 * v, 3 * v + 3), 3 * newIndex[v]);
  return { piece: { positions, triangles: Uint32Array.from(mesh.triangles, (v) => newIndex[v]) }, newIndex };
}

function expectGeometryError(f: () => unknown, code: string, text: string | RegExp): void {
  try {
    f();
    expect.unreachable(`expected ${code}`);
  } catch (e) {
    expect(isGeometryError(e)).toBe(true);
    expect((e as { code: string }).code).toBe(code);
    expect((e as Error).message).toMatch(text);
  }
}

describe('flattenPiece on developable surfaces (descriptive geometry: do Carmo, "Differential Geometry of Curves and Surfaces", §3-5, developables)', () => {
  it.each([
    [60, 80, 48], // slant 100, sector 216°: more than a half disc
    [30, 95, 40], // slant ≈ 99.6, sector ≈ 108°
  ])('unrolls a cone r=%i h=%i cut along a generator into a sector of radius s and angle 360°·r/s', (r, h, n) => {
    const piece = cutOpenAtAzimuthZero(cone(r, h, n, 8));
    const apex = n * 8; // cone(): apex is the vertex after the rings
    const flat = flattenPiece(piece);
    const s = Math.hypot(r, h);
    // Radius: every base vertex lies a slant height from the apex (the generators are straight edges).
    for (let v = 0; v < n; v++) expect(length2(flat.uv, apex, v) / s - 1).toBeLessThan(SOLVER_REL);
    // Angle: the apex angles of the fan add up to the sector angle.
    let sector = 0;
    for (let f = 0; f < piece.triangles.length / 3; f++) {
      const c = [0, 1, 2].find((k) => piece.triangles[3 * f + k] === apex);
      if (c === undefined) continue;
      const a = piece.triangles[3 * f + ((c + 1) % 3)];
      const b = piece.triangles[3 * f + ((c + 2) % 3)];
      const ax = flat.uv[2 * a] - flat.uv[2 * apex];
      const ay = flat.uv[2 * a + 1] - flat.uv[2 * apex + 1];
      const bx = flat.uv[2 * b] - flat.uv[2 * apex];
      const by = flat.uv[2 * b + 1] - flat.uv[2 * apex + 1];
      sector += Math.atan2(ax * by - ay * bx, ax * bx + ay * by);
    }
    const polygonal = 2 * n * Math.asin((r * Math.sin(Math.PI / n)) / s); // n isosceles fan triangles
    expect(Math.abs(sector - polygonal)).toBeLessThan(SOLVER_REL);
    const smooth = (2 * Math.PI * r) / s;
    expect(Math.abs(sector / smooth - 1)).toBeLessThan(chordDeficit(n));
    expect(flat.stretch.maxPct).toBeLessThan(100 * SOLVER_REL);
    expect(flat.flipped).toBe(0);
    expect(flat.area2d / flat.area3d - 1).toBeLessThan(SOLVER_REL);
  });

  it('unrolls a cylinder cut along a line into a 2πr × h rectangle', () => {
    const r = 40;
    const h = 120;
    const n = 64;
    const flat = flattenPiece(cutOpenAtAzimuthZero(cylinder(r, h, n, 6)));
    let maxX = 0;
    let maxY = 0;
    for (let i = 0; i < flat.uv.length; i += 2) {
      maxX = Math.max(maxX, flat.uv[i]);
      maxY = Math.max(maxY, flat.uv[i + 1]);
    }
    // Canonical pose: long side (2πr ≈ 251 mm) on x, lower-left corner at the origin.
    const perimeter = 2 * n * r * Math.sin(Math.PI / n);
    expect(Math.abs(maxX / perimeter - 1)).toBeLessThan(SOLVER_REL);
    expect(Math.abs(maxY / h - 1)).toBeLessThan(SOLVER_REL);
    expect(Math.abs(maxX / (2 * Math.PI * r) - 1)).toBeLessThan(chordDeficit(n));
    expect(flat.stretch.maxPct).toBeLessThan(100 * SOLVER_REL);
    expect(flat.flipped).toBe(0);
  });

  it('flattens a cylinder strip with a window cut out (a piece with a hole) without stretch', () => {
    const n = 48;
    const tube = cutOpenAtAzimuthZero(cylinder(40, 120, n, 12));
    // Drop the faces of rings 4..7, segments 10..19: the window's rim becomes a second boundary loop.
    const keep: number[] = [];
    for (let f = 0; f < tube.triangles.length / 3; f++) {
      const ring = Math.floor(f / (2 * n));
      const seg = Math.floor((f % (2 * n)) / 2);
      if (ring >= 4 && ring <= 7 && seg >= 10 && seg <= 19) continue;
      keep.push(tube.triangles[3 * f], tube.triangles[3 * f + 1], tube.triangles[3 * f + 2]);
    }
    const { piece, newIndex } = dropUnusedVertices({ positions: tube.positions, triangles: Uint32Array.from(keep) });
    const flat = flattenPiece(piece);
    expect(flat.stretch.maxPct).toBeLessThan(100 * SOLVER_REL);
    expect(worstEdgeRatio(piece, flat.uv)).toBeLessThan(SOLVER_REL);
    expect(flat.area2d / flat.area3d - 1).toBeLessThan(SOLVER_REL);
    // The window keeps its size: its rim (rings 4 and 8 between segments 10 and 20) in 2D and 3D.
    const rim = [10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20].map((s) => newIndex[4 * n + s]);
    expect(Math.abs(polylineLength2(flat.uv, rim) / polylineLength3(piece.positions, rim) - 1)).toBeLessThan(SOLVER_REL);
  });

  it('gives back a flat annulus unchanged up to a rigid motion', () => {
    const piece = annulusPiece(25, 60, 40, 5);
    const flat = flattenPiece(piece);
    expect(flat.stretch.maxPct).toBeLessThan(100 * SOLVER_REL);
    expect(worstEdgeRatio(piece, flat.uv)).toBeLessThan(SOLVER_REL);
  });
});

describe('flattenPiece on sphere gores (Snyder 1987, "Map Projections — A Working Manual", USGS PP 1395, sinusoidal projection)', () => {
  const R = 100;
  const along = 48;
  const across = 8;
  const results = [4, 8, 16].map((gores) => {
    const piece = sphereGore(R, gores, along, across);
    return { gores, piece, flat: flattenPiece(piece) };
  });

  it.each(results.map((r) => [r.gores, r] as const))('a 1/%i gore is about πR long and 2πR/N wide at the equator', (gores, { piece, flat }) => {
    // sphereGore(): rows k = 0..along−2 of (across+1) vertices, poles last. A mesh edge's 2D/3D length
    // ratio lies between the smallest and largest singular value of a triangle it bounds, so a path of
    // edges keeps its length to within maxPct; the path is a polygon of chords of the circle, short of
    // the arc by π²/(24·segments²) (chord = 2R·sin(θ/2), Taylor series).
    const cols = across + 1;
    const north = (along - 1) * cols;
    const south = north + 1;
    const meridian = [north, ...Array.from({ length: along - 1 }, (_, k) => k * cols + across / 2), south];
    const within = flat.stretch.maxPct / 100;
    const length = polylineLength2(flat.uv, meridian);
    expect(Math.abs(length / (Math.PI * R) - 1)).toBeLessThan(within + (Math.PI * Math.PI) / (24 * along * along));
    const equatorRow = along / 2 - 1;
    const equator = Array.from({ length: cols }, (_, s) => equatorRow * cols + s);
    const width = polylineLength2(flat.uv, equator);
    const chordsPerGore = across;
    expect(Math.abs(width / ((2 * Math.PI * R) / gores) - 1)).toBeLessThan(
      within + (Math.PI * Math.PI) / (6 * (gores * chordsPerGore) ** 2),
    );
    expect(flat.flipped).toBe(0);
  });

  it('reports non-zero stretch on the doubly curved gore, less for narrower gores', () => {
    // A sphere has Gaussian curvature 1/R² ≠ 0, so no piece of it flattens without stretch (Gauss's
    // Theorema Egregium; do Carmo §4-3). 0.1 % is 10⁵ times the stretch measured on the developable
    // pieces above, so it cannot be rounding.
    for (const { flat } of results) expect(flat.stretch.maxPct).toBeGreaterThan(0.1);
    expect(results[0].flat.stretch.maxPct).toBeGreaterThan(results[1].flat.stretch.maxPct);
    expect(results[1].flat.stretch.maxPct).toBeGreaterThan(results[2].flat.stretch.maxPct);
    expect(results[0].flat.stretch.rmsPct).toBeGreaterThan(results[1].flat.stretch.rmsPct);
    expect(results[1].flat.stretch.rmsPct).toBeGreaterThan(results[2].flat.stretch.rmsPct);
  });

  it('stretches less than the sinusoidal projection of the same gore', () => {
    // Sinusoidal projection about the gore's central meridian λ0: x = R(λ − λ0)cos φ, y = Rφ (Snyder 1987,
    // eqs. 30-1 and 30-2, equation numbers from memory). A least-stretch flattening must do at least as well.
    for (const { gores, piece, flat } of results) {
      const nv = piece.positions.length / 3;
      const uv = new Float64Array(2 * nv);
      for (let v = 0; v < nv; v++) {
        const [x, y, z] = [piece.positions[3 * v], piece.positions[3 * v + 1], piece.positions[3 * v + 2]];
        const phi = Math.asin(Math.max(-1, Math.min(1, z / R)));
        const lambda = Math.hypot(x, y) < 1e-9 * R ? Math.PI / gores : Math.atan2(y, x);
        uv[2 * v] = R * (lambda - Math.PI / gores) * Math.cos(phi);
        uv[2 * v + 1] = R * phi;
      }
      const projected = triangleStretch(piece.positions, piece.triangles, uv).summary;
      expect(flat.stretch.rmsPct).toBeLessThan(projected.rmsPct);
      expect(flat.stretch.maxPct).toBeLessThan(projected.maxPct);
    }
  });
});

describe('flattenPiece output', () => {
  it('is in the canonical pose: counter-clockwise, bounding box from the origin, principal axis on x', () => {
    const piece = sphereGore(80, 6, 20, 5);
    const flat = flattenPiece(piece);
    let minX = Infinity;
    let minY = Infinity;
    let maxX = 0;
    let maxY = 0;
    for (let i = 0; i < flat.uv.length; i += 2) {
      minX = Math.min(minX, flat.uv[i]);
      minY = Math.min(minY, flat.uv[i + 1]);
      maxX = Math.max(maxX, flat.uv[i]);
      maxY = Math.max(maxY, flat.uv[i + 1]);
    }
    expect(minX).toBe(0);
    expect(minY).toBe(0);
    expect(maxX).toBeGreaterThan(maxY); // a long gore lies along x
    for (const a of signedAreas(flat.uv, piece.triangles)) expect(a).toBeGreaterThan(0);
    expect(flat.trianglePct.length).toBe(piece.triangles.length / 3);
    expect(Math.max(...flat.trianglePct)).toBe(flat.stretch.maxPct);
  });

  it('reads a piece from its visible side: reversing the winding mirrors the pattern', () => {
    const piece = gridPiece(6, 10, (x, y) => 0.004 * (x - 30) ** 2 + 0.001 * x * y);
    const reversed: TriMesh = {
      positions: piece.positions,
      triangles: Uint32Array.from(piece.triangles, (_, i) => piece.triangles[i - (i % 3) + ((3 - (i % 3)) % 3)]),
    };
    const a = flattenPiece(piece);
    const b = flattenPiece(reversed);
    expect(b.flipped).toBe(0);
    for (const area of signedAreas(b.uv, reversed.triangles)) expect(area).toBeGreaterThan(0);
    // Same edge lengths (mirror images), same stretch.
    expect(b.stretch.maxPct).toBeCloseTo(a.stretch.maxPct, 6);
    for (let h = 0; h < piece.triangles.length; h += 5) {
      const u = piece.triangles[h];
      const v = piece.triangles[h - (h % 3) + ((h % 3) + 1) % 3];
      expect(length2(b.uv, u, v)).toBeCloseTo(length2(a.uv, u, v), 6);
    }
  });

  it('is deterministic', () => {
    const piece = sphereGore(50, 5, 16, 4);
    const a = flattenPiece(piece);
    const b = flattenPiece(piece);
    expect(Array.from(b.uv)).toEqual(Array.from(a.uv));
    expect(b.stretch).toEqual(a.stretch);
  });

  it('caps ARAP rounds by arapIterations and maxMillis', () => {
    const piece = sphereGore(100, 4, 24, 6);
    const none = flattenPiece(piece, { arapIterations: 0 });
    const full = flattenPiece(piece);
    // Zero rounds leaves the area-scaled conformal map, whose stretch ARAP then lowers (Liu et al. 2008, §5).
    expect(full.stretch.rmsPct).toBeLessThan(none.stretch.rmsPct);
    const tight = flattenPiece(piece, { maxMillis: 1e-9 });
    expect(tight.stretch.rmsPct).toBeGreaterThan(full.stretch.rmsPct);
  });
});

describe('flattenPiece never inverts a triangle', () => {
  /** icoSphere(100, 3) without the triangles whose corners all lie above height `zCut`. */
  const sphereMinusCap = (zCut: number): TriMesh => {
    const sphere = icoSphere(100, 3);
    const keep: number[] = [];
    for (let f = 0; f < sphere.triangles.length / 3; f++) {
      const c = [0, 1, 2].map((k) => sphere.triangles[3 * f + k]);
      if (!c.every((v) => sphere.positions[3 * v + 2] > zCut)) keep.push(...c);
    }
    return dropUnusedVertices({ positions: sphere.positions, triangles: Uint32Array.from(keep) }).piece;
  };
  it.each([
    ['the demo helmet shell (dome and brim as one piece)', () => helmetShell()],
    ['a half-sphere lune (1/2 gore)', () => sphereGore(100, 2, 30, 12)],
    ['a hemisphere', () => sphereMinusCap(-1e-9)],
    ['a sphere with a small cap cut off', () => sphereMinusCap(95)],
    ['a strongly saddle-shaped sheet', () => gridPiece(12, 5, (x, y) => 0.02 * (x - 30) * (y - 30))],
  ])('on %s', (_, make) => {
    // A flattening is only usable if every triangle keeps its orientation (Liu et al. 2008 §4 on
    // foldovers); stretch may be large on these doubly curved pieces, but never a fold.
    const piece = make();
    const flat = flattenPiece(piece);
    expect(flat.flipped).toBe(0);
    for (const a of signedAreas(flat.uv, piece.triangles)) expect(a).toBeGreaterThan(0);
    expect(Number.isFinite(flat.stretch.maxPct)).toBe(true);
  });
});

describe('flattenPiece refuses what cannot lie flat, saying why and where', () => {
  it('a closed piece', () => {
    expectGeometryError(() => flattenPiece(icoSphere(50, 1)), 'FLATTEN_FAILED', 'piece has no boundary: add a seam that cuts it open');
  });
  it('a piece in two parts', () => {
    const a = gridPiece(2, 1);
    const positions = new Float64Array(2 * a.positions.length);
    positions.set(a.positions);
    positions.set(a.positions.map((c, i) => (i % 3 === 2 ? c + 5 : c)), a.positions.length);
    const triangles = Uint32Array.from([...a.triangles, ...Array.from(a.triangles, (v) => v + 9)]);
    expectGeometryError(() => flattenPiece({ positions, triangles }), 'FLATTEN_FAILED', /separate parts \(triangle 8/);
  });
  it('an edge shared by three triangles', () => {
    const positions = Float64Array.of(0, 0, 0, 1, 0, 0, 0, 1, 0, 0, -1, 0, 0, 0, 1);
    const triangles = Uint32Array.of(0, 1, 2, 1, 0, 3, 0, 1, 4);
    expectGeometryError(() => flattenPiece({ positions, triangles }), 'FLATTEN_FAILED', /edge 0–1 is shared by more than two triangles/);
  });
  it('a zero-area triangle, a non-finite coordinate, an unused vertex, inconsistent winding', () => {
    const grid = gridPiece(2, 1);
    const squashed = Float64Array.from(grid.positions);
    squashed[3 * 1] = 0.25; // vertex 1 onto the segment from vertex 0 (0, 0) to vertex 4 (1, 1): triangle 0 collapses
    squashed[3 * 1 + 1] = 0.25;
    expectGeometryError(() => flattenPiece({ positions: squashed, triangles: grid.triangles }), 'FLATTEN_FAILED', /triangle 0 has zero area/);
    const nan = Float64Array.from(grid.positions);
    nan[3 * 5 + 2] = NaN;
    expectGeometryError(() => flattenPiece({ positions: nan, triangles: grid.triangles }), 'FLATTEN_FAILED', /vertex 5 has a non-finite coordinate/);
    const extra = new Float64Array(grid.positions.length + 3);
    extra.set(grid.positions);
    expectGeometryError(() => flattenPiece({ positions: extra, triangles: grid.triangles }), 'FLATTEN_FAILED', /vertex 9 belongs to no triangle/);
    const wound = Uint32Array.from(grid.triangles);
    [wound[4], wound[5]] = [wound[5], wound[4]];
    expectGeometryError(() => flattenPiece({ positions: grid.positions, triangles: wound }), 'FLATTEN_FAILED', /wound in opposite directions/);
  });
  it('bad options', () => {
    const grid = gridPiece(2, 1);
    expectGeometryError(() => flattenPiece(grid, { arapIterations: -1 }), 'FLATTEN_FAILED', /arapIterations must be/);
    expectGeometryError(() => flattenPiece(grid, { maxMillis: 0 }), 'FLATTEN_FAILED', /maxMillis must be/);
  });
});
