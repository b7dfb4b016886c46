import type { TriMesh } from '../mesh/tri-mesh';
import { requireCount, requirePositive } from './mesh-builder';

/**
 * Returns an open tube (no end caps): radius `radiusMm`, axis z from z = 0 to z = heightMm, `segments` ≥ 3
 * vertices around and `rings` ≥ 1 bands along the axis. Outward counter-clockwise triangles, two boundary
 * loops. Its development is a 2πr × h rectangle (descriptive geometry).
 */
export function cylinder(radiusMm: number, heightMm: number, segments: number, rings: number): TriMesh {
  requirePositive('radiusMm', radiusMm);
  requirePositive('heightMm', heightMm);
  requireCount('segments', segments, 3);
  requireCount('rings', rings, 1);
  const positions = new Float64Array(3 * segments * (rings + 1));
  for (let k = 0; k <= rings; k++) {
    for (let s = 0; s < segments; s++) {
      const a = (2 * Math.PI * s) / segments;
      const o = 3 * (k * segments + s);
      positions[o] = radiusMm * Math.cos(a);
      positions[o + 1] = radiusMm * Math.sin(a);
      positions[o + 2] = (k / rings) * heightMm;
    }
  }
  const triangles = new Uint32Array(6 * segments * rings);
  let w = 0;
  for (let k = 0; k < rings; k++) {
    for (let s = 0; s < segments; s++) {
      const a = k * segments + s;
      const b = k * segments + ((s + 1) % segments);
      triangles.set([a, b, b + segments, a, b + segments, a + segments], w);
      w += 6;
    }
  }
  return { positions, triangles };
}
