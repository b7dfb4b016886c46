/**
 * The sheet plan: every piece copy (quantity, mirrored copies, spares) nested true-shape on stock
 * sheets of its thickness.
 *
 * Method: each outline, in every rotation (`rotationStepDeg` steps) and mirror sense it can take, is
 * grown by half the cutting gap with clipper's round-join offset (offset-ring.ts); that offset ring is
 * rasterized on a fine grid by cell centres (raster-mask.ts), which is the fast candidate generator.
 * Copies go largest first, each to the first sheet where some rotation fits, at the bottom-left-most spot
 * (lowest top edge, then leftmost; bottom-left fill after Jakobs 1996, on a raster as in Oliveira and
 * Ferreira 1993). Every raster candidate is confirmed exactly before it is taken (offset-clearance.ts):
 * the offset ring must share no area with any placed piece's offset ring (clipper intersection) and lie
 * inside the sheet; a rejected candidate gives way to the next one on the raster. So placed copies never
 * overlap, keep at least the gap between them and half the gap to the sheet edge, and the raster only
 * decides where to look, not how much room a piece takes.
 */
import { GeometryError } from '../errors';
import type { PatternDoc, PatternPiece, PointMm } from '../pattern/pattern-doc';
import { signedAreaMm2 } from './outline-measure';
import { boundsOf, placeRing, type PlaceTransform } from './outline-transform';
import { OffsetClearance } from './offset-clearance';
import { OFFSET_SCALE, offsetRingUm, type OffsetRing } from './offset-ring';
import { rasterizeRingCentres, type RasterMask } from './raster-mask';
import { SheetGrid } from './sheet-grid';
import { DEFAULT_STOCK_SHEETS, stockForThickness, type StockSheet } from './stock-sheets';

export interface Placement extends PlaceTransform {
  pieceLabel: string;
  /** 1-based copy number of this piece; copies beyond the piece's quantity are spares. */
  copy: number;
  spare: boolean;
  thicknessMm: number;
  /** Index into SheetPlan.sheets. */
  sheetIndex: number;
  /** The piece outline after mirror, rotation and translation, sheet coordinates (mm, CCW). */
  outline: PointMm[];
  holes: PointMm[][];
}

export interface PlannedSheet {
  thicknessMm: number;
  widthMm: number;
  heightMm: number;
  pricePerSheet: number;
  /** Share of the sheet's area covered by piece outlines (holes excluded), percent. */
  usedPct: number;
  copies: number;
}

export interface ThicknessSummary {
  thicknessMm: number;
  sheets: number;
  /** Piece area over the area of all sheets of this thickness, percent. */
  usedPct: number;
  cost: number;
  stockNote: string;
}

/** Which pieces get spare copies: only repeated parts (quantity 2 or more), or every piece. */
export type SparesFor = 'repeated' | 'all';

export interface SheetPlan {
  gapMm: number;
  sparesPct: number;
  sparesFor: SparesFor;
  /** The spares rule in words, as printed on the bench card. */
  sparesRule: string;
  rotationStepDeg: number;
  /** Grid cell used for the search, mm. */
  cellMm: number;
  sheets: PlannedSheet[];
  placements: Placement[];
  byThickness: ThicknessSummary[];
  totalCost: number;
}

export interface PlanSheetsOptions {
  stock?: readonly StockSheet[];
  /** Cutting gap between pieces and to the sheet edge (half of it at the edge), mm. Default 3. */
  gapMm?: number;
  /** Spare copies as a percentage of each piece's quantity, rounded up per piece. Default 10. */
  sparesPct?: number;
  /**
   * Which pieces get spares: 'repeated' (default) only pieces with quantity 2 or more, since makers cut
   * spares of small repeated parts (shared/DESIGN.md, "What the trade knows", common practice); 'all'
   * gives every piece its allowance.
   */
  sparesFor?: SparesFor;
  /** Rotation step, degrees; 360 disables rotation. Default 15. */
  rotationStepDeg?: number;
  /** Search grid cell, mm. Default 1 (coarser on sheets over 1.5 m). */
  cellMm?: number;
}

interface Orientation {
  rotationDeg: number;
  mirrored: boolean;
  /** The outline after mirror and rotation about the piece origin, grown by half the gap, µm. */
  ring: OffsetRing;
  /** The ring rasterized with its lower-left bounds corner at cell (0, 0). */
  mask: RasterMask;
}

