/**
 * Where each stock sheet of a plan sits in a combined 1:1 drawing for the SVG and DXF files: sheets
 * side by side along x with a 50 mm space, each sheet's lower-left corner at (offsetX, 0), y up.
 */
import type { SheetPlan } from '../layout/plan-sheets';

export const SHEET_SPACING_MM = 50;

/** Returns the x offset of each sheet (mm) and the total drawing size. */
export function sheetFrames(plan: SheetPlan): { offsets: number[]; widthMm: number; heightMm: number } {
  const offsets: number[] = [];
  let x = 0;
  for (const s of plan.sheets) {
    offsets.push(x);
    x += s.widthMm + SHEET_SPACING_MM;
  }
  return { offsets, widthMm: Math.max(x - SHEET_SPACING_MM, 1), heightMm: Math.max(1, ...plan.sheets.map((s) => s.heightMm)) };
}
