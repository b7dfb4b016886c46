/**
 * Sheetsmith's mark: four foam sheets of the common thicknesses stacked and offset like a bevelled edge.
 */
import { StyleSheet, View } from 'react-native';
import { foamStack } from './theme';

/**
 * Draws the mark `size` px wide. Each bar's height is its sheet thickness in mm scaled by `size / 32`, and each
 * bar starts a little further right than the one above, the way a stack of bevelled offcuts lines up.
 */
export function FoamMark({ size = 32 }: { size?: number }) {
  const scale = size / 32;
  return (
    <View style={{ width: size }} aria-hidden>
      {foamStack.map(([color, mm], i) => (
        <View
          key={color}
          style={[
            styles.bar,
            { backgroundColor: color, height: mm * scale, marginLeft: i * 3 * scale, marginTop: i === 0 ? 0 : 1.5 * scale },
          ]}
        />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({ bar: { borderRadius: 1 } });
