/**
 * A pack's public page: cover, description, what is in it, licence, price and the buy/take form, and the
 * workshop cautions. After the payment page it shows "check your e-mail" (`paid`) or that nothing was charged
 * (`cancelled`).
 */
import { Link } from 'expo-router';
import { Image, StyleSheet, View } from 'react-native';
import { usePublicPack } from '../../hooks/use-packs';
import { formatBytes } from '../../hooks/use-upload';
import { Card } from '../ui/card';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Screen } from '../ui/screen';
import { PublicHeader } from './public-header';
import { Text } from '../ui/text';
import { palette, radius, space } from '../ui/theme';
import { BuyPackForm } from './buy-pack-form';

/** Renders pack `slug`; `returned` says how the buyer came back from the payment page, if they did. */
export function PackScreen({ slug, returned }: { slug: string; returned: 'paid' | 'cancelled' | null }) {
  const pack = usePublicPack(slug);
  if (pack.isPending) {
    return (
      <Screen>
        <PublicHeader />
        <Loading label="Loading the pack" />
      </Screen>
    );
  }
  if (pack.error || !pack.data) {
    return (
      <Screen>
        <PublicHeader />
        <PageTitle title="Pattern pack" />
        <Text variant="display" heading={1}>
          Pattern pack
        </Text>
        <Notice tone="error">{pack.error?.message ?? 'The pack could not be loaded.'}</Notice>
        <Link href="/packs" style={styles.link}>All pattern packs</Link>
      </Screen>
    );
  }
  const p = pack.data;
  return (
    <Screen>
      <PublicHeader />
      <Link href="/packs" style={styles.link} accessibilityLabel="All pattern packs">
        ← All pattern packs
      </Link>
      <PageTitle title={p.title} />
      <Text variant="display" heading={1}>
        {p.title}
      </Text>
      <Text variant="small">by {p.shopName}</Text>
      {returned === 'paid' ? (
        <Notice tone="note" title="Thank you — check your e-mail">
          Your payment went through. The receipt with your download link is on its way; it works for 24 hours and for 5
          file downloads.
        </Notice>
      ) : null}
      {returned === 'cancelled' ? <Notice tone="caution">The payment was cancelled; nothing was charged.</Notice> : null}
      {p.coverUrl ? <Image source={{ uri: p.coverUrl }} style={styles.cover} accessibilityLabel={`Cover of ${p.title}`} resizeMode="cover" /> : null}
      <Card edge style={styles.block}>
        <Text variant="title">{p.priceCents === 0 ? 'Free' : p.priceLabel}</Text>
        {returned === 'paid' ? null : <BuyPackForm pack={p} />}
      </Card>
      <Text variant="heading" heading={2} style={styles.heading}>About this pattern</Text>
      <Text>{p.description}</Text>
      <Text variant="heading" heading={2} style={styles.heading}>What you get</Text>
      <Text variant="small">{p.pieceCount} pieces, printed at 1:1 with a scale check square:</Text>
      {p.files.map((f) => (
        <Text key={f.name} variant="mono">
          {f.name} · {formatBytes(f.sizeBytes)}
        </Text>
      ))}
      <Text variant="heading" heading={2} style={styles.heading}>Licence</Text>
      <Text variant="small">{p.licence}</Text>
      <View style={styles.block}>
        <Notice tone="caution" title="Working foam safely">
          {p.cautions}
        </Notice>
      </View>
    </Screen>
  );
}

const styles = StyleSheet.create({
  link: { color: palette.emberDeep, fontSize: 14, textDecorationLine: 'underline', marginBottom: space.sm },
  // Capped so on a wide window the cover does not push the price and the form below the fold.
  cover: { width: '100%', maxWidth: 480, aspectRatio: 4 / 3, borderRadius: radius.md, marginTop: space.lg, backgroundColor: palette.sheetSunk },
  block: { marginTop: space.lg },
  heading: { marginTop: space.xl, marginBottom: space.xs },
});
