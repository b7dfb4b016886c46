/**
 * Keeps the texts of a printed drawing from piling up: texts are placed in priority order (piece
 * label, piece notes, seam numbers, bevel notes, stations); each tries its own spot and then its
 * alternatives, and takes the first that neither overlaps a text already placed nor crosses a cut
 * line and, for edge notes (seam numbers, bevels, stations, score notes), lies inside its own piece.
 * Texts marked `keep` stay even when every spot clashes, at the least bad one; the others are left
 * off, together with their companion lines. This is greedy label placement in the manner of
 * Christensen et al. 1995 (priority order, candidate positions, drop on conflict).
 */
import type { PointMm } from '../pattern/pattern-doc';
import { insideRing, type DrawLine, type DrawText, type PieceDrawing } from './piece-drawing';
import { convexOverlap, textBox } from './text-box';

const CELL = 8;

/** A uniform grid of shapes by bounding box, for finding the few that can clash with a new one. */
class ShapeGrid {
  private readonly cells = new Map<string, PointMm[][]>();

  private keys(shape: readonly PointMm[]): string[] {
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
    for (const [x, y] of shape) {
      minX = Math.min(minX, x); minY = Math.min(minY, y); maxX = Math.max(maxX, x); maxY = Math.max(maxY, y);
    }
    const out: string[] = [];
    for (let i = Math.floor(minX / CELL); i <= Math.floor(maxX / CELL); i++) for (let j = Math.floor(minY / CELL); j <= Math.floor(maxY / CELL); j++) out.push(`${i},${j}`);
    return out;
  }

  add(shape: PointMm[]): void {
    for (const k of this.keys(shape)) {
      const list = this.cells.get(k);
      if (list) list.push(shape);
      else this.cells.set(k, [shape]);
    }
  }

  hits(shape: readonly PointMm[]): boolean {
    for (const k of this.keys(shape)) for (const other of this.cells.get(k) ?? []) if (convexOverlap(shape, other)) return true;
    return false;
  }
}

/**
 * Returns copies of `drawings` (drawing mm, one shared frame) with their texts decluttered: each text
 * at the first of its spots that is clear, or left off when none is and it is not `keep`; companion
 * lines of placed texts join the drawing's lines. Cut lines (closed 'cut' lines) of every drawing are
 * obstacles. Deterministic: ties keep the input order.
 */
export function declutterTexts(drawings: readonly PieceDrawing[]): PieceDrawing[] {
  const cuts = new ShapeGrid();
  for (const d of drawings) {
    for (const l of d.lines) {
      if (l.style !== 'cut') continue;
      const n = l.points.length;
      for (let i = 0; i < (l.closed ? n : n - 1); i++) cuts.add([l.points[i], l.points[(i + 1) % n]]);
    }
  }
  const placed = new ShapeGrid();
  const queue = drawings.flatMap((d, di) => d.texts.map((t, ti) => ({ t, di, ti })));
  queue.sort((a, b) => (a.t.priority ?? 1) - (b.t.priority ?? 1));
  const out: PieceDrawing[] = drawings.map((d) => ({ lines: [...d.lines], texts: [] }));
  const chosen = new Map<string, DrawText>();
  for (const { t, di, ti } of queue) {
    const spots: Array<Pick<DrawText, 'text' | 'at' | 'angleDeg'>> = [t, ...(t.alternatives ?? [])];
    let pick: DrawText | null = null;
    let fallback: { t: DrawText; cost: number } | null = null;
    const own = drawings[di].lines[0];
    const edgeNote = (t.priority ?? 1) > 1;
    for (const spot of spots) {
      const cand: DrawText = { ...t, ...spot };
      const box = textBox(cand);
      // The piece label and its notes may sit over the piece's own outline when the piece is tiny;
      // edge notes must lie inside their own piece and clear of every cut line, or they read as
      // belonging to a neighbour.
      const outside = edgeNote && own !== undefined && !insideRing(own.points, cand.at);
      const overText = placed.hits(box);
      const overCut = edgeNote && cuts.hits(box);
      if (!outside && !overText && !overCut) {
        pick = cand;
        break;
      }
      // A text that must stay takes the least bad spot: inside its piece first, then clear of text.
      const cost = (outside ? 4 : 0) + (overText ? 2 : 0) + (overCut ? 1 : 0);
      if (t.keep && (!fallback || cost < fallback.cost)) fallback = { t: cand, cost };
    }
    if (!pick && fallback) pick = fallback.t;
    if (!pick) continue;
    placed.add(textBox(pick));
    chosen.set(`${di}:${ti}`, pick);
  }
  drawings.forEach((d, di) => {
    d.texts.forEach((_, ti) => {
      const t = chosen.get(`${di}:${ti}`);
      if (!t) return;
      const { alternatives: _alt, companions, ...kept } = t;
      out[di].texts.push(kept);
      out[di].lines.push(...((companions ?? []) as DrawLine[]));
    });
  });
  return out;
}
