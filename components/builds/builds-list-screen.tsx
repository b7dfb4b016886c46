/**
 * The current shop's builds: start one, find one (filter by name, sort by name, last change or progress), open
 * one, rename or delete as the role allows. A table on a wide screen, cards on a phone.
 */
import { useMemo, useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';
import { buildCreateBody } from '../../db/validation';
import { useCurrentShop } from '../../hooks/current-shop';
import { buildPermissionsFor, roleLabels } from '../../hooks/role-permissions';
import { useBuilds, useCreateBuild } from '../../hooks/use-builds';
import { useWideLayout } from '../../hooks/use-wide-layout';
import { Button } from '../ui/button';
import { Card } from '../ui/card';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { TextField } from '../ui/text-field';
import { fonts, palette, radius, space } from '../ui/theme';
import { BuildNameForm } from './build-name-form';
import { defaultDirection, filterBuilds, sortBuilds, type BuildSortKey, type SortDirection } from './build-list-order';
import { BuildRow, tableColumns } from './build-row';

const sortNames: Record<BuildSortKey, string> = { name: 'Name', updated: 'Last change', progress: 'Progress' };

/**
 * A sort control: pressing it sorts by `sortKey`, or reverses the direction when it already does. On the wide
 * table it is the column header (aria-sort tells screen readers the order).
 */
function SortButton({ sortKey, label, current, direction, onSort, width, align }: {
  sortKey: BuildSortKey;
  label: string;
  current: BuildSortKey;
  direction: SortDirection;
  onSort: (key: BuildSortKey) => void;
  width?: number;
  align?: 'left' | 'right';
}) {
  const active = current === sortKey;
  const arrow = active ? (direction === 'asc' ? ' ↑' : ' ↓') : '';
  return (
    <Pressable
      role="button"
      accessibilityLabel={`Sort by ${sortNames[sortKey].toLowerCase()}${active ? (direction === 'asc' ? ', now ascending' : ', now descending') : ''}`}
      aria-pressed={active}
      onPress={() => onSort(sortKey)}
      style={({ pressed }) => [styles.sortButton, width !== undefined ? { width } : styles.grow, active && styles.sortActive, pressed && styles.sortPressed]}
    >
      <Text variant="label" style={[styles.sortText, align === 'right' && styles.right, active && styles.sortTextActive]}>
        {label + arrow}
      </Text>
    </Pressable>
  );
}

/** A column title the table cannot sort by. */
function PlainHead({ label, width, align }: { label: string; width: number; align?: 'right' }) {
  return (
    <Text role="columnheader" variant="label" style={[styles.plainHead, { width }, align === 'right' && styles.right]}>
      {label}
    </Text>
  );
}

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
  const wide = useWideLayout();
  const [query, setQuery] = useState('');
  const [sortKey, setSortKey] = useState<BuildSortKey>('updated');
  const [direction, setDirection] = useState<SortDirection>('desc');
  const shown = useMemo(() => (builds.data ? sortBuilds(filterBuilds(builds.data, query), sortKey, direction) : []), [builds.data, query, sortKey, direction]);
  const onSort = (key: BuildSortKey) => {
    if (key === sortKey) setDirection(direction === 'asc' ? 'desc' : 'asc');
    else {
      setSortKey(key);
      setDirection(defaultDirection(key));
    }
  };

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
  const sortProps = { current: sortKey, direction, onSort };
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
          {builds.data ? (
            <Text variant="mono">
              {shown.length === builds.data.length
                ? builds.data.length === 1 ? '1 build' : `${builds.data.length} builds`
                : `${shown.length} of ${builds.data.length} builds`}
            </Text>
          ) : null}
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
          <>
            <TextField label="Find a build" placeholder="Part of its name" value={query} onChangeText={setQuery} autoCapitalize="none" autoCorrect={false} />
            {!wide ? (
              <View style={styles.sortRow} role="group" accessibilityLabel="Sort builds">
                <Text variant="small">Sort:</Text>
                {(['updated', 'name', 'progress'] as const).map((k) => (
                  <SortButton key={k} sortKey={k} label={sortNames[k]} {...sortProps} width={undefined} />
                ))}
              </View>
            ) : null}
            {shown.length === 0 ? (
              <Text variant="small" style={styles.empty}>
                {`No build's name contains “${query.trim()}”.`}
              </Text>
            ) : wide ? (
              <View role="table" accessibilityLabel="Builds">
                <View role="row" style={styles.headRow}>
                  <View role="columnheader" style={styles.grow} aria-sort={sortKey === 'name' ? (direction === 'asc' ? 'ascending' : 'descending') : 'none'}>
                    <SortButton sortKey="name" label="Name" {...sortProps} />
                  </View>
                  <View role="columnheader" style={{ width: tableColumns.updated }} aria-sort={sortKey === 'updated' ? (direction === 'asc' ? 'ascending' : 'descending') : 'none'}>
                    <SortButton sortKey="updated" label="Changed" {...sortProps} width={tableColumns.updated} />
                  </View>
                  <PlainHead label="Sculpt" width={tableColumns.sculpt} align="right" />
                  <PlainHead label="Pieces" width={tableColumns.pieces} align="right" />
                  <View role="columnheader" style={{ width: tableColumns.progress }} aria-sort={sortKey === 'progress' ? (direction === 'asc' ? 'ascending' : 'descending') : 'none'}>
                    <SortButton sortKey="progress" label="Progress" {...sortProps} width={tableColumns.progress} />
                  </View>
                  <PlainHead label="Status" width={tableColumns.status} />
                </View>
                {shown.map((b) => (
                  <BuildRow key={b.id} build={b} can={can} wide />
                ))}
              </View>
            ) : (
              <View role="list" accessibilityLabel="Builds">
                {shown.map((b) => (
                  <BuildRow key={b.id} build={b} can={can} wide={false} />
                ))}
              </View>
            )}
          </>
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
  sortRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: space.sm, marginBottom: space.sm },
  sortButton: { minHeight: 36, justifyContent: 'center', paddingHorizontal: space.sm, borderRadius: radius.sm, borderWidth: 1, borderColor: 'transparent' },
  sortActive: { borderColor: palette.ruleStrong, backgroundColor: palette.sheetSunk },
  sortPressed: { backgroundColor: palette.sheetSunk },
  sortText: { color: palette.inkSoft },
  sortTextActive: { color: palette.ink, fontFamily: fonts.bodyStrong },
  grow: { flex: 1 },
  right: { textAlign: 'right' },
  plainHead: { color: palette.inkSoft, paddingHorizontal: space.xxs },
  headRow: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingBottom: space.xs },
});
