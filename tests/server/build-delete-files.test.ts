/**
 * Deleting a build: its print-set rows go by the foreign key's ON DELETE CASCADE, and the server then removes
 * their stored files too. A store that cannot remove them leaves the delete successful and logs the failure.
 */
import { existsSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { Writable } from 'node:stream';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { builds, printSets } from '../../db/schema';
import { createLogger } from '../../server/logger';
import { printSetFileKey } from '../../server/print-sets/print-set-files';
import { runPrintSetJob } from '../../server/print-sets/print-set-job';
import type { FileStore } from '../../server/storage/file-store';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { piece, rectangle } from '../fixtures/pattern-docs/shape-docs';
import { insertBuild, makeShopFixture, makeTestApp, type ShopFixture, type TestContext } from './helpers';

const filesDir = mkdtempSync(path.join(tmpdir(), 'sheetsmith-build-delete-'));
const files = localDiskStore(filesDir);
let ctx: TestContext;
let fx: ShopFixture;
beforeAll(async () => {
  ctx = await makeTestApp({ files });
  fx = await makeShopFixture(ctx);
});
afterAll(async () => {
  await ctx.close();
});

/** Inserts a finished print set of the build and stores one SVG for it; returns the print set's id. */
async function storedPrintSet(db: TestContext['db'], shopId: string, buildId: string, store: FileStore): Promise<string> {
  const svg = new TextEncoder().encode('<svg xmlns="http://www.w3.org/2000/svg" width="40mm" height="30mm"/>');
  const [row] = await db
    .insert(printSets)
    .values({
      shopId,
      buildId,
      name: 'Delete walk',
      status: 'done',
      formats: ['svg'],
      page: 'a4',
      mode: 'tiled',
      pieceCount: 1,
      pattern: { units: 'mm', pieces: [piece('D', rectangle(40, 30))], seams: [], warnings: [] },
      files: [{ name: 'pattern.svg', sizeBytes: svg.byteLength, contentType: 'image/svg+xml' }],
    })
    .returning({ id: printSets.id });
  await store.put(printSetFileKey(row.id, 'pattern.svg'), svg);
  return row.id;
}

describe('deleting a build', () => {
  it("removes its print sets' rows and their stored files, and leaves other builds' files alone", async () => {
    const doomed = await insertBuild(ctx.db, fx.shopId, 'Gauntlet cuffs');
    const kept = await insertBuild(ctx.db, fx.shopId, 'Pauldron pair');
    const gone = [await storedPrintSet(ctx.db, fx.shopId, doomed, files), await storedPrintSet(ctx.db, fx.shopId, doomed, files)];
    const stays = await storedPrintSet(ctx.db, fx.shopId, kept, files);
    for (const id of [...gone, stays]) expect(existsSync(path.join(filesDir, 'print-sets', id, 'pattern.svg'))).toBe(true);

    await request(ctx.app).delete(`/api/shops/${fx.shopId}/builds/${doomed}`).set('Cookie', fx.people.owner.cookie).expect(204);

    for (const id of gone) {
      expect(existsSync(path.join(filesDir, 'print-sets', id)), id).toBe(false);
      expect(await ctx.db.select({ id: printSets.id }).from(printSets).where(eq(printSets.id, id))).toEqual([]);
    }
    expect(existsSync(path.join(filesDir, 'print-sets', stays, 'pattern.svg'))).toBe(true);
  });

  it('still answers 204 when the file store cannot remove the files, and logs which print set was left', async () => {
    const lines: string[] = [];
    const sink = new Writable({
      write(chunk, _enc, done) {
        lines.push(...String(chunk).split('\n').filter(Boolean));
        done();
      },
    });
    const failing: FileStore = { ...files, removePrefix: async (prefix) => Promise.reject(new Error(`disk refused ${prefix}`)) };
    const broken = await makeTestApp({ sessionSecret: ctx.secret, files: failing, logger: createLogger('info', 'test', sink) });
    try {
      const buildId = await insertBuild(broken.db, fx.shopId, 'Greave shells');
      const id = await storedPrintSet(broken.db, fx.shopId, buildId, files);
      await request(broken.app).delete(`/api/shops/${fx.shopId}/builds/${buildId}`).set('Cookie', fx.people.owner.cookie).expect(204);
      expect(await broken.db.select({ id: printSets.id }).from(printSets).where(eq(printSets.id, id))).toEqual([]);
      const logged = lines.map((l) => JSON.parse(l) as { level: number; prefix?: string; msg: string; err?: { message: string } });
      const entry = logged.find((e) => e.prefix === `print-sets/${id}`);
      // pino's numeric levels: 50 is "error".
      expect(entry).toMatchObject({ level: 50, err: { message: `disk refused print-sets/${id}` } });
    } finally {
      await broken.close();
    }
  });

  it('keeps the files when the delete is refused (404 for a build of another shop)', async () => {
    const foreign = await insertBuild(ctx.db, fx.otherShopId, 'Not yours');
    const id = await storedPrintSet(ctx.db, fx.otherShopId, foreign, files);
    await request(ctx.app).delete(`/api/shops/${fx.shopId}/builds/${foreign}`).set('Cookie', fx.people.owner.cookie).expect(404);
    expect(existsSync(path.join(filesDir, 'print-sets', id, 'pattern.svg'))).toBe(true);
  });
});

describe('a print set whose build is deleted while it renders', () => {
  it('leaves no files behind once the render finishes', async () => {
    const buildId = await insertBuild(ctx.db, fx.shopId, 'Bracer plates');
    const [row] = await ctx.db
      .insert(printSets)
      .values({
        shopId: fx.shopId,
        buildId,
        name: 'Raced',
        formats: ['svg'],
        page: 'a4',
        mode: 'tiled',
        pieceCount: 1,
        pattern: { units: 'mm', pieces: [piece('R', rectangle(40, 30))], seams: [], warnings: [] },
      })
      .returning({ id: printSets.id });
    // The build goes while the worker stores the files: the delete's own clean-up found no files yet.
    const racing: FileStore = {
      ...files,
      put: async (key, bytes) => {
        await ctx.db.delete(builds).where(eq(builds.id, buildId));
        await files.put(key, bytes);
      },
    };
    const summary = await runPrintSetJob({ db: ctx.db, files: racing }, { printSetId: row.id });
    expect(summary).toEqual({ printSetId: row.id, skipped: 'deleted or given up on while rendering' });
    expect(existsSync(path.join(filesDir, 'print-sets', row.id))).toBe(false);
  });
});
