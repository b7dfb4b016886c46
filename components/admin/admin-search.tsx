/** The filter row of an admin list: a search box and optional choice buttons (e.g. order status). */
import { StyleSheet, View } from 'react-native';
import { Button } from '../ui/button';
import { TextField } from '../ui/text-field';
import { space } from '../ui/theme';

/**
 * Renders a search field labelled `label` holding `q`, and, when `choices` are given, one toggle button per
 * choice plus "All"; `value` null means all.
 */
export function AdminSearch<C extends string>({
  label,
  q,
  onQ,
  choices,
  value,
  onChoice,
}: {
  label: string;
  q?: string;
  onQ?: (q: string) => void;
  choices?: readonly C[];
  value?: C | null;
  onChoice?: (c: C | null) => void;
}) {
  return (
    <View style={styles.row}>
      {onQ ? (
        <View style={styles.search}>
          <TextField label={label} value={q} onChangeText={onQ} autoCapitalize="none" autoCorrect={false} accessibilityLabel={label} />
        </View>
      ) : null}
      {choices && onChoice ? (
        <View style={styles.choices} role="group" accessibilityLabel={`${label}: filter`}>
          <Button label="All" compact tone={value === null ? 'primary' : 'secondary'} accessibilityLabel={`Show all (${label})`} onPress={() => onChoice(null)} />
          {choices.map((c) => (
            <Button key={c} label={c} compact tone={value === c ? 'primary' : 'secondary'} accessibilityLabel={`Show only ${c}`} onPress={() => onChoice(c)} />
          ))}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md, alignItems: 'flex-end' },
  search: { flexGrow: 1, flexBasis: 260, maxWidth: 420 },
  choices: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs },
});
