/**
 * A labelled text input with its error message underneath.
 */
import { forwardRef, useId } from 'react';
import { StyleSheet, TextInput, View, type TextInputProps } from 'react-native';
import { Text } from './text';
import { fonts, minTouchTarget, palette, radius, space } from './theme';

export interface TextFieldProps extends Omit<TextInputProps, 'style'> {
  /** Visible label; also the input's accessible name. */
  label: string;
  /** Message for a value that is wrong, shown under the field and announced. */
  error?: string;
  hint?: string;
}

/**
 * A text input whose accessible name is `label`, with `hint` under it and `error` (when set) replacing the hint,
 * outlined in the danger colour and linked to the input through aria-describedby.
 */
export const TextField = forwardRef<TextInput, TextFieldProps>(function TextField({ label, error, hint, ...input }, ref) {
  const messageId = useId();
  const message = error ?? hint;
  return (
    <View style={styles.wrap}>
      <Text variant="label" style={styles.label}>
        {label}
      </Text>
      <TextInput
        ref={ref}
        accessibilityLabel={label}
        aria-invalid={Boolean(error)}
        aria-describedby={message ? messageId : undefined}
        placeholderTextColor={palette.inkFaint}
        {...input}
        style={[styles.input, error ? styles.inputError : null]}
      />
      {message ? (
        <Text
          nativeID={messageId}
          variant="small"
          role={error ? 'alert' : undefined}
          style={error ? styles.error : undefined}
        >
          {message}
        </Text>
      ) : null}
    </View>
  );
});

const styles = StyleSheet.create({
  wrap: { gap: space.xs, marginBottom: space.lg },
  label: { marginBottom: space.xxs },
  input: {
    minHeight: minTouchTarget,
    borderWidth: 1,
    borderColor: palette.ruleStrong,
    borderRadius: radius.sm,
    backgroundColor: palette.sheet,
    paddingHorizontal: space.md,
    fontFamily: fonts.body,
    fontSize: 16,
    color: palette.ink,
  },
  inputError: { borderColor: palette.danger, borderWidth: 2 },
  error: { color: palette.danger },
});
