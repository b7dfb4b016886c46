/**
 * The studio's keyboard shortcuts on a wide screen (listed for people in studio-tools.tsx STUDIO_SHORTCUTS): which
 * action a key press asks for, and a hook that listens on the page.
 */
import { useEffect, useRef } from 'react';

/** What a shortcut asks the studio to do. */
export type StudioKeyAction =
  | 'help'
  | 'close-help'
  | 'finish-seam'
  | 'drop-pick'
  | 'undo'
  | 'redo'
  | 'erase-mode'
  | 'draw-mode'
  | 'pick-mode'
  | 'mirror'
  | 'creases'
  | 'stretch-map';

/** The parts of a key press the mapping reads. */
export interface KeyPress {
  key: string;
  shiftKey: boolean;
  ctrlKey: boolean;
  metaKey: boolean;
  altKey: boolean;
  /** True when the key went to a text field, which keeps its keys. */
  inTextField: boolean;
}

/**
 * Returns the action for `press`, or null when the key means nothing here (or a modifier other than Shift is
 * held, so the browser's own shortcuts keep working). `canEdit`: the role may change seams; `busy`: a suggestion
 * is running (edits wait); `drawing`: a seam is being drawn (Enter/Esc finish it, Backspace drops its last point).
 */
export function studioKeyAction(press: KeyPress, state: { canEdit: boolean; busy: boolean; drawing: boolean }): StudioKeyAction | null {
  if (press.inTextField || press.ctrlKey || press.metaKey || press.altKey) return null;
  const k = press.key.length === 1 ? press.key.toLowerCase() : press.key;
  const edit = state.canEdit && !state.busy;
  if (press.key === '?') return 'help';
  if ((k === 'Escape' || k === 'Enter') && state.drawing) return 'finish-seam';
  if (k === 'Escape') return 'close-help';
  if (k === 'Backspace' && state.drawing) return 'drop-pick';
  if (k === 'z' && edit) return press.shiftKey ? 'redo' : 'undo';
  if (k === 'y' && edit) return 'redo';
  if (k === 'e' && state.canEdit) return 'erase-mode';
  if (k === 'd' && state.canEdit) return 'draw-mode';
  if (k === 'p') return 'pick-mode';
  if (k === 'm' && edit) return 'mirror';
  if (k === 'c' && edit) return 'creases';
  if (k === 's') return 'stretch-map';
  return null;
}

/**
 * Listens for key presses on the page while `enabled` (web only) and calls `onAction` with each shortcut's action,
 * keeping the browser from also acting on it. `state` and `onAction` are read at the time of each press.
 */
export function useStudioKeys(enabled: boolean, state: { canEdit: boolean; busy: boolean; drawing: boolean }, onAction: (a: StudioKeyAction) => void): void {
  const latest = useRef({ state, onAction });
  latest.current = { state, onAction };
  useEffect(() => {
    // Only a browser has a document to listen on; on native there are no hardware-key shortcuts here.
    if (!enabled || typeof document === 'undefined') return;
    const listener = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      const inTextField = !!t && (t.tagName === 'INPUT' || t.tagName === 'TEXTAREA' || t.isContentEditable);
      const action = studioKeyAction({ key: e.key, shiftKey: e.shiftKey, ctrlKey: e.ctrlKey, metaKey: e.metaKey, altKey: e.altKey, inTextField }, latest.current.state);
      if (!action) return;
      e.preventDefault();
      latest.current.onAction(action);
    };
    document.addEventListener('keydown', listener);
    return () => document.removeEventListener('keydown', listener);
  }, [enabled]);
}
