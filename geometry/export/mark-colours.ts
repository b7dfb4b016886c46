/**
 * Sheetsmith's colours and dash rhythms for pattern marks, one table for paper (pdf-canvas.ts) and screen
 * (components/pieces/mark-styles.ts), so a maker reads the board and the printed sheet the same way: near-black
 * cut lines, teal match marks, rust bevels, violet score lines, plum darts. Pure data (no pdfkit), so the web
 * app can import it.
 */
import type { DrawStyle, DrawText } from './piece-drawing';

/** Stroke colour per draw style. */
export const MARK_COLOURS: Readonly<Record<DrawStyle, string>> = {
  cut: '#1b1b1b',
  match: '#00756f',
  bevel: '#b4501b',
  station: '#b4501b',
  score: '#6b3fa0',
  dart: '#9a2e4e',
  texture: '#4d5a2a',
};

/** Dash rhythm (on, off, …) of the dashed styles, in the drawing's units (pt on paper, px on screen). */
export const MARK_DASHES: Readonly<Partial<Record<DrawStyle, readonly number[]>>> = {
  score: [9, 3, 1.5, 3],
  dart: [4, 2.5],
};

/** Text colour per text style: labels and notes in the cut colour, the rest in their mark's colour. */
export const MARK_TEXT_COLOURS: Readonly<Record<DrawText['style'], string>> = {
  label: MARK_COLOURS.cut,
  info: MARK_COLOURS.cut,
  match: MARK_COLOURS.match,
  bevel: MARK_COLOURS.bevel,
  station: MARK_COLOURS.station,
  score: MARK_COLOURS.score,
  dart: MARK_COLOURS.dart,
  texture: MARK_COLOURS.texture,
};
