import type { TriMesh } from '../mesh/tri-mesh';
import { requireCount, requirePositive } from './mesh-builder';

/**
 * Returns one gore (lune) of a sphere of radius `radiusMm`: the strip between the meridians at longitude 0
 * and 2π/`gores`, from the north pole (0,0,R) to the south pole (0,0,−R). `segmentsAlong` ≥ 2 bands pole to
 * pole, `segmentsAcross` ≥ 1 bands between the meridians. Open mesh (one boundary loop), outward
 * counter-clockwise triangles. Flattened, a gore is πR long and 2πR/gores wide at the equator (Snyder,
 * Map Projections — A Working Manual, USGS PP 1395, sinusoidal projection).
 */
export function sphereGore(
  radiusMm: number,
  gores: number,
  segmentsAlong: number,
  segmentsAcross: number,
): TriMesh {
  requirePositive('radiusMm', radiusMm);
  requireCount('gores', gores, 2);
  requireCount('segmentsAlong', segmentsAlong, 2);
  requireCount('segmentsAcross', segmentsAcross, 1);
  const width = (2 * Math.PI) / gores;
  const cols = segmentsAcross + 1;
  const inner = segmentsAlong - 1;
  const V = inner * cols + 2;
  const positions = new Float64Array(3 * V);
  for (let k = 0; k < inner; k++) {
    const polar = (Math.PI * (k + 1)) / segmentsAlong;
    for (let s = 0; s < cols; s++) {
      const az = (width * s) / segmentsAcross;
      const o = 3 * (k * cols + s);
      positions[o] = radiusMm * Math.sin(polar) * Math.cos(az);
      positions[o + 1] = radiusMm * Math.sin(polar) * Math.sin(az);
      positions[o + 2] = radiusMm * Math.cos(polar);
    }
  }
  const north = V - 2;
  const south = V - 1;
  positions[3 * north + 2] = radiusMm;
  positions[3 * south + 2] = -radiusMm;
  const tris: number[] = [];
  const last = (inner - 1) * cols;
  for (let s = 0; s < segmentsAcross; s++) {
    tris.push(north, s, s + 1);
    tris.push(south, last + s + 1, last + s);
  }
  for (let k = 0; k + 1 < inner; k++) {
    for (let s = 0; s < segmentsAcross; s++) {
      const a = k * cols + s;
      const b = a + 1;
      tris.push(a, b + cols, b, a, a + cols, b + cols);
    }
  }
  return { positions, triangles: Uint32Array.from(tris) };
}
