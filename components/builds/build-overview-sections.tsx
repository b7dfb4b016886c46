/**
 * The build page's blocks under the sculpt versions: pieces, sheet plans, print sets and bench progress, each
 * from the build overview (hooks/use-builds.ts useBuildOverview).
 */
import { Link } from 'expo-router';
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import type { BuildOverview } from '../../hooks/use-builds';
import { formatBytes } from '../../hooks/use-upload';
import { Card } from '../ui/card';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import { formatWhen } from './format-time';
import { ProgressBar } from './progress-bar';

/** A titled card on the build page with an optional link at its foot. */
export function Section({ title, children, link }: { title: string; children: ReactNode; link?: { href: string; label: string; name: string } }) {
  return (
    <Card style={styles.section}>
      <Text variant="heading" heading={2} style={styles.sectionTitle}>
        {title}
      </Text>
      {children}
      {link ? (
        <Link href={link.href} accessibilityLabel={link.name} style={styles.link}>
          {link.label}
        </Link>
      ) : null}
    </Card>
  );
}

const jobWords = { queued: 'waiting for a worker', running: 'running', done: 'done', failed: 'failed' } as const;

/**
 * The pieces block: count, parts to cut, seams, pieces over the stretch budget, and the pattern job's state.
 * `canMarkSeams` (editor or owner) decides whether an empty build invites the reader to mark seams.
 */
export function PiecesSummary({ o, href, canMarkSeams }: { o: BuildOverview; href: string; canMarkSeams: boolean }) {
  const over = o.pieces.filter((p) => p.overBudget);
  const copies = o.pieces.reduce((n, p) => n + p.quantity, 0);
  const busy = o.pattern && (o.pattern.status === 'queued' || o.pattern.status === 'running');
  return (
    <Section title="Pieces" link={{ href, label: 'Open the pieces →', name: 'Open the pieces screen' }}>
      {busy ? (
        <View style={styles.job}>
          <Text variant="mono">{`Pattern ${jobWords[o.pattern!.status]}${o.pattern!.stage ? ` · ${o.pattern!.stage}` : ''} · ${Math.round(o.pattern!.progress)} %`}</Text>
          <ProgressBar pct={o.pattern!.progress} label="Pattern progress" />
        </View>
      ) : null}
      {o.pattern?.status === 'failed' ? <Notice tone="error" title="The pattern failed">{o.pattern.error ?? 'The job ended without saying why.'}</Notice> : null}
      {o.pieces.length === 0 ? (
        <Text variant="small">
          {o.pattern
            ? 'No finished pattern yet.'
            : canMarkSeams
              ? 'No pieces yet: mark seams in the studio and the pattern is made from them.'
              : 'No pieces yet: the pattern is made once the crew marks the seams.'}
        </Text>
      ) : (
        <>
          <View style={styles.stats}>
            <Stat value={String(o.pieces.length)} label={o.pieces.length === 1 ? 'piece' : 'pieces'} />
            <Stat value={String(copies)} label="to cut" />
            <Stat value={String(o.seamCount)} label={o.seamCount === 1 ? 'seam' : 'seams'} />
            <Stat value={String(over.length)} label="over budget" warn={over.length > 0} />
          </View>
          {over.length > 0 ? (
            <Notice tone="caution" title={`Over the ${o.stretchBudgetPct ?? '?'} % stretch budget`}>
              <Text>{over.map((p) => `${p.label} (${p.maxStretchPct.toFixed(1)} %)`).join(', ')}. Add a seam or cut the suggested dart.</Text>
            </Notice>
          ) : null}
        </>
      )}
    </Section>
  );
}

function Stat({ value, label, warn }: { value: string; label: string; warn?: boolean }) {
  return (
    <View style={styles.stat}>
      <Text variant="title" style={warn ? styles.warn : undefined}>
        {value}
      </Text>
      <Text variant="small">{label}</Text>
    </View>
  );
}

