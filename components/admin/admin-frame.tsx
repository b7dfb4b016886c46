/**
 * The frame of the site admin pages: a heading, the section tabs (people, shops, orders, jobs, mail) and the
 * page below. Admin pages are wider than the reading column because their lists are tables.
 */
import { Link, usePathname } from 'expo-router';
import type { ReactNode } from 'react';
import { ScrollView, StyleSheet, View } from 'react-native';
import { PageTitle } from '../ui/page-title';
import { Text } from '../ui/text';
import { fonts, minTouchTarget, palette, radius, space } from '../ui/theme';

export const ADMIN_SECTIONS = [
  { href: '/admin/users', label: 'People' },
  { href: '/admin/shops', label: 'Shops' },
  { href: '/admin/orders', label: 'Orders' },
  { href: '/admin/jobs', label: 'Jobs' },
  { href: '/admin/mail', label: 'Mail' },
] as const;

/** Renders the admin page `title` with the section tabs and `children` below. */
export function AdminFrame({ title, children }: { title: string; children: ReactNode }) {
  const path = usePathname();
  return (
    <ScrollView style={styles.scroll} contentContainerStyle={styles.content} keyboardShouldPersistTaps="handled">
      <PageTitle title={`Admin · ${title}`} />
      <View role="main" style={styles.column}>
        <View style={styles.top}>
          <Text variant="overline">Site admin</Text>
          <Link href="/builds" accessibilityLabel="Back to builds" style={styles.back}>
            Back to builds
          </Link>
        </View>
        <Text variant="title" heading={1}>
          {title}
        </Text>
        <View role="navigation" accessibilityLabel="Admin sections" style={styles.tabs}>
          {ADMIN_SECTIONS.map((s) => {
            const active = path === s.href;
            return (
              <Link key={s.href} href={s.href} accessibilityLabel={`Admin: ${s.label}`} aria-current={active ? 'page' : undefined} style={[styles.tab, active && styles.tabActive]}>
                {s.label}
              </Link>
            );
          })}
        </View>
        {children}
      </View>
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: palette.paper },
  content: { paddingHorizontal: space.lg, paddingTop: space.xl, paddingBottom: space.xxxl },
  column: { width: '100%', maxWidth: 1200, alignSelf: 'center', gap: space.md },
  top: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center' },
  back: { fontFamily: fonts.bodyStrong, fontSize: 14, color: palette.emberDeep, paddingVertical: space.sm },
  tabs: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, borderBottomWidth: 2, borderBottomColor: palette.rule, paddingBottom: space.xs },
  tab: {
    minHeight: minTouchTarget,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    borderRadius: radius.sm,
    fontFamily: fonts.bodyStrong,
    fontSize: 15,
    color: palette.inkSoft,
    textDecorationLine: 'none',
  },
  tabActive: { backgroundColor: palette.bench, color: palette.onBench },
});
