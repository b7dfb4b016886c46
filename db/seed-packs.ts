/**
 * Demo pattern packs: one paid and one free pack from a finished print set of the demo build, so a visitor can
 * browse, buy on the local payment fake and download right after `npm start`. When the build has no finished
 * print set yet, one is rendered here from `pattern` (or from a small invented bracer pattern).
 *
 * Called by db/seed.ts inside its seeding transaction, after the demo shop and builds exist:
 *   await seedDemoPacks(tx, files, { shopId, buildId, ownerId });
 */
import { deflateSync } from 'node:zlib';
import { and, desc, eq } from 'drizzle-orm';
import type { PatternDoc, PatternPiece, PointMm } from '../geometry/pattern/pattern-doc';
import { printSetFileKey } from '../server/print-sets/print-set-files';
import { renderPrintSet } from '../server/print-sets/render-print-set';
import type { FileStore } from '../server/storage/file-store';
import type { DbExecutor } from './client';
import { printSets } from './schema-core';
import { packs } from './schema-packs';

/** The demo packs as the catalogue shows them (slugs are fixed so the README and the browser test can name them). */
export const DEMO_PACKS: readonly DemoPack[] = [
  {
    slug: 'beetle-knight-helmet',
    title: 'Beetle knight helmet',
    priceCents: 1200,
    description: 'The full shell of a beetle-shell knight helmet in 6 mm foam: crown, brow and cheek pieces, every seam numbered and its bevel printed on both pieces, with a sheet plan and a bench card.',
  },
  {
    slug: 'beetle-knight-bracer-sampler',
    title: 'Bracer sampler (free)',
    priceCents: 0,
    description: 'A two-piece bracer to try the printed bevels and match marks before the big build.',
  },
];

const DEMO_LICENCE = 'For your own builds, including commissions you make by hand. Do not share or resell the pattern files.';

function rect(w: number, h: number): PointMm[] {
  return [[0, 0], [w, 0], [w, h], [0, h]];
}

function trapezoid(bottom: number, top: number, h: number): PointMm[] {
  const inset = (bottom - top) / 2;
  return [[0, 0], [bottom, 0], [bottom - inset, h], [inset, h]];
}

function demoPiece(label: string, outline: PointMm[], extra: Partial<PatternPiece>): PatternPiece {
  let twice = 0;
  for (let i = 0; i < outline.length; i++) {
    const [a, b] = [outline[i], outline[(i + 1) % outline.length]];
    twice += a[0] * b[1] - b[0] * a[1];
  }
  const area = twice / 2;
  return { label, faces: 0, area3d: area, area2d: area, outline, holes: [], stretch: { maxPct: 0.8, rmsPct: 0.3 }, quantity: 1, mirrored: false, thickness: 6, ...extra };
}

/** A small invented bracer: a shell (two mirrored copies) and a cuff band joined by one seam beveled 25°. */
export function demoBracerPattern(): PatternDoc {
  const shell = demoPiece('A', trapezoid(180, 140, 160), {
    quantity: 2,
    mirrored: true,
    mirroredCopies: 1,
    seamEdges: [{ seam: '1', side: 0, path: [[0, 0], [180, 0]], bevelDeg: 25, bevelFace: 'inner' }],
  });
  const cuff = demoPiece('B', rect(180, 40), {
    thickness: 4,
    seamEdges: [{ seam: '1', side: 1, path: [[180, 40], [0, 40]], bevelDeg: 25, bevelFace: 'inner' }],
  });
  return {
    units: 'mm',
    name: 'Bracer sampler',
    pieces: [shell, cuff],
    seams: [
      {
        label: '1',
        pieces: ['A', 'B'],
        length3d: 180,
        lengths: [180, 180],
        dihedral: { min: 130, mean: 130, max: 130 },
        bevel: { min: 25, mean: 25, max: 25 },
        convex: true,
        bevelFace: 'inner',
        stations: [{ at: 0, bevel: 25 }, { at: 90, bevel: 25 }, { at: 180, bevel: 25 }],
      },
    ],
    warnings: [],
  };
}

const CRC_TABLE = (() => {
  const t = new Uint32Array(256);
  for (let n = 0; n < 256; n++) {
    let c = n;
    for (let k = 0; k < 8; k++) c = c & 1 ? 0xedb88320 ^ (c >>> 1) : c >>> 1;
    t[n] = c >>> 0;
  }
  return t;
})();

/** CRC-32 as PNG chunks use it (ISO/IEC 15948 Annex D). */
function crc32(bytes: Uint8Array): number {
  let c = 0xffffffff;
  for (const b of bytes) c = CRC_TABLE[(c ^ b) & 0xff] ^ (c >>> 8);
  return (c ^ 0xffffffff) >>> 0;
}

function chunk(type: string, data: Uint8Array): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, 'ascii');
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])), 0);
  return Buffer.concat([head, data, crc]);
}

