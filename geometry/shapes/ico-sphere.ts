import type { TriMesh } from '../mesh/tri-mesh';
import { requireCount, requirePositive } from './mesh-builder';
import { platonicSolid } from './platonic-solid';

/**
 * Returns a geodesic sphere of radius `radiusMm` centred on the origin: an icosahedron whose triangles are
 * split into four `subdivisions` times (0 gives the icosahedron itself), new vertices pushed onto the sphere.
 * 20·4^k triangles, 10·4^k + 2 vertices; closed, genus 0, outward counter-clockwise triangles.
 */
export function icoSphere(radiusMm: number, subdivisions: number): TriMesh {
  requirePositive('radiusMm', radiusMm);
  requireCount('subdivisions', subdivisions, 0);
  const base = platonicSolid('icosahedron', 1);
  const pos: number[] = [];
  const push = (x: number, y: number, z: number): number => {
    const l = Math.hypot(x, y, z);
    pos.push((x / l) * radiusMm, (y / l) * radiusMm, (z / l) * radiusMm);
    return pos.length / 3 - 1;
  };
  for (let v = 0; v < base.positions.length / 3; v++)
    push(base.positions[3 * v], base.positions[3 * v + 1], base.positions[3 * v + 2]);
  let tris = Array.from(base.triangles);
  for (let level = 0; level < subdivisions; level++) {
    const mid = new Map<number, number>();
    const V = pos.length / 3;
    const midpoint = (a: number, b: number): number => {
      const key = Math.min(a, b) * (V + 1) + Math.max(a, b);
      let m = mid.get(key);
      if (m === undefined) {
        m = push(pos[3 * a] + pos[3 * b], pos[3 * a + 1] + pos[3 * b + 1], pos[3 * a + 2] + pos[3 * b + 2]);
        mid.set(key, m);
      }
      return m;
    };
    const next: number[] = [];
    for (let t = 0; t < tris.length; t += 3) {
      const [a, b, c] = [tris[t], tris[t + 1], tris[t + 2]];
      const ab = midpoint(a, b);
      const bc = midpoint(b, c);
      const ca = midpoint(c, a);
      next.push(a, ab, ca, b, bc, ab, c, ca, bc, ab, bc, ca);
    }
    tris = next;
  }
  return { positions: Float64Array.from(pos), triangles: Uint32Array.from(tris) };
}
