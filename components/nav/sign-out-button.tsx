/**
 * The sign-out control used by both navigation layouts.
 */
import { StyleSheet, View } from 'react-native';
import { useSignOut } from '../../hooks/use-auth';
import { Button } from '../ui/button';
import { Text } from '../ui/text';
import { palette, space } from '../ui/theme';

/**
 * A button that signs out; the signed-in layout then sends the person to the sign-in page. If the server
 * cannot be reached the reason is shown under the button and the person stays signed in.
 */
export function SignOutButton({ dark }: { dark?: boolean }) {
  const signOut = useSignOut();
  return (
    <View style={styles.wrap}>
      <Button
        label="Sign out"
        tone="secondary"
        compact
        busy={signOut.isPending}
        onPress={() => signOut.mutate()}
        style={dark ? styles.dark : undefined}
      />
      {signOut.error ? (
        <Text variant="small" role="alert" style={styles.error}>
          Not signed out: {signOut.error.message}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs },
  dark: { backgroundColor: palette.sheet, borderColor: palette.benchLine },
  error: { color: palette.sand },
});
