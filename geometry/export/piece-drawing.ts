/**
 * What is drawn for one placed piece, as renderer-neutral primitives in drawing millimetres (y up), so
 * the PDF, SVG and DXF writers show the same marks. Sheetsmith's own visual language (the legend on
 * the print set's first page explains it):
 * - cut line: solid outline; holes likewise.
 * - match mark: at the middle of each seam edge, ticks running inward from the edge, tens as long
 *   ticks then units as short ticks, in the seam's own direction, so both pieces of a seam carry the
 *   same pattern at the same place; the seam number sits in a small square just inside.
 * - bevel: a row of small triangles inside the edge pointing at it; hollow for an outside corner,
 *   solid for an inside corner; the angle and the face it is cut from are written along the edge, in
 *   full where the edge has room, else short ("22.5° inner"). Where the bevel changes, a short bar
 *   across the edge carries the station's angle. Notes that would clash are moved or left off by
 *   declutter-texts.ts; the piece label, its notes and the seam numbers always stay.
 * - score line: dash-dot line; dart: dashed line ending in a small V; texture line: a line with a
 *   half-arrow at each end.
 */
import type { PatternDoc, PatternPiece, PieceSeamEdge, PointMm } from '../pattern/pattern-doc';
import { pathLengthMm, pointAlongPath } from '../layout/outline-measure';
import { placePointFn, placeRing, type PlaceTransform } from '../layout/outline-transform';

export type DrawStyle = 'cut' | 'match' | 'bevel' | 'station' | 'score' | 'dart' | 'texture';
export type DrawLayer = 'cut' | 'score' | 'marks' | 'text';

export interface DrawLine {
  style: DrawStyle;
  layer: DrawLayer;
  points: PointMm[];
  closed: boolean;
  filled?: boolean;
}

export interface DrawText {
  layer: 'text';
  style: 'label' | 'info' | 'match' | 'bevel' | 'station' | 'score' | 'dart' | 'texture';
  text: string;
  /** Anchor point: the centre of the text's box, drawing mm. */
  at: PointMm;
  /** Baseline direction, degrees counter-clockwise from +x, kept upright (−90 < a ≤ 90). */
  angleDeg: number;
  /** Cap-height-ish size, mm. */
  sizeMm: number;
  weight: 'bold' | 'regular' | 'mono';
  /** Extra room kept around the text when checking for clashes, mm (e.g. the frame of a seam number). */
  padMm?: number;
  /** Clash order, lower first: 0 piece label, 1 piece notes, 2 seam numbers, 3 bevel notes, 4 stations. */
  priority?: number;
  /** Drawn even when it clashes (after the alternatives are tried): piece labels, notes, seam numbers. */
  keep?: boolean;
  /** Other places or shorter wordings to try, in order, when this one clashes (declutter-texts.ts). */
  alternatives?: Array<Pick<DrawText, 'text' | 'at' | 'angleDeg' | 'companions'>>;
  /** Lines that belong to this text and are drawn only when it is (a station's bar). */
  companions?: DrawLine[];
}

export interface PieceDrawing {
  lines: DrawLine[];
  texts: DrawText[];
}

export const STYLE_LAYER: Readonly<Record<DrawStyle, DrawLayer>> = {
  cut: 'cut',
  score: 'score',
  dart: 'score',
  match: 'marks',
  bevel: 'marks',
  station: 'marks',
  texture: 'marks',
};

const line = (style: DrawStyle, points: PointMm[], closed = false, filled = false): DrawLine => ({ style, layer: STYLE_LAYER[style], points, closed, filled });

function upright(dx: number, dy: number): number {
  let a = (Math.atan2(dy, dx) * 180) / Math.PI;
  if (a > 90) a -= 180;
  if (a <= -90) a += 180;
  return a;
}

/** Even-odd point-in-polygon (Shimrat 1962 crossing test). */
export function insideRing(ring: readonly PointMm[], p: PointMm): boolean {
  let inside = false;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i];
    const [xj, yj] = ring[j];
    if (yi > p[1] !== yj > p[1] && p[0] < xi + ((p[1] - yi) * (xj - xi)) / (yj - yi)) inside = !inside;
  }
  return inside;
}

function distToRing(ring: readonly PointMm[], p: PointMm): number {
  let d = Infinity;
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [ax, ay] = ring[j];
    const dx = ring[i][0] - ax;
    const dy = ring[i][1] - ay;
    const l2 = dx * dx + dy * dy;
    const t = l2 === 0 ? 0 : Math.max(0, Math.min(1, ((p[0] - ax) * dx + (p[1] - ay) * dy) / l2));
    d = Math.min(d, Math.hypot(p[0] - ax - t * dx, p[1] - ay - t * dy));
  }
  return d;
}

