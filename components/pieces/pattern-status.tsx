/**
 * The states every pattern-based page goes through: loading, an error, no pattern yet (go mark seams in the
 * studio), a pattern being flattened (with the job's progress), a failed flattening, and the finished document.
 */
import { Link } from 'expo-router';
import { useRef, type ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { isJobActive, usePattern, useRequeuePattern, type PatternView } from '../../hooks/use-pattern';
import { Button } from '../ui/button';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';
import { buildSectionHref } from './build-subpage';

/**
 * A labelled progress bar for a background job: role "progressbar" with its value 0–100 and the job's stage
 * in words ("queued", "flattening" …) beside it. A job that reports no figure (`progress` null) gets a bar
 * without a value, so no percentage is made up.
 */
export function JobProgress({ label, progress, stage }: { label: string; progress: number | null; stage: string | null }) {
  const pct = progress === null ? null : Math.max(0, Math.min(100, Math.round(progress)));
  return (
    <View style={styles.job}>
      <Text variant="label">
        {label}
        {stage ? ` · ${stage}` : ''}
        {pct === null ? '…' : ` · ${pct} %`}
      </Text>
      <View role="progressbar" accessibilityLabel={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct ?? undefined} style={styles.track}>
        <View style={[styles.fill, pct === null ? styles.unknown : { width: `${pct}%` }]} />
      </View>
    </View>
  );
}

export interface PatternGateProps {
  shopId: string;
  buildId: string;
  canEdit: boolean;
  /** What the page shows once there is a document. */
  children: (doc: PatternDoc, pattern: PatternView) => ReactNode;
}

/**
 * Loads the build's pattern (polling while it is made) and renders `children` once a document exists. While a
 * change re-flattens the pieces, the last finished pieces stay on screen under the job's progress, so a maker
 * does not lose the board on every setting change.
 */
export function PatternGate({ shopId, buildId, canEdit, children }: PatternGateProps) {
  const pattern = usePattern(shopId, buildId);
  const requeue = useRequeuePattern(shopId, buildId);
  const lastDone = useRef<PatternView | null>(null);
  if (pattern.data?.doc) lastDone.current = pattern.data;
  const studio = (
    <Link href={buildSectionHref(buildId, shopId, 'studio')} style={styles.link} accessibilityLabel="Open the studio to mark seams">
      Open the studio to mark seams →
    </Link>
  );
  if (pattern.isPending) return <Loading label="Loading the pattern" />;
  if (pattern.error) {
    return (
      <View>
        <Notice tone="error" title="The pattern did not load">
          {pattern.error.message}
        </Notice>
        <Button label="Try again" tone="secondary" compact onPress={() => pattern.refetch()} />
      </View>
    );
  }
  const p = pattern.data;
  if (!p) {
    return (
      <View style={styles.empty}>
        <Text variant="heading" heading={2}>
          No pattern yet
        </Text>
        <Text>Pieces appear here once the sculpt has seams and the pieces are flattened. Mark the seams on the 3D view first.</Text>
        {studio}
      </View>
    );
  }
  const active = isJobActive(p.status);
  const progress = active ? <JobProgress label={p.status === 'queued' ? 'Waiting to flatten the pieces' : 'Flattening the pieces'} progress={p.progress} stage={p.stage} /> : null;
  if (!p.doc) {
    const previous = lastDone.current;
    if (active && previous?.doc && previous.sculptId === p.sculptId) {
      return (
        <View>
          {progress}
          <Text variant="small" style={styles.previous}>
            Showing the pieces as they were until the new ones are ready.
          </Text>
          {children(previous.doc, previous)}
        </View>
      );
    }
    if (active) return progress;
    return (
      <View>
        <Notice tone="error" title="The pieces could not be flattened">
          {p.error ?? 'The pattern job failed without a message.'}
        </Notice>
        <View style={styles.row}>
          {canEdit ? <Button label="Flatten again" busy={requeue.isPending} onPress={() => requeue.mutate()} /> : null}
          {studio}
        </View>
        {requeue.error ? <Notice tone="error">{requeue.error.message}</Notice> : null}
      </View>
    );
  }
  return (
    <View>
      {progress}
      {p.status === 'failed' && p.error ? (
        <Notice tone="error" title="The last flattening failed">
          {p.error}
        </Notice>
      ) : null}
      {children(p.doc, p)}
    </View>
  );
}

const styles = StyleSheet.create({
  job: { gap: space.xs, marginBottom: space.lg },
  track: { height: 10, borderRadius: radius.pill, backgroundColor: palette.sheetSunk, borderWidth: 1, borderColor: palette.rule, overflow: 'hidden' },
  fill: { height: '100%', backgroundColor: palette.slate },
  unknown: { width: '100%', opacity: 0.35 },
  empty: { gap: space.md, padding: space.lg, borderWidth: 1, borderStyle: 'dashed', borderColor: palette.ruleStrong, borderRadius: radius.md, backgroundColor: palette.sheet },
  link: { color: palette.emberDeep, textDecorationLine: 'underline', fontSize: 16, paddingVertical: space.sm },
  previous: { marginTop: -space.sm, marginBottom: space.lg },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'center', marginBottom: space.lg },
});
