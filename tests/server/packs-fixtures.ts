/**
 * Concrete calls for the pack, order, webhook and download routes, for tests that walk the access table:
 * each call comes with its own published free pack (with cover), a paid order and a fresh download link in
 * shop `shopId`, and a body (and headers) that succeed for an allowed caller. Used by packs-access.test.ts;
 * tests/server/access.test.ts can use `packsConcreteCall` for these paths (`isPacksRoute`).
 */
import { randomUUID } from 'node:crypto';
import type { Db } from '../../db/client';
import { builds, printSets } from '../../db/schema-core';
import { downloadLinks, orders, packs } from '../../db/schema-packs';
import type { HttpMethod } from '../../server/auth/access';
import { signWebhookPayload, SIGNATURE_HEADER } from '../../server/dev/payment-fake';
import { newDownloadToken } from '../../server/downloads/download-token';
import { parseEnv } from '../../server/env';
import { printSetFileKey } from '../../server/print-sets/print-set-files';
import type { FileStore } from '../../server/storage/file-store';
import { piece, rectangle } from '../fixtures/pattern-docs/shape-docs';

const MINE = ['/api/shops/:shopId/packs', '/api/packs', '/api/pay/', '/api/shops/:shopId/orders', '/api/downloads/'];

/** Returns whether `path` is one of the pack, order, webhook or download routes. */
export function isPacksRoute(path: string): boolean {
  return MINE.some((m) => path.startsWith(m));
}

const PNG = Uint8Array.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 1, 2, 3]);

async function donePrintSet(db: Db, files: FileStore, shopId: string): Promise<string> {
  const [build] = await db.insert(builds).values({ shopId, name: 'Access build' }).returning({ id: builds.id });
  const [row] = await db
    .insert(printSets)
    .values({
      shopId,
      buildId: build.id,
      name: 'Access set',
      status: 'done',
      formats: ['svg'],
      page: 'a4',
      mode: 'tiled',
      pieceCount: 1,
      pattern: { units: 'mm', pieces: [piece('A', rectangle(10, 10))], seams: [], warnings: [] },
      files: [{ name: 'pattern.svg', sizeBytes: 6, contentType: 'image/svg+xml' }],
    })
    .returning({ id: printSets.id });
  await files.put(printSetFileKey(row.id, 'pattern.svg'), new TextEncoder().encode('<svg/>'));
  return row.id;
}

/**
 * Returns the URL, body and headers of a call to route `method path` that succeeds for an allowed caller, after
 * making what it needs in shop `shopId`. The webhook call is signed with the environment's default secret (the
 * app must use it, i.e. run without PAY_WEBHOOK_SECRET set).
 */
export async function packsConcreteCall(
  db: Db,
  files: FileStore,
  shopId: string,
  method: HttpMethod,
  path: string,
  persona: string,
): Promise<{ url: string; body?: object | string; headers?: Record<string, string> }> {
  const printSetId = await donePrintSet(db, files, shopId);
  const slug = `access-${randomUUID().slice(0, 8)}`;
  const coverKey = `packs/${randomUUID()}/cover-x.png`;
  await files.put(coverKey, PNG);
  const [pack] = await db
    .insert(packs)
    .values({ shopId, printSetId, slug, title: 'Access pack', description: 'd', licence: 'l', priceCents: 0, currency: 'eur', status: 'published', publishedAt: new Date(), coverKey })
    .returning();
  const [order] = await db.insert(orders).values({ packId: pack.id, email: 'a@test.example.com', amountCents: 0, currency: 'eur', status: 'paid', paidAt: new Date() }).returning();
  const { token, hash } = newDownloadToken();
  await db.insert(downloadLinks).values({ orderId: order.id, tokenHash: hash, expiresAt: new Date(Date.now() + 3_600_000), maxUses: 5 });
  const url = path
    .replace(':shopId', shopId)
    .replace(':packId', pack.id)
    .replace(':slug', pack.slug)
    .replace(':orderId', order.id)
    .replace(':token', token)
    .replace(':name', 'pattern.svg');
  if (path === '/api/pay/webhook') {
    const payload = JSON.stringify({ id: `evt_${randomUUID()}`, type: 'customer.created', data: { object: {} } });
    const signature = signWebhookPayload(payload, parseEnv({}).PAY_WEBHOOK_SECRET, Math.floor(Date.now() / 1000));
    return { url, body: payload, headers: { 'Content-Type': 'application/json', [SIGNATURE_HEADER]: signature } };
  }
  if (path.endsWith('/cover') && method === 'PUT') return { url, body: { dataUrl: `data:image/png;base64,${Buffer.from(PNG).toString('base64')}` } };
  if (path === '/api/shops/:shopId/packs' && method === 'POST') return { url, body: { printSetId, title: 'Walked', description: 'd', licence: 'l', priceCents: 0, currency: 'eur' } };
  if (path.endsWith('/checkout')) return { url, body: { email: 'walker@test.example.com' } };
  if (method === 'PATCH') return { url, body: { title: `Walked by ${persona}` } };
  return { url };
}
