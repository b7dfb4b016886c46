/**
 * The signed-in shell: a top bar on phones, a side bar from 1024 px wide, and the page beside or below it.
 */
import { Link, usePathname } from 'expo-router';
import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import type { User } from '../../hooks/api-types';
import { useCurrentShop } from '../../hooks/current-shop';
import { useWideLayout } from '../../hooks/use-wide-layout';
import { FoamEdge } from '../ui/foam-edge';
import { FoamMark } from '../ui/foam-mark';
import { Text } from '../ui/text';
import { fonts, minTouchTarget, palette, radius, space } from '../ui/theme';
import { RoleBadge } from './role-badge';
import { BrandLink } from './brand-link';
import { ShopSwitcher } from './shop-switcher';
import { SignOutButton } from './sign-out-button';

interface Section {
  href: '/builds' | '/members' | '/packs' | '/admin';
  label: string;
}

/** The main sections for `user`: every member's work, the public pattern packs, and the admin pages for site admins. */
function sectionsFor(user: User): Section[] {
  const sections: Section[] = [
    { href: '/builds', label: 'Builds' },
    { href: '/members', label: 'Crew & clients' },
    { href: '/packs', label: 'Pattern packs' },
  ];
  if (user.isAdmin) sections.push({ href: '/admin', label: 'Site admin' });
  return sections;
}

function SectionLinks({ user, compact }: { user: User; compact?: boolean }) {
  const path = usePathname();
  return (
    <View style={compact ? styles.topLinks : styles.sideLinks}>
      {sectionsFor(user).map((s) => {
        const active = path === s.href || path.startsWith(`${s.href}/`);
        return (
          <Link
            key={s.href}
            href={s.href}
            aria-current={active ? 'page' : undefined}
            style={[compact ? styles.topLink : styles.sideLink, active && (compact ? styles.topLinkActive : styles.sideLinkActive)]}
          >
            {s.label}
          </Link>
        );
      })}
    </View>
  );
}

function SideBar({ user }: { user: User }) {
  const { membership } = useCurrentShop();
  return (
    <View role="navigation" accessibilityLabel="Main" style={styles.side}>
      <View style={styles.sideBrand}>
        <FoamMark size={30} />
        <Text variant="title" style={styles.onBench}>
          Sheetsmith
        </Text>
      </View>
      <ShopSwitcher dark />
      <SectionLinks user={user} />
      <View style={styles.sideFoot}>
        <Text variant="overline" style={styles.onBenchSoft}>
          Signed in
        </Text>
        <Text variant="bodyStrong" numberOfLines={1} style={styles.onBench}>
          {user.name}
        </Text>
        <Text variant="mono" numberOfLines={1} style={styles.onBenchSoft}>
          {user.email}
        </Text>
        {membership ? <RoleBadge role={membership.role} style={styles.sideBadge} /> : null}
        {user.isAdmin ? (
          <Text variant="mono" style={styles.sand}>
            Site admin
          </Text>
        ) : null}
        <SignOutButton dark />
      </View>
    </View>
  );
}

function TopBar({ user }: { user: User }) {
  return (
    <View role="navigation" accessibilityLabel="Main" style={styles.top}>
      <View style={styles.topRow}>
        <BrandLink href="/builds" accessibilityLabel="Sheetsmith: builds" dark />
        <View style={styles.topUser}>
          <Text variant="small" numberOfLines={1} style={[styles.onBenchSoft, styles.topUserName]}>
            {user.name}
          </Text>
        </View>
        <SignOutButton dark />
      </View>
      <ShopSwitcher dark />
      <SectionLinks user={user} compact />
    </View>
  );
}

/**
 * Wraps the page `children` in the navigation for `user`: side bar (brand, shop switcher, sections, who is
 * signed in with their role, sign out) at 1024 px and wider, otherwise a top bar with the same parts stacked.
 */
export function AppFrame({ user, children }: { user: User; children: ReactNode }) {
  const wide = useWideLayout();
  return (
    <View style={[styles.root, wide && styles.rootWide]}>
      {wide ? <SideBar user={user} /> : <TopBar user={user} />}
      {wide ? null : <FoamEdge height={5} />}
      <View style={styles.page}>{children}</View>
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1, backgroundColor: palette.paper },
  rootWide: { flexDirection: 'row' },
  page: { flex: 1 },
  onBench: { color: palette.onBench },
  onBenchSoft: { color: palette.onBenchSoft },
  sand: { color: palette.sand },
  side: { width: 272, backgroundColor: palette.bench, padding: space.xl, gap: space.xl },
  sideBrand: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  sideLinks: { gap: space.xs },
  sideLink: {
    minHeight: minTouchTarget,
    lineHeight: minTouchTarget,
    paddingHorizontal: space.md,
    borderRadius: radius.sm,
    color: palette.onBench,
    fontFamily: fonts.bodyStrong,
    fontSize: 16,
  },
  sideLinkActive: { backgroundColor: palette.benchLine, borderLeftWidth: 4, borderLeftColor: palette.ember },
  sideBadge: { alignSelf: 'flex-start' },
  sideFoot: { marginTop: 'auto', gap: space.xs, borderTopWidth: 1, borderTopColor: palette.benchLine, paddingTop: space.lg },
  top: { backgroundColor: palette.bench, paddingHorizontal: space.lg, paddingTop: space.md, paddingBottom: space.md, gap: space.md },
  topRow: { flexDirection: 'row', alignItems: 'center', gap: space.md },
  topUser: { flex: 1, minWidth: 0, alignItems: 'flex-end' },
  topUserName: { maxWidth: '100%' },
  topLinks: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  topLink: {
    minHeight: minTouchTarget,
    lineHeight: minTouchTarget,
    paddingHorizontal: space.sm,
    borderRadius: radius.sm,
    color: palette.onBench,
    fontFamily: fonts.bodyStrong,
    fontSize: 15,
  },
  topLinkActive: { borderBottomWidth: 3, borderBottomColor: palette.ember },
});
