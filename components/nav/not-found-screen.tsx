/**
 * The page for an address the app does not know.
 */
import { Link, usePathname } from 'expo-router';
import { StyleSheet } from 'react-native';
import { FoamMark } from '../ui/foam-mark';
import { PageTitle } from '../ui/page-title';
import { Screen } from '../ui/screen';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

/** Says which address was not found and links back to the builds list. */
export function NotFoundScreen() {
  const path = usePathname();
  return (
    <Screen>
      <PageTitle title="No page here" />
      <FoamMark size={40} />
      <Text variant="display" heading={1} style={styles.title}>
        No page here
      </Text>
      <Text>
        Sheetsmith has nothing at <Text variant="mono">{path}</Text>. The link may be mistyped or out of date.
      </Text>
      <Link href="/builds" style={styles.link}>
        Go to your builds
      </Link>
    </Screen>
  );
}

const styles = StyleSheet.create({
  title: { marginVertical: space.lg },
  link: { marginTop: space.xl, color: palette.emberDeep, fontSize: 16, textDecorationLine: 'underline' },
});
