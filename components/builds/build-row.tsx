/**
 * One build in the shop's list, with the actions the person's role allows: a table row on a wide screen, a card
 * on a phone.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { buildRenameBody } from '../../db/validation';
import type { Build } from '../../hooks/api-types';
import type { BuildPermissions } from '../../hooks/role-permissions';
import { useDeleteBuild, useRenameBuild, type BuildListItem } from '../../hooks/use-builds';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import { fonts, palette, space } from '../ui/theme';
import { BuildNameForm } from './build-name-form';
import { DeleteBuildConfirm } from './delete-build-confirm';
import { formatWhen } from './format-time';
import { ProgressBar } from './progress-bar';
import { StageBadge } from './stage-badge';

/** Path of a build's page; the shop id travels along so a shared link opens in the right shop. */
export function buildHref(build: Pick<Build, 'id' | 'shopId'>, sub = ''): string {
  return `/builds/${encodeURIComponent(build.id)}${sub}?shop=${encodeURIComponent(build.shopId)}`;
}

/** Widths of the wide table's columns in px (the name column takes the rest); shared with the header. */
export const tableColumns = { updated: 150, sculpt: 64, pieces: 64, progress: 96, status: 150 } as const;

/**
 * Renders `build`: on a wide screen (`wide`) as a table row with name (a link), last change, sculpt version,
 * piece count, bench progress and stage; on a phone as a card with the same facts. Rename and Delete appear
 * when `can` allows; rename opens an inline form, delete asks first.
 */
export function BuildRow({ build, can, wide }: { build: BuildListItem; can: BuildPermissions; wide: boolean }) {
  const [mode, setMode] = useState<'view' | 'rename' | 'delete'>('view');
  const rename = useRenameBuild(build.shopId);
  const remove = useDeleteBuild(build.shopId);
  const s = build.summary;
  const version = s.sculptVersion === null ? '—' : `v${s.sculptVersion}`;
  const actions =
    mode === 'view' && (can.rename || can.delete) ? (
      <View style={styles.actions}>
        {can.rename ? <Button label="Rename" accessibilityLabel={`Rename ${build.name}`} tone="secondary" compact onPress={() => setMode('rename')} /> : null}
        {can.delete ? <Button label="Delete" accessibilityLabel={`Delete ${build.name}`} tone="quiet" compact onPress={() => setMode('delete')} /> : null}
      </View>
    ) : null;
  const name = (
    <Link href={buildHref(build)} style={styles.name}>
      {build.name}
    </Link>
  );
  const forms = (
    <>
      {mode === 'rename' ? (
        <BuildNameForm
          schema={buildRenameBody}
          label={`New name for “${build.name}”`}
          submitLabel="Save name"
          autoFocus
          initialName={build.name}
          onSave={(body) => rename.mutateAsync({ buildId: build.id, body })}
          onSaved={() => setMode('view')}
          onCancel={() => setMode('view')}
        />
      ) : null}
      {mode === 'delete' ? <DeleteBuildConfirm name={build.name} onDelete={() => remove.mutateAsync(build.id)} onCancel={() => setMode('view')} /> : null}
    </>
  );

  if (wide) {
    return (
      <View role="row" accessibilityLabel={build.name} style={styles.tableRow}>
        <View style={styles.cells}>
          <View role="cell" style={styles.nameCell}>
            {mode === 'rename' ? null : name}
          </View>
          <Text role="cell" variant="mono" style={{ width: tableColumns.updated }}>
            {formatWhen(build.updatedAt)}
          </Text>
          <Text role="cell" variant="mono" style={[styles.num, { width: tableColumns.sculpt }]}>
            {version}
          </Text>
          <Text role="cell" variant="mono" style={[styles.num, { width: tableColumns.pieces }]}>
            {String(s.pieceCount)}
          </Text>
          <View role="cell" style={[styles.progressCell, { width: tableColumns.progress }]}>
            <Text variant="mono">{`${s.progressPct} %`}</Text>
            <ProgressBar pct={s.progressPct} label={`Bench progress of ${build.name}`} tone="bench" />
          </View>
          <View role="cell" style={{ width: tableColumns.status }}>
            <StageBadge stage={s.stage} />
          </View>
        </View>
        {actions ? <View style={styles.rowActions}>{actions}</View> : null}
        {forms}
      </View>
    );
  }

  return (
    <View role="listitem" accessibilityLabel={build.name} style={styles.card}>
      {mode === 'rename' ? null : (
        <View style={styles.cardHead}>
          <View style={styles.cardTitle}>{name}</View>
          <StageBadge stage={s.stage} />
        </View>
      )}
      {mode === 'rename' ? null : (
        <>
          <View style={styles.facts}>
            <Text variant="mono">Changed {formatWhen(build.updatedAt)}</Text>
            <Text variant="mono">Sculpt {version}</Text>
            <Text variant="mono">{s.pieceCount === 1 ? '1 piece' : `${s.pieceCount} pieces`}</Text>
          </View>
          {s.pieceCount > 0 ? (
            <View style={styles.cardProgress}>
              <Text variant="mono">{`Bench ${s.progressPct} %`}</Text>
              <ProgressBar pct={s.progressPct} label={`Bench progress of ${build.name}`} tone="bench" />
            </View>
          ) : null}
        </>
      )}
      {actions}
      {forms}
    </View>
  );
}

const styles = StyleSheet.create({
  tableRow: { paddingVertical: space.md, borderTopWidth: 1, borderTopColor: palette.rule },
  cells: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  nameCell: { flex: 1, minWidth: 0, gap: space.xs },
  num: { textAlign: 'right' },
  progressCell: { gap: space.xxs },
  name: { fontFamily: fonts.bodyStrong, fontSize: 17, lineHeight: 24, color: palette.ink, textDecorationLine: 'underline', textDecorationColor: palette.ruleStrong },
  actions: { flexDirection: 'row', gap: space.sm, flexWrap: 'wrap' },
  rowActions: { marginTop: space.xs },
  card: { paddingVertical: space.md, borderTopWidth: 1, borderTopColor: palette.rule, gap: space.sm },
  cardHead: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', justifyContent: 'space-between', gap: space.sm },
  cardTitle: { flexShrink: 1 },
  facts: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.xxs },
  cardProgress: { gap: space.xxs },
});
