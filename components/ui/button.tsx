/**
 * The app's one button, in four tones.
 */
import { ActivityIndicator, Pressable, StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import { Text } from './text';
import { fonts, minTouchTarget, palette, radius, space } from './theme';

export type ButtonTone = 'primary' | 'secondary' | 'danger' | 'quiet';

export interface ButtonProps {
  label: string;
  onPress: () => void;
  tone?: ButtonTone;
  /** Shows a spinner and ignores presses while a request is in flight. */
  busy?: boolean;
  disabled?: boolean;
  /** Spoken name when it should say more than the visible label (e.g. "Rename Left pauldron"). */
  accessibilityLabel?: string;
  compact?: boolean;
  style?: StyleProp<ViewStyle>;
}

const tones: Record<ButtonTone, { bg: string; bgPressed: string; fg: string; border: string }> = {
  primary: { bg: palette.ember, bgPressed: palette.emberDeep, fg: palette.sheet, border: palette.emberDeep },
  secondary: { bg: palette.sheet, bgPressed: palette.sheetSunk, fg: palette.ink, border: palette.ruleStrong },
  danger: { bg: palette.danger, bgPressed: '#7E1F16', fg: palette.sheet, border: '#7E1F16' },
  quiet: { bg: 'transparent', bgPressed: palette.sheetSunk, fg: palette.ink, border: 'transparent' },
};

/**
 * A pressable button with role "button" and an accessible name (its label unless `accessibilityLabel` is given).
 * While `busy` or `disabled` it reports itself disabled and does not call `onPress`.
 */
export function Button({ label, onPress, tone = 'primary', busy, disabled, accessibilityLabel, compact, style }: ButtonProps) {
  const t = tones[tone];
  const inactive = Boolean(busy || disabled);
  return (
    <Pressable
      role="button"
      accessibilityLabel={accessibilityLabel ?? label}
      aria-disabled={inactive}
      aria-busy={busy}
      disabled={inactive}
      onPress={onPress}
      style={({ pressed }) => [
        styles.base,
        compact && styles.compact,
        { backgroundColor: pressed ? t.bgPressed : t.bg, borderColor: t.border },
        inactive && styles.inactive,
        style,
      ]}
    >
      <View style={styles.row}>
        {busy ? <ActivityIndicator size="small" color={t.fg} style={styles.spinner} /> : null}
        <Text style={[styles.label, { color: t.fg }]}>{label}</Text>
      </View>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  base: {
    minHeight: minTouchTarget,
    paddingHorizontal: space.lg,
    borderRadius: radius.sm,
    borderWidth: 1,
    justifyContent: 'center',
    alignItems: 'center',
  },
  compact: { minHeight: 36, paddingHorizontal: space.md },
  inactive: { opacity: 0.55 },
  row: { flexDirection: 'row', alignItems: 'center' },
  spinner: { marginRight: space.sm },
  label: { fontFamily: fonts.bodyStrong, fontSize: 15, lineHeight: 20 },
});
