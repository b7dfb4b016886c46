/**
 * One pattern piece drawn as a DOM `<svg>` (web), with the print set's marks: see piece-svg-model.ts.
 */
import { useMemo } from 'react';
import { fonts } from '../ui/theme';
import { SCREEN_PENS, SCREEN_TEXT_COLORS } from './mark-styles';
import { readableTexts, type PieceSvgModel } from './piece-svg-model';

export interface PieceSvgProps {
  model: PieceSvgModel;
  /** Screen pixels per millimetre. */
  pxPerMm: number;
  /** Fill behind the marks (selection or warning wash). */
  fill: string;
  /** Outline pen width multiplier, e.g. 2 for the picked piece. */
  outlineBoost?: number;
  /** Short text description for screen readers (the drawing itself is decorative to them). */
  title: string;
  /**
   * Board thumbnails: leave off the frames round seam numbers (the numbers are raised to a readable size and
   * would spill out of frames drawn at paper size) and the thickness line (the cell's caption gives it).
   */
  thumbnail?: boolean;
}

const fontFor = (weight: 'bold' | 'regular' | 'mono') => (weight === 'bold' ? fonts.display : weight === 'mono' ? fonts.mono : fonts.body);

/**
 * Renders `model` at `pxPerMm`: the outline filled with `fill`, every line in its print pen, and the texts that
 * are readable at this scale (readableTexts). Returns an `<svg role="img">` sized in px.
 */
export function PieceSvg({ model, pxPerMm, fill, outlineBoost = 1, title, thumbnail }: PieceSvgProps) {
  const [x, y, w, h] = model.viewBox;
  const texts = useMemo(() => readableTexts(model.texts, pxPerMm).filter((t) => !(thumbnail && t.style === 'info')), [model, pxPerMm, thumbnail]);
  const lines = thumbnail ? model.lines.filter((l) => !(l.style === 'match' && l.d.endsWith('Z'))) : model.lines;
  return (
    <svg
      width={Math.max(1, w * pxPerMm)}
      height={Math.max(1, h * pxPerMm)}
      viewBox={`${x} ${y} ${w} ${h}`}
      role="img"
      aria-label={title}
      style={{ display: 'block', overflow: 'visible' }}
    >
      <path d={model.outlineD} fill={fill} fillRule="evenodd" stroke="none" />
      {lines.map((l, i) => {
        const pen = SCREEN_PENS[l.style];
        const boost = l.style === 'cut' ? outlineBoost : 1;
        return (
          <path
            key={i}
            d={l.d}
            fill={l.filled ? pen.color : 'none'}
            stroke={pen.color}
            strokeWidth={pen.widthPx * boost}
            strokeDasharray={pen.dash ? pen.dash.join(' ') : undefined}
            strokeLinejoin="round"
            vectorEffect="non-scaling-stroke"
          />
        );
      })}
      {texts.map((t, i) => (
        <text
          key={`t${i}`}
          x={t.x}
          y={t.y}
          fontSize={t.shownSizeMm}
          fontFamily={fontFor(t.weight)}
          fill={SCREEN_TEXT_COLORS[t.style]}
          textAnchor="middle"
          dominantBaseline="middle"
          transform={t.rotateDeg ? `rotate(${t.rotateDeg} ${t.x} ${t.y})` : undefined}
        >
          {t.text}
        </text>
      ))}
    </svg>
  );
}
