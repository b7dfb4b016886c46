/**
 * The frame around the sign-in and sign-up forms: the brand on a dark bench panel, the form on paper.
 */
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { useWideLayout } from '../../hooks/use-wide-layout';
import { FoamEdge } from '../ui/foam-edge';
import { FoamMark } from '../ui/foam-mark';
import { PageTitle } from '../ui/page-title';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

const steps = [
  'Bring in a sculpt of the prop',
  'Mark where the seams go',
  'Flatten every piece with the least stretch',
  'Read the bevel for each side of every seam',
  'Print the pattern at true scale and cut',
];

function Brand({ wide }: { wide: boolean }) {
  return (
    <View style={[styles.brand, wide ? styles.brandWide : styles.brandNarrow]}>
      <View style={styles.brandRow}>
        <FoamMark size={wide ? 40 : 30} />
        <Text variant={wide ? 'display' : 'title'} style={styles.brandName}>
          Sheetsmith
        </Text>
      </View>
      <Text style={styles.pitch}>
        From a 3D sculpt to flat foam pieces that bend, bevel and glue back into the same shape.
      </Text>
      {wide ? (
        <View style={styles.steps}>
          {steps.map((s, i) => (
            <View key={s} style={styles.stepRow}>
              <Text variant="mono" style={styles.stepNo}>
                {String(i + 1).padStart(2, '0')}
              </Text>
              <Text style={styles.stepText}>{s}</Text>
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}

/**
 * Lays out `children` (a form) under `title`: beside the brand panel on wide windows, below a compact brand
 * header on phones.
 */
export function AuthFrame({ title, children }: { title: string; children: ReactNode }) {
  const wide = useWideLayout();
  return (
    <View style={[styles.root, wide && styles.rootWide]}>
      <PageTitle title={title} />
      <Brand wide={wide} />
      {wide ? null : <FoamEdge height={6} />}
      <ScrollView
        style={styles.formScroll}
        contentContainerStyle={[styles.formContent, wide && styles.formContentWide]}
        keyboardShouldPersistTaps="handled"
      >
        <View role="main" style={styles.form}>
          <Text variant="title" heading={1} style={styles.title}>
            {title}
          </Text>
          {children}
        </View>
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: palette.paper },
  rootWide: { flexDirection: 'row' },
  brand: { backgroundColor: palette.bench },
  brandWide: { width: 420, padding: space.xxxl, justifyContent: 'center', gap: space.xl },
  brandNarrow: { paddingHorizontal: space.lg, paddingTop: space.xl, paddingBottom: space.lg, gap: space.sm },
  brandRow: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  brandName: { color: palette.onBench },
  pitch: { color: palette.onBenchSoft },
  steps: { gap: space.md, borderTopWidth: 1, borderTopColor: palette.benchLine, paddingTop: space.xl },
  stepRow: { flexDirection: 'row', gap: space.md, alignItems: 'baseline' },
  stepNo: { color: palette.sand },
  stepText: { color: palette.onBench, flex: 1 },
  formScroll: { flex: 1 },
  formContent: { flexGrow: 1, padding: space.lg, paddingVertical: space.xxl },
  formContentWide: { justifyContent: 'center' },
  form: { width: '100%', maxWidth: 420, alignSelf: 'center' },
  title: { marginBottom: space.xl },
});
