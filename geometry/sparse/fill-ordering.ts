import { nestedDissectionOrdering } from './nested-dissection';
import type { SparseSymmetricMatrix } from './sparse-symmetric-matrix';

/**
 * Returns the engine's fill-reducing elimination order for `a` (perm[k] = original index of pivot k).
 * The contract names it after approximate minimum degree (Amestoy, Davis & Duff 1996, SIAM J. Matrix
 * Anal. Appl. 17); the brief allows nested dissection instead, and that is what runs here
 * (`nestedDissectionOrdering`, George 1973), because on the meshes the engine factors — 2D-like
 * surface pieces — it reaches the same O(n log n) fill with far simpler code.
 */
export function amdOrdering(a: SparseSymmetricMatrix): Int32Array {
  return nestedDissectionOrdering(a);
}
