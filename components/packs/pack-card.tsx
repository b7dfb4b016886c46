/** One pack in the public catalogue: cover, title, price (or "Free") and the shop that made it. */
import { Link } from 'expo-router';
import { useState } from 'react';
import { Image, StyleSheet, View } from 'react-native';
import type { PackPublic } from '../../hooks/use-packs';
import { Card } from '../ui/card';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';

/** Renders `pack` as a card linking to its page; a pack without a (loadable) cover shows its piece count on a plain panel. */
export function PackCard({ pack, width }: { pack: PackPublic; width: number }) {
  // A cover that fails to load (e.g. removed from the file store) falls back to the plain panel.
  const [coverFailed, setCoverFailed] = useState(false);
  return (
    <Link href={`/packs/${pack.slug}`} accessibilityLabel={`${pack.title}, ${pack.priceCents === 0 ? 'free' : pack.priceLabel}, by ${pack.shopName}`} style={{ width }}>
      <Card edge style={{ width }}>
        {pack.coverUrl && !coverFailed ? (
          <Image source={{ uri: pack.coverUrl }} style={styles.cover} accessibilityLabel={`Cover of ${pack.title}`} resizeMode="cover" onError={() => setCoverFailed(true)} />
        ) : (
          <View style={[styles.cover, styles.blank]}>
            <Text variant="mono">{pack.pieceCount} pieces</Text>
          </View>
        )}
        <Text variant="heading" numberOfLines={2} style={styles.title}>
          {pack.title}
        </Text>
        <View style={styles.row}>
          <Text variant="bodyStrong" style={pack.priceCents === 0 ? styles.free : undefined}>
            {pack.priceCents === 0 ? 'Free' : pack.priceLabel}
          </Text>
          <Text variant="small" numberOfLines={1}>
            {pack.shopName}
          </Text>
        </View>
      </Card>
    </Link>
  );
}

const styles = StyleSheet.create({
  cover: { width: '100%', aspectRatio: 4 / 3, borderRadius: radius.sm, backgroundColor: palette.sheetSunk },
  blank: { alignItems: 'center', justifyContent: 'center' },
  title: { marginTop: space.sm },
  row: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: space.sm, marginTop: space.xs },
  free: { color: palette.ok },
});
