/**
 * The studio's keyboard shortcuts as its help panel lists them (components/studio/studio-tools.tsx
 * STUDIO_SHORTCUTS, the brief's Z / Shift+Z undo-redo, E erase, M mirror, Esc finish seam).
 */
import { describe, expect, it } from 'vitest';
import { studioKeyAction, type KeyPress } from '../../../components/studio/studio-keys';

const press = (key: string, more: Partial<KeyPress> = {}): KeyPress => ({ key, shiftKey: false, ctrlKey: false, metaKey: false, altKey: false, inTextField: false, ...more });
const editor = { canEdit: true, busy: false, drawing: false };

describe('studio shortcuts', () => {
  it('maps the listed keys for an editor', () => {
    expect(studioKeyAction(press('z'), editor)).toBe('undo');
    expect(studioKeyAction(press('Z', { shiftKey: true }), editor)).toBe('redo');
    expect(studioKeyAction(press('y'), editor)).toBe('redo');
    expect(studioKeyAction(press('e'), editor)).toBe('erase-mode');
    expect(studioKeyAction(press('d'), editor)).toBe('draw-mode');
    expect(studioKeyAction(press('m'), editor)).toBe('mirror');
    expect(studioKeyAction(press('c'), editor)).toBe('creases');
    expect(studioKeyAction(press('S'), editor)).toBe('stretch-map');
    expect(studioKeyAction(press('?', { shiftKey: true }), editor)).toBe('help');
    expect(studioKeyAction(press('Escape'), editor)).toBe('close-help');
  });
  it('finishes or trims the seam being drawn with Enter, Esc and Backspace', () => {
    const drawing = { ...editor, drawing: true };
    expect(studioKeyAction(press('Escape'), drawing)).toBe('finish-seam');
    expect(studioKeyAction(press('Enter'), drawing)).toBe('finish-seam');
    expect(studioKeyAction(press('Backspace'), drawing)).toBe('drop-pick');
    expect(studioKeyAction(press('Backspace'), editor)).toBeNull();
  });
  it('gives a viewer no editing keys, holds edits while a suggestion runs, and leaves text fields and browser shortcuts alone', () => {
    const viewer = { canEdit: false, busy: false, drawing: false };
    for (const k of ['z', 'e', 'd', 'm', 'c']) expect(studioKeyAction(press(k), viewer)).toBeNull();
    expect(studioKeyAction(press('p'), viewer)).toBe('pick-mode');
    expect(studioKeyAction(press('s'), viewer)).toBe('stretch-map');
    expect(studioKeyAction(press('z'), { ...editor, busy: true })).toBeNull();
    expect(studioKeyAction(press('z', { ctrlKey: true }), editor)).toBeNull();
    expect(studioKeyAction(press('z', { inTextField: true }), editor)).toBeNull();
  });
});
