export { fromTriplets, multiply, diagonal, principalSubmatrix, type SparseSymmetricMatrix } from './sparse-symmetric-matrix';
export { amdOrdering } from './fill-ordering';
export { nestedDissectionOrdering } from './nested-dissection';
export { choleskyFactor, CholeskyFactor } from './cholesky';
export { pcgSolve, type PcgOptions, type PcgResult } from './pcg';
