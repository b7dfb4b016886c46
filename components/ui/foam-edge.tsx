/**
 * A thin band of the foam-stack colours, used as the top edge of cards and panels.
 */
import { StyleSheet, View } from 'react-native';
import { foamStack } from './theme';

/** Renders a horizontal band `height` px tall split into the foam colours in proportion to their thicknesses. */
export function FoamEdge({ height = 4 }: { height?: number }) {
  return (
    <View style={[styles.row, { height }]} aria-hidden>
      {foamStack.map(([color, mm]) => (
        <View key={color} style={{ flex: mm, backgroundColor: color }} />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({ row: { flexDirection: 'row' } });