interface CopyJob {
  piece: PatternPiece;
  copy: number;
  spare: boolean;
  mirrored: boolean;
  area: number;
}

interface OpenSheet {
  stock: StockSheet;
  grid: SheetGrid;
  clearance: OffsetClearance;
  index: number;
}

/**
 * Raster candidates the exact test may turn down for one orientation on one sheet before that orientation
 * is given up there. Each rejection costs one clipper intersection; in the bench set a rejected candidate is
 * almost always followed by an accepted one a cell or two further on, so the cap only bounds the worst case
 * (a sliver the centre raster barely sees); giving up is safe, it can only cost sheet area.
 */
const MAX_REJECTIONS = 64;

function checkPiece(p: PatternPiece, i: number): void {
  const name = `piece ${p.label || `#${i + 1}`}`;
  if (!Array.isArray(p.outline) || p.outline.length < 3) {
    throw new GeometryError('LAYOUT_FAILED', `${name} has an outline of fewer than 3 points`);
  }
  for (const [k, q] of p.outline.entries()) {
    if (!Number.isFinite(q[0]) || !Number.isFinite(q[1])) {
      throw new GeometryError('NON_FINITE', `${name}: outline point ${k + 1} is not a finite number (${q[0]}, ${q[1]})`, { vertex: k });
    }
  }
  if (!Number.isInteger(p.quantity) || p.quantity < 1) {
    throw new GeometryError('BAD_OPTION', `${name}: quantity must be a whole number of 1 or more, got ${p.quantity}`);
  }
  if (Math.abs(signedAreaMm2(p.outline)) < 1e-6) throw new GeometryError('LAYOUT_FAILED', `${name} has an outline with no area`);
}

function checkOptions(gapMm: number, sparesPct: number, sparesFor: string, stepDeg: number, cellMm: number | undefined): void {
  if (sparesFor !== 'repeated' && sparesFor !== 'all') throw new GeometryError('BAD_OPTION', `spares must go to "repeated" or "all" pieces, got "${sparesFor}"`);
  if (!(Number.isFinite(gapMm) && gapMm >= 0)) throw new GeometryError('BAD_OPTION', `cutting gap must be 0 mm or more, got ${gapMm}`);
  if (!(Number.isFinite(sparesPct) && sparesPct >= 0)) throw new GeometryError('BAD_OPTION', `spares allowance must be 0 % or more, got ${sparesPct}`);
  if (!(Number.isFinite(stepDeg) && stepDeg > 0 && stepDeg <= 360)) {
    throw new GeometryError('BAD_OPTION', `rotation step must be more than 0° and at most 360°, got ${stepDeg}`);
  }
  if (cellMm !== undefined && !(Number.isFinite(cellMm) && cellMm > 0)) throw new GeometryError('BAD_OPTION', `search grid cell must be a positive number of mm, got ${cellMm}`);
}

function pieceArea(p: PatternPiece): number {
  return Math.abs(signedAreaMm2(p.outline)) - p.holes.reduce((s, h) => s + Math.abs(signedAreaMm2(h)), 0);
}

/** Number of spare copies of a piece of `quantity` under the rule: ceil(quantity·pct/100), for repeated parts only unless `sparesFor` is 'all'. */
export function spareCount(quantity: number, sparesPct: number, sparesFor: SparesFor): number {
  if (sparesFor === 'repeated' && quantity < 2) return 0;
  return Math.ceil((quantity * sparesPct) / 100 - 1e-9);
}

/** The spares rule in words for the bench card and the sheet-plan JSON. */
export function sparesRuleText(sparesPct: number, sparesFor: SparesFor): string {
  if (sparesPct === 0) return 'no spares';
  const who = sparesFor === 'all' ? 'every piece' : 'repeated parts only (pieces cut 2 or more times)';
  return `spares: ${sparesPct} % of the quantity, rounded up per piece, for ${who}`;
}

