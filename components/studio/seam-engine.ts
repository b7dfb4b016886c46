/**
 * The geometry the studio asks for while seams are marked, prepared once per working mesh: seam paths between
 * picks, crease suggestions, the symmetry plane and mirror copies, and automatic seams from a stretch budget.
 * It runs inside the studio's web worker (seam-worker.ts) or, where workers are unavailable, on the page itself;
 * both call the same functions, so they answer alike.
 */
import type { SeamLine, SymmetryPlane } from '../../db/schema-sculpts';
import { buildTwins } from '../../geometry/mesh/half-edges';
import { meanEdgeLength } from '../../geometry/mesh/mesh-measures';
import type { TriMesh } from '../../geometry/mesh/tri-mesh';
import { buildVertexGrid, type VertexGrid } from '../../geometry/mesh/vertex-grid';
import { autoSeams } from '../../geometry/seams/auto-seams';
import { creaseSeams } from '../../geometry/seams/crease-seams';
import { buildEdgeGraph } from '../../geometry/seams/edge-graph';
import { findSymmetryPlane } from '../../geometry/seams/mirror-seams';
import { seamPathFinder, type SeamPathFinder } from '../../geometry/seams/seam-path-fast';
import { seamMaskLines } from './seam-mask-lines';
import { mirrorSeamLine } from './seam-set-edits';

/** A request to the seam engine; each names its kind and carries what that kind needs. */
export type SeamEngineRequest =
  | { kind: 'path'; from: number; to: number }
  | { kind: 'creases'; minDeviationDeg: number }
  | { kind: 'symmetry' }
  | { kind: 'mirror'; seams: SeamLine[]; plane: SymmetryPlane }
  | { kind: 'auto'; stretchBudgetPct: number; symmetric: boolean };

/** The answer to each request kind. */
export interface SeamEngineAnswers {
  path: number[] | null;
  creases: number[][];
  symmetry: SymmetryPlane | null;
  mirror: (SeamLine | null)[];
  auto: number[][];
}

/** A working mesh prepared for seam requests. */
export interface PreparedSeamMesh {
  mesh: TriMesh;
  twin: Int32Array;
  findPath: SeamPathFinder;
  /** Built on the first mirror request. */
  grid: VertexGrid | null;
  meanEdgeMm: number;
}

/**
 * Prepares `positions` (Float32Array or Float64Array(3V), mm) and `triangles` (Uint32Array(3F)) for seam
 * requests: half-edge twins, the edge graph and the A* path finder (geometry/seams/seam-path-fast.ts).
 */
export function prepareSeamMesh(positions: ArrayLike<number>, triangles: Uint32Array): PreparedSeamMesh {
  const mesh: TriMesh = { positions: Float64Array.from(positions), triangles };
  const twin = buildTwins(triangles, mesh.positions.length / 3);
  const findPath = seamPathFinder(mesh, twin, {}, buildEdgeGraph(mesh, twin));
  return { mesh, twin, findPath, grid: null, meanEdgeMm: meanEdgeLength(mesh.positions, triangles) };
}

/**
 * Answers one request on a prepared mesh. Mirror images snap to the nearest vertex within half the mean edge
 * length (the engine's mirrorSeams uses the same tolerance). Geometry errors (a vertex out of range, a bad
 * option) are thrown as the engine's GeometryError with its message.
 */
export function answerSeamRequest<K extends SeamEngineRequest['kind']>(
  prepared: PreparedSeamMesh,
  request: Extract<SeamEngineRequest, { kind: K }>,
): SeamEngineAnswers[K] {
  const r = request as SeamEngineRequest;
  const { mesh, twin } = prepared;
  switch (r.kind) {
    case 'path': {
      const p = prepared.findPath(r.from, r.to);
      return (p ? Array.from(p) : null) as SeamEngineAnswers[K];
    }
    case 'creases':
      return seamMaskLines(creaseSeams(mesh.positions, mesh.triangles, twin, r.minDeviationDeg), mesh.triangles, twin) as SeamEngineAnswers[K];
    case 'symmetry': {
      const plane = findSymmetryPlane(mesh);
      return (plane ? { normal: plane.normal, offsetMm: plane.offset } : null) as SeamEngineAnswers[K];
    }
    case 'mirror': {
      const grid = (prepared.grid ??= buildVertexGrid(mesh.positions));
      const P = mesh.positions;
      const l = Math.hypot(...r.plane.normal);
      const n = r.plane.normal.map((x) => x / l);
      const offset = r.plane.offsetMm / l;
      const snap = 0.5 * prepared.meanEdgeMm;
      const mirror = (v: number) => {
        const d = 2 * (P[3 * v] * n[0] + P[3 * v + 1] * n[1] + P[3 * v + 2] * n[2] - offset);
        return grid.nearest(P[3 * v] - d * n[0], P[3 * v + 1] - d * n[1], P[3 * v + 2] - d * n[2], snap);
      };
      const find = (a: number, b: number) => prepared.findPath(a, b);
      return r.seams.map((s) => mirrorSeamLine(s, mirror, find)) as SeamEngineAnswers[K];
    }
    case 'auto': {
      const mask = autoSeams(mesh, twin, { stretchBudgetPct: r.stretchBudgetPct, symmetric: r.symmetric });
      return seamMaskLines(mask, mesh.triangles, twin) as SeamEngineAnswers[K];
    }
  }
}
