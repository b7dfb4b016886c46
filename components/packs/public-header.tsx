/**
 * The strip above the public pattern-pack pages (catalogue, pack, download): the Sheetsmith mark back to the
 * catalogue, and a way into the app — the signed-in person's builds, or sign-in.
 */
import { Link } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { useMe } from '../../hooks/use-me';
import { BrandLink } from '../nav/brand-link';
import { fonts, minTouchTarget, palette, space } from '../ui/theme';

export function PublicHeader() {
  const me = useMe();
  const signedIn = !!me.data;
  return (
    <View role="navigation" accessibilityLabel="Sheetsmith" style={styles.bar}>
      <BrandLink href="/packs" accessibilityLabel="Sheetsmith pattern packs" size={22} />
      <Link href={signedIn ? '/builds' : '/sign-in'} style={styles.link}>
        {signedIn ? 'Your builds' : 'Sign in'}
      </Link>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: space.md,
    marginBottom: space.lg,
    paddingBottom: space.sm,
    borderBottomWidth: 1,
    borderBottomColor: palette.rule,
  },
  link: { minHeight: minTouchTarget, lineHeight: minTouchTarget, paddingHorizontal: space.sm, fontFamily: fonts.bodyStrong, color: palette.ink },
});
