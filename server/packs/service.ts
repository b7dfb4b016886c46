/**
 * Pattern-pack rules: a pack sells one finished print set of the shop; it starts as a draft, is published
 * (the owner gets an e-mail) and may be withdrawn. Published packs are public. Checkout opens a payment for a
 * paid pack, or pays a free one at once and mails its link.
 */
import { randomBytes } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import { printSets } from '../../db/schema-core';
import type { PackCreateBody, PackUpdateBody } from '../../db/validation-packs';
import { AppError, notFound } from '../errors';
import type { SessionUser } from '../http/define-route';
import type { FileStore, StoredFile } from '../storage/file-store';
import { issueDownloadLink, sendReceipt, type FulfilSettings } from '../orders/fulfil-order';
import { insertOrder, setOrderSession } from '../orders/queries';
import type { PaymentGateway } from '../pay/payment-gateway';
import { coverType } from './cover-image';
import { packPublishedMail } from '../mail/templates/pack-published-mail';
import { FOAM_CAUTIONS, priceLabel, type PackMailer } from './pack-mails';
import { slugFromTitle } from './pack-slug';
import { insertPack, selectPackBySlug, selectPublishedPacks, selectShopPack, selectShopPacks, slugTaken, updatePack, type PackWithSet } from './queries';

export interface PackDeps {
  db: Db;
  files: FileStore;
  mailer: PackMailer | null;
  payments: PaymentGateway | null;
  settings: FulfilSettings;
  logger: Logger;
}

export interface PackPublicView {
  slug: string;
  title: string;
  description: string;
  licence: string;
  priceCents: number;
  currency: string;
  priceLabel: string;
  shopName: string;
  coverUrl: string | null;
  publishedAt: string | null;
  pieceCount: number;
  files: Array<{ name: string; sizeBytes: number }>;
  cautions: string;
}

export interface PackView extends Omit<PackPublicView, 'coverUrl'> {
  id: string;
  status: 'draft' | 'published' | 'withdrawn';
  printSetId: string;
  buildId: string;
  coverUrl: string | null;
  createdAt: string;
  paidOrders: number;
  refundedOrders: number;
}

function publicView(p: PackWithSet): PackPublicView {
  return {
    slug: p.pack.slug,
    title: p.pack.title,
    description: p.pack.description,
    licence: p.pack.licence,
    priceCents: p.pack.priceCents,
    currency: p.pack.currency,
    priceLabel: priceLabel(p.pack.priceCents, p.pack.currency),
    shopName: p.shopName,
    coverUrl: p.pack.coverKey ? `/api/packs/${p.pack.slug}/cover` : null,
    publishedAt: p.pack.publishedAt?.toISOString() ?? null,
    pieceCount: p.pieceCount,
    files: p.files.map((f) => ({ name: f.name, sizeBytes: f.sizeBytes })),
    cautions: FOAM_CAUTIONS,
  };
}

function shopView(p: PackWithSet, counts = { paidOrders: 0, refundedOrders: 0 }): PackView {
  return {
    ...publicView(p),
    id: p.pack.id,
    status: p.pack.status,
    printSetId: p.pack.printSetId,
    buildId: p.buildId,
    coverUrl: p.pack.coverKey ? `/api/shops/${p.pack.shopId}/packs/${p.pack.id}/cover` : null,
    createdAt: p.pack.createdAt.toISOString(),
    ...counts,
  };
}

function isUniqueViolation(err: unknown): boolean {
  const cause = (err as { cause?: { code?: string } }).cause;
  return (err as { code?: string }).code === '23505' || cause?.code === '23505';
}

/**
 * Records a draft pack of print set `body.printSetId` and returns it. Throws 404 NOT_FOUND when the shop has no
 * such print set, 409 PRINT_SET_NOT_READY when it is not done. The slug comes from the title, made unique.
 */
export async function createPack(deps: PackDeps, user: SessionUser, shopId: string, body: PackCreateBody): Promise<PackView> {
  const [set] = await deps.db
    .select({ buildId: printSets.buildId, status: printSets.status })
    .from(printSets)
    .where(and(eq(printSets.id, body.printSetId), eq(printSets.shopId, shopId)));
  if (!set) throw notFound('Print set');
  if (set.status !== 'done') {
    throw new AppError('PRINT_SET_NOT_READY', 409, `The print set is ${set.status}; only a finished (done) print set can be sold as a pack`, { printSetId: 'not finished' });
  }
  for (let attempt = 0; attempt < 6; attempt++) {
    let slug = slugFromTitle(body.title, attempt === 0 ? undefined : attempt + 1);
    if (attempt === 5) slug = slugFromTitle(body.title, undefined) + `-${randomBytes(3).toString('hex')}`;
    if (attempt < 5 && (await slugTaken(deps.db, slug))) continue;
    try {
      const pack = await insertPack(deps.db, { ...body, shopId, slug, createdBy: user.id });
      const full = await selectShopPack(deps.db, shopId, pack.id);
      return shopView(full!);
    } catch (err) {
      if (!isUniqueViolation(err)) throw err;
    }
  }
  throw new AppError('SLUG_TAKEN', 409, `Could not find a free address for the title "${body.title}"; change the title a little`, { title: 'taken' });
}

/** Returns the shop's packs, newest first, with order counts. */
export async function listShopPacks(db: Db, shopId: string): Promise<PackView[]> {
  return (await selectShopPacks(db, shopId)).map((r) => shopView(r, { paidOrders: r.paidOrders, refundedOrders: r.refundedOrders }));
}

/**
 * Changes a pack; publishing it the first time (or again after a withdrawal) stamps publishedAt and mails the
 * person who published it. Throws 404 NOT_FOUND when the shop has no such pack.
 */
