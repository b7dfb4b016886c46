/**
 * The frame of a build's working pages (pieces, sheets and print, bench): the build's name, a way back to the
 * build page, links between the sections, and the shop the page works in with the person's role there.
 */
import { Link } from 'expo-router';
import { useEffect, useRef, type ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import type { Role } from '../../db/validation';
import { useCurrentShop } from '../../hooks/current-shop';
import { useBuild } from '../../hooks/use-builds';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';

export type BuildSection = 'studio' | 'pieces' | 'sheets' | 'bench';

const SECTIONS: ReadonlyArray<{ key: BuildSection; name: string; path: string }> = [
  { key: 'studio', name: 'Studio', path: '/studio' },
  { key: 'pieces', name: 'Pieces', path: '/pieces' },
  { key: 'sheets', name: 'Sheets & print', path: '/sheets' },
  { key: 'bench', name: 'Bench', path: '/bench' },
];

/** Link to a section of build `buildId` in shop `shopId`, in the app's `/builds/:id/<section>?shop=` form. */
export function buildSectionHref(buildId: string, shopId: string, section: BuildSection | null): string {
  const path = section ? SECTIONS.find((s) => s.key === section)!.path : '';
  return `/builds/${encodeURIComponent(buildId)}${path}?shop=${encodeURIComponent(shopId)}`;
}

export interface BuildPageContext {
  shopId: string;
  buildId: string;
  buildName: string;
  role: Role;
  /** Owners and crew (editors) may change things; clients (viewers) only look. */
  canEdit: boolean;
}

export interface BuildSubpageProps {
  buildId: string;
  /** The `shop` query parameter, or null to use the current shop. */
  shopParam: string | null;
  section: BuildSection;
  /** Widest the page gets, px: the bench stays a phone column, pieces and sheets use a laptop's width. */
  maxWidth?: number;
  children: (ctx: BuildPageContext) => ReactNode;
}

/**
 * Resolves the shop (making the link's shop the current one, as the build page does), loads the build's name and
 * renders the page's heading, back link and section links, then `children` with the page context. Shows a loading
 * line while the build loads and an error notice when it cannot be opened or the person is not in the shop.
 */
export function BuildSubpage({ buildId, shopParam, section, maxWidth = 1200, children }: BuildSubpageProps) {
  const { membership, memberships, choose } = useCurrentShop();
  const shopId = shopParam ?? membership?.shopId ?? '';
  const target = memberships.find((m) => m.shopId === shopId) ?? null;
  const build = useBuild(shopId, buildId);
  const chosen = useRef(false);
  useEffect(() => {
    if (target && !chosen.current) {
      chosen.current = true;
      if (membership?.shopId !== target.shopId) choose(target.shopId);
    }
  }, [target, membership, choose]);

  const sectionName = SECTIONS.find((s) => s.key === section)!.name;
  let body: ReactNode;
  if (!target) {
    body = (
      <Notice tone="error" title="Not in this shop">
        This build belongs to a shop you are not a member of. Ask its owner for an invitation.
      </Notice>
    );
  } else if (build.isPending) {
    body = <Loading label="Loading the build" />;
  } else if (build.error) {
    body = (
      <Notice tone="error" title="This build did not open">
        {build.error.message}
      </Notice>
    );
  } else {
    body = children({ shopId, buildId, buildName: build.data.name, role: target.role, canEdit: target.role !== 'viewer' });
  }
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content} keyboardShouldPersistTaps="handled">
      <View role="main" style={[styles.column, { maxWidth }]}>
        <PageTitle title={build.data ? `${sectionName} · ${build.data.name}` : sectionName} />
        <Link href={buildSectionHref(buildId, shopId, null)} style={styles.back} accessibilityLabel={build.data ? `Back to build ${build.data.name}` : 'Back to the build'}>
          ← {build.data?.name ?? 'Build'}
        </Link>
        <View style={styles.headRow}>
          <Text variant="display" heading={1} style={styles.title}>
            {sectionName}
          </Text>
        </View>
        <View role="navigation" accessibilityLabel="Build sections" style={styles.tabs}>
          {SECTIONS.map((s) => {
            const current = s.key === section;
            return (
              <Link
                key={s.key}
                href={buildSectionHref(buildId, shopId, s.key)}
                aria-current={current ? 'page' : undefined}
                accessibilityLabel={s.name}
                style={[styles.tab, current && styles.tabCurrent]}
              >
                {s.name}
              </Link>
            );
          })}
        </View>
        {body}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: palette.paper },
  content: { paddingHorizontal: space.lg, paddingTop: space.xl, paddingBottom: space.xxxl },
  column: { width: '100%', alignSelf: 'center' },
  back: { color: palette.emberDeep, fontSize: 15, marginBottom: space.sm, alignSelf: 'flex-start', textDecorationLine: 'underline' },
  headRow: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm },
  title: { marginBottom: space.sm },
  tabs: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, marginBottom: space.xl, borderBottomWidth: 1, borderBottomColor: palette.rule },
  tab: {
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    minHeight: 44,
    fontSize: 15,
    color: palette.inkSoft,
    borderTopLeftRadius: radius.sm,
    borderTopRightRadius: radius.sm,
  },
  tabCurrent: { color: palette.ink, backgroundColor: palette.sheet, borderBottomWidth: 3, borderBottomColor: palette.ember, fontWeight: '600' },
});
