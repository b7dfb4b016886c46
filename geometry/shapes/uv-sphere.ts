import type { TriMesh } from '../mesh/tri-mesh';
import { requireCount, requirePositive } from './mesh-builder';

/**
 * Returns a closed latitude/longitude sphere of radius `radiusMm` centred on the origin: poles on the z axis,
 * `segments` ≥ 3 meridians and `rings` ≥ 2 latitude bands (rings − 1 parallels plus the two pole vertices).
 * Outward counter-clockwise triangles; genus 0.
 */
export function uvSphere(radiusMm: number, segments: number, rings: number): TriMesh {
  requirePositive('radiusMm', radiusMm);
  requireCount('segments', segments, 3);
  requireCount('rings', rings, 2);
  const parallels = rings - 1;
  const V = parallels * segments + 2;
  const positions = new Float64Array(3 * V);
  for (let k = 0; k < parallels; k++) {
    const polar = (Math.PI * (k + 1)) / rings;
    for (let s = 0; s < segments; s++) {
      const az = (2 * Math.PI * s) / segments;
      const o = 3 * (k * segments + s);
      positions[o] = radiusMm * Math.sin(polar) * Math.cos(az);
      positions[o + 1] = radiusMm * Math.sin(polar) * Math.sin(az);
      positions[o + 2] = radiusMm * Math.cos(polar);
    }
  }
  const north = V - 2;
  const south = V - 1;
  positions[3 * north + 2] = radiusMm;
  positions[3 * south + 2] = -radiusMm;
  const triangles = new Uint32Array(3 * (2 * segments + 2 * segments * (parallels - 1)));
  let w = 0;
  for (let s = 0; s < segments; s++) {
    const s1 = (s + 1) % segments;
    triangles.set([north, s, s1], w);
    w += 3;
    const last = (parallels - 1) * segments;
    triangles.set([south, last + s1, last + s], w);
    w += 3;
  }
  for (let k = 0; k + 1 < parallels; k++) {
    for (let s = 0; s < segments; s++) {
      const a = k * segments + s;
      const b = k * segments + ((s + 1) % segments);
      triangles.set([a, b + segments, b, a, a + segments, b + segments], w);
      w += 6;
    }
  }
  return { positions, triangles };
}
