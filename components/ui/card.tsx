/**
 * A sheet of paper on the bench: the container for one block of content.
 */
import type { ReactNode } from 'react';
import { StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import { FoamEdge } from './foam-edge';
import { palette, radius, space } from './theme';

/** Renders `children` on a bordered sheet; `edge` adds the foam-stack band across the top. */
export function Card({ children, edge, style }: { children: ReactNode; edge?: boolean; style?: StyleProp<ViewStyle> }) {
  return (
    <View style={[styles.card, style]}>
      {edge ? <FoamEdge /> : null}
      <View style={styles.body}>{children}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: palette.sheet,
    borderWidth: 1,
    borderColor: palette.rule,
    borderRadius: radius.md,
    overflow: 'hidden',
  },
  body: { padding: space.lg },
});
