/**
 * Per-piece settings on top of the pattern pipeline: a maker picks, per piece label, the foam thickness, the
 * surface the pattern follows, how many copies to cut and whether every second copy is cut mirrored
 * (DESIGN.md step 6 and 7). Thickness and surface change the geometry (the flattened surface moves inward by
 * the offset), quantity and mirrored only the counts.
 */
import { GeometryError } from '../errors';
import { surfaceOffsetMm } from '../thickness/offset-surface';
import { DEFAULT_THICKNESS_MM, patternWithFaceMaps, type BuildPatternOptions, type PatternFaceMaps } from './build-pattern';
import type { PatternDoc, PatternPiece, PatternSurface } from './pattern-doc';
import type { PreparedPieces } from './prepare-pieces';

/** What a maker may set on one piece; an absent field keeps the pattern-wide option or the engine's count. */
export interface PieceSettings {
  /** Foam thickness, mm (> 0, at most MAX_PIECE_THICKNESS_MM). */
  thicknessMm?: number;
  surface?: PatternSurface;
  /** Copies to cut, a whole number from 1 to MAX_PIECE_QUANTITY. */
  quantity?: number;
  /** Cut every second copy mirrored (the template turned over), as the sheet planner alternates them. */
  mirrored?: boolean;
}

/** Thickest foam a piece may be set to, mm: beyond floor-mat and block foam, a value this large is a typo. */
export const MAX_PIECE_THICKNESS_MM = 100;
/** Most copies of one piece (scales, rivets and spikes run to dozens; thousands is a typo). */
export const MAX_PIECE_QUANTITY = 999;

/** Throws GeometryError BAD_OPTION naming the piece label and the field when a setting is out of range. */
export function checkPieceSettings(settings: Readonly<Record<string, PieceSettings>>): void {
  for (const [label, s] of Object.entries(settings)) {
    if (s.thicknessMm !== undefined && !(Number.isFinite(s.thicknessMm) && s.thicknessMm > 0 && s.thicknessMm <= MAX_PIECE_THICKNESS_MM)) {
      throw new GeometryError('BAD_OPTION', `piece ${label}: thickness must be more than 0 and at most ${MAX_PIECE_THICKNESS_MM} mm, got ${s.thicknessMm}`);
    }
    if (s.surface !== undefined && s.surface !== 'outer' && s.surface !== 'mid' && s.surface !== 'inner') {
      throw new GeometryError('BAD_OPTION', `piece ${label}: surface must be outer, mid or inner, got ${String(s.surface)}`);
    }
    if (s.quantity !== undefined && !(Number.isInteger(s.quantity) && s.quantity >= 1 && s.quantity <= MAX_PIECE_QUANTITY)) {
      throw new GeometryError('BAD_OPTION', `piece ${label}: quantity must be a whole number from 1 to ${MAX_PIECE_QUANTITY}, got ${s.quantity}`);
    }
  }
}

/**
 * Builds the pattern of `prepared` with per-piece settings by label (labels as the pattern-wide run assigns them:
 * A, B, … in group order).
 *
 * Method: the pattern is made once with the pattern-wide options; for each distinct (thickness, surface) pair
 * whose inward offset (surfaceOffsetMm) differs from the pattern-wide one, it is made again with that pair and
 * the pieces set to it are taken from that run, with their per-face stretch and their sides' seam lengths.
 * Taking them is sound only when the second run cuts and groups the faces the same way (compared face by face);
 * when it does not, those pieces keep the pattern-wide surface and a warning says so. Where only the thickness
 * changes and the offset does not (the outer skin is the same for any thickness), only the figure changes.
 * Seam angles and `length3d` stay those of the pattern-wide surface.
 * Quantity and mirrored replace the engine's counts: `mirroredCopies` becomes ⌊quantity/2⌋ when mirrored (every
 * second copy, as planSheets cuts them), and seam edges of copies past the quantity are dropped.
 *
 * @param prepared pieces from preparePieces (mm).
 * @param options pattern-wide options as for patternFromPieces (thickness default 6 mm, surface 'outer').
 * @param settings per-label settings; labels the pattern does not have are ignored.
 * @returns the document and its per-face maps (PatternFaceMaps).
 * @throws GeometryError BAD_OPTION for a setting out of range (checkPieceSettings), and whatever
 *   patternFromPieces throws.
 */
