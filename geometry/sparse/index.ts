export { fromTriplets, multiply, diagonal, principalSubmatrix, type SparseSymmetricMatrix } from './sparse-symmetric-matrix';
export { amdOrdering } from './fill-ordering';
export { nestedDissectionOrdering } from './nested-dissection';
export { approximateMinimumDegree } from './approximate-minimum-degree';
export { choleskyFactor, CholeskyFactor } from './cholesky';
export { choleskyFactor2x2, Cholesky2x2Factor } from './block2-cholesky';
export { pcgSolve, type PcgOptions, type PcgResult } from './pcg';
