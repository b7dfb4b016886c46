import { boundingBox } from './mesh-measures';

/** A uniform grid over a point set for nearest-point queries (see buildVertexGrid). */
export interface VertexGrid {
  /** Returns the index of the point nearest to (x, y, z) within `maxDistMm`, or −1 when there is none. */
  nearest(x: number, y: number, z: number, maxDistMm: number): number;
}

/**
 * Buckets the points of `positions` (Float64Array(3V), mm) into a uniform grid of about one point per cell
 * (cells sorted in compressed rows), for nearest-point queries that search outward ring by ring and stop
 * once no closer point can exist. Build O(V); a query visits the cells within `maxDistMm`.
 */
export function buildVertexGrid(positions: Float64Array): VertexGrid {
  const V = positions.length / 3;
  const { min, max } = boundingBox(positions);
  const ext = [max[0] - min[0], max[1] - min[1], max[2] - min[2]];
  const longest = Math.max(ext[0], ext[1], ext[2], 1e-12);
  // Cell size from the box volume per point, never below 1/1000 of the longest side (flat or line-like sets).
  const volume = Math.max(ext[0], longest * 1e-3) * Math.max(ext[1], longest * 1e-3) * Math.max(ext[2], longest * 1e-3);
  const cell = Math.max(Math.cbrt(volume / Math.max(1, V)), longest * 1e-3);
  const dims = ext.map((e) => Math.min(1024, Math.floor(e / cell) + 1));
  const [nx, ny, nz] = dims;
  const cellOf = (x: number, y: number, z: number) => {
    const ix = Math.min(nx - 1, Math.max(0, Math.floor((x - min[0]) / cell)));
    const iy = Math.min(ny - 1, Math.max(0, Math.floor((y - min[1]) / cell)));
    const iz = Math.min(nz - 1, Math.max(0, Math.floor((z - min[2]) / cell)));
    return [ix, iy, iz];
  };
  const start = new Uint32Array(nx * ny * nz + 1);
  const cellIndex = new Uint32Array(V);
  for (let v = 0; v < V; v++) {
    const [ix, iy, iz] = cellOf(positions[3 * v], positions[3 * v + 1], positions[3 * v + 2]);
    cellIndex[v] = ix + nx * (iy + ny * iz);
    start[cellIndex[v] + 1]++;
  }
  for (let c = 0; c < nx * ny * nz; c++) start[c + 1] += start[c];
  const fill = start.slice(0, nx * ny * nz);
  const items = new Uint32Array(V);
  for (let v = 0; v < V; v++) items[fill[cellIndex[v]]++] = v;
  return {
    nearest(x, y, z, maxDistMm) {
      const [cx, cy, cz] = cellOf(x, y, z);
      let best = -1;
      let bestD2 = maxDistMm * maxDistMm;
      const maxRing = Math.min(Math.max(nx, ny, nz), Math.ceil(maxDistMm / cell) + 1);
      for (let r = 0; r <= maxRing; r++) {
        // Any point in ring r is at least (r − 1)·cell away.
        if (best >= 0 && (r - 1) * cell > Math.sqrt(bestD2)) break;
        for (let iz = cz - r; iz <= cz + r; iz++) {
          if (iz < 0 || iz >= nz) continue;
          for (let iy = cy - r; iy <= cy + r; iy++) {
            if (iy < 0 || iy >= ny) continue;
            for (let ix = cx - r; ix <= cx + r; ix++) {
              if (ix < 0 || ix >= nx) continue;
              if (Math.max(Math.abs(ix - cx), Math.abs(iy - cy), Math.abs(iz - cz)) !== r) continue;
              const c = ix + nx * (iy + ny * iz);
              for (let k = start[c]; k < start[c + 1]; k++) {
                const v = items[k];
                const dx = positions[3 * v] - x;
                const dy = positions[3 * v + 1] - y;
                const dz = positions[3 * v + 2] - z;
                const d2 = dx * dx + dy * dy + dz * dz;
                if (d2 <= bestD2) {
                  if (d2 < bestD2 || best < 0 || v < best) best = v;
                  bestD2 = d2;
                }
              }
            }
          }
        }
      }
      return best;
    },
  };
}
