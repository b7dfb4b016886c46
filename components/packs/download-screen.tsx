/**
 * The buyer's download page (the link in the receipt): the pack's files, how many downloads are left and
 * until when. Opening the page does not use up the link; each file download counts one use.
 */
import { Linking, Platform, StyleSheet, View } from 'react-native';
import { useDownload } from '../../hooks/use-packs';
import { formatBytes } from '../../hooks/use-upload';
import { Card } from '../ui/card';
import { Loading } from '../ui/loading';
import { Notice } from '../ui/notice';
import { PageTitle } from '../ui/page-title';
import { Screen } from '../ui/screen';
import { PublicHeader } from './public-header';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

/** Starts the browser's download of `url` (the server sends it as an attachment, so this page stays). */
function openFile(url: string): void {
  if (Platform.OS === 'web') window.location.assign(url);
  else void Linking.openURL(url);
}

/** Renders download link `token`, or the server's reason when it is unknown, expired, used up or revoked. */
export function DownloadScreen({ token }: { token: string }) {
  const download = useDownload(token);
  if (download.isPending) {
    return (
      <Screen>
        <PublicHeader />
        <Loading label="Opening your download" />
      </Screen>
    );
  }
  if (download.error || !download.data) {
    return (
      <Screen>
        <PublicHeader />
        <PageTitle title="Download" />
        <Text variant="display" heading={1}>
          Download
        </Text>
        <Notice tone="error">{download.error?.message ?? 'The download could not be opened.'}</Notice>
      </Screen>
    );
  }
  const d = download.data;
  const left = d.maxUses - d.uses;
  return (
    <Screen>
      <PublicHeader />
      <PageTitle title={d.packTitle} />
      <Text variant="display" heading={1}>
        {d.packTitle}
      </Text>
      <Text variant="small">from {d.shopName}</Text>
      <Card edge style={styles.card}>
        <Text variant="label">
          {left} of {d.maxUses} downloads left · until {new Date(d.expiresAt).toLocaleString()}
        </Text>
        {d.files.map((f) => (
          <View key={f.name} style={styles.file}>
            <Text role="link" aria-label={`Download ${f.name}`} onPress={() => openFile(f.url)} style={styles.fileLink}>
              {f.name}
            </Text>
            <Text variant="mono">{formatBytes(f.sizeBytes)}</Text>
          </View>
        ))}
      </Card>
      <Text variant="small" style={styles.note}>
        Print the PDF at 100 % (no “fit to page”) and measure the scale check square before cutting. {d.licence}
      </Text>
    </Screen>
  );
}

const styles = StyleSheet.create({
  card: { marginTop: space.lg },
  file: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'center', paddingVertical: space.sm, borderBottomWidth: 1, borderBottomColor: palette.rule },
  note: { marginTop: space.lg },
  fileLink: { color: palette.emberDeep, textDecorationLine: 'underline' },
});
