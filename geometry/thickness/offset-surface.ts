/**
 * Which surface of the foam sheet a pattern follows. The sculpt is the visible outer skin; a sheet of
 * thickness t bent to that shape has its middle surface t/2 and its inner face t further in. On a curved
 * piece these surfaces have different lengths (a tube of radius r: 2πr outside, 2π(r − t) inside), so the
 * pattern is cut to the surface the maker chooses.
 */
import type { PatternSurface } from '../pattern/pattern-doc';

/** Inward offset of a surface, mm: 0 for the outer skin, t/2 for the mid-surface, t for the inner face. */
export function surfaceOffsetMm(surface: PatternSurface, thicknessMm: number): number {
  if (surface === 'outer') return 0;
  return surface === 'mid' ? thicknessMm / 2 : thicknessMm;
}

/**
 * Moves every vertex inward: p − offsetMm·direction.
 *
 * @param positions Float64Array(3V), mm, the outer skin.
 * @param normals Float64Array(3V), outward offset directions: unit vertex normals (angle-weighted, Thürmer &
 *   Wüthrich 1998, so the offset of a smooth surface does not depend on how it was triangulated), or the
 *   crease-aware directions of offsetDirections, longer than 1 at creases and corners.
 * @param offsetMm distance to move inward, mm (≥ 0).
 * @returns a new Float64Array(3V). With unit normals, exact for a cylinder or sphere (the offset of a circle of
 *   radius r by d is the concentric circle of radius r − d) but short at sharp creases; offsetDirections fixes
 *   the creases.
 */
export function offsetSurface(positions: Float64Array, normals: Float64Array, offsetMm: number): Float64Array {
  const out = new Float64Array(positions.length);
  for (let i = 0; i < positions.length; i++) out[i] = positions[i] - offsetMm * normals[i];
  return out;
}
