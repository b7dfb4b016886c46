/**
 * Print sets whose job died: the reconcile job fails those queued or running longer than the queue's own
 * limits allow (every attempt to its expiry, plus a margin), with a message saying so, and leaves the rest.
 * Rows are back-dated in the real test database rather than waiting for a real expiry.
 */
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { eq, inArray } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { printSets } from '../../db/schema';
import { JOB_TYPES } from '../../server/jobs/job-types';
import { printSetFileKey } from '../../server/print-sets/print-set-files';
import { PRINT_SET_QUEUE, runPrintSetJob } from '../../server/print-sets/print-set-job';
import { STALE_PRINT_SET_ERROR, STALE_PRINT_SET_MINUTES, STALE_PRINT_SETS_JOB } from '../../server/print-sets/stale-print-sets';
import type { FileStore } from '../../server/storage/file-store';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { piece, rectangle } from '../fixtures/pattern-docs/shape-docs';
import { insertBuild, makeShopFixture, makeTestApp, type ShopFixture, type TestContext } from './helpers';

const filesDir = mkdtempSync(path.join(tmpdir(), 'sheetsmith-stale-'));
const files = localDiskStore(filesDir);
let ctx: TestContext;
let fx: ShopFixture;
let buildId: string;
beforeAll(async () => {
  ctx = await makeTestApp({ files });
  fx = await makeShopFixture(ctx);
  buildId = await insertBuild(ctx.db, fx.shopId, 'Crested helm');
});
afterAll(async () => {
  await ctx.close();
});

const minutesAgo = (m: number) => new Date(Date.now() - m * 60_000);

/** Inserts a print set with the given status and times; returns its id. */
async function printSetRow(status: 'queued' | 'running' | 'done' | 'failed', createdAt: Date, startedAt: Date | null): Promise<string> {
  const [row] = await ctx.db
    .insert(printSets)
    .values({
      shopId: fx.shopId,
      buildId,
      name: `Stale check ${status}`,
      status,
      formats: ['svg'],
      page: 'a4',
      mode: 'tiled',
      pieceCount: 1,
      pattern: { units: 'mm', pieces: [piece('S', rectangle(40, 30))], seams: [], warnings: [] },
      createdAt,
      startedAt,
    })
    .returning({ id: printSets.id });
  return row.id;
}

const reconcile = () => {
  const type = JOB_TYPES.find((t) => t.name === STALE_PRINT_SETS_JOB);
  if (!type) throw new Error(`no job type ${STALE_PRINT_SETS_JOB}`);
  return type.run({ db: ctx.db, files }, {});
};

describe('stale print sets', () => {
  it('allows every attempt the queue makes to reach its expiry before giving up', () => {
    // pg-boss expires an attempt after expireInSeconds and retries retryLimit times after retryDelay.
    const queueLimitMinutes = ((PRINT_SET_QUEUE.retryLimit + 1) * PRINT_SET_QUEUE.expireInSeconds + PRINT_SET_QUEUE.retryDelay) / 60;
    expect(STALE_PRINT_SET_MINUTES).toBeGreaterThan(queueLimitMinutes);
    expect(STALE_PRINT_SET_MINUTES).toBeLessThanOrEqual(queueLimitMinutes + 10);
    expect(STALE_PRINT_SET_ERROR).toBe(`the job did not finish within ${STALE_PRINT_SET_MINUTES} minutes; try again`);
  });

  it('runs every five minutes as a scheduled job (POSIX crontab minute field "*/5")', () => {
    expect(JOB_TYPES.find((t) => t.name === STALE_PRINT_SETS_JOB)?.cron).toBe('*/5 * * * *');
  });

  it('fails back-dated queued and running print sets with the message and removes files a dead job left', async () => {
    const old = STALE_PRINT_SET_MINUTES + 1;
    const young = STALE_PRINT_SET_MINUTES - 1;
    const staleRunning = await printSetRow('running', minutesAgo(old + 5), minutesAgo(old));
    const staleQueued = await printSetRow('queued', minutesAgo(old), null);
    // Created long ago but restarted by the retry recently: the clock runs from the last start.
    const retried = await printSetRow('running', minutesAgo(old + 20), minutesAgo(young));
    const freshQueued = await printSetRow('queued', minutesAgo(young), null);
    const oldDone = await printSetRow('done', minutesAgo(old * 10), minutesAgo(old * 10));
    await files.put(printSetFileKey(staleRunning, 'pattern.svg'), new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg"/>'));

    const summary = await reconcile();
    expect(summary.failed).toBeGreaterThanOrEqual(2);
    expect(summary.filesLeft).toEqual([]);

    const rows = await ctx.db
      .select({ id: printSets.id, status: printSets.status, error: printSets.error, finishedAt: printSets.finishedAt })
      .from(printSets)
      .where(inArray(printSets.id, [staleRunning, staleQueued, retried, freshQueued, oldDone]));
    const byId = new Map(rows.map((r) => [r.id, r]));
    for (const id of [staleRunning, staleQueued]) {
      expect(byId.get(id)).toMatchObject({ status: 'failed', error: STALE_PRINT_SET_ERROR });
      expect(byId.get(id)?.finishedAt).toBeInstanceOf(Date);
    }
    expect(byId.get(retried)).toMatchObject({ status: 'running', error: null });
    expect(byId.get(freshQueued)).toMatchObject({ status: 'queued', error: null });
    expect(byId.get(oldDone)).toMatchObject({ status: 'done', error: null });
    expect(existsSync(path.join(filesDir, 'print-sets', staleRunning))).toBe(false);

    // A second pass finds nothing more of these.
    await reconcile();
    const again = await ctx.db.select({ status: printSets.status }).from(printSets).where(eq(printSets.id, freshQueued));
    expect(again[0].status).toBe('queued');
  });

  it('keeps a given-up print set failed when its lost job finishes after all, and removes that job\'s files', async () => {
    const id = await printSetRow('queued', new Date(), null);
    const late: FileStore = {
      ...files,
      put: async (key, bytes) => {
        // The render took so long that the reconcile job gave up on it meanwhile.
        await ctx.db.update(printSets).set({ status: 'failed', error: STALE_PRINT_SET_ERROR }).where(eq(printSets.id, id));
        await files.put(key, bytes);
      },
    };
    const summary = await runPrintSetJob({ db: ctx.db, files: late }, { printSetId: id });
    expect(summary).toEqual({ printSetId: id, skipped: 'deleted or given up on while rendering' });
    const [row] = await ctx.db.select({ status: printSets.status, error: printSets.error }).from(printSets).where(eq(printSets.id, id));
    expect(row).toEqual({ status: 'failed', error: STALE_PRINT_SET_ERROR });
    expect(existsSync(path.join(filesDir, 'print-sets', id))).toBe(false);
  });
});
