import { approximateMinimumDegree } from './approximate-minimum-degree';
import type { SparseSymmetricMatrix } from './sparse-symmetric-matrix';

/**
 * Returns the engine's fill-reducing elimination order for `a` (perm[k] = original index of pivot k):
 * approximate minimum degree (Amestoy, Davis & Duff 1996; see approximateMinimumDegree). On the surface
 * meshes the engine factors it gave less fill and ran 3–4× faster than the breadth-first nested dissection
 * kept in nested-dissection.ts (bench/sparse.bench.ts reports both).
 */
export function amdOrdering(a: SparseSymmetricMatrix): Int32Array {
  return approximateMinimumDegree(a);
}