/** Expands each piece into its copies: quantity, then its spares (spareCount); every second copy of a mirrored piece is the mirror image. */
function copyJobs(doc: PatternDoc, sparesPct: number, sparesFor: SparesFor): CopyJob[] {
  const jobs: CopyJob[] = [];
  for (const piece of doc.pieces) {
    const spares = spareCount(piece.quantity, sparesPct, sparesFor);
    const area = pieceArea(piece);
    for (let k = 0; k < piece.quantity + spares; k++) {
      jobs.push({ piece, copy: k + 1, spare: k >= piece.quantity, mirrored: piece.mirrored && k % 2 === 1, area });
    }
  }
  // Largest first: big pieces fix the sheet count, small ones fill the gaps they leave.
  return jobs.sort((a, b) => b.area - a.area);
}

/**
 * Nests every piece copy of `doc` on stock sheets, grouped by thickness.
 * Returns the SheetPlan (placements in sheet mm, y up, origin at the sheet's lower-left corner).
 * Throws GeometryError('LAYOUT_FAILED') for a document without pieces or a piece that fits no stock
 * sheet of its thickness in any rotation (naming the piece and its size), 'BAD_OPTION' for bad options.
 */
export function planSheets(doc: PatternDoc, opts: PlanSheetsOptions = {}): SheetPlan {
  const gapMm = opts.gapMm ?? 3;
  const sparesPct = opts.sparesPct ?? 10;
  const sparesFor = opts.sparesFor ?? 'repeated';
  const stepDeg = opts.rotationStepDeg ?? 15;
  const stock = opts.stock ?? DEFAULT_STOCK_SHEETS;
  checkOptions(gapMm, sparesPct, sparesFor, stepDeg, opts.cellMm);
  if (!doc.pieces || doc.pieces.length === 0) throw new GeometryError('LAYOUT_FAILED', 'the pattern has no pieces to lay out on stock sheets');
  doc.pieces.forEach(checkPiece);

  const rotations: number[] = [];
  for (let r = 0; r < 360 - 1e-9; r += stepDeg) rotations.push(r);
  const largestSide = Math.max(...stock.map((s) => Math.max(s.widthMm, s.heightMm)));
  const cellMm = opts.cellMm ?? Math.max(1, largestSide / 1500);

  const orientationCache = new Map<string, Orientation[]>();
  const orientationsOf = (piece: PatternPiece, mirrored: boolean): Orientation[] => {
    const key = `${piece.label}\u0000${mirrored}`;
    const hit = orientationCache.get(key);
    if (hit) return hit;
    const list = rotations.map((rotationDeg) => {
      const ring = offsetRingUm(placeRing(piece.outline, { mirrored, rotationDeg, x: 0, y: 0 }), gapMm / 2);
      const local = ring.outerMm.map(([x, y]) => [x - ring.minX / OFFSET_SCALE, y - ring.minY / OFFSET_SCALE] as PointMm);
      return { rotationDeg, mirrored, ring, mask: rasterizeRingCentres(local, cellMm) };
    });
    orientationCache.set(key, list);
    return list;
  };

  /** Translation (µm) that puts an orientation's ring bounds corner at grid cell (x, y). */
  const shiftUm = (o: Orientation, x: number, y: number): { dx: number; dy: number } => ({
    dx: Math.round(x * cellMm * OFFSET_SCALE) - o.ring.minX,
    dy: Math.round(y * cellMm * OFFSET_SCALE) - o.ring.minY,
  });

  const bestOn = (sheet: OpenSheet, list: Orientation[]): { o: Orientation; x: number; y: number } | null => {
    let best: { o: Orientation; x: number; y: number } | null = null;
    let bestTop = Number.POSITIVE_INFINITY;
    for (const o of list) {
      let from = { x: 0, y: 0 };
      for (let rejected = 0; rejected <= MAX_REJECTIONS; rejected++) {
        const at = sheet.grid.findBottomLeft(o.mask, bestTop, from);
        if (!at) break;
        const top = at.y + o.mask.heightCells;
        if (top === bestTop && best !== null && at.x >= best.x) break;
        const { dx, dy } = shiftUm(o, at.x, at.y);
        if (sheet.clearance.fits(o.ring, dx, dy)) {
          best = { o, x: at.x, y: at.y };
          bestTop = top;
          break;
        }
        from = { x: at.x + 1, y: at.y };
      }
    }
    return best;
  };

  const sheets: PlannedSheet[] = [];
  const placements: Placement[] = [];
  const open = new Map<number, OpenSheet[]>();
  const usedArea: number[] = [];
  const labelsSeen = new Set<string>();
  for (const p of doc.pieces) {
    if (labelsSeen.has(p.label)) throw new GeometryError('BAD_OPTION', `two pieces share the label "${p.label}"; labels must be unique`);
    labelsSeen.add(p.label);
  }

  for (const job of copyJobs(doc, sparesPct, sparesFor)) {
    const t = job.piece.thickness;
    const options = stockForThickness(t, stock);
    const list = orientationsOf(job.piece, job.mirrored);
    const sheetsOfT = open.get(t) ?? [];
    open.set(t, sheetsOfT);
    let chosen: { sheet: OpenSheet; o: Orientation; x: number; y: number } | null = null;
    for (const sheet of sheetsOfT) {
      const b = bestOn(sheet, list);
      if (b) {
        chosen = { sheet, ...b };
        break;
      }
    }
    if (!chosen) {
      for (const s of options) {
        const grid = new SheetGrid(Math.floor(s.widthMm / cellMm + 1e-9), Math.floor(s.heightMm / cellMm + 1e-9));
        const fresh: OpenSheet = { stock: s, grid, clearance: new OffsetClearance(Math.round(s.widthMm * OFFSET_SCALE), Math.round(s.heightMm * OFFSET_SCALE)), index: sheets.length };
        const b = bestOn(fresh, list);
        if (b) {
          const sheet = fresh;
          sheets.push({ thicknessMm: t, widthMm: s.widthMm, heightMm: s.heightMm, pricePerSheet: s.pricePerSheet, usedPct: 0, copies: 0 });
          usedArea.push(0);
          sheetsOfT.push(sheet);
          chosen = { sheet, ...b };
          break;
        }
      }
    }
    if (!chosen) {
      const bb = boundsOf(job.piece.outline);
      const sizes = options.map((s) => `${s.widthMm}×${s.heightMm} mm`).join(', ');
      throw new GeometryError(
        'LAYOUT_FAILED',
        `piece ${job.piece.label} (${(bb.maxX - bb.minX).toFixed(1)}×${(bb.maxY - bb.minY).toFixed(1)} mm) does not fit on any ${t} mm stock sheet (${sizes}) in any rotation, with a ${gapMm} mm cutting gap`,
      );
    }
    const { sheet, o, x, y } = chosen;
    sheet.grid.place(o.mask, x, y);
    const { dx, dy } = shiftUm(o, x, y);
    sheet.clearance.add(o.ring, dx, dy);
    const tf: PlaceTransform = { mirrored: o.mirrored, rotationDeg: o.rotationDeg, x: dx / OFFSET_SCALE, y: dy / OFFSET_SCALE };
    placements.push({
      ...tf,
      pieceLabel: job.piece.label,
      copy: job.copy,
      spare: job.spare,
      thicknessMm: t,
      sheetIndex: sheet.index,
      outline: placeRing(job.piece.outline, tf),
      holes: job.piece.holes.map((h) => placeRing(h, tf)),
    });
    usedArea[sheet.index] += job.area;
    sheets[sheet.index].copies++;
  }

  sheets.forEach((s, i) => (s.usedPct = (100 * usedArea[i]) / (s.widthMm * s.heightMm)));
  const byThickness: ThicknessSummary[] = [...open.keys()]
    .sort((a, b) => a - b)
    .map((t) => {
      const idx = sheets.map((s, i) => (s.thicknessMm === t ? i : -1)).filter((i) => i >= 0);
      const area = idx.reduce((s, i) => s + usedArea[i], 0);
      const sheetArea = idx.reduce((s, i) => s + sheets[i].widthMm * sheets[i].heightMm, 0);
      return {
        thicknessMm: t,
        sheets: idx.length,
        usedPct: (100 * area) / sheetArea,
        cost: idx.reduce((s, i) => s + sheets[i].pricePerSheet, 0),
        stockNote: stockForThickness(t, stock)[0].note,
      };
    });
  placements.sort((a, b) => a.sheetIndex - b.sheetIndex || a.pieceLabel.localeCompare(b.pieceLabel) || a.copy - b.copy);
  return { gapMm, sparesPct, sparesFor, sparesRule: sparesRuleText(sparesPct, sparesFor), rotationStepDeg: stepDeg, cellMm, sheets, placements, byThickness, totalCost: byThickness.reduce((s, b) => s + b.cost, 0) };
}
