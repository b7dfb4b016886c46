/**
 * Screen pens for the pattern marks: the same colours and dash rhythm as the printed print set
 * (geometry/export/mark-colours.ts, also used by pdf-canvas.ts), so a maker reads the board and the paper
 * the same way. Widths and dashes are screen pixels (strokes are drawn with non-scaling width).
 */
import { MARK_COLOURS, MARK_DASHES, MARK_TEXT_COLOURS } from '../../geometry/export/mark-colours';
import type { DrawStyle, DrawText } from '../../geometry/export/piece-drawing';

export interface ScreenPen {
  color: string;
  widthPx: number;
  /** SVG stroke-dasharray in px, absent for a solid line. */
  dash?: readonly number[];
}

/** Pen per draw style; colours and dashes are the print set's (geometry/export/mark-colours.ts). */
export const SCREEN_PENS: Readonly<Record<DrawStyle, ScreenPen>> = {
  cut: { color: MARK_COLOURS.cut, widthPx: 1.6 },
  match: { color: MARK_COLOURS.match, widthPx: 1.2 },
  bevel: { color: MARK_COLOURS.bevel, widthPx: 1 },
  station: { color: MARK_COLOURS.station, widthPx: 1.4 },
  score: { color: MARK_COLOURS.score, widthPx: 1.2, dash: MARK_DASHES.score },
  dart: { color: MARK_COLOURS.dart, widthPx: 1.2, dash: MARK_DASHES.dart },
  texture: { color: MARK_COLOURS.texture, widthPx: 1 },
};

/** Text colour per text style, as printed. */
export const SCREEN_TEXT_COLORS: Readonly<Record<DrawText['style'], string>> = MARK_TEXT_COLOURS;

/** Fill of the picked piece and of a piece over its stretch budget (light washes that keep the marks legible). */
export const PIECE_FILLS = { plain: '#fffcf6', selected: '#f7e3d4', overBudget: '#fbf0d2' } as const;
