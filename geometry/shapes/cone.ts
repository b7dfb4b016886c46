import type { TriMesh } from '../mesh/tri-mesh';
import { requireCount, requirePositive } from './mesh-builder';

/**
 * Returns the lateral surface of a right circular cone (no base disc): base circle of radius `radiusMm` in
 * the plane z = 0, apex at (0, 0, heightMm). `segments` ≥ 3 vertices around, `rings` ≥ 1 bands from base to
 * apex (the last band is a fan onto the single apex vertex). Open mesh, outward counter-clockwise triangles.
 * Its development is a circular sector of radius s = √(r² + h²) and angle 360°·r/s (descriptive geometry).
 */
export function cone(radiusMm: number, heightMm: number, segments: number, rings: number): TriMesh {
  requirePositive('radiusMm', radiusMm);
  requirePositive('heightMm', heightMm);
  requireCount('segments', segments, 3);
  requireCount('rings', rings, 1);
  const positions = new Float64Array(3 * (segments * rings + 1));
  for (let k = 0; k < rings; k++) {
    const t = k / rings;
    for (let s = 0; s < segments; s++) {
      const a = (2 * Math.PI * s) / segments;
      const o = 3 * (k * segments + s);
      positions[o] = (1 - t) * radiusMm * Math.cos(a);
      positions[o + 1] = (1 - t) * radiusMm * Math.sin(a);
      positions[o + 2] = t * heightMm;
    }
  }
  const apex = segments * rings;
  positions[3 * apex + 2] = heightMm;
  const triangles = new Uint32Array(3 * (segments * (2 * rings - 1)));
  let w = 0;
  for (let k = 0; k + 1 < rings; k++) {
    for (let s = 0; s < segments; s++) {
      const a = k * segments + s;
      const b = k * segments + ((s + 1) % segments);
      const c = a + segments;
      const d = b + segments;
      triangles.set([a, b, d, a, d, c], w);
      w += 6;
    }
  }
  const top = (rings - 1) * segments;
  for (let s = 0; s < segments; s++) {
    triangles.set([top + s, top + ((s + 1) % segments), apex], w);
    w += 3;
  }
  return { positions, triangles };
}
