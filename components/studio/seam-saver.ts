/**
 * Saving the studio's seams to the server: edits are gathered for a short quiet spell (debounce) and sent as one
 * PUT naming the revision they started from. A save that finds the seams changed by someone else (409) hands
 * over the server's copy instead of overwriting it; a failed save keeps the edit and says why.
 */
import type { SeamSetDraft } from './seam-set-edits';

/** Where the seams stand against the server, for the "saved / saving… / not saved" line. */
export type SeamSaveStatus =
  | { state: 'saved' }
  | { state: 'waiting' }
  | { state: 'saving' }
  | { state: 'failed'; reason: string }
  | { state: 'conflict' };

/** What the server answered a save: the new revision, or 409 with its current seams. */
export type SeamPutResult<V> = { ok: true; revision: number; view: V } | { ok: false; current: V; revision: number };

/** What a saver needs from its surroundings (the hook gives fetch and window timers; tests give fakes). */
export interface SeamSaverDeps<V> {
  /** PUT the draft with `baseRevision`; resolves with the answer, rejects with an Error whose message says why. */
  put(baseRevision: number, draft: SeamSetDraft): Promise<SeamPutResult<V>>;
  onStatus(status: SeamSaveStatus): void;
  /** The server took the save; `view` is its answer. */
  onSaved?(view: V): void;
  /** Someone else saved first; `current` is the server's seam set, which should replace the page's. */
  onConflict(current: V): void;
  /** Quiet time before a save, ms (the studio uses ~800 ms). */
  delayMs: number;
  setTimer?: (fn: () => void, ms: number) => unknown;
  clearTimer?: (handle: unknown) => void;
}

/** A debounced saver of one sculpt's seams. */
export interface SeamSaver {
  /** Records an edit; it is sent once no further edit comes for `delayMs`. */
  change(draft: SeamSetDraft): void;
  /** Sends a waiting edit now (e.g. before leaving the page); resolves once no save is in flight. */
  flush(): Promise<void>;
  /** Takes a new base revision (after the page loaded the server's seams) and drops any waiting edit. */
  rebase(revision: number): void;
  /** The revision the next save will name. */
  readonly revision: number;
  /** Stops the timer; nothing more is sent. */
  dispose(): void;
}

/** Returns a saver that starts from server revision `revision` (see SeamSaver and SeamSaverDeps). */
export function createSeamSaver<V>(deps: SeamSaverDeps<V>, revision: number): SeamSaver {
  const setTimer = deps.setTimer ?? ((fn: () => void, ms: number) => setTimeout(fn, ms));
  const clearTimer = deps.clearTimer ?? ((h: unknown) => clearTimeout(h as ReturnType<typeof setTimeout>));
  let base = revision;
  let waiting: SeamSetDraft | null = null;
  let timer: unknown = null;
  let inFlight: Promise<void> | null = null;
  let disposed = false;

  const send = (): Promise<void> => {
    timer = null;
    if (disposed || !waiting) return inFlight ?? Promise.resolve();
    if (inFlight) return inFlight.then(send);
    const draft = waiting;
    waiting = null;
    deps.onStatus({ state: 'saving' });
    const run = deps
      .put(base, draft)
      .then(
        (result) => {
          if (disposed) return;
          base = result.revision;
          if (result.ok) {
            deps.onSaved?.(result.view);
            deps.onStatus(waiting ? { state: 'waiting' } : { state: 'saved' });
          } else {
            waiting = null;
            if (timer !== null) clearTimer(timer);
            timer = null;
            deps.onConflict(result.current);
            deps.onStatus({ state: 'conflict' });
          }
        },
        (err: unknown) => {
          if (disposed) return;
          // Keep the edit: the next change (or flush) sends it again with whatever came after it.
          waiting ??= draft;
          deps.onStatus({ state: 'failed', reason: err instanceof Error ? err.message : String(err) });
        },
      )
      .finally(() => {
        inFlight = null;
      });
    inFlight = run;
    return run;
  };

  return {
    get revision() {
      return base;
    },
    change(draft) {
      if (disposed) return;
      waiting = draft;
      if (timer !== null) clearTimer(timer);
      deps.onStatus({ state: 'waiting' });
      timer = setTimer(() => void send(), deps.delayMs);
    },
    flush() {
      if (timer !== null) clearTimer(timer);
      return send();
    },
    rebase(rev) {
      base = rev;
      waiting = null;
      if (timer !== null) clearTimer(timer);
      timer = null;
    },
    dispose() {
      disposed = true;
      if (timer !== null) clearTimer(timer);
      timer = null;
    },
  };
}