export async function changePack(deps: PackDeps, user: SessionUser, shopId: string, packId: string, body: PackUpdateBody): Promise<PackView> {
  const before = await selectShopPack(deps.db, shopId, packId);
  if (!before) throw notFound('Pack');
  const publishing = body.status === 'published' && before.pack.status !== 'published';
  const updated = await updatePack(deps.db, shopId, packId, { ...body, ...(publishing ? { publishedAt: new Date() } : {}) });
  if (!updated) throw notFound('Pack');
  if (publishing && deps.mailer) {
    const content = packPublishedMail({ packTitle: updated.title, shopName: before.shopName, packUrl: `${deps.settings.publicUrl}/packs/${updated.slug}`, priceCents: updated.priceCents, currency: updated.currency });
    try {
      await deps.mailer.send({ kind: 'pack-published', to: user.email, ...content, detail: { packId } });
    } catch (err) {
      deps.logger.error({ err, packId }, 'the pack-published e-mail could not be sent');
    }
  }
  return shopView((await selectShopPack(deps.db, shopId, packId))!);
}

/** Stores `bytes` (checked PNG/JPEG ≤ 5 MB) as the pack's cover under a new random key; the old cover is removed. */
export async function setPackCover(deps: PackDeps, shopId: string, packId: string, bytes: Uint8Array, where: string): Promise<PackView> {
  const found = await selectShopPack(deps.db, shopId, packId);
  if (!found) throw notFound('Pack');
  const type = coverType(bytes, where);
  const key = `packs/${packId}/cover-${randomBytes(12).toString('hex')}.${type.ext}`;
  await deps.files.put(key, bytes);
  await updatePack(deps.db, shopId, packId, { coverKey: key });
  if (found.pack.coverKey) await deps.files.removePrefix(found.pack.coverKey);
  return shopView((await selectShopPack(deps.db, shopId, packId))!);
}

async function openCover(files: FileStore, key: string | null): Promise<{ file: StoredFile; contentType: string; name: string }> {
  if (!key) throw new AppError('NOT_FOUND', 404, 'This pack has no cover image');
  const file = await files.open(key);
  if (!file) throw new AppError('NOT_FOUND', 404, 'The cover image is missing from the file store');
  const jpeg = key.endsWith('.jpg');
  return { file, contentType: jpeg ? 'image/jpeg' : 'image/png', name: jpeg ? 'cover.jpg' : 'cover.png' };
}

/** Opens the cover of the shop's pack (any status). */
export async function openShopPackCover(deps: PackDeps, shopId: string, packId: string) {
  const found = await selectShopPack(deps.db, shopId, packId);
  if (!found) throw notFound('Pack');
  return openCover(deps.files, found.pack.coverKey);
}

async function publishedPack(db: Db, slug: string): Promise<PackWithSet> {
  const found = await selectPackBySlug(db, slug);
  if (!found || found.pack.status === 'draft') throw new AppError('NOT_FOUND', 404, `There is no pattern pack at /packs/${slug}`);
  if (found.pack.status === 'withdrawn') throw new AppError('WITHDRAWN', 410, `The pattern pack "${found.pack.title}" is no longer offered`);
  return found;
}

/** Opens the cover of a published pack. */
export async function openPublicCover(deps: PackDeps, slug: string) {
  return openCover(deps.files, (await publishedPack(deps.db, slug)).pack.coverKey);
}

/** Returns page `page` (from 1) of published packs, `perPage` each, newest first. */
export async function listPublishedPacks(db: Db, page: number, perPage: number) {
  const { rows, total } = await selectPublishedPacks(db, (page - 1) * perPage, perPage);
  return { packs: rows.map(publicView), page, perPage, total };
}

/** Returns a published pack; 404 for unknown or draft, 410 WITHDRAWN for a withdrawn one. */
export async function getPublishedPack(db: Db, slug: string): Promise<PackPublicView> {
  return publicView(await publishedPack(db, slug));
}

/**
 * Starts buying pack `slug` for `email`. A paid pack gets a pending order and a checkout session on the payment
 * service: returns `{ url }` of its pay page. A free pack's order is paid at once and its link mailed: returns
 * `{ url: null, emailed }`.
 */
export async function checkoutPack(deps: PackDeps, slug: string, email: string): Promise<{ url: string | null; emailed: boolean }> {
  const found = await publishedPack(deps.db, slug);
  const { pack } = found;
  if (pack.priceCents === 0) {
    const receipt = await deps.db.transaction(async (tx) => {
      const order = await insertOrder(tx, { packId: pack.id, email, amountCents: 0, currency: pack.currency, status: 'paid', paidAt: new Date() });
      return issueDownloadLink(tx, order, deps.settings);
    });
    const emailed = await sendReceipt(deps.mailer, deps.logger, deps.settings, receipt, { title: pack.title });
    return { url: null, emailed };
  }
  if (!deps.payments) throw new AppError('PAYMENT_UNAVAILABLE', 503, 'Payments are not set up on this server, so paid packs cannot be bought now');
  const order = await insertOrder(deps.db, { packId: pack.id, email, amountCents: pack.priceCents, currency: pack.currency });
  const back = `${deps.settings.publicUrl}/packs/${pack.slug}`;
  const session = await deps.payments.createCheckout({
    orderId: order.id,
    title: pack.title,
    amountCents: pack.priceCents,
    currency: pack.currency,
    email,
    successUrl: `${back}?paid=1`,
    cancelUrl: `${back}?cancelled=1`,
  });
  await setOrderSession(deps.db, order.id, session.sessionId);
  return { url: session.url, emailed: false };
}
