/**
 * The seams along one piece's edges, for the piece panel: which piece each joins, the bevel this piece's edge is
 * cut at and from which face, and the kind of corner, in seam-number order.
 */
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';

export interface PieceSeamRow {
  seam: string;
  /** The piece on the other side (the same piece for a tube closed on itself). */
  joins: string;
  bevelDeg: number;
  face: 'outer' | 'inner' | 'none';
  corner: 'outside' | 'inside';
}

/**
 * Returns one row per seam edge of piece `label`'s first copy (seam-number order, numbers compared as numbers).
 * An edge whose seam is missing from `doc.seams` is left out. Returns [] for an unknown label.
 */
export function pieceSeamRows(doc: PatternDoc, label: string): PieceSeamRow[] {
  const piece = doc.pieces.find((p) => p.label === label);
  if (!piece) return [];
  const rows: PieceSeamRow[] = [];
  for (const e of piece.seamEdges ?? []) {
    if ((e.copy ?? 0) !== 0) continue;
    const seam = doc.seams.find((s) => s.label === e.seam);
    if (!seam) continue;
    const joins = seam.pieces.length === 1 ? seam.pieces[0] : seam.pieces[1 - e.side] ?? seam.pieces[0];
    rows.push({ seam: seam.label, joins, bevelDeg: e.bevelDeg, face: e.bevelFace, corner: seam.convex ? 'outside' : 'inside' });
  }
  return rows.sort((a, b) => a.seam.localeCompare(b.seam, undefined, { numeric: true }));
}
