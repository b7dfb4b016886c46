/**
 * The studio's controls: a tool button that can be on or off, the save line, the stretch legend and the
 * keyboard help.
 */
import type { ReactNode } from 'react';
import { Pressable, StyleSheet, View, type PressableStateCallbackType } from 'react-native';
import { Text } from '../ui/text';
import { fonts, palette, radius, space } from '../ui/theme';
import { rgbCss, stretchColour } from './face-colours';
import type { SeamSaveStatus } from './seam-saver';

type PressState = PressableStateCallbackType & { focused?: boolean; hovered?: boolean };

/**
 * A keyboard-focus ring for the studio's tools drawn by the browser's :focus-visible, which clears itself when a
 * focused tool becomes disabled (a pressable's own `focused` state can stay set when no blur event comes).
 */
let focusStyleAdded = false;
function addFocusStyle(): void {
  if (focusStyleAdded || typeof document === 'undefined') return;
  focusStyleAdded = true;
  const style = document.createElement('style');
  style.textContent = `[data-studio-tool]:focus-visible { outline: 2px solid ${palette.ember}; outline-offset: 2px; }`;
  document.head.appendChild(style);
}

/**
 * A compact tool button. With `on` set it is a toggle (announced as pressed or not); `hint` is the keyboard
 * key shown beside the label on wide screens.
 */
export function ToolButton({
  label,
  onPress,
  on,
  disabled,
  hint,
  accessibilityLabel,
}: {
  label: string;
  onPress(): void;
  on?: boolean;
  disabled?: boolean;
  hint?: string;
  accessibilityLabel?: string;
}) {
  addFocusStyle();
  const webData = { dataSet: { studioTool: 'true' } } as object;
  return (
    <Pressable
      {...webData}
      role="button"
      accessibilityLabel={accessibilityLabel ?? label}
      aria-pressed={on === undefined ? undefined : on}
      accessibilityState={{ disabled: !!disabled, selected: on }}
      disabled={disabled}
      onPress={onPress}
      style={(s: PressState) => [
        styles.tool,
        on && styles.toolOn,
        disabled && styles.toolOff,
        s.pressed && styles.toolPressed,
      ]}
    >
      <Text style={[styles.toolText, on && styles.toolTextOn]}>{label}</Text>
      {hint ? <Text style={[styles.hint, on && styles.toolTextOn]}>{hint}</Text> : null}
    </Pressable>
  );
}

/** A labelled group of tools that wraps on narrow screens. */
export function ToolGroup({ label, children }: { label: string; children: ReactNode }) {
  return (
    <View role="group" accessibilityLabel={label} style={styles.group}>
      {children}
    </View>
  );
}

/** Words for each save state, as the maker reads them. */
export function saveStatusText(status: SeamSaveStatus): string {
  switch (status.state) {
    case 'saved':
      return 'Saved';
    case 'waiting':
      return 'Changes waiting to save…';
    case 'saving':
      return 'Saving…';
    case 'failed':
      return `Not saved: ${status.reason}`;
    case 'conflict':
      return 'Someone else changed the seams; their version is loaded now.';
  }
}

/** The save line, announced politely when it changes. */
export function SaveLine({ status }: { status: SeamSaveStatus }) {
  const bad = status.state === 'failed' || status.state === 'conflict';
  return (
    <View role="status" aria-live="polite" style={[styles.save, bad && styles.saveBad]}>
      <Text variant="small" style={bad ? { color: palette.danger } : undefined}>
        {saveStatusText(status)}
      </Text>
    </View>
  );
}

/** Legend of the stretch map: the ramp over 0 … 2 × budget with ticks in percent. */
export function StretchLegend({ budgetPct }: { budgetPct: number }) {
  const steps = 24;
  const ticks = [0, budgetPct / 2, budgetPct, 1.5 * budgetPct, 2 * budgetPct];
  return (
    <View role="img" accessibilityLabel={`Stretch map legend: pale green lies flat, sand is the ${budgetPct}% budget, red is ${2 * budgetPct}% or more`} style={styles.legend}>
      <Text variant="overline">Stretch, %</Text>
      <View style={styles.ramp}>
        {Array.from({ length: steps }, (_, i) => (
          <View key={i} style={{ flex: 1, backgroundColor: rgbCss(stretchColour(((i + 0.5) / steps) * 2 * budgetPct, budgetPct)) }} />
        ))}
      </View>
      <View style={styles.ticks}>
        {ticks.map((t, i) => (
          <Text key={i} style={styles.tick}>
            {i === ticks.length - 1 ? `≥${fmt(t)}` : fmt(t)}
          </Text>
        ))}
      </View>
    </View>
  );
}