/**
 * A point well inside the piece for its label: the best of a 24×24 grid of samples by distance to the
 * outline and holes (a coarse pole of inaccessibility). Returns the point and that distance, mm.
 */
export function labelSpot(outline: readonly PointMm[], holes: readonly PointMm[][]): { at: PointMm; room: number } {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const [x, y] of outline) {
    minX = Math.min(minX, x); minY = Math.min(minY, y); maxX = Math.max(maxX, x); maxY = Math.max(maxY, y);
  }
  let best: PointMm = [(minX + maxX) / 2, (minY + maxY) / 2];
  let room = -1;
  const n = 24;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const p: PointMm = [minX + ((i + 0.5) / n) * (maxX - minX), minY + ((j + 0.5) / n) * (maxY - minY)];
      if (!insideRing(outline, p) || holes.some((h) => insideRing(h, p))) continue;
      const d = Math.min(distToRing(outline, p), ...holes.map((h) => distToRing(h, p)));
      if (d > room) {
        room = d;
        best = p;
      }
    }
  }
  return { at: best, room: Math.max(room, 0) };
}

/** Digits of a seam label as (long, short) tick counts: tens and units of its number, or one short tick for a label that is not a number. */
export function matchTicks(label: string): { long: number; short: number } {
  const n = /^\d+$/.test(label) ? Number(label) : NaN;
  if (!Number.isFinite(n) || n <= 0) return { long: 0, short: 1 };
  return { long: Math.floor(n / 10), short: n % 10 };
}

