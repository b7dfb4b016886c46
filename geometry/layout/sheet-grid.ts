/**
 * Occupancy of one stock sheet on a square cell grid, with per-row "next occupied" and "next free"
 * tables so a bottom-left search can jump over whole occupied runs instead of stepping cell by cell.
 */
import type { RasterMask } from './raster-mask';

export class SheetGrid {
  readonly widthCells: number;
  readonly heightCells: number;
  private readonly occupied: Uint8Array;
  private readonly nextOccupied: Int32Array;
  private readonly nextFree: Int32Array;
  /** Free cells left on the sheet. */
  freeCells: number;

  constructor(widthCells: number, heightCells: number) {
    this.widthCells = widthCells;
    this.heightCells = heightCells;
    const n = widthCells * heightCells;
    this.occupied = new Uint8Array(n);
    this.nextOccupied = new Int32Array(n);
    this.nextFree = new Int32Array(n);
    this.freeCells = n;
    for (let y = 0; y < heightCells; y++) this.refreshRow(y);
  }

  private refreshRow(y: number): void {
    const W = this.widthCells;
    const base = y * W;
    let nextOcc = W;
    let nextFree = W;
    for (let x = W - 1; x >= 0; x--) {
      if (this.occupied[base + x]) nextOcc = x;
      else nextFree = x;
      this.nextOccupied[base + x] = nextOcc;
      this.nextFree[base + x] = nextFree;
    }
  }

  /**
   * The lowest row, then the leftmost column, where `mask` fits without touching a set cell, or null.
   * Rows are searched only while the mask's top edge stays at or below `maxTopRow` (a bound from a
   * better orientation already found), starting at cell `from` (row-major order: the rest of that row,
   * then the rows above), so a caller that rejects a candidate can ask for the next one.
   */
  findBottomLeft(mask: RasterMask, maxTopRow: number = Number.POSITIVE_INFINITY, from: { x: number; y: number } = { x: 0, y: 0 }): { x: number; y: number } | null {
    const W = this.widthCells;
    const h = mask.heightCells;
    const w = mask.widthCells;
    if (w > W || h > this.heightCells || mask.cellCount > this.freeCells) return null;
    const lastY = Math.min(this.heightCells - h, maxTopRow - h);
    let firstRow = 0;
    for (let y = from.y; y <= lastY; y++) {
      let x = y === from.y ? from.x : 0;
      search: while (x + w <= W) {
        for (let k = 0; k < h; k++) {
          const r = (firstRow + k) % h;
          const runs = mask.rows[r];
          const base = (y + r) * W;
          for (let i = 0; i < runs.length; i += 2) {
            const a = runs[i];
            const c = this.nextOccupied[base + x + a];
            if (c <= x + runs[i + 1]) {
              x = this.nextFree[base + c] - a;
              firstRow = r;
              continue search;
            }
          }
        }
        return { x, y };
      }
    }
    return null;
  }

  /** Marks the mask's cells at cell offset (x, y) as occupied. Precondition: it fits there. */
  place(mask: RasterMask, x: number, y: number): void {
    const W = this.widthCells;
    for (let r = 0; r < mask.heightCells; r++) {
      const runs = mask.rows[r];
      const base = (y + r) * W + x;
      for (let i = 0; i < runs.length; i += 2) {
        for (let c = runs[i]; c <= runs[i + 1]; c++) {
          if (!this.occupied[base + c]) {
            this.occupied[base + c] = 1;
            this.freeCells--;
          }
        }
      }
      this.refreshRow(y + r);
    }
  }
}
