/**
 * A quiet placeholder shown while the first data for a page arrives.
 */
import { ActivityIndicator, StyleSheet, View } from 'react-native';
import { Text } from './text';
import { palette, space } from './theme';

/** Renders a spinner with `label` (e.g. "Loading builds") as its visible and accessible text. */
export function Loading({ label }: { label: string }) {
  return (
    <View style={styles.wrap} role="progressbar" accessibilityLabel={label}>
      <ActivityIndicator color={palette.ember} />
      <Text variant="small">{label}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { flex: 1, minHeight: 160, alignItems: 'center', justifyContent: 'center', gap: space.sm, padding: space.xl },
});
