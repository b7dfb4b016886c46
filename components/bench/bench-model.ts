/**
 * What the bench view shows, worked out from the pattern document and the crew's piece rows: pieces to cut
 * grouped by foam thickness with their counts and checklist, and a seam looked up by its number with the two
 * pieces and the bevel to cut on each side.
 */
import type { PatternDoc, PatternSeam } from '../../geometry/pattern/pattern-doc';

/** The checklist state of one piece as the bench needs it (a subset of the API's PieceStateView). */
export interface BenchPieceState {
  label: string;
  cut: boolean;
  shaped: boolean;
  glued: boolean;
  notes: number;
}

export interface BenchPiece extends BenchPieceState {
  quantity: number;
  /** Spare copies the newest sheet plan adds (0 without a plan). */
  spares: number;
  mirroredCopies: number;
  maxStretchPct: number;
}

export interface ThicknessGroup {
  thicknessMm: number;
  pieces: BenchPiece[];
  /** Copies to cut in this thickness (sum of quantities and spares). */
  copies: number;
  /** Pieces of this group with every step ticked. */
  done: number;
}

/**
 * Groups the pattern's pieces by thickness (thinnest first; pieces by label within a group), each with its copy
 * count and its checklist from `states` (unticked when the piece has no row yet), and its spare copies from
 * `spares` (by label; the server's bench view takes them from the newest sheet plan). Rows for labels the pattern
 * no longer has are left out.
 */
export function piecesByThickness(doc: PatternDoc, states: readonly BenchPieceState[], spares: ReadonlyMap<string, number> = new Map()): ThicknessGroup[] {
  const byLabel = new Map(states.map((s) => [s.label, s]));
  const groups = new Map<number, ThicknessGroup>();
  for (const p of doc.pieces) {
    const s = byLabel.get(p.label);
    const piece: BenchPiece = {
      label: p.label,
      cut: s?.cut ?? false,
      shaped: s?.shaped ?? false,
      glued: s?.glued ?? false,
      notes: s?.notes ?? 0,
      quantity: p.quantity,
      spares: spares.get(p.label) ?? 0,
      mirroredCopies: p.mirrored ? (p.mirroredCopies ?? 1) : 0,
      maxStretchPct: p.stretch.maxPct,
    };
    let g = groups.get(p.thickness);
    if (!g) {
      g = { thicknessMm: p.thickness, pieces: [], copies: 0, done: 0 };
      groups.set(p.thickness, g);
    }
    g.pieces.push(piece);
    g.copies += p.quantity + piece.spares;
    if (piece.cut && piece.shaped && piece.glued) g.done += 1;
  }
  const out = [...groups.values()].sort((a, b) => a.thicknessMm - b.thicknessMm);
  for (const g of out) g.pieces.sort((a, b) => a.label.localeCompare(b.label, undefined, { numeric: true }));
  return out;
}

export interface SeamSide {
  piece: string;
  /** Bevel to cut on this piece's edge, degrees from square. */
  bevelDeg: number;
  /** Face the bevel takes material from. */
  face: 'outer' | 'inner' | 'none';
}

export interface SeamLookup {
  seam: PatternSeam;
  sides: SeamSide[];
  corner: 'outside' | 'inside';
  /** True when the bevel changes along the seam by 1° or more, so stations matter. */
  varies: boolean;
}

/**
 * Reads what a person typed as a seam number: spaces, a leading "#" or "seam" and leading zeros are ignored.
 * Returns the label to look for, or null when nothing usable was typed.
 */
export function normaliseSeamQuery(typed: string): string | null {
  const t = typed.trim().replace(/^(seam\s*|#)/i, '').trim();
  if (!t) return null;
  return /^\d+$/.test(t) ? String(Number(t)) : t;
}

/**
 * Finds seam `typed` in `doc` and returns its two sides (a tube's self-seam gives the one piece twice) with the
 * bevel each piece's edge is cut at, taken from the pieces' seam edges (first copy) or, when a piece has no edge
 * for it, the seam's mean bevel. Returns null when no seam has that number.
 */
export function lookUpSeam(doc: PatternDoc, typed: string): SeamLookup | null {
  const label = normaliseSeamQuery(typed);
  if (label === null) return null;
  const seam = doc.seams.find((s) => s.label === label || normaliseSeamQuery(s.label) === label);
  if (!seam) return null;
  const defaultFace = seam.bevelFace ?? (seam.convex ? 'inner' : 'outer');
  const sides: SeamSide[] = [];
  const names = seam.pieces.length === 1 ? [seam.pieces[0], seam.pieces[0]] : seam.pieces;
  names.forEach((name, side) => {
    const piece = doc.pieces.find((p) => p.label === name);
    const edge = piece?.seamEdges?.find((e) => e.seam === seam.label && e.side === side && (e.copy ?? 0) === 0);
    sides.push(edge ? { piece: name, bevelDeg: edge.bevelDeg, face: edge.bevelFace } : { piece: name, bevelDeg: seam.bevel.mean, face: defaultFace });
  });
  return { seam, sides, corner: seam.convex ? 'outside' : 'inside', varies: seam.bevel.max - seam.bevel.min >= 1 };
}

/**
 * Stations to read out along a varying seam: where the bevel has moved by 1° or more since the last one listed
 * (the first and last always), as the printed pieces mark them. Returns distances in mm and bevels in degrees.
 */
export function benchStations(seam: PatternSeam): Array<{ atMm: number; bevelDeg: number }> {
  const out: Array<{ atMm: number; bevelDeg: number }> = [];
  seam.stations.forEach((st, i) => {
    const last = out[out.length - 1];
    const isLast = i === seam.stations.length - 1;
    if (!last || Math.abs(st.bevel - last.bevelDeg) >= 1 || (isLast && st.at !== last.atMm)) out.push({ atMm: st.at, bevelDeg: st.bevel });
  });
  return out;
}

/** "30°" or "22.5°": a bevel angle as the bench shows it, to half a degree (what a maker can set a blade to). */
export function formatBevel(deg: number): string {
  const half = Math.round(deg * 2) / 2;
  return `${Number.isInteger(half) ? half.toFixed(0) : half.toFixed(1)}°`;
}

/** "1 copy", "3 copies", or "4 copies (3 + 1 spare)": how many copies of a piece to cut. */
export function copiesText(quantity: number, spares: number): string {
  const n = quantity + spares;
  return `${n} ${n === 1 ? 'copy' : 'copies'}${spares > 0 ? ` (${quantity} + ${spares} spare${spares === 1 ? '' : 's'})` : ''}`;
}
