/**
 * A seam seen from each of its two pieces: the run of each piece's flattened outline that the seam occupies.
 * Print sets draw the seam number and its match-mark ticks along these runs, so both runs are listed in the
 * seam's own 3D direction and a tick at distance s from the start lands on the same point of the sculpt on
 * both pieces.
 */
import type { SeamChain } from '../bevel/seam-chains';
import type { PieceMesh } from '../pieces/split-pieces';
import type { PointMm } from './pattern-doc';

export interface SeamSide {
  piece: number;
  /** Points along the seam in this piece's 2D coordinates, mm, in the seam's direction. */
  path: PointMm[];
  /** Length of `path`, mm. */
  length2d: number;
}

/**
 * Local vertex (within its piece) at corner `corner` of global face `face`.
 *
 * @param triangles the global Uint32Array(3F); pieceOfFace/localFaceOf map a global face to its piece and
 *   local face. Works whether or not the splitter kept the corner order, by matching global vertex ids.
 */
export function localCorner(
  triangles: Uint32Array,
  pieces: PieceMesh[],
  pieceOfFace: Int32Array,
  localFaceOf: Int32Array,
  face: number,
  corner: number,
): number {
  const piece = pieces[pieceOfFace[face]];
  const lf = localFaceOf[face];
  const global = triangles[3 * face + corner];
  for (let k = 0; k < 3; k++) {
    const lv = piece.triangles[3 * lf + ((corner + k) % 3)];
    if (piece.vertexIds[lv] === global) return lv;
  }
  throw new RangeError(`face ${face} has no local copy of vertex ${global}`);
}

/**
 * Both sides of a seam in 2D.
 *
 * @param chain the seam (side-0 half-edges in order; their twins are side 1).
 * @param twin global half-edge twins; `uvOf(piece)` the flattened Float64Array(2V) of each piece, mm.
 * @returns [side 0, side 1], each path n+1 points for n edges, ordered along the chain.
 */
export function seamSides(
  chain: SeamChain,
  triangles: Uint32Array,
  twin: Int32Array,
  pieces: PieceMesh[],
  pieceOfFace: Int32Array,
  localFaceOf: Int32Array,
  uvOf: (piece: number) => Float64Array,
): [SeamSide, SeamSide] {
  const corner = (h: number, end: boolean): number =>
    localCorner(triangles, pieces, pieceOfFace, localFaceOf, (h / 3) | 0, end ? ((h % 3) + 1) % 3 : h % 3);
  const n = chain.halfEdges.length;
  const side = (s: 0 | 1): SeamSide => {
    const piece = s === 0 ? chain.pieces[0] : chain.pieces[1];
    const uv = uvOf(piece);
    const locals: number[] = [];
    for (let k = 0; k < n; k++) {
      const h = chain.halfEdges[k];
      // Side 0 runs with the chain (start of h_k is point k); side 1's twin runs against it (its end is point k).
      locals.push(s === 0 ? corner(h, false) : corner(twin[h], true));
    }
    const last = chain.halfEdges[n - 1];
    locals.push(s === 0 ? corner(last, true) : corner(twin[last], false));
    const path = locals.map((v): PointMm => [uv[2 * v], uv[2 * v + 1]]);
    let length2d = 0;
    for (let k = 0; k < n; k++) length2d += Math.hypot(path[k + 1][0] - path[k][0], path[k + 1][1] - path[k][1]);
    return { piece, path, length2d };
  };
  return [side(0), side(1)];
}
