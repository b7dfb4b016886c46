/**
 * The build page's list of sculpt versions: each upload's status, its processing progress, its error, and
 * what the clean-up found (the report figures).
 */
import { StyleSheet, View } from 'react-native';
import { sculptInProgress, type Sculpt } from '../../hooks/use-sculpts';
import { formatBytes } from '../../hooks/use-upload';
import { formatWhen } from '../builds/format-time';
import { ProgressBar } from '../builds/progress-bar';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

const statusWords: Record<Sculpt['status'], string> = { queued: 'Waiting for a worker', running: 'Processing', done: 'Ready', failed: 'Failed' };

/** Returns `mm` as "312 mm" below a metre and "1.25 m" from there. */
export function formatLengthMm(mm: number): string {
  return mm < 1000 ? `${Math.round(mm)} mm` : `${(mm / 1000).toFixed(2)} m`;
}

/** Renders one sculpt version: header line, progress while its job runs, its error, or its report figures. */
export function SculptVersion({ sculpt, newest }: { sculpt: Sculpt; newest: boolean }) {
  const r = sculpt.report;
  return (
    <View role="listitem" accessibilityLabel={`Sculpt version ${sculpt.version}`} style={styles.item}>
      <View style={styles.head}>
        <Text variant="bodyStrong">{`v${sculpt.version}${newest ? ' (current)' : ''}`}</Text>
        <Text variant="mono" style={sculpt.status === 'failed' ? styles.failed : undefined}>
          {statusWords[sculpt.status]}
        </Text>
      </View>
      <Text variant="small">{`${sculpt.fileName} · ${formatBytes(sculpt.sourceBytes)} · units ${sculpt.units} · scale ${Number(sculpt.scale.toFixed(4))} · ${formatWhen(sculpt.createdAt)}`}</Text>
      {sculptInProgress(sculpt) ? (
        <View style={styles.progress}>
          <Text variant="mono">{`${sculpt.stage ?? 'waiting'} · ${Math.round(sculpt.progress)} %`}</Text>
          <ProgressBar pct={sculpt.progress} label={`Processing sculpt version ${sculpt.version}`} />
        </View>
      ) : null}
      {sculpt.status === 'failed' ? <Notice tone="error" title="Processing failed">{sculpt.error ?? 'The job ended without saying why.'}</Notice> : null}
      {r ? (
        <View style={styles.figures}>
          <Text variant="mono">{`Size ${r.sizeMm.map(formatLengthMm).join(' × ')}`}</Text>
          <Text variant="mono">{`${r.sourceTriangles.toLocaleString('en')} → ${r.workingTriangles.toLocaleString('en')} triangles`}</Text>
          {r.weldedVertices > 0 ? <Text variant="mono">{`${r.weldedVertices.toLocaleString('en')} vertices welded`}</Text> : null}
          {r.droppedFaces > 0 ? <Text variant="mono">{`${r.droppedFaces.toLocaleString('en')} degenerate faces dropped`}</Text> : null}
          {r.flippedFaces > 0 ? <Text variant="mono">{`${r.flippedFaces.toLocaleString('en')} faces turned to match`}</Text> : null}
          {r.nonManifoldEdges + r.nonManifoldVertices > 0 ? (
            <Text variant="mono" style={styles.warn}>{`${r.nonManifoldEdges} non-manifold edges, ${r.nonManifoldVertices} non-manifold vertices`}</Text>
          ) : null}
        </View>
      ) : null}
      {r && r.warnings.length > 0 ? (
        <Notice tone="note" title="From the clean-up">
          {r.warnings.map((w, i) => (
            <Text key={i}>{w}</Text>
          ))}
        </Notice>
      ) : null}
    </View>
  );
}

/** Renders the versions newest first (the first is the current one); `sculpts` must be newest first. */
export function SculptVersions({ sculpts }: { sculpts: readonly Sculpt[] }) {
  return (
    <View role="list" accessibilityLabel="Sculpt versions">
      {sculpts.map((s, i) => (
        <SculptVersion key={s.id} sculpt={s} newest={i === 0} />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  item: { paddingVertical: space.md, borderTopWidth: 1, borderTopColor: palette.rule, gap: space.xs },
  head: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', flexWrap: 'wrap', gap: space.sm },
  progress: { gap: space.xxs },
  figures: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.xxs },
  failed: { color: palette.danger },
  warn: { color: palette.caution },
});
