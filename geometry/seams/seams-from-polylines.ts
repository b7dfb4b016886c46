import type { TriMesh } from '../mesh/tri-mesh';
import { buildEdgeGraph, findEdge } from './edge-graph';
import { addSeamEdge, type SeamMask } from './seam-mask';
import { seamPath } from './seam-path';

/** Something about a seam polyline that did not map straight onto mesh edges. */
export interface SeamProblem {
  /** Index of the polyline in the input list. */
  polyline: number;
  /** Index of the step (from point `step` to point `step + 1`). */
  step: number;
  kind: 'not-an-edge' | 'no-path' | 'bad-vertex';
  from: number;
  to: number;
  /** For 'not-an-edge': the vertex path that was used instead. */
  path?: Uint32Array;
  /** Human-readable description of the problem and what was done. */
  message: string;
}

/**
 * Returns the SeamMask of seam polylines given as vertex lists (the OBJ file's `l` lines), plus the problems
 * met. A step between two vertices that share an edge marks that edge. A step between vertices that do not
 * share an edge follows the shortest edge path between them (seamPath) and is reported as 'not-an-edge'; a
 * step between unconnected vertices is reported as 'no-path' and skipped; an index outside the mesh as
 * 'bad-vertex'. `mesh` positions mm, `twin` from buildTwins, `polylines` Uint32Array vertex lists.
 */
export function seamsFromPolylines(mesh: TriMesh, twin: Int32Array, polylines: readonly Uint32Array[]): { mask: SeamMask; problems: SeamProblem[] } {
  const V = mesh.positions.length / 3;
  const mask = new Uint8Array(mesh.triangles.length);
  const problems: SeamProblem[] = [];
  const graph = buildEdgeGraph(mesh, twin);
  polylines.forEach((line, li) => {
    for (let s = 0; s + 1 < line.length; s++) {
      const a = line[s];
      const b = line[s + 1];
      if (a >= V || b >= V) {
        problems.push({ polyline: li, step: s, kind: 'bad-vertex', from: a, to: b, message: `seam line ${li + 1}, step ${s + 1}: vertex ${a >= V ? a : b} is not in the mesh (it has ${V})` });
        continue;
      }
      if (a === b) continue;
      const h = findEdge(graph, a, b);
      if (h >= 0) {
        addSeamEdge(mask, twin, h);
        continue;
      }
      const path = seamPath(mesh, twin, a, b, { graph });
      if (!path) {
        problems.push({ polyline: li, step: s, kind: 'no-path', from: a, to: b, message: `seam line ${li + 1}, step ${s + 1}: vertices ${a} and ${b} are on parts of the model that do not connect; the step was skipped` });
        continue;
      }
      for (let k = 0; k + 1 < path.length; k++) addSeamEdge(mask, twin, findEdge(graph, path[k], path[k + 1]));
      problems.push({ polyline: li, step: s, kind: 'not-an-edge', from: a, to: b, path, message: `seam line ${li + 1}, step ${s + 1}: vertices ${a} and ${b} share no edge; the seam follows the shortest edge path through ${path.length - 2} more vertices` });
    }
  });
  return { mask, problems };
}
