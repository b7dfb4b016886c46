/**
 * The studio's seam-editing logic: undo/redo history, picks joined along mesh edges, mirror copies, erasing,
 * accepted suggestions and seams as polylines from an engine seam mask. Expected values come from the meshes'
 * construction (a flat grid whose shortest edge paths are known in closed form, a cube's 12 edges and 8
 * corners of degree 3 — Euler's polyhedron formula V − E + F = 2 with V = 8, F = 6) and from the usual
 * semantics of an undo stack (common practice).
 */
import { describe, expect, it } from 'vitest';
import type { SeamLine } from '../../../db/schema-sculpts';
import { buildTwins } from '../../../geometry/mesh/half-edges';
import type { TriMesh } from '../../../geometry/mesh/tri-mesh';
import { creaseSeams } from '../../../geometry/seams/crease-seams';
import { emptySeamMask, addSeamEdge } from '../../../geometry/seams/seam-mask';
import { platonicSolid, uvSphere } from '../../../geometry/shapes';
import { answerSeamRequest, prepareSeamMesh } from '../../../components/studio/seam-engine';
import { pushHistory, redoHistory, resetHistory, startHistory, undoHistory } from '../../../components/studio/seam-history';
import { seamMaskLines } from '../../../components/studio/seam-mask-lines';
import {
  acceptSuggestions,
  addSeam,
  applySymmetry,
  eraseSeam,
  extendPath,
  pathThroughPicks,
  removeSymmetry,
  seamNearPoint,
  seamsWithoutCopy,
  type SeamSetDraft,
} from '../../../components/studio/seam-set-edits';

/** A flat (n+1)×(n+1) vertex grid of 1 mm cells in z = 0, each cell split by its rising diagonal. v = i + (n+1)·j. */
function grid(n: number): TriMesh {
  const positions: number[] = [];
  const triangles: number[] = [];
  for (let j = 0; j <= n; j++) for (let i = 0; i <= n; i++) positions.push(i, j, 0);
  const id = (i: number, j: number) => i + (n + 1) * j;
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      triangles.push(id(i, j), id(i + 1, j), id(i + 1, j + 1), id(i, j), id(i + 1, j + 1), id(i, j + 1));
    }
  }
  return { positions: Float64Array.from(positions), triangles: Uint32Array.from(triangles) };
}

const N = 10;
const mesh = grid(N);
const prepared = prepareSeamMesh(mesh.positions, mesh.triangles);
const findPath = (a: number, b: number) => answerSeamRequest(prepared, { kind: 'path', from: a, to: b });
const v = (i: number, j: number) => i + (N + 1) * j;
const empty: SeamSetDraft = { seams: [], symmetry: null, stretchBudgetPct: 3 };
const lengthOf = (path: readonly number[]) => {
  let s = 0;
  for (let k = 1; k < path.length; k++) {
    const a = 3 * path[k - 1];
    const b = 3 * path[k];
    s += Math.hypot(mesh.positions[b] - mesh.positions[a], mesh.positions[b + 1] - mesh.positions[a + 1]);
  }
  return s;
};
const seam = (id: string, path: number[]): SeamLine => ({ id, picks: [path[0], path[path.length - 1]], path, source: 'picked' });

describe('seam history', () => {
  it('undoes and redoes in order, an edit clears redo, and undo/redo at either end change nothing', () => {
    let h = startHistory('a');
    h = pushHistory(h, 'b');
    h = pushHistory(h, 'c');
    expect(undoHistory(undoHistory(h)).present).toBe('a');
    expect(undoHistory(undoHistory(undoHistory(h)))).toEqual(undoHistory(undoHistory(h)));
    const back = undoHistory(h);
    expect(back.present).toBe('b');
    expect(redoHistory(back).present).toBe('c');
    const edited = pushHistory(back, 'd');
    expect(edited.future).toEqual([]);
    expect(redoHistory(edited)).toBe(edited);
    expect(pushHistory(edited, edited.present)).toBe(edited);
    expect(resetHistory('z')).toEqual({ past: [], present: 'z', future: [] });
  });
  it('keeps only the newest `limit` past states', () => {
    let h = startHistory(0);
    for (let k = 1; k <= 10; k++) h = pushHistory(h, k, 4);
    expect(h.past).toEqual([6, 7, 8, 9]);
    expect(h.present).toBe(10);
  });
});

describe('seam paths through picks', () => {
  it('joins legs at the picks without repeating them; a grid diagonal of n cells is n·√2 mm long', () => {
    const path = pathThroughPicks([v(0, 0), v(5, 5), v(10, 5)], findPath)!;
    expect(path[0]).toBe(v(0, 0));
    expect(path[path.length - 1]).toBe(v(10, 5));
    expect(new Set(path).size).toBe(path.length);
    // Shortest edge paths on this grid: the diagonal leg is 5√2 mm, the straight leg 5 mm (construction).
    expect(lengthOf(path)).toBeCloseTo(5 * Math.SQRT2 + 5, 9);
    expect(path.indexOf(v(5, 5))).toBeGreaterThan(0);
  });
  it('extends an empty path to the pick itself, and answers null when the engine finds no path', () => {
    expect(extendPath([], 7, findPath)).toEqual([7]);
    expect(extendPath([3], 3, findPath)).toEqual([3]);
    expect(extendPath([0], 5, () => null)).toBeNull();
    expect(pathThroughPicks([0, 5], () => null)).toBeNull();
  });
});

