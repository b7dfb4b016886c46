import { GeometryError } from '../errors';
import { diagonal, multiply, type SparseSymmetricMatrix } from './sparse-symmetric-matrix';

export interface PcgOptions {
  /** Stop when ‖b − A·x‖ ≤ tol·‖b‖ (default 1e-10). */
  tol?: number;
  /** Iteration cap (default 10·n). */
  maxIter?: number;
  /** 'jacobi' divides the residual by diag(A) (default); 'none' is plain conjugate gradients. */
  preconditioner?: 'jacobi' | 'none';
  /** Starting guess (length n), zero by default. */
  x0?: Float64Array;
}

export interface PcgResult {
  x: Float64Array;
  iterations: number;
  /** ‖b − A·x‖ / ‖b‖ at exit. */
  relativeResidual: number;
}

/**
 * Solves A·x = b for a symmetric positive definite `a` by preconditioned conjugate gradients
 * (Hestenes & Stiefel 1952; Saad, "Iterative Methods for Sparse Linear Systems", 2nd ed. 2003,
 * Algorithm 9.1). The fallback when a factorization is not wanted. Throws GeometryError NO_CONVERGENCE
 * (with the residual reached) when maxIter runs out, NOT_POSITIVE_DEFINITE when a search direction has
 * non-positive curvature, BAD_OPTION for a bad argument.
 */
export function pcgSolve(a: SparseSymmetricMatrix, b: Float64Array, opts: PcgOptions = {}): PcgResult {
  const n = a.n;
  const tol = opts.tol ?? 1e-10;
  const maxIter = opts.maxIter ?? 10 * n;
  if (b.length !== n) throw new GeometryError('BAD_OPTION', `right-hand side has length ${b.length}, matrix is ${n}×${n}`);
  if (!(tol > 0)) throw new GeometryError('BAD_OPTION', `pcg tolerance must be positive, got ${tol}`);
  if (!(maxIter >= 0)) throw new GeometryError('BAD_OPTION', `pcg maxIter must be non-negative, got ${maxIter}`);
  const invDiag = new Float64Array(n).fill(1);
  if ((opts.preconditioner ?? 'jacobi') === 'jacobi') {
    const dg = diagonal(a);
    for (let i = 0; i < n; i++) {
      if (!(dg[i] > 0)) {
        throw new GeometryError('NOT_POSITIVE_DEFINITE', `diagonal entry ${dg[i]} at column ${i} is not positive`);
      }
      invDiag[i] = 1 / dg[i];
    }
  }
  const x = opts.x0 ? Float64Array.from(opts.x0) : new Float64Array(n);
  const r = new Float64Array(n);
  multiply(a, x, r);
  for (let i = 0; i < n; i++) r[i] = b[i] - r[i];
  let bNorm = 0;
  for (let i = 0; i < n; i++) bNorm += b[i] * b[i];
  bNorm = Math.sqrt(bNorm);
  if (bNorm === 0) return { x: new Float64Array(n), iterations: 0, relativeResidual: 0 };
  const z = new Float64Array(n);
  const p = new Float64Array(n);
  const ap = new Float64Array(n);
  let rz = 0;
  for (let i = 0; i < n; i++) {
    z[i] = r[i] * invDiag[i];
    p[i] = z[i];
    rz += r[i] * z[i];
  }
  let rNorm = norm(r);
  let it = 0;
  while (rNorm > tol * bNorm) {
    if (it >= maxIter) {
      throw new GeometryError(
        'NO_CONVERGENCE',
        `conjugate gradients stopped after ${it} iterations at relative residual ${(rNorm / bNorm).toExponential(2)} (asked ${tol})`,
      );
    }
    multiply(a, p, ap);
    let pAp = 0;
    for (let i = 0; i < n; i++) pAp += p[i] * ap[i];
    if (!(pAp > 0)) {
      throw new GeometryError('NOT_POSITIVE_DEFINITE', `matrix is not positive definite: pᵀAp = ${pAp} at iteration ${it}`);
    }
    const alpha = rz / pAp;
    let rzNew = 0;
    for (let i = 0; i < n; i++) {
      x[i] += alpha * p[i];
      r[i] -= alpha * ap[i];
      z[i] = r[i] * invDiag[i];
      rzNew += r[i] * z[i];
    }
    const beta = rzNew / rz;
    rz = rzNew;
    for (let i = 0; i < n; i++) p[i] = z[i] + beta * p[i];
    rNorm = norm(r);
    it++;
  }
  return { x, iterations: it, relativeResidual: rNorm / bNorm };
}

function norm(v: Float64Array): number {
  let s = 0;
  for (let i = 0; i < v.length; i++) s += v[i] * v[i];
  return Math.sqrt(s);
}
