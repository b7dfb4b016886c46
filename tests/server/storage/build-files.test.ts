/**
 * Deletes follow the database: every file stored for a build (sculpt versions, patterns, print sets) is
 * found from its rows, and removing those prefixes leaves another build's files alone. Runs on the real
 * test database and a temporary local-disk store.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { printSets } from '../../../db/schema-core';
import { patterns, sculpts } from '../../../db/schema-sculpts';
import { printSetFileKey } from '../../../server/print-sets/print-set-files';
import { sculptMeshKey, sculptSourceKey } from '../../../server/sculpts/sculpt-files';
import { patternFilePrefix, removeFilePrefixes, selectBuildFilePrefixes } from '../../../server/storage/build-files';
import type { FileStore } from '../../../server/storage/file-store';
import { localDiskStore } from '../../../server/storage/local-disk-store';
import { helmetLikeDoc } from '../../fixtures/pattern-docs/shape-docs';
import { insertBuild, makeShopFixture, makeTestApp, type ShopFixture, type TestContext } from '../helpers';

let ctx: TestContext;
let fx: ShopFixture;
beforeAll(async () => {
  ctx = await makeTestApp();
  fx = await makeShopFixture(ctx);
});
afterAll(async () => {
  await ctx?.close();
});

async function buildWithFiles(files: FileStore, name: string) {
  const buildId = await insertBuild(ctx.db, fx.shopId, name);
  const sculptIds: string[] = [];
  for (const version of [1, 2]) {
    const [s] = await ctx.db
      .insert(sculpts)
      .values({ shopId: fx.shopId, buildId, version, fileName: `${name}-v${version}.obj`, format: 'obj', sourceKey: 'x', sourceBytes: 1, units: 'mm', targetTriangles: 1000 })
      .returning({ id: sculpts.id });
    sculptIds.push(s.id);
    await files.put(sculptSourceKey(s.id, 'obj'), new TextEncoder().encode('v 0 0 0'));
    await files.put(sculptMeshKey(s.id), new Uint8Array(16));
  }
  const [p] = await ctx.db.insert(patterns).values({ shopId: fx.shopId, buildId, sculptId: sculptIds[1], seamRevision: 1 }).returning({ id: patterns.id });
  await files.put(`${patternFilePrefix(p.id)}/faces.bin`, new Uint8Array(8));
  const doc = helmetLikeDoc();
  const [ps] = await ctx.db
    .insert(printSets)
    .values({ shopId: fx.shopId, buildId, name, formats: ['svg'], page: 'a4', mode: 'tiled', pieceCount: doc.pieces.length, pattern: doc })
    .returning({ id: printSets.id });
  await files.put(printSetFileKey(ps.id, 'print-set.svg'), new TextEncoder().encode('<svg/>'));
  return { buildId, sculptIds, patternId: p.id, printSetId: ps.id };
}

describe('files of a build', () => {
  it('lists the prefixes of all sculpt versions, patterns and print sets of the build and of no other build', async () => {
    const files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-build-files-')));
    const a = await buildWithFiles(files, 'Gauntlet');
    const b = await buildWithFiles(files, 'Pauldron');
    const prefixes = await selectBuildFilePrefixes(ctx.db, fx.shopId, a.buildId);
    expect(new Set(prefixes)).toEqual(new Set([`sculpts/${a.sculptIds[0]}`, `sculpts/${a.sculptIds[1]}`, `patterns/${a.patternId}`, `print-sets/${a.printSetId}`]));
    // The shop is part of the match: the same build id asked for under another shop finds nothing.
    expect(await selectBuildFilePrefixes(ctx.db, fx.otherShopId, a.buildId)).toEqual([]);

    expect(await removeFilePrefixes(files, prefixes, () => undefined)).toEqual([]);
    for (const key of [sculptSourceKey(a.sculptIds[0], 'obj'), sculptMeshKey(a.sculptIds[1]), `patterns/${a.patternId}/faces.bin`, printSetFileKey(a.printSetId, 'print-set.svg')]) {
      expect(await files.open(key), key).toBeNull();
    }
    for (const key of [sculptSourceKey(b.sculptIds[0], 'obj'), sculptMeshKey(b.sculptIds[1]), `patterns/${b.patternId}/faces.bin`, printSetFileKey(b.printSetId, 'print-set.svg')]) {
      expect(await files.open(key), key).not.toBeNull();
    }
  });

  it('carries on past a prefix the store cannot remove and reports it', async () => {
    const store = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-build-files-')));
    const failing: FileStore = { ...store, removePrefix: async (prefix) => (prefix.startsWith('patterns/') ? Promise.reject(new Error('disk refused')) : store.removePrefix(prefix)) };
    const c = await buildWithFiles(store, 'Visor');
    const seen: string[] = [];
    const left = await removeFilePrefixes(failing, await selectBuildFilePrefixes(ctx.db, fx.shopId, c.buildId), (prefix, err) => seen.push(`${prefix}: ${(err as Error).message}`));
    expect(left).toEqual([`patterns/${c.patternId}`]);
    expect(seen).toEqual([`patterns/${c.patternId}: disk refused`]);
    expect(await store.open(printSetFileKey(c.printSetId, 'print-set.svg'))).toBeNull();
  });
});
