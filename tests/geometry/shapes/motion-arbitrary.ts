import fc from 'fast-check';
import type { MeshTransform } from '../../../geometry/shapes';

/**
 * fast-check arbitraries for the "each geometry test also runs under rotation, translation and scale" rule
 * (STYLE.md §10): a random unit quaternion, a translation up to ±1 m, and a uniform scale from 1/1000 to 1000.
 */
const unit = fc.double({ min: -1, max: 1, noNaN: true });

export const rigidMotion = fc
  .tuple(unit, unit, unit, unit, fc.double({ min: -1000, max: 1000, noNaN: true }), fc.double({ min: -1000, max: 1000, noNaN: true }), fc.double({ min: -1000, max: 1000, noNaN: true }))
  .filter(([x, y, z, w]) => Math.hypot(x, y, z, w) > 0.1)
  .map(([x, y, z, w, tx, ty, tz]): MeshTransform => ({ rotation: [x, y, z, w], translation: [tx, ty, tz] }));

export const scaleFactor = fc.double({ min: -3, max: 3, noNaN: true }).map((e) => 10 ** e);
