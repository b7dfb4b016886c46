/**
 * A row of chips of which one is chosen: a radio group, for short fixed choices (thickness, surface, page size).
 */
import { Pressable, StyleSheet, View, type PressableStateCallbackType } from 'react-native';
import { Text } from '../ui/text';
import { minTouchTarget, palette, radius, space } from '../ui/theme';

export interface Choice<T extends string | number> {
  value: T;
  label: string;
  /** Spoken name when the label alone says too little (e.g. "4 mm foam"). */
  name?: string;
}

type PressState = PressableStateCallbackType & { focused?: boolean };

/**
 * Renders `choices` as a radio group named `label`; the chip whose value equals `value` is checked. Chips call
 * `onChange` unless `disabled` (then the group only shows the choice).
 */
export function ChoiceChips<T extends string | number>({
  label,
  choices,
  value,
  onChange,
  disabled,
}: {
  label: string;
  choices: ReadonlyArray<Choice<T>>;
  value: T | null;
  onChange: (value: T) => void;
  disabled?: boolean;
}) {
  return (
    <View role="radiogroup" accessibilityLabel={label} style={styles.row}>
      {choices.map((c) => {
        const checked = c.value === value;
        return (
          <Pressable
            key={String(c.value)}
            role="radio"
            aria-checked={checked}
            aria-disabled={disabled}
            disabled={disabled}
            accessibilityLabel={c.name ?? c.label}
            onPress={() => onChange(c.value)}
            style={(s: PressState) => [styles.chip, checked && styles.checked, disabled && !checked && styles.inactive, s.focused && styles.focus]}
          >
            <Text style={[styles.text, checked && styles.textChecked]}>{c.label}</Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  chip: {
    minHeight: minTouchTarget,
    minWidth: minTouchTarget,
    paddingHorizontal: space.md,
    justifyContent: 'center',
    alignItems: 'center',
    borderWidth: 1,
    borderColor: palette.ruleStrong,
    borderRadius: radius.pill,
    backgroundColor: palette.sheet,
  },
  checked: { backgroundColor: palette.ink, borderColor: palette.ink },
  inactive: { opacity: 0.55 },
  focus: { outlineColor: palette.slate, outlineWidth: 3, outlineStyle: 'solid', outlineOffset: 2 },
  text: { fontSize: 15 },
  textChecked: { color: palette.sheet },
});
