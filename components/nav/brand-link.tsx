/** The Sheetsmith mark and name as a link, on the dark bench bar of the app or the light strip of public pages. */
import { Link, type Href } from 'expo-router';
import { StyleSheet, View } from 'react-native';
import { FoamMark } from '../ui/foam-mark';
import { Text } from '../ui/text';
import { fonts, palette, space } from '../ui/theme';

export function BrandLink({ href, accessibilityLabel, dark, size = 24 }: { href: Href; accessibilityLabel: string; dark?: boolean; size?: number }) {
  return (
    <Link href={href} accessibilityLabel={accessibilityLabel} style={styles.link}>
      <View style={styles.brand}>
        <FoamMark size={size} />
        <Text variant="heading" style={[styles.name, { color: dark ? palette.onBench : palette.ink }]}>
          Sheetsmith
        </Text>
      </View>
    </Link>
  );
}

const styles = StyleSheet.create({
  link: { flexShrink: 0 },
  brand: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  name: { fontFamily: fonts.display },
});
