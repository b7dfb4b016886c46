/**
 * The second step of deleting a build: say what will go, then ask again.
 */
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';
import { ApiError } from '../../hooks/api-client';
import { Button } from '../ui/button';
import { Notice } from '../ui/notice';
import { Text } from '../ui/text';
import { space } from '../ui/theme';

/**
 * Asks whether to delete the build named `name`. "Delete build" calls `onDelete`; a failure is shown here and
 * the build stays. "Keep it" calls `onCancel`.
 */
export function DeleteBuildConfirm({ name, onDelete, onCancel }: { name: string; onDelete: () => Promise<unknown>; onCancel: () => void }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  return (
    <View role="alertdialog" accessibilityLabel={`Delete ${name}?`} style={styles.wrap}>
      <Notice tone="caution" title={`Delete “${name}”?`}>
        <Text>The build and everything in it goes for good, for everyone in the shop. This cannot be undone.</Text>
      </Notice>
      {error ? <Notice tone="error">{error}</Notice> : null}
      <View style={styles.row}>
        <Button
          label="Delete build"
          accessibilityLabel={`Delete build ${name} for good`}
          tone="danger"
          compact
          busy={busy}
          onPress={async () => {
            setBusy(true);
            setError(null);
            try {
              await onDelete();
            } catch (e) {
              setError(e instanceof ApiError ? e.message : `Could not delete: ${String(e)}`);
              setBusy(false);
            }
          }}
        />
        <Button label="Keep it" tone="secondary" compact onPress={onCancel} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { marginTop: space.md },
  row: { flexDirection: 'row', gap: space.sm },
});
