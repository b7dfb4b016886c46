/**
 * One build in the shop's list, with the actions the person's role allows.
 */
import { Link } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { buildRenameBody } from '../../db/validation';
import type { Build } from '../../hooks/api-types';
import type { BuildPermissions } from '../../hooks/role-permissions';
import { useDeleteBuild, useRenameBuild } from '../../hooks/use-builds';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import { fonts, palette, space } from '../ui/theme';
import { BuildNameForm } from './build-name-form';
import { DeleteBuildConfirm } from './delete-build-confirm';
import { formatWhen } from './format-time';

/** Path of a build's page; the shop id travels along so a shared link opens in the right shop. */
export function buildHref(build: Build): string {
  return `/builds/${encodeURIComponent(build.id)}?shop=${encodeURIComponent(build.shopId)}`;
}

/**
 * Renders `build`'s name (a link to its page) and last change time, plus Rename and Delete when `can` allows.
 * Rename opens an inline form; Delete asks to confirm first.
 */
export function BuildRow({ build, can }: { build: Build; can: BuildPermissions }) {
  const [mode, setMode] = useState<'view' | 'rename' | 'delete'>('view');
  const rename = useRenameBuild(build.shopId);
  const remove = useDeleteBuild(build.shopId);

  return (
    <View role="listitem" accessibilityLabel={build.name} style={styles.row}>
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
      ) : (
        <View style={styles.main}>
          <View style={styles.text}>
            <Link href={buildHref(build)} style={styles.name}>
              {build.name}
            </Link>
            <Text variant="mono">Changed {formatWhen(build.updatedAt)}</Text>
          </View>
          {mode === 'view' && (can.rename || can.delete) ? (
            <View style={styles.actions}>
              {can.rename ? (
                <Button label="Rename" accessibilityLabel={`Rename ${build.name}`} tone="secondary" compact onPress={() => setMode('rename')} />
              ) : null}
              {can.delete ? (
                <Button label="Delete" accessibilityLabel={`Delete ${build.name}`} tone="quiet" compact onPress={() => setMode('delete')} />
              ) : null}
            </View>
          ) : null}
        </View>
      )}
      {mode === 'delete' ? (
        <DeleteBuildConfirm name={build.name} onDelete={() => remove.mutateAsync(build.id)} onCancel={() => setMode('view')} />
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { paddingVertical: space.md, borderTopWidth: 1, borderTopColor: palette.rule },
  main: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.md },
  text: { flexGrow: 1, flexShrink: 1, flexBasis: 200, gap: space.xxs },
  name: { fontFamily: fonts.bodyStrong, fontSize: 17, lineHeight: 24, color: palette.ink, textDecorationLine: 'underline', textDecorationColor: palette.ruleStrong },
  actions: { flexDirection: 'row', gap: space.sm },
});
