/**
 * One pattern piece as screen-ready SVG data, drawn with the same marks as the printed print set
 * (geometry/export/piece-drawing.ts): solid cut line, match-mark ticks with the seam number in a square,
 * bevel triangles (hollow for an outside corner, solid for an inside one), station bars, dash-dot score lines,
 * dashed darts ending in a V. Coordinates are SVG user units of one millimetre with y pointing down (the
 * pattern's y is up), so a `viewBox` in millimetres shows the piece at any screen size.
 */
import { declutterTexts } from '../../geometry/export/declutter-texts';
import { pieceDrawing, type DrawStyle, type DrawText } from '../../geometry/export/piece-drawing';
import type { PatternDoc, PatternPiece, PointMm } from '../../geometry/pattern/pattern-doc';

export interface SvgLine {
  style: DrawStyle;
  /** SVG path data in millimetres, y down. */
  d: string;
  filled: boolean;
}

export interface SvgText {
  style: DrawText['style'];
  text: string;
  x: number;
  y: number;
  /** Clockwise rotation for SVG's `rotate()`, degrees. */
  rotateDeg: number;
  sizeMm: number;
  weight: DrawText['weight'];
}

export interface PieceSvgModel {
  label: string;
  /** Index of the piece in `doc.pieces` (the faces file's piece index). */
  index: number;
  /** The drawing's extent with a margin, SVG millimetres: x, y (top left, y down), width, height. */
  viewBox: [number, number, number, number];
  lines: SvgLine[];
  texts: SvgText[];
  /** The outline alone, as path data, for the selection fill and the hit area. */
  outlineD: string;
}

const num = (v: number) => (Math.round(v * 100) / 100).toString();

/** SVG path data of `points` (pattern mm, y up) with y turned down; `closed` adds the closing Z. */
export function svgPathData(points: readonly PointMm[], closed: boolean): string {
  if (points.length === 0) return '';
  const body = points.map(([x, y], i) => `${i === 0 ? 'M' : 'L'}${num(x)} ${num(-y)}`).join(' ');
  return closed ? `${body} Z` : body;
}

/**
 * Returns the SVG model of piece `index` of `doc`: its first copy's marks as piece-drawing.ts draws them for
 * print, texts decluttered the same way (declutter-texts.ts), placed in the piece's own frame, and a viewBox
 * around everything drawn plus `marginMm` (default 4 mm). Precondition: `index` is a valid piece index and
 * the outline has at least three points.
 */
export function pieceSvgModel(doc: PatternDoc, index: number, marginMm = 4): PieceSvgModel {
  const piece: PatternPiece = doc.pieces[index];
  const [drawing] = declutterTexts([pieceDrawing(piece, doc, { mirrored: false, rotationDeg: 0, x: 0, y: 0 })]);
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  const grow = ([x, y]: PointMm, pad = 0) => {
    minX = Math.min(minX, x - pad); maxX = Math.max(maxX, x + pad);
    minY = Math.min(minY, y - pad); maxY = Math.max(maxY, y + pad);
  };
  for (const l of drawing.lines) for (const p of l.points) grow(p);
  // A text's extent is estimated from its size (about half an em per character, as text-box.ts does for print).
  for (const t of drawing.texts) grow(t.at, Math.max(t.sizeMm, (t.text.length * 0.5 * t.sizeMm) / 2));
  const lines: SvgLine[] = drawing.lines.map((l) => ({ style: l.style, d: svgPathData(l.points, l.closed), filled: Boolean(l.filled) }));
  const texts: SvgText[] = drawing.texts.map((t) => ({
    style: t.style,
    text: t.text,
    x: t.at[0],
    y: -t.at[1],
    rotateDeg: -t.angleDeg,
    sizeMm: t.sizeMm,
    weight: t.weight,
  }));
  return {
    label: piece.label,
    index,
    viewBox: [minX - marginMm, -maxY - marginMm, maxX - minX + 2 * marginMm, maxY - minY + 2 * marginMm],
    lines,
    texts,
    outlineD: svgPathData(piece.outline, true) + piece.holes.map((h) => ' ' + svgPathData(h, true)).join(''),
  };
}

/**
 * The one scale, screen pixels per millimetre, at which every piece of the board is drawn, so pieces keep their
 * true relative sizes: the largest piece's longer side fills `cellPx`. Returns 1 for a document without pieces.
 */
export function boardScale(models: readonly PieceSvgModel[], cellPx: number): number {
  let longest = 0;
  for (const m of models) longest = Math.max(longest, m.viewBox[2], m.viewBox[3]);
  return longest > 0 ? cellPx / longest : 1;
}

/** Smallest on-screen text, px: below about 9 px a note is not readable on a phone (common practice). */
export const MIN_TEXT_PX = 9;

/**
 * The texts worth drawing at `pxPerMm`, each with its on-screen font size in millimetres of the drawing. The
 * piece label, its thickness line and the seam numbers always stay (raised to MIN_TEXT_PX when smaller, since a
 * maker matches pieces by them); notes that would show below MIN_TEXT_PX are left off (the detail view at a
 * larger scale and the printed set carry them).
 */
export function readableTexts(texts: readonly SvgText[], pxPerMm: number): Array<SvgText & { shownSizeMm: number }> {
  const minMm = MIN_TEXT_PX / pxPerMm;
  const out: Array<SvgText & { shownSizeMm: number }> = [];
  for (const t of texts) {
    const always = t.style === 'label' || t.style === 'info' || t.style === 'match';
    if (!always && t.sizeMm < minMm) continue;
    out.push({ ...t, shownSizeMm: Math.max(t.sizeMm, minMm) });
  }
  return out;
}

/**
 * The spoken name of a piece on the board, e.g. "Piece C, 6 mm, 2 copies" or "Piece A, 4 mm, 1 copy, 1 mirrored".
 * Thickness is shown with at most one decimal.
 */
export function pieceAccessibleName(piece: Pick<PatternPiece, 'label' | 'thickness' | 'quantity' | 'mirrored' | 'mirroredCopies'>): string {
  const t = Math.round(piece.thickness * 10) / 10;
  const parts = [`Piece ${piece.label}`, `${t} mm`, `${piece.quantity} ${piece.quantity === 1 ? 'copy' : 'copies'}`];
  if (piece.mirrored) parts.push(`${piece.mirroredCopies ?? 1} mirrored`);
  return parts.join(', ');
}
