/**
 * A row of choices for a role, as a radio group: one press picks it. Used for inviting (crew or client) and
 * for changing a member's role.
 */
import { Pressable, StyleSheet, View } from 'react-native';
import type { Role } from '../../db/validation';
import { roleLabels } from '../../hooks/role-permissions';
import { Text } from '../ui/text';
import { fonts, palette, radius, space } from '../ui/theme';

/**
 * Renders `roles` as radio buttons named by their display names ("Crew", "Client", ...) inside a group named
 * `label`; `value` is checked, `onChange` gets the picked role. `disabled` greys out the group while saving.
 */
export function RoleChoice({ label, roles, value, onChange, disabled }: { label: string; roles: readonly Role[]; value: Role; onChange: (role: Role) => void; disabled?: boolean }) {
  return (
    <View role="radiogroup" accessibilityLabel={label} style={styles.row}>
      {roles.map((role) => {
        const checked = role === value;
        return (
          <Pressable
            key={role}
            role="radio"
            aria-checked={checked}
            accessibilityLabel={`${roleLabels[role].name}: ${roleLabels[role].blurb}`}
            disabled={disabled}
            onPress={() => onChange(role)}
            style={[styles.choice, checked && styles.checked, disabled && styles.disabled]}
          >
            <Text style={[styles.text, checked && styles.textChecked]}>{roleLabels[role].name}</Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
  choice: { minHeight: 36, paddingHorizontal: space.md, justifyContent: 'center', borderWidth: 1, borderColor: palette.ruleStrong, borderRadius: radius.sm, backgroundColor: palette.sheet },
  checked: { backgroundColor: palette.bench, borderColor: palette.bench },
  disabled: { opacity: 0.55 },
  text: { fontFamily: fonts.bodyStrong, fontSize: 14, color: palette.ink },
  textChecked: { color: palette.onBench },
});