const fmt = (x: number) => (Number.isInteger(x) ? String(x) : x.toFixed(1));

/** Keyboard shortcuts of the studio on a wide screen (shown in the help panel). */
export const STUDIO_SHORTCUTS: ReadonlyArray<readonly [string, string]> = [
  ['D', 'Draw seams: click points on the model'],
  ['Enter or Esc', 'Finish the seam being drawn'],
  ['Backspace', 'Take back the last point of the seam being drawn'],
  ['E', 'Erase mode: click a seam to remove it'],
  ['P', 'Pick mode: click a piece to select it'],
  ['Z', 'Undo'],
  ['Shift+Z or Y', 'Redo'],
  ['M', 'Mirror seams across the symmetry plane (on/off)'],
  ['C', 'Show crease suggestions'],
  ['S', 'Stretch map on/off'],
  ['?', 'This help'],
];

/** The help panel listing the keyboard shortcuts and how to turn the model. */
export function ShortcutsHelp({ onClose }: { onClose(): void }) {
  return (
    <View role="dialog" accessibilityLabel="Studio keyboard shortcuts" style={styles.help}>
      <Text variant="heading">Keys</Text>
      {STUDIO_SHORTCUTS.map(([key, what]) => (
        <View key={key} style={styles.helpRow}>
          <Text style={styles.key}>{key}</Text>
          <Text variant="small" style={styles.helpText}>
            {what}
          </Text>
        </View>
      ))}
      <Text variant="small">Turn the model with the left mouse button or one finger; pan with the right button or two fingers; zoom with the wheel or a pinch.</Text>
      <ToolButton label="Close" accessibilityLabel="Close the shortcuts help" onPress={onClose} />
    </View>
  );
}

/** Stretch budget choices, percent (the engine's default is 3). */
const BUDGETS = [2, 3, 5, 8];

/** Picks the stretch budget suggested pieces are cut to. */
export function BudgetChooser({ value, onChange, disabled }: { value: number; onChange(v: number): void; disabled: boolean }) {
  return (
    <View style={styles.budget} role="radiogroup" accessibilityLabel="Stretch budget for suggested pieces">
      <Text variant="small">Budget</Text>
      {BUDGETS.map((b) => (
        <ToolButton key={b} label={`${b}%`} on={value === b} disabled={disabled} onPress={() => onChange(b)} accessibilityLabel={`Stretch budget ${b} percent`} />
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  budget: { flexDirection: 'row', alignItems: 'center', gap: space.xxs },
  group: { flexDirection: 'row', flexWrap: 'wrap', gap: space.xs, alignItems: 'center' },
  tool: {
    minHeight: 36,
    paddingHorizontal: space.sm,
    paddingVertical: space.xs,
    borderRadius: radius.sm,
    borderWidth: 1,
    borderColor: palette.ruleStrong,
    backgroundColor: palette.sheet,
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.xs,
  },
  toolOn: { backgroundColor: palette.bench, borderColor: palette.bench },
  toolOff: { opacity: 0.45 },
  toolPressed: { backgroundColor: palette.sheetSunk },
  toolText: { fontFamily: fonts.bodyStrong, fontSize: 14, color: palette.ink },
  toolTextOn: { color: palette.onBench },
  hint: { fontFamily: fonts.mono, fontSize: 11, color: palette.inkFaint },
  save: { paddingVertical: space.xxs },
  saveBad: {},
  legend: { gap: space.xxs, minWidth: 200, maxWidth: 320 },
  ramp: { flexDirection: 'row', height: 10, borderRadius: radius.sm, overflow: 'hidden', borderWidth: 1, borderColor: palette.rule },
  ticks: { flexDirection: 'row', justifyContent: 'space-between' },
  tick: { fontFamily: fonts.mono, fontSize: 11, color: palette.inkSoft },
  help: {
    gap: space.xs,
    padding: space.md,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: palette.ruleStrong,
    backgroundColor: palette.sheet,
  },
  helpRow: { flexDirection: 'row', gap: space.sm, alignItems: 'baseline' },
  key: { fontFamily: fonts.monoStrong, fontSize: 13, minWidth: 110, color: palette.ink },
  helpText: { flex: 1 },
});