describe('mirror copies, erase and suggestions', () => {
  // The grid is mirror-symmetric in the plane x = 5 mm.
  const plane = { normal: [1, 0, 0] as [number, number, number], offsetMm: 5 };
  const mirrorAsk = (seams: SeamLine[]) => answerSeamRequest(prepared, { kind: 'mirror', seams, plane });

  it('mirrors a seam to x → 10 − x and adds the copy with the seam; erasing either removes both', () => {
    const s = seam('picked-1', pathThroughPicks([v(1, 0), v(1, 6)], findPath)!);
    const [copy] = mirrorAsk([s]);
    expect(copy).not.toBeNull();
    expect(copy!.path).toEqual(s.path.map((x) => v(N - (x % (N + 1)), Math.floor(x / (N + 1)))));
    expect(copy!.source).toBe('mirror');
    const withSym = { ...empty, symmetry: plane };
    const d = addSeam(withSym, s, copy);
    expect(d.seams.map((x) => x.id)).toEqual(['picked-1', 'picked-1~mirror']);
    expect(eraseSeam(d, 'picked-1~mirror').seams).toEqual([]);
    expect(eraseSeam(d, 'picked-1').seams).toEqual([]);
    expect(eraseSeam(d, 'nothing')).toBe(d);
    // Without a plane the copy is not added.
    expect(addSeam(empty, s, copy).seams).toHaveLength(1);
  });

  it('symmetry on mirrors every seam once (a seam on the plane gets no copy); off removes the copies', () => {
    const off = seam('picked-1', pathThroughPicks([v(2, 0), v(2, 4)], findPath)!);
    const on = seam('picked-2', pathThroughPicks([v(5, 0), v(5, 8)], findPath)!);
    const d0 = { ...empty, seams: [off, on] };
    const need = seamsWithoutCopy(d0);
    const d1 = applySymmetry(d0, plane, mirrorAsk(need));
    expect(d1.seams.map((x) => x.id)).toEqual(['picked-1', 'picked-2', 'picked-1~mirror']);
    expect(seamsWithoutCopy(d1).map((x) => x.id)).toEqual(['picked-2']);
    expect(d1.symmetry).toEqual(plane);
    const d2 = removeSymmetry(d1);
    expect(d2.symmetry).toBeNull();
    expect(d2.seams.map((x) => x.id)).toEqual(['picked-1', 'picked-2']);
  });

  it('accepts suggestions as numbered seams, skipping a line already on a seam', () => {
    const a = pathThroughPicks([v(0, 3), v(10, 3)], findPath)!;
    const d = acceptSuggestions({ ...empty, seams: [seam('picked-1', a)] }, [a, [v(0, 7), v(1, 7)], [4]], 'crease');
    expect(d.seams.map((x) => [x.id, x.source])).toEqual([
      ['picked-1', 'picked'],
      ['crease-1', 'crease'],
    ]);
    expect(acceptSuggestions(d, [[v(0, 7), v(1, 7)]], 'crease')).toBe(d);
  });

  it('finds the seam under a click within the tolerance, and none farther away', () => {
    const s1 = seam('picked-1', pathThroughPicks([v(0, 2), v(10, 2)], findPath)!);
    const s2 = seam('picked-2', pathThroughPicks([v(0, 8), v(10, 8)], findPath)!);
    expect(seamNearPoint([s1, s2], mesh.positions, [4.5, 2.3, 0], 0.5)?.id).toBe('picked-1');
    expect(seamNearPoint([s1, s2], mesh.positions, [4.5, 7.6, 0], 0.5)?.id).toBe('picked-2');
    expect(seamNearPoint([s1, s2], mesh.positions, [4.5, 5, 0], 0.5)).toBeNull();
  });
});

describe('seam mask as lines', () => {
  it("gives a cube's 12 crease edges as 12 one-edge lines between its 8 corners of degree 3", () => {
    const cube = platonicSolid('cube', 10);
    const twin = buildTwins(cube.triangles, 8);
    const lines = seamMaskLines(creaseSeams(cube.positions, cube.triangles, twin, 45), cube.triangles, twin);
    expect(lines).toHaveLength(12);
    expect(lines.every((l) => l.length === 2)).toBe(true);
    const keys = new Set(lines.map(([a, b]) => (a < b ? `${a}-${b}` : `${b}-${a}`)));
    expect(keys.size).toBe(12);
  });

  it('gives a closed parallel of a sphere as one loop that ends where it starts', () => {
    const segments = 12;
    const s = uvSphere(10, segments, 6);
    const twin = buildTwins(s.triangles, s.positions.length / 3);
    const z = (k: number) => s.positions[3 * k + 2];
    const mask = emptySeamMask(s.triangles.length / 3);
    // Mark every edge whose two ends sit on the equator (z = 0): the sphere's middle parallel.
    for (let h = 0; h < s.triangles.length; h++) {
      const a = s.triangles[h];
      const b = s.triangles[h - (h % 3) + ((h % 3) + 1) % 3];
      if (Math.abs(z(a)) < 1e-9 && Math.abs(z(b)) < 1e-9) addSeamEdge(mask, twin, h);
    }
    const lines = seamMaskLines(mask, s.triangles, twin);
    expect(lines).toHaveLength(1);
    expect(lines[0]).toHaveLength(segments + 1);
    expect(lines[0][0]).toBe(lines[0][segments]);
  });
});
