/**
 * The sculpt file chooser in a browser: the platform's own file input (keyboard and screen-reader friendly),
 * limited to model files.
 */
import type { CSSProperties } from 'react';
import { fonts, palette, radius, space } from '../ui/theme';
import type { FilePickerProps } from './file-picker';

const inputStyle: CSSProperties = {
  fontFamily: fonts.body,
  fontSize: 15,
  color: palette.ink,
  padding: space.md,
  border: `1px dashed ${palette.ruleStrong}`,
  borderRadius: radius.sm,
  background: palette.sheet,
  width: '100%',
  boxSizing: 'border-box',
};

/** Renders a labelled file input accepting .obj, .stl and .ply; calls `onPick` with the chosen file (or null when cleared). */
export function FilePicker({ label, onPick, disabled }: FilePickerProps) {
  return (
    <label style={{ display: 'flex', flexDirection: 'column', gap: space.xs, fontFamily: fonts.bodyStrong, fontSize: 14, color: palette.ink }}>
      {label}
      <input
        type="file"
        accept=".obj,.stl,.ply,model/obj,model/stl,application/sla"
        aria-label={label}
        disabled={disabled}
        style={inputStyle}
        onChange={(e) => onPick(e.currentTarget.files?.[0] ?? null)}
      />
    </label>
  );
}
