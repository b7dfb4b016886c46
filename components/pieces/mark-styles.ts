/**
 * Screen pens for the pattern marks: the same colours and dash rhythm as the printed print set
 * (geometry/export/pdf-canvas.ts STYLE_PEN and its text colours), so a maker reads the board and the paper
 * the same way. Widths and dashes are screen pixels (strokes are drawn with non-scaling width).
 */
import type { DrawStyle, DrawText } from '../../geometry/export/piece-drawing';

export interface ScreenPen {
  color: string;
  widthPx: number;
  /** SVG stroke-dasharray in px, absent for a solid line. */
  dash?: readonly number[];
}

/** Pen per draw style; colours match the print set's pens one for one. */
export const SCREEN_PENS: Readonly<Record<DrawStyle, ScreenPen>> = {
  cut: { color: '#1b1b1b', widthPx: 1.6 },
  match: { color: '#00756f', widthPx: 1.2 },
  bevel: { color: '#b4501b', widthPx: 1 },
  station: { color: '#b4501b', widthPx: 1.4 },
  score: { color: '#6b3fa0', widthPx: 1.2, dash: [9, 3, 1.5, 3] },
  dart: { color: '#9a2e4e', widthPx: 1.2, dash: [4, 2.5] },
  texture: { color: '#4d5a2a', widthPx: 1 },
};

/** Text colour per text style, as printed. */
export const SCREEN_TEXT_COLORS: Readonly<Record<DrawText['style'], string>> = {
  label: '#1b1b1b',
  info: '#1b1b1b',
  match: '#00756f',
  bevel: '#b4501b',
  station: '#b4501b',
  score: '#6b3fa0',
  dart: '#9a2e4e',
  texture: '#4d5a2a',
};

/** Fill of the picked piece and of a piece over its stretch budget (light washes that keep the marks legible). */
export const PIECE_FILLS = { plain: '#fffcf6', selected: '#f7e3d4', overBudget: '#fbf0d2' } as const;
