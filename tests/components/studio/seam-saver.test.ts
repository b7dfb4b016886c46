/**
 * Debounced seam saving with revisions (the contract in team CONTRACTS.md: PUT seams names `baseRevision`; the
 * server answers the new revision, or 409 SEAMS_CHANGED with its current seams). Timing follows the studio
 * brief (~800 ms quiet spell); the fake timers make it exact.
 */
import { describe, expect, it, vi } from 'vitest';
import { createSeamSaver, type SeamPutResult, type SeamSaveStatus } from '../../../components/studio/seam-saver';
import type { SeamSetDraft } from '../../../components/studio/seam-set-edits';

const draft = (n: number): SeamSetDraft => ({
  seams: [{ id: `picked-${n}`, picks: [0, n], path: [0, n], source: 'picked' }],
  symmetry: null,
  stretchBudgetPct: 3,
});

function setup(answers: ((base: number, d: SeamSetDraft) => Promise<SeamPutResult<string>>)[]) {
  vi.useFakeTimers();
  const puts: { base: number; draft: SeamSetDraft }[] = [];
  const statuses: SeamSaveStatus['state'][] = [];
  const conflicts: string[] = [];
  const reasons: string[] = [];
  const saver = createSeamSaver<string>(
    {
      delayMs: 800,
      put: (base, d) => {
        puts.push({ base, draft: d });
        const answer = answers.shift();
        if (!answer) throw new Error('unexpected PUT');
        return answer(base, d);
      },
      onStatus: (s) => {
        statuses.push(s.state);
        if (s.state === 'failed') reasons.push(s.reason);
      },
      onConflict: (c) => conflicts.push(c),
    },
    4,
  );
  return { saver, puts, statuses, conflicts, reasons };
}

const ok = (base: number): Promise<SeamPutResult<string>> => Promise.resolve({ ok: true, revision: base + 1, view: `rev ${base + 1}` });

describe('seam saver', () => {
  it('sends one PUT for a burst of edits, 800 ms after the last, with the revision it started from', async () => {
    const { saver, puts, statuses } = setup([ok, ok]);
    saver.change(draft(1));
    await vi.advanceTimersByTimeAsync(500);
    saver.change(draft(2));
    await vi.advanceTimersByTimeAsync(500);
    saver.change(draft(3));
    await vi.advanceTimersByTimeAsync(799);
    expect(puts).toHaveLength(0);
    await vi.advanceTimersByTimeAsync(1);
    expect(puts).toEqual([{ base: 4, draft: draft(3) }]);
    expect(saver.revision).toBe(5);
    expect(statuses.at(-1)).toBe('saved');
    saver.change(draft(4));
    await vi.advanceTimersByTimeAsync(800);
    expect(puts[1].base).toBe(5);
    vi.useRealTimers();
  });

  it('on 409 hands over the server copy, reports the conflict, and the next save names the server revision', async () => {
    const { saver, puts, statuses, conflicts } = setup([() => Promise.resolve({ ok: false, current: 'theirs', revision: 9 }), ok]);
    saver.change(draft(1));
    await vi.advanceTimersByTimeAsync(800);
    expect(conflicts).toEqual(['theirs']);
    expect(statuses.at(-1)).toBe('conflict');
    saver.change(draft(2));
    await vi.advanceTimersByTimeAsync(800);
    expect(puts.map((p) => p.base)).toEqual([4, 9]);
    expect(statuses.at(-1)).toBe('saved');
    vi.useRealTimers();
  });

  it('keeps a failed edit and says why; the next edit sends the newest seams', async () => {
    const { saver, puts, statuses, reasons } = setup([() => Promise.reject(new Error('Cannot reach the Sheetsmith server.')), ok]);
    saver.change(draft(1));
    await vi.advanceTimersByTimeAsync(800);
    expect(statuses.at(-1)).toBe('failed');
    expect(reasons).toEqual(['Cannot reach the Sheetsmith server.']);
    expect(saver.revision).toBe(4);
    saver.change(draft(2));
    await vi.advanceTimersByTimeAsync(800);
    expect(puts.map((p) => [p.base, p.draft.seams[0].id])).toEqual([
      [4, 'picked-1'],
      [4, 'picked-2'],
    ]);
    expect(statuses.at(-1)).toBe('saved');
    vi.useRealTimers();
  });

  it('an edit made while a save is in flight is sent after it, on the new revision; flush sends at once', async () => {
    let release: () => void = () => undefined;
    const slow = (base: number) =>
      new Promise<SeamPutResult<string>>((resolve) => {
        release = () => resolve({ ok: true, revision: base + 1, view: 'x' });
      });
    const { saver, puts, statuses } = setup([slow, ok]);
    saver.change(draft(1));
    await vi.advanceTimersByTimeAsync(800);
    saver.change(draft(2));
    await vi.advanceTimersByTimeAsync(800);
    expect(puts).toHaveLength(1);
    release();
    await vi.advanceTimersByTimeAsync(0);
    expect(puts.map((p) => p.base)).toEqual([4, 5]);
    expect(statuses.at(-1)).toBe('saved');
    const { saver: s2, puts: p2 } = setup([ok]);
    s2.change(draft(7));
    await s2.flush();
    expect(p2).toHaveLength(1);
    s2.dispose();
    s2.change(draft(8));
    await vi.advanceTimersByTimeAsync(2000);
    expect(p2).toHaveLength(1);
    vi.useRealTimers();
  });
});