function edgeMarks(piece: PatternPiece, edge: PieceSeamEdge, doc: PatternDoc, f: (p: PointMm) => PointMm, out: PieceDrawing): void {
  const len = pathLengthMm(edge.path);
  if (len < 1) return;
  const place = (p: PointMm) => f(p);
  // Inward normal, chosen by testing which side of the edge's midpoint lies inside the piece.
  const mid = pointAlongPath(edge.path, len / 2);
  let nx = -mid.tangent[1];
  let ny = mid.tangent[0];
  if (!insideRing(piece.outline, [mid.p[0] + nx * 1.5, mid.p[1] + ny * 1.5])) {
    nx = -nx;
    ny = -ny;
  }
  const along = (d: number, inward: number): PointMm => {
    const q = pointAlongPath(edge.path, d);
    return place([q.p[0] + nx * inward, q.p[1] + ny * inward]);
  };
  const tangentAngle = (d: number) => {
    const a = place(pointAlongPath(edge.path, d).p);
    const b = place(pointAlongPath(edge.path, Math.min(len, d + 1)).p);
    return upright(b[0] - a[0], b[1] - a[1]);
  };

  // Match mark: ticks centred on the edge's middle, tens (long) first in the seam's direction. On an
  // edge shorter than the run the pitch closes up to 0.8 mm so the ticks stay on their own edge.
  const { long, short } = matchTicks(edge.seam);
  const count = long + short;
  const pitch = count > 1 ? Math.max(0.8, Math.min(1.6, (len - 1) / (count - 1))) : 1.6;
  const start = len / 2 - ((count - 1) * pitch) / 2;
  for (let k = 0; k < count; k++) {
    const d = start + k * pitch;
    out.lines.push(line('match', [along(d, 0), along(d, k < long ? 7 : 4)]));
  }
  // The seam number once, at the edge's middle, in a square frame turned with the edge.
  const boxC = len / 2;
  const s = 2.6;
  const theta = (tangentAngle(boxC) * Math.PI) / 180;
  const ux: PointMm = [Math.cos(theta) * s, Math.sin(theta) * s];
  const uy: PointMm = [-ux[1], ux[0]];
  // The frame travels with the number: further in, or to either side, when the first spot is taken.
  const numberAt = (d: number, inward: number) => {
    const centre = along(d, inward);
    const corner = (a: number, b: number): PointMm => [centre[0] + a * ux[0] + b * uy[0], centre[1] + a * ux[1] + b * uy[1]];
    return { text: edge.seam, at: centre, angleDeg: tangentAngle(boxC), companions: [line('match', [corner(-1, -1), corner(1, -1), corner(1, 1), corner(-1, 1)], true)] };
  };
  // On a ragged outline the side found at the middle can be the outside a little further on, so the
  // other side is tried too (declutter-texts.ts keeps the number inside its piece when it can).
  const numberSpots = [9, 15, -9, -15, 21].flatMap((inward) => [numberAt(boxC, inward + Math.sign(inward) * s), numberAt(boxC - 2.5 * s, inward + Math.sign(inward) * s), numberAt(boxC + 2.5 * s, inward + Math.sign(inward) * s)]);
  out.texts.push({ layer: 'text', style: 'match', ...numberSpots[0], sizeMm: 2.6, weight: 'bold', padMm: 1.6, priority: 2, keep: true, alternatives: numberSpots.slice(1) });

  // Bevel triangles and text.
  const seam = doc.seams.find((q) => q.label === edge.seam);
  const convex = seam ? seam.convex : true;
  const square = edge.bevelFace === 'none' || edge.bevelDeg < 0.5;
  if (!square) {
    for (let d = 6; d < len - 4; d += 14) {
      if (Math.abs(d - len / 2) < 9) continue;
      out.lines.push(line('bevel', [along(d, 1.2), along(d + 1.6, 4), along(d - 1.6, 4)], true, !convex));
    }
  }
  // Bevel note: the full wording where the edge is long enough to carry it beside the number frame,
  // else the short form (angle and face; the frame gives the seam, the triangles the corner), tried at
  // several places along the edge; a note that clashes everywhere is left off (declutter-texts.ts).
  const full = square ? `seam ${edge.seam} · square cut` : `seam ${edge.seam} · bevel ${edge.bevelDeg.toFixed(1)}° · ${edge.bevelFace} face · ${convex ? 'outside' : 'inside'} corner`;
  const brief = square ? 'square cut' : `${edge.bevelDeg.toFixed(1)}° ${edge.bevelFace}`;
  const noteSize = 2.1;
  const fits = (text: string, room: number) => text.length * 0.48 * noteSize <= room;
  const places: Array<Pick<DrawText, 'text' | 'at' | 'angleDeg'>> = [];
  for (const text of [full, brief]) {
    const half = (text.length * 0.48 * noteSize) / 2;
    // Centres along the edge, either side of the number frame first, then over it further in.
    const spots: Array<[number, number]> = [[boxC - s - 2 - half, 7], [boxC + s + 2 + half, 7], [boxC, 16.5], [len * 0.2, 7], [len * 0.8, 7]];
    for (const [d, inward] of spots) {
      if (d - half < 0 || d + half > len || !fits(text, len)) continue;
      places.push({ text, at: along(d, inward), angleDeg: tangentAngle(d) });
    }
  }
  if (places.length > 0) {
    const [first, ...rest] = places;
    out.texts.push({ layer: 'text', style: 'bevel', ...first, sizeMm: noteSize, weight: 'regular', priority: 3, alternatives: rest });
  }

  // Stations where the bevel changes along the seam (at least 1° from the previous one shown).
  if (seam && seam.stations.length > 1 && seam.bevel.max - seam.bevel.min >= 1) {
    const scale = seam.length3d > 0 ? len / seam.length3d : 1;
    let last = Number.NaN;
    let lastD = -Infinity;
    for (const st of seam.stations) {
      if (!Number.isNaN(last) && Math.abs(st.bevel - last) < 1) continue;
      const d = Math.max(0.5, Math.min(len - 0.5, st.at * scale));
      // Stations closer than 10 mm read as noise on paper; the bench card gives the seam's range.
      if (d - lastD < 10) continue;
      last = st.bevel;
      lastD = d;
      const bar = line('station', [along(d, -1), along(d, 5)]);
      out.texts.push({ layer: 'text', style: 'station', text: `${st.bevel.toFixed(0)}°`, at: along(d, 12.5), angleDeg: tangentAngle(d), sizeMm: 2.1, weight: 'mono', priority: 4, companions: [bar] });
    }
  }
}

/**
 * The copy (0-based, as PieceSeamEdge.copy counts) whose match marks a cut piece of sheet-plan copy
 * `copy` (1-based) carries; a spare repeats the marks of the copy it would replace in turn.
 */
export function markedCopyIndex(piece: PatternPiece, copy: number): number {
  return (copy - 1) % Math.max(1, piece.quantity);
}

/**
 * The copies that need a paper template of their own: every copy when the copies' seams carry different
 * match-mark numbers, else just the first (one template traced `quantity` times).
 */
export function templateCopies(piece: PatternPiece): number[] {
  const marked = (piece.seamEdges ?? []).some((e) => (e.copy ?? 0) > 0);
  return marked ? Array.from({ length: piece.quantity }, (_, k) => k) : [0];
}

/**
 * Builds the drawing of one placed piece copy: outline, holes, label block (label, thickness,
 * quantity, "mirror one", copy), seam match marks and bevels, score lines, darts and texture line.
 * `t` places the piece (outline-transform.ts); `note` is an extra line under the label (e.g. "copy 2").
 * `copyIndex` (0-based) picks which copy's match marks to draw: grouped identical pieces carry different
 * seam numbers on each copy (PieceSeamEdge.copy), and a cut piece must show only its own.
 */
