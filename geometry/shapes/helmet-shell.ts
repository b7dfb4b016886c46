import { GeometryError } from '../errors';
import type { TriMesh } from '../mesh/tri-mesh';
import { requireCount, requirePositive } from './mesh-builder';

/** Size and resolution of the demo helmet shell; every length in millimetres. */
export interface HelmetShellOptions {
  /** Dome width across the ears (x), default 210. */
  widthMm?: number;
  /** Dome length front to back (y), default 240. */
  lengthMm?: number;
  /** Dome height above the brim line (z), default 150. */
  heightMm?: number;
  /** How far the brim reaches out beyond the dome, default 30. */
  brimMm?: number;
  /** How far the brim's outer edge drops below the brim line, default 12. */
  brimDropMm?: number;
  /** Steps around, default 48 (≥ 3). */
  segments?: number;
  /** Bands from crown to brim line, default 16 (≥ 2). */
  rings?: number;
  /** Bands across the brim, default 3 (≥ 1). */
  brimRings?: number;
}

/**
 * Returns the demo helmet: half of an ellipsoid (semi-axes width/2, length/2, height) standing on the plane
 * z = 0, crown at (0, 0, height), with a brim that flares outward and slightly down from the dome's rim.
 * An invented shape for the demo and tests: one open surface (boundary = the brim's outer edge), normals
 * pointing away from the wearer's head (up and out), genus 0.
 */
export function helmetShell(options: HelmetShellOptions = {}): TriMesh {
  const a = (options.widthMm ?? 210) / 2;
  const b = (options.lengthMm ?? 240) / 2;
  const c = options.heightMm ?? 150;
  const brim = options.brimMm ?? 30;
  const drop = options.brimDropMm ?? 12;
  const segments = options.segments ?? 48;
  const rings = options.rings ?? 16;
  const brimRings = options.brimRings ?? 3;
  requirePositive('widthMm', a);
  requirePositive('lengthMm', b);
  requirePositive('heightMm', c);
  requirePositive('brimMm', brim);
  if (!Number.isFinite(drop) || drop < 0) {
    throw new GeometryError('BAD_OPTION', `brimDropMm must be a finite number ≥ 0, got ${String(drop)}`);
  }
  requireCount('segments', segments, 3);
  requireCount('rings', rings, 2);
  requireCount('brimRings', brimRings, 1);
  // Circles from the first parallel below the crown down to the rim (k = 1…rings), then out across the brim.
  const circles = rings + brimRings;
  const positions = new Float64Array(3 * (circles * segments + 1));
  const crown = circles * segments;
  positions[3 * crown + 2] = c;
  for (let k = 1; k <= circles; k++) {
    for (let s = 0; s < segments; s++) {
      const az = (2 * Math.PI * s) / segments;
      const o = 3 * ((k - 1) * segments + s);
      if (k <= rings) {
        const polar = (Math.PI / 2) * (k / rings);
        positions[o] = a * Math.sin(polar) * Math.cos(az);
        positions[o + 1] = b * Math.sin(polar) * Math.sin(az);
        positions[o + 2] = c * Math.cos(polar);
      } else {
        const t = (k - rings) / brimRings;
        const ex = Math.cos(az);
        const ey = Math.sin(az);
        // Push out along the rim ellipse's outward normal so the brim keeps an even width all round.
        const nx = ex / a;
        const ny = ey / b;
        const nl = Math.hypot(nx, ny);
        positions[o] = a * ex + (t * brim * nx) / nl;
        positions[o + 1] = b * ey + (t * brim * ny) / nl;
        positions[o + 2] = -t * t * drop;
      }
    }
  }
  const triangles = new Uint32Array(3 * (segments + 2 * segments * (circles - 1)));
  let w = 0;
  for (let s = 0; s < segments; s++) {
    triangles.set([crown, s, (s + 1) % segments], w);
    w += 3;
  }
  for (let k = 0; k + 1 < circles; k++) {
    for (let s = 0; s < segments; s++) {
      const p = k * segments + s;
      const q = k * segments + ((s + 1) % segments);
      triangles.set([p, q + segments, q, p, p + segments, q + segments], w);
      w += 6;
    }
  }
  return { positions, triangles };
}
