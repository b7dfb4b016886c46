/**
 * What the marks on a piece mean, in words (native build; the web build draws a sample of each mark beside it).
 */
import { StyleSheet, View } from 'react-native';
import { Text } from '../ui/text';
import { space } from '../ui/theme';
import { LEGEND_ENTRIES } from './marks-legend-entries';

/** Renders the legend as a list of mark names and meanings. */
export function MarksLegend() {
  return (
    <View role="list" accessibilityLabel="What the marks mean" style={styles.list}>
      {LEGEND_ENTRIES.map((e) => (
        <Text key={e.key} role="listitem" variant="small">
          {e.name}: {e.meaning}
        </Text>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({ list: { gap: space.xs } });
