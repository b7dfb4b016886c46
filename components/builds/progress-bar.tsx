/**
 * A thin bar that fills as work gets done: processing jobs, uploads and the bench checklist.
 */
import { StyleSheet, View } from 'react-native';
import { palette, radius } from '../ui/theme';

/**
 * Renders a progressbar (role "progressbar", aria-valuenow 0–100) filled to `pct` percent (clamped) with the
 * accessible name `label`. `tone` picks the fill: ember while working, sage for finished bench work.
 */
export function ProgressBar({ pct, label, tone = 'work' }: { pct: number; label: string; tone?: 'work' | 'bench' }) {
  const clamped = Math.max(0, Math.min(100, Number.isFinite(pct) ? pct : 0));
  return (
    <View
      role="progressbar"
      aria-label={label}
      aria-valuemin={0}
      aria-valuemax={100}
      aria-valuenow={Math.round(clamped)}
      style={styles.track}
    >
      <View style={[styles.fill, { width: `${clamped}%`, backgroundColor: tone === 'work' ? palette.ember : palette.sage }]} />
    </View>
  );
}

const styles = StyleSheet.create({
  track: { height: 8, borderRadius: radius.pill, backgroundColor: palette.sheetSunk, borderWidth: 1, borderColor: palette.rule, overflow: 'hidden' },
  fill: { height: '100%' },
});
