/** The public catalogue of pattern packs: no sign-in needed, newest first, a page at a time. */
import { useState } from 'react';
import { StyleSheet, useWindowDimensions, View } from 'react-native';
import { useCatalogue } from '../../hooks/use-packs';
import { Button } from '../ui/button';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Screen } from '../ui/screen';
import { PublicHeader } from './public-header';
import { Text } from '../ui/text';
import { contentMaxWidth, space } from '../ui/theme';
import { PackCard } from './pack-card';

/** Renders the catalogue as a grid of cards: one column on a phone, up to three on a wide window. */
export function CatalogueScreen() {
  const [page, setPage] = useState(1);
  const catalogue = useCatalogue(page);
  const { width } = useWindowDimensions();
  const column = Math.min(width - space.lg * 2, contentMaxWidth);
  const perRow = column >= 700 ? 3 : column >= 460 ? 2 : 1;
  const cardWidth = Math.floor((column - space.md * (perRow - 1)) / perRow);
  const data = catalogue.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / data.perPage)) : 1;
  return (
    <Screen>
      <PublicHeader />
      <PageTitle title="Pattern packs" />
      <Text variant="display" heading={1}>
        Pattern packs
      </Text>
      <Text variant="small" style={styles.lead}>
        Foam patterns made with Sheetsmith, ready to print at true scale. Free ones are yours for an e-mail address.
      </Text>
      {catalogue.isPending ? <Loading label="Loading the catalogue" /> : null}
      {catalogue.error ? <Notice tone="error">{catalogue.error.message}</Notice> : null}
      {data && data.packs.length === 0 ? <Notice tone="note">No packs are published yet.</Notice> : null}
      {data ? (
        <View style={styles.grid} role="list">
          {data.packs.map((p) => (
            <View key={p.slug} role="listitem">
              <PackCard pack={p} width={cardWidth} />
            </View>
          ))}
        </View>
      ) : null}
      {pages > 1 ? (
        <View style={styles.pager}>
          <Button label="Newer" tone="secondary" compact disabled={page <= 1} onPress={() => setPage(page - 1)} accessibilityLabel="Newer packs" />
          <Text variant="mono">
            Page {page} of {pages}
          </Text>
          <Button label="Older" tone="secondary" compact disabled={page >= pages} onPress={() => setPage(page + 1)} accessibilityLabel="Older packs" />
        </View>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  lead: { marginBottom: space.lg },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  pager: { flexDirection: 'row', alignItems: 'center', justifyContent: 'center', gap: space.md, marginTop: space.xl },
});
