/**
 * The scrolling page body every screen sits in.
 */
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { contentMaxWidth, palette, space } from './theme';

/**
 * Renders `children` in a vertically scrolling column no wider than the theme's reading width, centred on
 * wide windows, with the page padding. `role="main"` marks it as the page's main region.
 */
export function Screen({ children }: { children: ReactNode }) {
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content} keyboardShouldPersistTaps="handled">
      <View role="main" style={styles.column}>
        {children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: palette.paper },
  content: { paddingHorizontal: space.lg, paddingTop: space.xl, paddingBottom: space.xxxl },
  column: { width: '100%', maxWidth: contentMaxWidth, alignSelf: 'center' },
});
