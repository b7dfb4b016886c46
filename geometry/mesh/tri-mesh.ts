/**
 * A triangle mesh as two flat arrays, as libigl keeps one:
 * - `positions`: Float64Array of length 3·V, vertex v at [3v, 3v+1, 3v+2], millimetres once imported;
 * - `triangles`: Uint32Array of length 3·F, triangle f's corners at [3f, 3f+1, 3f+2], counter-clockwise
 *   seen from outside.
 *
 * Half-edge convention used across the engine: half-edge h = 3f + i runs from corner i of triangle f to
 * corner (i+1) mod 3; `twin[h]` is the opposite half-edge or −1 on a boundary.
 */
export interface TriMesh {
  positions: Float64Array;
  triangles: Uint32Array;
}

/** What an importer returns: the mesh plus what the file said beyond triangles. */
export interface ImportedModel {
  mesh: TriMesh;
  /** Per triangle, an index into `tagNames` (from OBJ `o`/`g`), 0 when untagged. */
  faceTags: Uint32Array;
  /** Tag names; index 0 is the default group (''). */
  tagNames: string[];
  /** Seam polylines from OBJ `l` lines, each a list of vertex indices into `mesh.positions`. */
  seamPolylines: Uint32Array[];
  /** Per-corner texture coordinates when the file had them (length 6·F), else null. */
  cornerUVs: Float64Array | null;
  /** Notes for the maker (e.g. "3 polygons were triangulated"), never errors. */
  notes: string[];
}

/** Number of vertices of `mesh`. */
export const vertexCount = (mesh: TriMesh): number => mesh.positions.length / 3;
/** Number of triangles of `mesh`. */
export const triangleCount = (mesh: TriMesh): number => mesh.triangles.length / 3;