/** Sheet plans and print sets, newest first, with a link to the sheets screen. */
export function SheetsSummary({ o, href }: { o: BuildOverview; href: string }) {
  return (
    <Section title="Sheets and print" link={{ href, label: 'Open sheets & print →', name: 'Open the sheets and print screen' }}>
      <Text variant="label" style={styles.sub}>
        Sheet plans
      </Text>
      {o.sheetPlans.length === 0 ? <Text variant="small">No sheet plan yet.</Text> : null}
      {o.sheetPlans.map((p) => (
        <View key={p.id} style={styles.line}>
          <Text variant="mono">{formatWhen(p.createdAt)}</Text>
          <Text variant="small">
            {p.status === 'done'
              ? `${p.sheets ?? '?'} sheets · ${p.usedPct === null ? '?' : p.usedPct.toFixed(0)} % used · cost ${p.totalCost === null ? '?' : p.totalCost.toFixed(2)}`
              : p.status === 'failed'
                ? `failed: ${p.error ?? 'no reason given'}`
                : jobWords[p.status]}
          </Text>
        </View>
      ))}
      <Text variant="label" style={styles.sub}>
        Print sets
      </Text>
      {o.printSets === null ? (
        <Notice tone="note" title="Print sets are shared by the shop owner">
          The owner has not opened print sets to you yet; ask them if you need the files.
        </Notice>
      ) : null}
      {o.printSets && o.printSets.length === 0 ? <Text variant="small">No print set yet.</Text> : null}
      {(o.printSets ?? []).map((p) => (
        <View key={p.id} style={styles.line}>
          <Text variant="mono">{`${p.name} · ${p.page.toUpperCase()}`}</Text>
          <Text variant="small">
            {p.status === 'done'
              ? p.files.map((f) => `${f.name} (${formatBytes(f.sizeBytes)})`).join(', ')
              : p.status === 'failed'
                ? `failed: ${p.error ?? 'no reason given'}`
                : jobWords[p.status]}
          </Text>
        </View>
      ))}
    </Section>
  );
}

/** The crew's checklist totals: cut, shaped and glued out of the pieces, and the overall share. */
export function BenchSummary({ o, href }: { o: BuildOverview; href: string }) {
  const b = o.bench;
  return (
    <Section title="Progress" link={{ href, label: 'Open the bench view →', name: 'Open the bench view' }}>
      {b.pieces === 0 ? (
        <Text variant="small">The checklist starts when the pattern has pieces.</Text>
      ) : (
        <>
          <View style={styles.stats}>
            <Stat value={`${b.cut}/${b.pieces}`} label="cut" />
            <Stat value={`${b.shaped}/${b.pieces}`} label="shaped" />
            <Stat value={`${b.glued}/${b.pieces}`} label="glued" />
          </View>
          <Text variant="mono">{`${b.progressPct} % of the bench work done`}</Text>
          <ProgressBar pct={b.progressPct} label="Bench progress" tone="bench" />
          {b.stale > 0 ? <Text variant="small">{`${b.stale} ticked pieces belong to an older pattern and are kept aside.`}</Text> : null}
        </>
      )}
    </Section>
  );
}

const styles = StyleSheet.create({
  section: { marginBottom: space.lg },
  sectionTitle: { marginBottom: space.sm },
  link: { color: palette.emberDeep, fontSize: 15, marginTop: space.md, alignSelf: 'flex-start', textDecorationLine: 'underline' },
  job: { gap: space.xxs, marginBottom: space.md },
  stats: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xl, marginBottom: space.sm },
  stat: { minWidth: 64 },
  warn: { color: palette.caution },
  sub: { marginTop: space.sm, marginBottom: space.xxs },
  line: { flexDirection: 'row', flexWrap: 'wrap', justifyContent: 'space-between', columnGap: space.md, paddingVertical: space.xxs },
});
