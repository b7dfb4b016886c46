/**
 * A small tag naming a person's role in the current shop.
 */
import { StyleSheet, View, type StyleProp, type ViewStyle } from 'react-native';
import type { Role } from '../../db/validation';
import { roleLabels } from '../../hooks/role-permissions';
import { Text } from '../ui/text';
import { fonts, palette, radius, space } from '../ui/theme';

const roleColours: Record<Role, string> = { owner: palette.ember, editor: palette.slate, viewer: palette.sage };

/** Renders the role's display name ("Owner", "Crew", "Client") on the role's colour, with "Role:" for readers. */
export function RoleBadge({ role, style }: { role: Role; style?: StyleProp<ViewStyle> }) {
  return (
    <View style={[styles.badge, { backgroundColor: roleColours[role] }, style]} accessibilityLabel={`Role: ${roleLabels[role].name}`}>
      <Text style={styles.text}>{roleLabels[role].name}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: { borderRadius: radius.sm, paddingHorizontal: space.sm, paddingVertical: 1 },
  text: { fontFamily: fonts.monoStrong, fontSize: 12, lineHeight: 18, color: palette.sheet, letterSpacing: 0.6 },
});
