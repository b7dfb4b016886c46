/**
 * One build's page: its name and dates, rename and delete as the role allows, the ways into the studio,
 * pieces, sheets and bench screens, the sculpt versions, pieces, sheet plans, print sets, bench progress, the
 * shop's crew and clients (managed by the owner, read by everyone else) and, for the owner, publishing a
 * pattern pack from a finished print set.
 */
import { Link, useRouter } from 'expo-router';
import { useEffect, useRef, useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { buildRenameBody } from '../../db/validation';
import { useCurrentShop } from '../../hooks/current-shop';
import { buildPermissionsFor } from '../../hooks/role-permissions';
import { useWideLayout } from '../../hooks/use-wide-layout';
import { useBuild, useBuildOverview, useDeleteBuild, useRenameBuild } from '../../hooks/use-builds';
import { useSculpts } from '../../hooks/use-sculpts';
import { MembersPanel } from '../members/members-panel';
import { PublishPackForm } from '../packs/publish-pack-form';
import { usePackCoverPicture } from '../../hooks/use-pack-cover-picture';
import { SculptVersions } from '../sculpts/sculpt-versions';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';
import { BuildNameForm } from './build-name-form';
import { BenchSummary, PiecesSummary, Section, SheetsSummary } from './build-overview-sections';
import { buildHref } from './build-row';
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
  const overview = useBuildOverview(targetShopId, buildId);
  const coverPicture = usePackCoverPicture(buildId);
  const sculpts = useSculpts(targetShopId, buildId);
  const rename = useRenameBuild(targetShopId);
  const remove = useDeleteBuild(targetShopId);
  const [mode, setMode] = useState<'view' | 'rename' | 'delete'>('view');
  // The pack form is long and most visits are about the build itself, so an owner opens it on purpose.
  const [packOpen, setPackOpen] = useState(false);
  const wide = useWideLayout();

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
      <View style={styles.goRow} role="group" accessibilityLabel="Build screens">
        {can.rename ? <Button label="Upload a sculpt" onPress={() => router.push(buildHref(b, '/upload'))} compact /> : null}
        <Button label="Studio" accessibilityLabel="Open the studio" tone="secondary" compact onPress={() => router.push(buildHref(b, '/studio'))} />
        <Button label="Pieces" accessibilityLabel="Open the pieces" tone="secondary" compact onPress={() => router.push(buildHref(b, '/pieces'))} />
        <Button label="Sheets & print" accessibilityLabel="Open sheets and print" tone="secondary" compact onPress={() => router.push(buildHref(b, '/sheets'))} />
        <Button label="Bench view" accessibilityLabel="Open the bench view" tone="secondary" compact onPress={() => router.push(buildHref(b, '/bench'))} />
      </View>
      <Section title="Sculpt versions">
        {sculpts.isPending ? <Loading label="Loading sculpt versions" /> : null}
        {sculpts.error ? (
          <Notice tone="error" title="The sculpt versions did not load">
            {sculpts.error.message}
          </Notice>
        ) : null}
        {sculpts.data && sculpts.data.length === 0 ? (
          <Text variant="small">{can.rename ? 'No sculpt yet. Upload an OBJ, STL or PLY file to start.' : 'No sculpt uploaded yet.'}</Text>
        ) : null}
        {sculpts.data && sculpts.data.length > 0 ? <SculptVersions sculpts={sculpts.data} /> : null}
      </Section>
      {overview.isPending ? <Loading label="Loading pieces, sheets and progress" /> : null}
      {overview.error ? (
        <Notice tone="error" title="Pieces, sheets and progress did not load">
          <Text>{overview.error.message}</Text>
          <Button label="Try again" tone="secondary" compact onPress={() => overview.refetch()} style={styles.retry} />
        </Notice>
      ) : null}
      {overview.data ? (
        <View style={wide ? styles.grid : undefined}>
          <View style={wide ? styles.gridCell : undefined}>
            <PiecesSummary o={overview.data} href={buildHref(b, '/pieces')} canMarkSeams={can.rename} />
          </View>
          <View style={wide ? styles.gridCell : undefined}>
            <BenchSummary o={overview.data} href={buildHref(b, '/bench')} />
          </View>
          <View style={wide ? styles.gridCell : undefined}>
            <SheetsSummary o={overview.data} href={buildHref(b, '/sheets')} />
          </View>
        </View>
      ) : null}
      {targetMembership ? (
        <View style={styles.block}>
          <MembersPanel shopId={targetMembership.shopId} />
        </View>
      ) : null}
      {targetMembership?.role === 'owner' ? (
        packOpen ? (
          <View style={styles.block}>
            <PublishPackForm shopId={targetMembership.shopId} buildId={b.id} coverDataUrl={coverPicture.picture} />
            <Button label="Close the pack form" tone="quiet" compact onPress={() => setPackOpen(false)} style={styles.retry} />
          </View>
        ) : (
          <Section title="Pattern pack">
            <Text variant="small">Share or sell a finished print set of this build as a pattern pack; you see its packs and orders here.</Text>
            <Button label="Publish a pattern pack" tone="secondary" compact onPress={() => setPackOpen(true)} style={styles.retry} />
          </Section>
        )
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
  goRow: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm, marginBottom: space.xl },
  retry: { alignSelf: 'flex-start', marginTop: space.sm },
  grid: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg },
  gridCell: { flexBasis: '47%', flexGrow: 1 },
});
