/**
 * Demo packs (db/seed-packs.ts): seeded into a fresh shop, they are published, public, backed by a finished
 * print set whose PDF reads as a PDF, and carry PNG covers that decode by the PNG rules; seeding again adds
 * nothing.
 */
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { crc32, inflateSync } from 'node:zlib';
import { eq } from 'drizzle-orm';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { printSets } from '../../db/schema-core';
import { DEMO_PACKS, demoCoverPng, seedDemoPacks } from '../../db/seed-packs';
import { localDiskStore } from '../../server/storage/local-disk-store';
import { insertBuild, makeShopFixture, makeTestApp, type ShopFixture, type TestContext } from './helpers';

let ctx: TestContext;
let fx: ShopFixture;
const files = localDiskStore(mkdtempSync(path.join(tmpdir(), 'sheetsmith-packs-seed-')));

beforeAll(async () => {
  ctx = await makeTestApp({ files });
  fx = await makeShopFixture(ctx);
});
afterAll(() => ctx.close());

/** Splits a PNG into chunks, checking the signature and each chunk's CRC with zlib's crc32 (ISO/IEC 15948 §5). */
function pngChunks(bytes: Uint8Array): Array<{ type: string; data: Buffer }> {
  const buf = Buffer.from(bytes);
  expect([...buf.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  const out: Array<{ type: string; data: Buffer }> = [];
  let o = 8;
  while (o < buf.length) {
    const len = buf.readUInt32BE(o);
    const typeAndData = buf.subarray(o + 4, o + 8 + len);
    expect(buf.readUInt32BE(o + 8 + len)).toBe(crc32(typeAndData));
    out.push({ type: typeAndData.subarray(0, 4).toString('ascii'), data: typeAndData.subarray(4) });
    o += 12 + len;
  }
  return out;
}

describe('demo packs', () => {
  it('seeds the paid and the free pack, public, with a rendered print set; a second run adds nothing', async () => {
    const [owner] = [fx.people.owner];
    const buildId = await insertBuild(ctx.db, fx.shopId, 'Beetle knight helmet');
    // Demo slugs are fixed and the test database outlives a run (and other files seed too), so this run's copies
    // carry a tag.
    const tag = Math.random().toString(36).slice(2, 8);
    const demos = DEMO_PACKS.map((d) => ({ ...d, slug: `${d.slug}-${tag}` }));
    const ids = { shopId: fx.shopId, buildId, ownerId: owner.id };
    const added = await ctx.db.transaction((tx) => seedDemoPacks(tx, files, ids, { demos }));
    expect(added).toEqual(demos.map((p) => p.slug));
    const again = await ctx.db.transaction((tx) => seedDemoPacks(tx, files, ids, { demos }));
    expect(again).toEqual([]);

    const list = await request(ctx.app).get('/api/packs?perPage=60').expect(200);
    const paid = list.body.packs.find((p: { slug: string }) => p.slug === demos[0].slug);
    expect(paid).toMatchObject({ priceCents: 1200, priceLabel: '12.00 EUR' });
    const [set] = await ctx.db.select().from(printSets).where(eq(printSets.buildId, buildId));
    expect(set.status).toBe('done');
    expect(set.files.map((f) => f.name)).toEqual(expect.arrayContaining(['print-set.pdf', 'pattern.svg', 'pattern.dxf']));
    const pdf = await files.open(`print-sets/${set.id}/print-set.pdf`);
    const chunks: Buffer[] = [];
    for await (const c of pdf!.stream) chunks.push(c as Buffer);
    // A PDF file starts with the header "%PDF-" (ISO 32000-1 §7.5.2).
    expect(Buffer.concat(chunks).subarray(0, 5).toString('latin1')).toBe('%PDF-');
    const cover = await request(ctx.app).get(`/api/packs/${demos[0].slug}/cover`).expect(200);
    expect(cover.headers['content-type']).toBe('image/png');
  });

  it('draws covers that decode as 480×360 8-bit RGB PNGs with the bands in order', () => {
    const bands = [[217, 179, 108], [68, 96, 107]] as const;
    const chunks = pngChunks(demoCoverPng(bands));
    expect(chunks.map((c) => c.type)).toEqual(['IHDR', 'IDAT', 'IEND']);
    const ihdr = chunks[0].data;
    expect([ihdr.readUInt32BE(0), ihdr.readUInt32BE(4), ihdr[8], ihdr[9]]).toEqual([480, 360, 8, 2]);
    const raw = inflateSync(chunks[1].data);
    const stride = 480 * 3 + 1;
    expect(raw.length).toBe(stride * 360);
    // Left edge (left of the cut): top band at the top row, bottom band at the last row.
    expect([...raw.subarray(1, 4)]).toEqual([217, 179, 108]);
    expect([...raw.subarray(359 * stride + 1, 359 * stride + 4)]).toEqual([68, 96, 107]);
  });
});
