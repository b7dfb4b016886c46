/**
 * One build's page: its name and dates, rename and delete as the role allows, and what comes next.
 */
import { Link, useRouter } from 'expo-router';
import { useEffect, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { buildRenameBody } from '../../db/validation';
import { useCurrentShop } from '../../hooks/current-shop';
import { buildPermissionsFor } from '../../hooks/role-permissions';
import { useBuild, useDeleteBuild, useRenameBuild } from '../../hooks/use-builds';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import { BuildNameForm } from './build-name-form';
import { DeleteBuildConfirm } from './delete-build-confirm';
import { formatWhen } from './format-time';
import { JobSteps } from './job-steps';

/**
 * Shows build `buildId` of shop `shopId` (the current shop when the link carried none). If the person belongs
 * to that shop it becomes the current shop; switching shop afterwards returns to the builds list. Rename and delete follow buildPermissionsFor; after a delete the
 * page returns to the builds list.
 */
export function BuildScreen({ buildId, shopId }: { buildId: string; shopId: string | null }) {
  const router = useRouter();
  const { membership, memberships, choose } = useCurrentShop();
  const targetShopId = shopId ?? membership?.shopId ?? '';
  const targetMembership = memberships.find((m) => m.shopId === targetShopId) ?? null;
  const build = useBuild(targetShopId, buildId);
  const rename = useRenameBuild(targetShopId);
  const remove = useDeleteBuild(targetShopId);
  const [mode, setMode] = useState<'view' | 'rename' | 'delete'>('view');

  // On arrival the build's shop becomes the current shop; if the person later switches to another shop in the
  // navigation, this build is no longer in view, so go to that shop's list.
  const arrivedIn = useRef<string | null>(null);
  useEffect(() => {
    if (!targetMembership) return;
    if (arrivedIn.current !== targetMembership.shopId) {
      arrivedIn.current = targetMembership.shopId;
      if (membership?.shopId !== targetMembership.shopId) choose(targetMembership.shopId);
    } else if (membership && membership.shopId !== targetMembership.shopId) {
      router.replace('/builds');
    }
  }, [targetMembership, membership, choose, router]);

  const back = (
    <Link href="/builds" style={styles.back}>
      ← All builds
    </Link>
  );

  if (build.isPending) {
    return (
      <Screen>
        {back}
        <Loading label="Loading the build" />
      </Screen>
    );
  }
  if (build.error) {
    return (
      <Screen>
        {back}
        <Notice tone="error" title="This build did not open">
          {build.error.message}
        </Notice>
      </Screen>
    );
  }
  const b = build.data;
  const can = targetMembership ? buildPermissionsFor(targetMembership.role) : buildPermissionsFor('viewer');
  return (
    <Screen>
      <PageTitle title={b.name} />
      {back}
      <Text variant="overline">{targetMembership?.shopName ?? 'Build'}</Text>
      <Text variant="display" heading={1} style={styles.title}>
        {b.name}
      </Text>
      <View style={styles.dates}>
        <Text variant="mono">Started {formatWhen(b.createdAt)}</Text>
        <Text variant="mono">Changed {formatWhen(b.updatedAt)}</Text>
      </View>
      {mode === 'view' && (can.rename || can.delete) ? (
        <View style={styles.actions}>
          {can.rename ? <Button label="Rename" accessibilityLabel={`Rename ${b.name}`} tone="secondary" compact onPress={() => setMode('rename')} /> : null}
          {can.delete ? <Button label="Delete" accessibilityLabel={`Delete ${b.name}`} tone="quiet" compact onPress={() => setMode('delete')} /> : null}
        </View>
      ) : null}
      {mode === 'rename' ? (
        <Card style={styles.block}>
          <BuildNameForm
            schema={buildRenameBody}
            label="Build name"
            submitLabel="Save name"
            autoFocus
            initialName={b.name}
            onSave={(body) => rename.mutateAsync({ buildId: b.id, body })}
            onSaved={() => setMode('view')}
            onCancel={() => setMode('view')}
          />
        </Card>
      ) : null}
      {mode === 'delete' ? (
        <View style={styles.block}>
          <DeleteBuildConfirm
            name={b.name}
            onDelete={async () => {
              await remove.mutateAsync(b.id);
              router.replace('/builds');
            }}
            onCancel={() => setMode('view')}
          />
        </View>
      ) : null}
      <JobSteps />
    </Screen>
  );
}

const styles = StyleSheet.create({
  back: { color: palette.emberDeep, fontSize: 15, marginBottom: space.lg, alignSelf: 'flex-start', textDecorationLine: 'underline' },
  title: { marginBottom: space.sm },
  dates: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.xxs, marginBottom: space.lg },
  actions: { flexDirection: 'row', gap: space.sm, marginBottom: space.xl },
  block: { marginBottom: space.xl },
});
