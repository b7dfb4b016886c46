/**
 * Shown when the app cannot tell who is signed in (the server is down or answered with an error).
 */
import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/button';
import { FoamMark } from '../ui/foam-mark';
import { Notice } from '../ui/notice';
import { palette, space } from '../ui/theme';

/** Shows `message` with a "Try again" button that calls `onRetry`. */
export function SessionProblem({ message, onRetry }: { message: string; onRetry: () => void }) {
  return (
    <View role="main" style={styles.wrap}>
      <View style={styles.box}>
        <FoamMark size={40} />
        <Notice tone="error" title="Sheetsmith could not check your sign-in">
          {message}
        </Notice>
        <Button label="Try again" onPress={onRetry} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { flex: 1, backgroundColor: palette.paper, alignItems: 'center', justifyContent: 'center', padding: space.lg },
  box: { width: '100%', maxWidth: 420, gap: space.lg },
});
