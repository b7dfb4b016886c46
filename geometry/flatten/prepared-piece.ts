import { amdOrdering } from '../sparse/fill-ordering';
import type { SparseSymmetricMatrix } from '../sparse/sparse-symmetric-matrix';
import { cotanLaplacian } from './cotan-laplacian';
import { cotanWeights } from './cotan-weights';
import { pieceTopology, type PieceTopology } from './piece-topology';

/**
 * What LSCM and ARAP both need from a piece, computed once: checked topology, per-half-edge cotangents,
 * the cotangent Laplacian and a fill-reducing order of its vertices (so flattenPiece pays for them once).
 */
export interface PreparedPiece {
  positions: Float64Array;
  triangles: Uint32Array;
  topo: PieceTopology;
  cot: Float64Array;
  laplacian: SparseSymmetricMatrix;
  /** Fill-reducing order of all vertices (amdOrdering of the Laplacian). */
  vertexOrder: Int32Array;
}

/**
 * Returns the shared precomputation for a piece (`positions` 3V mm, `triangles` 3F). Throws GeometryError
 * FLATTEN_FAILED as pieceTopology does.
 */
export function preparePiece(positions: Float64Array, triangles: Uint32Array): PreparedPiece {
  const topo = pieceTopology(positions, triangles);
  const cot = cotanWeights(positions, triangles);
  const laplacian = cotanLaplacian(triangles, cot, positions.length / 3);
  return { positions, triangles, topo, cot, laplacian, vertexOrder: amdOrdering(laplacian) };
}

/**
 * Returns `order` restricted to the kept vertices, renumbered: `index[v]` is the new number of vertex v or
 * −1 if it was removed (pinned); `size` the number kept. Dropping a few vertices from a nested-dissection
 * order leaves the separators in place, so the fill stays as low.
 */
export function restrictOrder(order: Int32Array, index: Int32Array, size: number): Int32Array {
  const out = new Int32Array(size);
  let k = 0;
  for (let i = 0; i < order.length; i++) {
    const j = index[order[i]];
    if (j >= 0) out[k++] = j;
  }
  return out;
}
