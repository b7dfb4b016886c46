/**
 * One stock sheet of a sheet plan drawn as a DOM `<svg>`: the sheet's edge, each placed copy's cut line in the
 * print set's cut pen with its label, spares dashed.
 */
import type { Placement, PlannedSheet } from '../../geometry/layout/plan-sheets';
import { SCREEN_PENS } from '../pieces/mark-styles';
import { fonts } from '../ui/theme';
import { ringLabelPoint, sheetRingPath } from './sheet-plan-model';

export interface SheetDrawingProps {
  sheet: PlannedSheet;
  placements: readonly Placement[];
  /** Width to draw at, px; the height follows the sheet's proportions. */
  widthPx: number;
  title: string;
}

/** Renders the sheet at `widthPx` wide. */
export function SheetDrawing({ sheet, placements, widthPx, title }: SheetDrawingProps) {
  const scale = widthPx / sheet.widthMm;
  const labelMm = Math.max(10 / scale, 6);
  return (
    <svg width={widthPx} height={sheet.heightMm * scale} viewBox={`0 0 ${sheet.widthMm} ${sheet.heightMm}`} role="img" aria-label={title} style={{ display: 'block' }}>
      <rect x={0} y={0} width={sheet.widthMm} height={sheet.heightMm} fill="#efe6d7" stroke="#9a9a9a" strokeWidth={1} vectorEffect="non-scaling-stroke" />
      {placements.map((p, i) => {
        const [lx, ly] = ringLabelPoint(p.outline, sheet.heightMm);
        return (
          <g key={i}>
            <path
              d={sheetRingPath(p.outline, sheet.heightMm) + p.holes.map((h) => ' ' + sheetRingPath(h, sheet.heightMm)).join('')}
              fill={p.spare ? '#fbf0d2' : '#fffcf6'}
              fillRule="evenodd"
              stroke={SCREEN_PENS.cut.color}
              strokeWidth={1}
              strokeDasharray={p.spare ? '4 3' : undefined}
              vectorEffect="non-scaling-stroke"
            />
            <text x={lx} y={ly} fontSize={labelMm} fontFamily={fonts.display} fill="#1b1b1b" textAnchor="middle" dominantBaseline="middle">
              {p.pieceLabel}
              {p.mirrored ? '′' : ''}
            </text>
          </g>
        );
      })}
    </svg>
  );
}
