/**
 * Conservative raster of a polygon on a square grid: every cell the polygon touches (interior or
 * boundary) is set, so two masks that share no cell belong to polygons whose interiors are disjoint.
 * Per row band [y0, y1] a point of the polygon either sees the boundary straight above it inside the
 * band (so it lies in the x-extent of an edge clipped to the band) or stays inside up to y1 (so it
 * lies in the cross-section at y1); the union of both covers the band.
 *
 * The cutting gap is kept by dilating each mask by half the gap (dilateMask): if two outlines came
 * closer than the gap, the midpoint of their closest points would lie in a cell of both dilated masks.
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
 * Grows a mask by every cell whose square lies closer than `radiusMm` to a set cell (square-to-square
 * distance), so the dilated mask covers the polygon's offset by `radiusMm`. Returns the new mask and
 * `shiftCells`, how far the original cell (0, 0) moved (the same in x and y).
 */
export function dilateMask(mask: RasterMask, radiusMm: number, cellMm: number): { mask: RasterMask; shiftCells: number } {
  const k = radiusMm > 0 ? Math.ceil(radiusMm / cellMm - 1e-9) : 0;
  if (k === 0) return { mask, shiftCells: 0 };
  // reach[d]: cells to extend sideways at a row distance d, from (|dy|−1)² + (|dx|−1)² < (r/cell)².
  const rr = (radiusMm / cellMm) ** 2;
  const reach: number[] = [];
  for (let d = 0; d <= k; d++) {
    const dy = Math.max(0, d - 1);
    const left = rr - dy * dy;
    reach.push(left <= 0 ? -1 : Math.ceil(Math.sqrt(left) - 1e-9));
  }
  const widthCells = mask.widthCells + 2 * k;
  const heightCells = mask.heightCells + 2 * k;
  const rows: Int32Array[] = [];
  let cellCount = 0;
  for (let r = 0; r < heightCells; r++) {
    const spans: Array<[number, number]> = [];
    for (let d = -k; d <= k; d++) {
      const src = r - k + d;
      const ext = reach[Math.abs(d)];
      if (src < 0 || src >= mask.heightCells || ext < 0) continue;
      const runs = mask.rows[src];
      for (let i = 0; i < runs.length; i += 2) spans.push([runs[i] + k - ext, runs[i + 1] + k + ext]);
    }
    spans.sort((a, b) => a[0] - b[0]);
    const out: number[] = [];
    for (const [s, e] of spans) {
      const n = out.length;
      if (n > 0 && s <= out[n - 1] + 1) {
        if (e > out[n - 1]) out[n - 1] = e;
      } else out.push(s, e);
    }
    for (let i = 0; i < out.length; i += 2) cellCount += out[i + 1] - out[i] + 1;
    rows.push(Int32Array.from(out));
  }
  return { mask: { widthCells, heightCells, rows, cellCount }, shiftCells: k };
}
