/**
 * Conservative raster of a polygon on a square grid: every cell the polygon touches (interior or
 * boundary) is set, so two masks that share no cell belong to polygons whose interiors are disjoint.
 * Per row band [y0, y1] a point of the polygon either sees the boundary straight above it inside the
 * band (so it lies in the x-extent of an edge clipped to the band) or stays inside up to y1 (so it
 * lies in the cross-section at y1); the union of both covers the band.
 *
 * rasterizeRingCentres is the looser raster the sheet plan searches on: a cell is set when its centre
 * lies inside the polygon, so masks that share no cell may still overlap by part of a cell; the planner
 * confirms every raster candidate with an exact clipper test (offset-clearance.ts).
 */
import type { PointMm } from '../pattern/pattern-doc';

export interface RasterMask {
  /** Size in cells. */
  widthCells: number;
  heightCells: number;
  /** Per row r, inclusive cell runs as [start0, end0, start1, end1, …]. */
  rows: Int32Array[];
  /** Number of set cells. */
  cellCount: number;
}

/** x-coordinates where the horizontal line at `y` crosses the ring (half-open rule), sorted. */
function crossings(ring: readonly PointMm[], y: number): number[] {
  const xs: number[] = [];
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > y !== yj > y) xs.push(xi + ((y - yi) * (xj - xi)) / (yj - yi));
  }
  return xs.sort((a, b) => a - b);
}

/**
 * Rasterizes `ring` (mm, any winding, already moved so its bounds start at 0,0) on cells of
 * `cellMm`. Returns the mask with its cell runs per row (row 0 at y = 0).
 */
export function rasterizeRing(ring: readonly PointMm[], cellMm: number): RasterMask {
  let maxX = 0;
  let maxY = 0;
  for (const [x, y] of ring) {
    if (x > maxX) maxX = x;
    if (y > maxY) maxY = y;
  }
  const widthCells = Math.max(1, Math.ceil(maxX / cellMm - 1e-9));
  const heightCells = Math.max(1, Math.ceil(maxY / cellMm - 1e-9));
  const rows: Int32Array[] = [];
  let cellCount = 0;
  for (let r = 0; r < heightCells; r++) {
    const y0 = r * cellMm;
    const y1 = (r + 1) * cellMm;
    const spans: Array<[number, number]> = [];
    const top = crossings(ring, y1);
    for (let k = 0; k + 1 < top.length; k += 2) spans.push([top[k], top[k + 1]]);
    for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
      const [ax, ay] = ring[j];
      const [bx, by] = ring[i];
      const lo = Math.max(y0, Math.min(ay, by));
      const hi = Math.min(y1, Math.max(ay, by));
      if (lo > hi) continue;
      let xa: number;
      let xb: number;
      if (ay === by) {
        xa = Math.min(ax, bx);
        xb = Math.max(ax, bx);
      } else {
        const x0 = ax + ((lo - ay) * (bx - ax)) / (by - ay);
        const x1 = ax + ((hi - ay) * (bx - ax)) / (by - ay);
        xa = Math.min(x0, x1);
        xb = Math.max(x0, x1);
      }
      spans.push([xa, xb]);
    }
    spans.sort((a, b) => a[0] - b[0]);
    const runs: number[] = [];
    for (const [a, b] of spans) {
      const s = Math.max(0, Math.floor(a / cellMm));
      const e = Math.min(widthCells - 1, Math.max(s, Math.ceil(b / cellMm) - 1));
      const n = runs.length;
      if (n > 0 && s <= runs[n - 1] + 1) {
        if (e > runs[n - 1]) runs[n - 1] = e;
      } else runs.push(s, e);
    }
    for (let k = 0; k < runs.length; k += 2) cellCount += runs[k + 1] - runs[k] + 1;
    rows.push(Int32Array.from(runs));
  }
  return { widthCells, heightCells, rows, cellCount };
}

/**
 * Rasterizes `ring` (mm, any winding, moved so its bounds start at 0,0) on cells of `cellMm`, setting a
 * cell when its centre lies inside the ring (even-odd crossings of the row's centre line). The mask is
 * ceil(width / cellMm) × ceil(height / cellMm) cells, so it never reaches past the ring's bounds rounded
 * up to whole cells. Rows of a sliver thinner than a cell may be empty.
 */
export function rasterizeRingCentres(ring: readonly PointMm[], cellMm: number): RasterMask {
  let maxX = 0;
  let maxY = 0;
  for (const [x, y] of ring) {
    if (x > maxX) maxX = x;
    if (y > maxY) maxY = y;
  }
  const widthCells = Math.max(1, Math.ceil(maxX / cellMm - 1e-9));
  const heightCells = Math.max(1, Math.ceil(maxY / cellMm - 1e-9));
  // Each edge drops its crossings into the rows whose centre line it spans (half-open in y, as in
  // crossings()), so the cost grows with vertices plus crossings, not vertices times rows.
  const perRow: number[][] = Array.from({ length: heightCells }, () => []);
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi === yj) continue;
    const lo = Math.min(yi, yj);
    const hi = Math.max(yi, yj);
    const first = Math.max(0, Math.ceil(lo / cellMm - 0.5));
    const last = Math.min(heightCells - 1, Math.ceil(hi / cellMm - 0.5) - 1);
    for (let r = first; r <= last; r++) {
      const y = (r + 0.5) * cellMm;
      if (yi > y !== yj > y) perRow[r].push(xi + ((y - yi) * (xj - xi)) / (yj - yi));
    }
  }
  const rows: Int32Array[] = [];
  let cellCount = 0;
  for (let r = 0; r < heightCells; r++) {
    const xs = perRow[r].sort((a, b) => a - b);
    const runs: number[] = [];
    for (let k = 0; k + 1 < xs.length; k += 2) {
      const s = Math.max(0, Math.ceil(xs[k] / cellMm - 0.5));
      const e = Math.min(widthCells - 1, Math.floor(xs[k + 1] / cellMm - 0.5));
      if (s > e) continue;
      const n = runs.length;
      if (n > 0 && s <= runs[n - 1] + 1) runs[n - 1] = Math.max(runs[n - 1], e);
      else runs.push(s, e);
    }
    for (let k = 0; k < runs.length; k += 2) cellCount += runs[k + 1] - runs[k] + 1;
    rows.push(Int32Array.from(runs));
  }
  return { widthCells, heightCells, rows, cellCount };
}
