import type { TriMesh } from '../mesh/tri-mesh';
import { requireCount, requirePositive } from './mesh-builder';

/**
 * Returns a closed ring torus centred on the origin around the z axis: distance `majorRadiusMm` (R) from the
 * axis to the tube centre, tube radius `minorRadiusMm` (r < R), `segments` ≥ 3 steps around the axis and
 * `ringSegments` ≥ 3 steps around the tube. Outward counter-clockwise triangles; genus 1 (χ = 0).
 */
export function torus(majorRadiusMm: number, minorRadiusMm: number, segments: number, ringSegments: number): TriMesh {
  requirePositive('majorRadiusMm', majorRadiusMm);
  requirePositive('minorRadiusMm', minorRadiusMm);
  requirePositive('majorRadiusMm − minorRadiusMm', majorRadiusMm - minorRadiusMm);
  requireCount('segments', segments, 3);
  requireCount('ringSegments', ringSegments, 3);
  const positions = new Float64Array(3 * segments * ringSegments);
  for (let i = 0; i < segments; i++) {
    const u = (2 * Math.PI * i) / segments;
    for (let j = 0; j < ringSegments; j++) {
      const v = (2 * Math.PI * j) / ringSegments;
      const o = 3 * (i * ringSegments + j);
      const rho = majorRadiusMm + minorRadiusMm * Math.cos(v);
      positions[o] = rho * Math.cos(u);
      positions[o + 1] = rho * Math.sin(u);
      positions[o + 2] = minorRadiusMm * Math.sin(v);
    }
  }
  const triangles = new Uint32Array(6 * segments * ringSegments);
  let w = 0;
  for (let i = 0; i < segments; i++) {
    const i1 = (i + 1) % segments;
    for (let j = 0; j < ringSegments; j++) {
      const j1 = (j + 1) % ringSegments;
      const a = i * ringSegments + j;
      const b = i1 * ringSegments + j;
      const c = i1 * ringSegments + j1;
      const d = i * ringSegments + j1;
      triangles.set([a, b, c, a, c, d], w);
      w += 6;
    }
  }
  return { positions, triangles };
}