export function patternWithPieceSettings(
  prepared: PreparedPieces,
  options: BuildPatternOptions,
  settings: Readonly<Record<string, PieceSettings>>,
): { doc: PatternDoc; faces: PatternFaceMaps } {
  checkPieceSettings(settings);
  const base = patternWithFaceMaps(prepared, options);
  const { doc, faces } = base;
  const defaultThickness = options.thickness ?? DEFAULT_THICKNESS_MM;
  const defaultSurface = options.surface ?? 'outer';
  const defaultOffset = surfaceOffsetMm(defaultSurface, defaultThickness);

  // Pieces whose surface moves: grouped by their (thickness, surface) pair, one extra run per pair.
  const reruns = new Map<string, { thickness: number; surface: PatternSurface; indices: number[] }>();
  doc.pieces.forEach((piece, i) => {
    const s = settings[piece.label];
    if (!s) return;
    const thickness = s.thicknessMm ?? defaultThickness;
    const surface = s.surface ?? defaultSurface;
    if (Math.abs(surfaceOffsetMm(surface, thickness) - defaultOffset) < 1e-9) {
      piece.thickness = thickness;
      piece.surface = surface;
      return;
    }
    const key = `${thickness}|${surface}`;
    const entry = reruns.get(key) ?? { thickness, surface, indices: [] };
    entry.indices.push(i);
    reruns.set(key, entry);
  });
  for (const { thickness, surface, indices } of reruns.values()) {
    const alt = patternWithFaceMaps(prepared, { ...options, thickness, surface });
    const labels = indices.map((i) => doc.pieces[i].label).join(', ');
    if (!sameArrays(alt.faces.pieceIndex, faces.pieceIndex) || alt.doc.seams.length !== doc.seams.length) {
      doc.warnings.push(
        `piece${indices.length > 1 ? 's' : ''} ${labels}: the ${surface} surface of ${thickness} mm foam splits or groups the pieces differently, ` +
          `so ${indices.length > 1 ? 'they follow' : 'it follows'} the pattern-wide ${defaultSurface} surface`,
      );
      continue;
    }
    const taken = new Set(indices);
    for (const i of indices) doc.pieces[i] = alt.doc.pieces[i];
    for (let f = 0; f < faces.pieceIndex.length; f++) {
      if (taken.has(faces.pieceIndex[f])) faces.stretchPct[f] = alt.faces.stretchPct[f];
    }
    const takenLabels = new Set(indices.map((i) => doc.pieces[i].label));
    doc.seams.forEach((seam, j) => {
      seam.lengths = seam.lengths.map((len, k) => (takenLabels.has(seam.pieces[Math.min(k, seam.pieces.length - 1)]) ? alt.doc.seams[j].lengths[k] : len));
    });
    for (const i of indices) {
      const p = doc.pieces[i];
      doc.warnings.push(
        `piece ${p.label} follows the ${surface === 'mid' ? 'middle' : surface === 'inner' ? 'inner face' : 'outer skin'} of ${thickness} mm foam (set for this piece)` +
          (p.perimeterChangeMm ? `: its outline is ${(-p.perimeterChangeMm).toFixed(1)} mm shorter around than on the outer skin` : ''),
      );
    }
  }

  for (const piece of doc.pieces) {
    const s = settings[piece.label];
    if (s && (s.quantity !== undefined || s.mirrored !== undefined)) applyCounts(piece, s.quantity ?? piece.quantity, s.mirrored ?? piece.mirrored);
  }
  return { doc, faces };
}

function applyCounts(piece: PatternPiece, quantity: number, mirrored: boolean): void {
  piece.quantity = quantity;
  piece.mirrored = mirrored;
  const copies = mirrored ? Math.floor(quantity / 2) : 0;
  if (copies > 0) piece.mirroredCopies = copies;
  else delete piece.mirroredCopies;
  if (piece.seamEdges) piece.seamEdges = piece.seamEdges.filter((e) => (e.copy ?? 0) < quantity);
}

function sameArrays(a: Int32Array, b: Int32Array): boolean {
  if (a.length !== b.length) return false;
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false;
  return true;
}
