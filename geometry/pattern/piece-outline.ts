/**
 * The cut lines of a flattened piece: its outer boundary and the boundaries of any holes, in the piece's
 * 2D pattern coordinates.
 */
import { signedAreaMm2 } from '../layout/outline-measure';
import { boundaryLoops } from '../mesh/boundary-loops';
import type { PointMm } from './pattern-doc';

export interface PieceOutline {
  /** Outer boundary, counter-clockwise, mm. */
  outline: PointMm[];
  /** Hole boundaries, clockwise, mm. */
  holes: PointMm[][];
  /** The local vertex loops behind `outline` (index 0) and `holes` (1…), in the same order as their points. */
  loops: Uint32Array[];
}

/**
 * Outline and holes of a flattened piece.
 *
 * @param triangles the piece's local Uint32Array(3F).
 * @param twin its local half-edge twins, −1 on the boundary.
 * @param uv Float64Array(2V), mm, triangles counter-clockwise.
 * @returns the loop enclosing the largest area as the outline (made counter-clockwise) and every other loop as
 *   a hole (made clockwise), or null when the piece has no boundary at all (a closed surface).
 */
export function pieceOutline(triangles: Uint32Array, twin: Int32Array, uv: Float64Array): PieceOutline | null {
  const loops = boundaryLoops(triangles, twin);
  if (loops.length === 0) return null;
  const polys = loops.map((loop) => Array.from(loop, (v): PointMm => [uv[2 * v], uv[2 * v + 1]]));
  const areas = polys.map(signedAreaMm2);
  let outer = 0;
  for (let i = 1; i < polys.length; i++) if (Math.abs(areas[i]) > Math.abs(areas[outer])) outer = i;
  const order = [outer, ...polys.map((_, i) => i).filter((i) => i !== outer)];
  const outLoops: Uint32Array[] = [];
  const outPolys: PointMm[][] = [];
  for (const i of order) {
    const wantPositive = i === outer;
    if (areas[i] > 0 !== wantPositive) {
      outPolys.push(polys[i].slice().reverse());
      outLoops.push(loops[i].slice().reverse());
    } else {
      outPolys.push(polys[i]);
      outLoops.push(loops[i]);
    }
  }
  return { outline: outPolys[0], holes: outPolys.slice(1), loops: outLoops };
}