/**
 * Returns a 480×360 PNG (8-bit RGB, ISO/IEC 15948) of stacked foam-coloured bands with a diagonal cut edge:
 * a plain cover for the demo packs, drawn here so the demo needs no image files.
 */
export function demoCoverPng(bands: ReadonlyArray<readonly [number, number, number]>): Uint8Array {
  const w = 480;
  const h = 360;
  const raw = Buffer.alloc((w * 3 + 1) * h);
  for (let y = 0; y < h; y++) {
    raw[y * (w * 3 + 1)] = 0;
    for (let x = 0; x < w; x++) {
      const cut = x > 120 + y * 0.6;
      const band = bands[Math.min(bands.length - 1, Math.floor((y / h) * bands.length))];
      const [r, g, b] = cut ? [245, 239, 228] : band;
      const o = y * (w * 3 + 1) + 1 + x * 3;
      raw[o] = r;
      raw[o + 1] = g;
      raw[o + 2] = b;
    }
  }
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(w, 0);
  ihdr.writeUInt32BE(h, 4);
  ihdr.set([8, 2, 0, 0, 0], 8);
  const signature = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  return new Uint8Array(Buffer.concat([signature, chunk('IHDR', ihdr), chunk('IDAT', deflateSync(raw)), chunk('IEND', new Uint8Array(0))]));
}

/** Returns the newest finished print set of the build, rendering and storing one from `pattern` when there is none. */
async function finishedPrintSet(tx: DbExecutor, files: FileStore, ids: { shopId: string; buildId: string; ownerId: string }, pattern: PatternDoc): Promise<string> {
  const [existing] = await tx
    .select({ id: printSets.id })
    .from(printSets)
    .where(and(eq(printSets.buildId, ids.buildId), eq(printSets.status, 'done')))
    .orderBy(desc(printSets.createdAt))
    .limit(1);
  if (existing) return existing.id;
  const name = pattern.name ?? 'Demo print set';
  const rendered = await renderPrintSet(pattern, { formats: ['pdf', 'svg', 'dxf'], page: 'a4', mode: 'tiled', name });
  const [row] = await tx
    .insert(printSets)
    .values({
      shopId: ids.shopId,
      buildId: ids.buildId,
      createdBy: ids.ownerId,
      name,
      status: 'done',
      formats: ['pdf', 'svg', 'dxf'],
      page: 'a4',
      mode: 'tiled',
      pieceCount: pattern.pieces.length,
      pattern,
      files: rendered.map((f) => ({ name: f.name, sizeBytes: f.bytes.byteLength, contentType: f.contentType })),
      startedAt: new Date(),
      finishedAt: new Date(),
    })
    .returning({ id: printSets.id });
  for (const f of rendered) await files.put(printSetFileKey(row.id, f.name), f.bytes);
  return row.id;
}

export interface DemoPack {
  slug: string;
  title: string;
  priceCents: number;
  description: string;
}

/**
 * Adds the demo packs (DEMO_PACKS unless `options.demos` names others; published, newest first as listed) for the
 * build's finished print set, with generated covers; `options.pattern` is rendered when the build has no finished
 * print set (default: demoBracerPattern). Skips a pack whose slug already exists, so running it twice adds
 * nothing. Returns the slugs added.
 */
export async function seedDemoPacks(
  tx: DbExecutor,
  files: FileStore,
  ids: { shopId: string; buildId: string; ownerId: string },
  options: { pattern?: PatternDoc; demos?: readonly DemoPack[] } = {},
): Promise<string[]> {
  const printSetId = await finishedPrintSet(tx, files, ids, options.pattern ?? demoBracerPattern());
  const covers = [
    demoCoverPng([[217, 179, 108], [126, 154, 110], [68, 96, 107], [180, 80, 28]]),
    demoCoverPng([[126, 154, 110], [217, 179, 108]]),
  ];
  const added: string[] = [];
  for (const [i, demo] of (options.demos ?? DEMO_PACKS).entries()) {
    const taken = await tx.select({ id: packs.id }).from(packs).where(eq(packs.slug, demo.slug));
    if (taken.length > 0) continue;
    const coverKey = `packs/demo-${demo.slug}/cover-${i}.png`;
    await files.put(coverKey, covers[i % covers.length]);
    await tx.insert(packs).values({
      shopId: ids.shopId,
      printSetId,
      slug: demo.slug,
      title: demo.title,
      description: demo.description,
      licence: DEMO_LICENCE,
      priceCents: demo.priceCents,
      currency: 'eur',
      coverKey,
      status: 'published',
      createdBy: ids.ownerId,
      // Staggered so the paid pack is the newest in the catalogue.
      publishedAt: new Date(Date.now() - i * 60_000),
    });
    added.push(demo.slug);
  }
  return added;
}
