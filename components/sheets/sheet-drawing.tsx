/**
 * One stock sheet of a sheet plan on a native device, in words (react-native-svg is not part of the app; the
 * web build, sheet-drawing.web.tsx, draws it).
 */
import { View } from 'react-native';
import type { Placement, PlannedSheet } from '../../geometry/layout/plan-sheets';
import { Text } from '../ui/text';

export interface SheetDrawingProps {
  sheet: PlannedSheet;
  placements: readonly Placement[];
  widthPx: number;
  title: string;
}

/** Lists the copies placed on the sheet. */
export function SheetDrawing({ placements, title }: SheetDrawingProps) {
  return (
    <View role="img" accessibilityLabel={title}>
      <Text variant="small">{placements.map((p) => `${p.pieceLabel}${p.spare ? ' (spare)' : ''}`).join(', ')}</Text>
    </View>
  );
}
