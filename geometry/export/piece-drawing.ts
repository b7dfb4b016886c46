/**
 * What is drawn for one placed piece, as renderer-neutral primitives in drawing millimetres (y up), so
 * the PDF, SVG and DXF writers show the same marks. Sheetsmith's own visual language (the legend on
 * the print set's first page explains it):
 * - cut line: solid outline; holes likewise.
 * - match mark: at the middle of each seam edge, ticks running inward from the edge, tens as long
 *   ticks then units as short ticks, in the seam's own direction, so both pieces of a seam carry the
 *   same pattern at the same place; the seam number sits in a small square just inside.
 * - bevel: a row of small triangles inside the edge pointing at it; hollow for an outside corner,
 *   solid for an inside corner; the angle and the face it is cut from are written along the edge.
 *   Where the bevel changes, a short bar across the edge carries the station's angle.
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

  // Match mark: ticks centred on the edge's middle, tens (long) first in the seam's direction.
  const { long, short } = matchTicks(edge.seam);
  const count = long + short;
  const pitch = 1.6;
  const start = len / 2 - ((count - 1) * pitch) / 2;
  for (let k = 0; k < count; k++) {
    const d = start + k * pitch;
    out.lines.push(line('match', [along(d, 0), along(d, k < long ? 7 : 4)]));
  }
  const boxC = len / 2;
  const s = 2.6;
  out.lines.push(line('match', [along(boxC - s, 9), along(boxC + s, 9), along(boxC + s, 9 + 2 * s), along(boxC - s, 9 + 2 * s)], true));
  out.texts.push({ layer: 'text', style: 'match', text: edge.seam, at: along(boxC, 9 + s), angleDeg: tangentAngle(boxC), sizeMm: 2.6, weight: 'bold' });

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
  const text = square ? `seam ${edge.seam} · square cut` : `seam ${edge.seam} · bevel ${edge.bevelDeg.toFixed(1)}° · ${edge.bevelFace} face · ${convex ? 'outside' : 'inside'} corner`;
  const tAt = Math.min(len * 0.28, Math.max(len / 2 - 10, 0));
  out.texts.push({ layer: 'text', style: 'bevel', text, at: along(tAt, 7), angleDeg: tangentAngle(tAt), sizeMm: 2.1, weight: 'regular' });

  // Stations where the bevel changes along the seam (at least 1° from the previous one shown).
  if (seam && seam.stations.length > 1 && seam.bevel.max - seam.bevel.min >= 1) {
    const scale = seam.length3d > 0 ? len / seam.length3d : 1;
    let last = Number.NaN;
    for (const st of seam.stations) {
      if (!Number.isNaN(last) && Math.abs(st.bevel - last) < 1) continue;
      last = st.bevel;
      const d = Math.max(0.5, Math.min(len - 0.5, st.at * scale));
      out.lines.push(line('station', [along(d, -1), along(d, 5)]));
      out.texts.push({ layer: 'text', style: 'station', text: `${st.bevel.toFixed(0)}°`, at: along(d, 12.5), angleDeg: tangentAngle(d), sizeMm: 2.1, weight: 'mono' });
    }
  }
}

/**
 * Builds the drawing of one placed piece copy: outline, holes, label block (label, thickness,
 * quantity, "mirror one", copy), seam match marks and bevels, score lines, darts and texture line.
 * `t` places the piece (outline-transform.ts); `note` is an extra line under the label (e.g. "copy 2").
 */
export function pieceDrawing(piece: PatternPiece, doc: PatternDoc, t: PlaceTransform, note?: string): PieceDrawing {
  const f = placePointFn(t);
  const out: PieceDrawing = { lines: [], texts: [] };
  const outline = placeRing(piece.outline, t);
  out.lines.push(line('cut', outline, true));
  for (const h of piece.holes) out.lines.push(line('cut', placeRing(h, t), true));

  const spot = labelSpot(piece.outline, piece.holes);
  const size = Math.max(3, Math.min(14, spot.room * 0.8));
  out.texts.push({ layer: 'text', style: 'label', text: piece.label, at: f(spot.at), angleDeg: 0, sizeMm: size, weight: 'bold' });
  const infoSize = Math.max(1.8, Math.min(3, size / 3));
  const info = [`${piece.thickness} mm`, `×${piece.quantity}`];
  if (piece.mirrored) info.push('mirror one');
  if (t.mirrored) info.push('mirrored');
  if (note) info.push(note);
  const c = f(spot.at);
  out.texts.push({ layer: 'text', style: 'info', text: info.join(' · '), at: [c[0], c[1] - size * 0.75 - infoSize], angleDeg: 0, sizeMm: infoSize, weight: 'regular' });

  for (const e of piece.seamEdges ?? []) edgeMarks(piece, e, doc, f, out);
  for (const sl of piece.scoreLines ?? []) {
    if (sl.path.length < 2) continue;
    const pts = sl.path.map(f);
    out.lines.push(line('score', pts));
    const half = pointAlongPath(sl.path, pathLengthMm(sl.path) / 2);
    const a = f(half.p);
    const b = f([half.p[0] + half.tangent[0], half.p[1] + half.tangent[1]]);
    out.texts.push({ layer: 'text', style: 'score', text: `score on inner face · fold ${sl.foldDeg.toFixed(0)}°`, at: f([half.p[0] - half.tangent[1] * 3, half.p[1] + half.tangent[0] * 3]), angleDeg: upright(b[0] - a[0], b[1] - a[1]), sizeMm: 2, weight: 'regular' });
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
    out.texts.push({ layer: 'text', style: 'dart', text: `dart: cut to the V · leaves ${d.stretchAfterPct.toFixed(1)} % stretch`, at: f([s0[0] - ux * 4, s0[1] - uy * 4]), angleDeg: 0, sizeMm: 2, weight: 'regular' });
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
    out.texts.push({ layer: 'text', style: 'texture', text: 'texture side up along this line', at: f([(p0[0] + p1[0]) / 2 - uy * 3, (p0[1] + p1[1]) / 2 + ux * 3]), angleDeg: upright(b[0] - a[0], b[1] - a[1]), sizeMm: 2, weight: 'regular' });
  }
  return out;
}
