/**
 * The current shop's builds: start one, open one, rename or delete as the role allows.
 */
import { StyleSheet, View } from 'react-native';
import { buildCreateBody } from '../../db/validation';
import { useCurrentShop } from '../../hooks/current-shop';
import { buildPermissionsFor, roleLabels } from '../../hooks/role-permissions';
import { useBuilds, useCreateBuild } from '../../hooks/use-builds';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { space } from '../ui/theme';
import { BuildNameForm } from './build-name-form';
import { BuildRow } from './build-row';

function StartBuild({ shopId }: { shopId: string }) {
  const create = useCreateBuild(shopId);
  return (
    <Card edge style={styles.block}>
      <Text variant="heading" heading={2} style={styles.blockTitle}>
        Start a build
      </Text>
      <BuildNameForm
        schema={buildCreateBody}
        label="Build name"
        placeholder="e.g. Ridge helmet, left pauldron"
        submitLabel="Start build"
        clearOnSave
        onSave={(body) => create.mutateAsync(body)}
      />
    </Card>
  );
}

/**
 * Lists the current shop's builds newest first with their last change time. Owners and crew can start a build;
 * rename and delete follow buildPermissionsFor. A person with no shop is told so.
 */
export function BuildsListScreen() {
  const { membership } = useCurrentShop();
  const builds = useBuilds(membership?.shopId ?? null);

  if (!membership) {
    return (
      <Screen>
        <PageTitle title="Builds" />
        <Text variant="display" heading={1} style={styles.title}>
          Builds
        </Text>
        <Notice tone="note" title="You are not in any shop">
          Open a shop of your own from the shop switcher (“Open another shop”), or ask a shop owner to add you.
        </Notice>
      </Screen>
    );
  }
  const can = buildPermissionsFor(membership.role);
  return (
    <Screen>
      <PageTitle title={`Builds – ${membership.shopName}`} />
      <Text variant="overline">{membership.shopName}</Text>
      <Text variant="display" heading={1} style={styles.title}>
        Builds
      </Text>
      {can.create ? <StartBuild shopId={membership.shopId} /> : (
        <Notice tone="note">{`You follow this shop's builds as a ${roleLabels[membership.role].name.toLowerCase()}: you can open them but not change them.`}</Notice>
      )}
      <Card style={styles.block}>
        <View style={styles.listHead}>
          <Text variant="heading" heading={2}>
            All builds
          </Text>
          {builds.data ? <Text variant="mono">{builds.data.length === 1 ? '1 build' : `${builds.data.length} builds`}</Text> : null}
        </View>
        {builds.isPending ? <Loading label="Loading builds" /> : null}
        {builds.error ? (
          <Notice tone="error" title="The builds did not load">
            <Text>{builds.error.message}</Text>
            <Button label="Try again" tone="secondary" compact onPress={() => builds.refetch()} style={styles.retry} />
          </Notice>
        ) : null}
        {builds.data && builds.data.length === 0 ? (
          <Text variant="small" style={styles.empty}>
            {can.create ? 'No builds yet. Name your first one above.' : 'No builds in this shop yet.'}
          </Text>
        ) : null}
        {builds.data && builds.data.length > 0 ? (
          <View role="list" accessibilityLabel="Builds">
            {builds.data.map((b) => (
              <BuildRow key={b.id} build={b} can={can} />
            ))}
          </View>
        ) : null}
      </Card>
    </Screen>
  );
}

const styles = StyleSheet.create({
  title: { marginBottom: space.xl },
  block: { marginBottom: space.xl },
  blockTitle: { marginBottom: space.md },
  listHead: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', marginBottom: space.sm },
  empty: { paddingVertical: space.lg },
  retry: { alignSelf: 'flex-start', marginTop: space.sm },
});
