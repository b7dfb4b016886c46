import { GeometryError } from '../errors';
import type { TriMesh } from '../mesh/tri-mesh';

/**
 * Checks a generator's size argument and says which one is wrong.
 * Throws GeometryError('BAD_OPTION') unless `value` is a finite number > 0.
 */
export function requirePositive(name: string, value: number): void {
  if (!Number.isFinite(value) || value <= 0) {
    throw new GeometryError('BAD_OPTION', `${name} must be a positive finite number, got ${String(value)}`);
  }
}

/**
 * Checks a generator's count argument (segments, rings, …).
 * Throws GeometryError('BAD_OPTION') unless `value` is an integer ≥ `min`.
 */
export function requireCount(name: string, value: number, min: number): void {
  if (!Number.isInteger(value) || value < min) {
    throw new GeometryError('BAD_OPTION', `${name} must be an integer of at least ${min}, got ${String(value)}`);
  }
}

/** Packs plain number lists into a TriMesh (positions in mm, triangles CCW seen from outside). */
export function meshFromLists(positions: number[], triangles: number[]): TriMesh {
  return { positions: Float64Array.from(positions), triangles: Uint32Array.from(triangles) };
}
