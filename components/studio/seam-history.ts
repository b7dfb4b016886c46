/**
 * Undo and redo for the studio's seam editing: a bounded stack of whole seam sets. A seam set is small (vertex
 * lists), so keeping snapshots is simpler and safer than inverting each edit.
 */

/** Past states (oldest first), the present one, and states undone that redo can bring back (next first). */
export interface History<T> {
  past: readonly T[];
  present: T;
  future: readonly T[];
}

/** How many past states are kept; older ones are dropped (ours: ample for a session of marking). */
export const HISTORY_LIMIT = 100;

/** A history holding only `present`. */
export function startHistory<T>(present: T): History<T> {
  return { past: [], present, future: [] };
}

/**
 * Returns the history after an edit to `next`: the present goes onto the past (trimmed to `limit` states) and
 * the redo states are dropped. An edit to the very same object is no edit and returns `h` unchanged.
 */
export function pushHistory<T>(h: History<T>, next: T, limit = HISTORY_LIMIT): History<T> {
  if (next === h.present) return h;
  const past = [...h.past, h.present];
  return { past: past.length > limit ? past.slice(past.length - limit) : past, present: next, future: [] };
}

/** Returns the history one step back, or `h` itself when there is nothing to undo. */
export function undoHistory<T>(h: History<T>): History<T> {
  if (h.past.length === 0) return h;
  return { past: h.past.slice(0, -1), present: h.past[h.past.length - 1], future: [h.present, ...h.future] };
}

/** Returns the history one step forward again, or `h` itself when there is nothing to redo. */
export function redoHistory<T>(h: History<T>): History<T> {
  if (h.future.length === 0) return h;
  return { past: [...h.past, h.present], present: h.future[0], future: h.future.slice(1) };
}

/**
 * Replaces the present without making an undo step (used when the server's copy replaces ours after a
 * conflict: undoing into a set the server has moved past would only conflict again), clearing both stacks.
 */
export function resetHistory<T>(present: T): History<T> {
  return startHistory(present);
}
