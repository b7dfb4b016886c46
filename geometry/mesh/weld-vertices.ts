/** Result of welding: where each old vertex went and the surviving positions. */
export interface WeldResult {
  /** Per input vertex, its index in `positions`. */
  remap: Uint32Array;
  /** Surviving vertices, Float64Array(3V'), each at its first input vertex's position. */
  positions: Float64Array;
}

const P1 = 73856093;
const P2 = 19349663;
const P3 = 83492791;

/**
 * Welds vertices closer than `toleranceMm`: each vertex joins the first earlier surviving vertex within the
 * tolerance, else survives itself (greedy, in input order, so the result is deterministic). A uniform grid
 * of cell size = tolerance is hashed into a power-of-two table (spatial hashing, Teschner et al. 2003,
 * "Optimized Spatial Hashing for Collision Detection of Deformable Objects", with their three primes), and
 * the 27 cells around a vertex are searched. `positions` Float64Array(3V) in mm; tolerance ≥ 0 (0 welds
 * only exactly equal points). O(V) expected time.
 */
export function weldVertices(positions: Float64Array, toleranceMm: number): WeldResult {
  const V = positions.length / 3;
  const cell = toleranceMm > 0 ? toleranceMm : 1;
  const tol2 = toleranceMm * toleranceMm;
  let size = 1;
  while (size < 2 * V) size <<= 1;
  const mask = size - 1;
  const head = new Int32Array(size).fill(-1);
  const next = new Int32Array(V);
  const out = new Float64Array(positions.length);
  const remap = new Uint32Array(V);
  let kept = 0;
  const bucket = (ix: number, iy: number, iz: number) =>
    (Math.imul(ix | 0, P1) ^ Math.imul(iy | 0, P2) ^ Math.imul(iz | 0, P3)) & mask;
  for (let v = 0; v < V; v++) {
    const x = positions[3 * v];
    const y = positions[3 * v + 1];
    const z = positions[3 * v + 2];
    const ix = Math.floor(x / cell);
    const iy = Math.floor(y / cell);
    const iz = Math.floor(z / cell);
    let found = -1;
    for (let dx = -1; dx <= 1 && found < 0; dx++)
      for (let dy = -1; dy <= 1 && found < 0; dy++)
        for (let dz = -1; dz <= 1 && found < 0; dz++) {
          for (let k = head[bucket(ix + dx, iy + dy, iz + dz)]; k >= 0; k = next[k]) {
            const ex = out[3 * k] - x;
            const ey = out[3 * k + 1] - y;
            const ez = out[3 * k + 2] - z;
            if (ex * ex + ey * ey + ez * ez <= tol2) {
              found = k;
              break;
            }
          }
        }
    if (found >= 0) {
      remap[v] = found;
      continue;
    }
    out[3 * kept] = x;
    out[3 * kept + 1] = y;
    out[3 * kept + 2] = z;
    const b = bucket(ix, iy, iz);
    next[kept] = head[b];
    head[b] = kept;
    remap[v] = kept++;
  }
  return { remap, positions: out.slice(0, 3 * kept) };
}
