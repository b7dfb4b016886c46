import { GeometryError } from '../errors';
import { faceComponents } from '../mesh/connected-components';
import { cornerFans } from '../mesh/corner-fans';
import type { TriMesh } from '../mesh/tri-mesh';

/** One piece cut out of a mesh, as its own small mesh with links back to the whole. */
export interface PieceMesh {
  /** Float64Array(3·Vp) in mm. */
  positions: Float64Array;
  /** Uint32Array(3·Fp), local vertex indices, same corner order as the global faces. */
  triangles: Uint32Array;
  /** Per local triangle, the global face it came from (ascending). */
  faceIds: Uint32Array;
  /** Per local vertex, the global vertex it is a copy of. */
  vertexIds: Uint32Array;
}

/**
 * Cuts a mesh into pieces along seams. Faces joined across a paired edge that is not a seam belong to the
 * same piece. Each piece gets its own vertices: a global vertex becomes one local vertex per fan of the
 * piece's corners around it (cornerFans with the seams blocked), so a vertex on a seam or where sheets touch
 * is duplicated, and a seam that runs inside a single piece — a tube cut along one line, or a dart — opens
 * up into boundary on both of its sides. Pieces are ordered by their smallest global face id; local faces
 * keep ascending global order and local vertices are numbered in order of first use.
 *
 * `mesh` positions mm and triangles Uint32Array(3F); `twin` from buildTwins; `seamMask` Uint8Array(3F) with
 * either or both half-edges of a seam set. Throws GeometryError('BAD_SEAM') when the mask's length is wrong.
 */
export function splitPieces(mesh: TriMesh, twin: Int32Array, seamMask: Uint8Array): PieceMesh[] {
  const { positions, triangles } = mesh;
  if (seamMask.length !== triangles.length || twin.length !== triangles.length) {
    throw new GeometryError('BAD_SEAM', `seam mask (${seamMask.length}) and twin array (${twin.length}) must both have one entry per half-edge (${triangles.length})`);
  }
  const F = triangles.length / 3;
  const comps = faceComponents(twin, seamMask);
  const fans = cornerFans(triangles, twin, seamMask);
  const faceCount = new Uint32Array(comps.count);
  for (let f = 0; f < F; f++) faceCount[comps.faceComponent[f]]++;
  const localOfFan = new Int32Array(fans.fanCount).fill(-1);
  const vertexCount = new Uint32Array(comps.count);
  // First pass: number each piece's fans (local vertices) in order of first use.
  for (let c = 0; c < triangles.length; c++) {
    const fan = fans.fanOfCorner[c];
    if (localOfFan[fan] < 0) localOfFan[fan] = vertexCount[comps.faceComponent[(c / 3) | 0]]++;
  }
  const pieces: PieceMesh[] = [];
  for (let p = 0; p < comps.count; p++) {
    pieces.push({
      positions: new Float64Array(3 * vertexCount[p]),
      triangles: new Uint32Array(3 * faceCount[p]),
      faceIds: new Uint32Array(faceCount[p]),
      vertexIds: new Uint32Array(vertexCount[p]),
    });
  }
  const filled = new Uint32Array(comps.count);
  for (let f = 0; f < F; f++) {
    const p = comps.faceComponent[f];
    const piece = pieces[p];
    const lf = filled[p]++;
    piece.faceIds[lf] = f;
    for (let k = 0; k < 3; k++) {
      const c = 3 * f + k;
      const local = localOfFan[fans.fanOfCorner[c]];
      const v = triangles[c];
      piece.triangles[3 * lf + k] = local;
      piece.vertexIds[local] = v;
      piece.positions[3 * local] = positions[3 * v];
      piece.positions[3 * local + 1] = positions[3 * v + 1];
      piece.positions[3 * local + 2] = positions[3 * v + 2];
    }
  }
  return pieces;
}
