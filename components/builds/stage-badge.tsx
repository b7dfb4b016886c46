/**
 * A build's stage as a small tag: a foam-coloured dot and the stage's words.
 */
import { StyleSheet, View } from 'react-native';
import type { BuildStage } from '../../hooks/use-builds';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';
import { stageWords } from './build-list-order';

const dot: Record<(typeof stageWords)[BuildStage]['tone'], string> = {
  idle: palette.inkFaint,
  busy: palette.sand,
  ready: palette.slate,
  done: palette.sage,
  failed: palette.danger,
};

/** Renders the label of `stage` with a dot in the stage's tone; the text itself carries the meaning. */
export function StageBadge({ stage }: { stage: BuildStage }) {
  const w = stageWords[stage];
  return (
    <View style={styles.badge}>
      <View style={[styles.dot, { backgroundColor: dot[w.tone] }]} />
      <Text variant="label" style={w.tone === 'failed' ? styles.failed : undefined}>
        {w.label}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: { flexDirection: 'row', alignItems: 'center', gap: space.xs, paddingVertical: space.xxs, paddingHorizontal: space.sm, borderRadius: radius.pill, backgroundColor: palette.sheetSunk, alignSelf: 'flex-start' },
  dot: { width: 8, height: 8, borderRadius: 4 },
  failed: { color: palette.danger },
});