export function pieceDrawing(piece: PatternPiece, doc: PatternDoc, t: PlaceTransform, note?: string, copyIndex = 0): PieceDrawing {
  const f = placePointFn(t);
  const out: PieceDrawing = { lines: [], texts: [] };
  const outline = placeRing(piece.outline, t);
  out.lines.push(line('cut', outline, true));
  for (const h of piece.holes) out.lines.push(line('cut', placeRing(h, t), true));

  const spot = labelSpot(piece.outline, piece.holes);
  const size = Math.max(3, Math.min(14, spot.room * 0.8));
  out.texts.push({ layer: 'text', style: 'label', text: piece.label, at: f(spot.at), angleDeg: 0, sizeMm: size, weight: 'bold', priority: 0, keep: true });
  const infoSize = Math.max(1.8, Math.min(3, size / 3));
  const info = [`${piece.thickness} mm`, `×${piece.quantity}`];
  if (piece.mirrored) info.push('mirror one');
  if (t.mirrored) info.push('mirrored');
  if (note) info.push(note);
  const c = f(spot.at);
  out.texts.push({ layer: 'text', style: 'info', text: info.join(' · '), at: [c[0], c[1] - size * 0.75 - infoSize], angleDeg: 0, sizeMm: infoSize, weight: 'regular', priority: 1, keep: true });

  for (const e of piece.seamEdges ?? []) if ((e.copy ?? 0) === copyIndex) edgeMarks(piece, e, doc, f, out);
  for (const sl of piece.scoreLines ?? []) {
    if (sl.path.length < 2) continue;
    const pts = sl.path.map(f);
    out.lines.push(line('score', pts));
    const half = pointAlongPath(sl.path, pathLengthMm(sl.path) / 2);
    const a = f(half.p);
    const b = f([half.p[0] + half.tangent[0], half.p[1] + half.tangent[1]]);
    const side = (k: number) => f([half.p[0] - half.tangent[1] * k, half.p[1] + half.tangent[0] * k]);
    const angleDeg = upright(b[0] - a[0], b[1] - a[1]);
    const full = `score on inner face · fold ${sl.foldDeg.toFixed(0)}°`;
    const brief = `score ${sl.foldDeg.toFixed(0)}°`;
    out.texts.push({ layer: 'text', style: 'score', text: full, at: side(3), angleDeg, sizeMm: 2, weight: 'regular', priority: 3, alternatives: [{ text: full, at: side(-3), angleDeg }, { text: brief, at: side(3), angleDeg }, { text: brief, at: side(-3), angleDeg }] });
  }
  for (const d of piece.darts ?? []) {
    if (d.path.length < 2) continue;
    out.lines.push(line('dart', d.path.map(f)));
    const end = d.path[d.path.length - 1];
    const prev = d.path[d.path.length - 2];
    const L = Math.hypot(end[0] - prev[0], end[1] - prev[1]) || 1;
    const ux = (end[0] - prev[0]) / L;
    const uy = (end[1] - prev[1]) / L;
    out.lines.push(line('dart', [f([end[0] - ux * 3 - uy * 2, end[1] - uy * 3 + ux * 2]), f(end), f([end[0] - ux * 3 + uy * 2, end[1] - uy * 3 - ux * 2])]));
    const s0 = d.path[0];
    out.texts.push({ layer: 'text', style: 'dart', text: `dart: cut to the V · leaves ${d.stretchAfterPct.toFixed(1)} % stretch`, at: f([s0[0] - ux * 4, s0[1] - uy * 4]), angleDeg: 0, sizeMm: 2, weight: 'regular', priority: 1, keep: true });
  }
  if (piece.textureLine && piece.textureLine.length >= 2) {
    const [p0, p1] = piece.textureLine;
    const L = Math.hypot(p1[0] - p0[0], p1[1] - p0[1]) || 1;
    const ux = (p1[0] - p0[0]) / L;
    const uy = (p1[1] - p0[1]) / L;
    out.lines.push(line('texture', [f(p0), f(p1)]));
    out.lines.push(line('texture', [f(p1), f([p1[0] - ux * 4 - uy * 2, p1[1] - uy * 4 + ux * 2])]));
    out.lines.push(line('texture', [f(p0), f([p0[0] + ux * 4 - uy * 2, p0[1] + uy * 4 + ux * 2])]));
    const a = f(p0);
    const b = f(p1);
    out.texts.push({ layer: 'text', style: 'texture', text: 'texture side up along this line', at: f([(p0[0] + p1[0]) / 2 - uy * 3, (p0[1] + p1[1]) / 2 + ux * 3]), angleDeg: upright(b[0] - a[0], b[1] - a[1]), sizeMm: 2, weight: 'regular', priority: 1, keep: true });
  }
  return out;
}
