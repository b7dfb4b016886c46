/**
 * The studio page of a build: finds the newest processed sculpt version and its seams, shows loading, empty
 * (no sculpt yet → upload), processing and error states, and loads the 3D workspace (three.js and the seam
 * engine) as a separate chunk only once there is something to show.
 */
import { Link } from 'expo-router';
import { lazy, Suspense, type ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { useCurrentShop } from '../../hooks/current-shop';
import { PieceSelectionProvider } from '../../hooks/use-piece-selection';
import { useSculptMesh } from '../../hooks/use-sculpt-mesh';
import { useSculpts } from '../../hooks/use-sculpts';
import { useSeams } from '../../hooks/use-seams';
import { useWideLayout } from '../../hooks/use-wide-layout';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Text } from '../ui/text';
import { contentMaxWidth, palette, space } from '../ui/theme';

const StudioWorkspace = lazy(() => import('./studio-workspace'));

const href = (buildId: string, shopId: string, sub = '') => `/builds/${encodeURIComponent(buildId)}${sub}?shop=${encodeURIComponent(shopId)}`;

/** Renders the studio for build `buildId` of shop `shopId` (the current shop when the link carried none). */
export function StudioScreen({ buildId, shopId }: { buildId: string; shopId: string | null }) {
  const { membership, memberships } = useCurrentShop();
  const targetShopId = shopId ?? membership?.shopId ?? '';
  const role = memberships.find((m) => m.shopId === targetShopId)?.role ?? null;
  const canEdit = role === 'owner' || role === 'editor';
  const wide = useWideLayout();
  const sculpts = useSculpts(targetShopId, buildId);
  const done = sculpts.data?.find((s) => s.status === 'done' && s.meshUrl) ?? null;
  const newest = sculpts.data?.[0] ?? null;
  const mesh = useSculptMesh(done?.meshUrl ?? null);
  const seams = useSeams(targetShopId, buildId, done?.id ?? null);

  let body: ReactNode;
  if (!targetShopId) {
    body = (
      <Notice tone="error" title="No shop">
        This build's shop is not one of yours. Open it from your builds list.
      </Notice>
    );
  } else if (sculpts.isPending) {
    body = <Loading label="Loading the sculpt" />;
  } else if (sculpts.error) {
    body = (
      <Notice tone="error" title="The sculpt did not load">
        {sculpts.error.message}
      </Notice>
    );
  } else if (!newest) {
    body = (
      <View style={styles.empty}>
        <Text>This build has no sculpt yet. Upload a model (OBJ, STL or PLY) to mark its seams here.</Text>
        {canEdit ? (
          <Link href={href(buildId, targetShopId, '/upload')} style={styles.link} accessibilityLabel="Upload a sculpt">
            Upload a sculpt →
          </Link>
        ) : null}
      </View>
    );
  } else if (!done) {
    body =
      newest.status === 'failed' ? (
        <Notice tone="error" title="The sculpt could not be processed">
          {`${newest.fileName}: ${newest.error ?? 'unknown error'}`}
        </Notice>
      ) : (
        <Loading label={`Processing ${newest.fileName}: ${newest.stage ?? 'waiting'} ${newest.progress}%`} />
      );
  } else if (mesh.isPending || seams.isPending) {
    body = <Loading label={mesh.isPending ? 'Downloading the working mesh' : 'Loading the seams'} />;
  } else if (mesh.error || seams.error) {
    body = (
      <Notice tone="error" title={mesh.error ? 'The working mesh did not load' : 'The seams did not load'}>
        {(mesh.error ?? seams.error)!.message}
      </Notice>
    );
  } else {
    body = (
      <>
        {newest.id !== done.id ? (
          <Notice tone="note">{`Version ${newest.version} is still being processed; you are marking version ${done.version}. Seams carry over to the new version where edges match.`}</Notice>
        ) : null}
        <Suspense fallback={<Loading label="Starting the 3D view" />}>
          <StudioWorkspace
            key={done.id}
            shopId={targetShopId}
            buildId={buildId}
            sculptId={done.id}
            mesh={mesh.data!}
            seams={seams.data!}
            canEdit={canEdit}
          />
        </Suspense>
      </>
    );
  }

  return (
    <PieceSelectionProvider>
      <ScrollView style={styles.scroll} contentContainerStyle={[styles.content, wide && styles.contentWide]} keyboardShouldPersistTaps="handled">
        <View role="main" style={[styles.column, wide && styles.columnWide]}>
          <Link href={targetShopId ? href(buildId, targetShopId) : '/builds'} style={styles.back} accessibilityLabel="Back to the build">
            ← Build
          </Link>
          <PageTitle title={done ? `Studio · ${done.fileName} v${done.version}` : 'Studio'} />
          <Text variant="title" role="heading" aria-level={1}>
            {done ? `Studio · ${done.fileName}, version ${done.version}` : 'Studio'}
          </Text>
          {body}
        </View>
      </ScrollView>
    </PieceSelectionProvider>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: palette.paper },
  content: { paddingHorizontal: space.md, paddingTop: space.lg, paddingBottom: space.xxxl },
  contentWide: { paddingHorizontal: space.xl },
  column: { width: '100%', maxWidth: contentMaxWidth, alignSelf: 'center', gap: space.sm },
  columnWide: { maxWidth: 1600 },
  back: { color: palette.slate, fontSize: 15 },
  empty: { gap: space.md, paddingVertical: space.lg },
  link: { color: palette.ember, fontSize: 16, fontWeight: '600' },
});
