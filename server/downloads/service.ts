/**
 * A buyer's download link. Looking at the link's page (the file list) does not count as a use; each file
 * download counts one, so a link of 5 uses gives 5 files in all (e.g. the PDF on two printers plus the SVG
 * and the DXF and one retry). An expired, used-up or revoked link answers 410 with the reason.
 */
import type { Db } from '../../db/client';
import { AppError } from '../errors';
import { printSetFileKey } from '../print-sets/print-set-files';
import type { FileStore, StoredFile } from '../storage/file-store';
import { DOWNLOAD_TOKEN_PATTERN, hashDownloadToken } from './download-token';
import { selectDownload, takeLinkUse } from './queries';

export interface DownloadView {
  packTitle: string;
  packSlug: string;
  shopName: string;
  licence: string;
  files: Array<{ name: string; sizeBytes: number; contentType: string; url: string }>;
  uses: number;
  maxUses: number;
  expiresAt: string;
}

type Found = NonNullable<Awaited<ReturnType<typeof selectDownload>>>;

async function findGoodLink(db: Db, token: string, now: Date): Promise<Found> {
  const unknown = new AppError('NOT_FOUND', 404, 'This download link is not known; check that the whole link from the e-mail was copied');
  if (!DOWNLOAD_TOKEN_PATTERN.test(token)) throw unknown;
  const found = await selectDownload(db, hashDownloadToken(token));
  if (!found) throw unknown;
  const { link } = found;
  if (link.revokedAt || found.orderStatus !== 'paid') {
    throw new AppError('LINK_REVOKED', 410, 'This download link was withdrawn because its order was refunded');
  }
  if (link.expiresAt.getTime() <= now.getTime()) {
    throw new AppError('LINK_EXPIRED', 410, `This download link expired on ${link.expiresAt.toUTCString()}; ask the shop for a new one`);
  }
  if (link.uses >= link.maxUses) {
    throw new AppError('LINK_USED_UP', 410, `This download link has been used for ${link.maxUses} downloads, its limit; ask the shop for a new one`);
  }
  return found;
}

/** Returns what the link offers; throws 404 for an unknown token, 410 when expired, used up or revoked. */
export async function getDownload(db: Db, token: string, now = new Date()): Promise<DownloadView> {
  const found = await findGoodLink(db, token, now);
  return {
    packTitle: found.packTitle,
    packSlug: found.packSlug,
    shopName: found.shopName,
    licence: found.licence,
    files: found.files.map((f) => ({ ...f, url: `/api/downloads/${token}/files/${encodeURIComponent(f.name)}` })),
    uses: found.link.uses,
    maxUses: found.link.maxUses,
    expiresAt: found.link.expiresAt.toISOString(),
  };
}

/**
 * Counts one use and opens file `name` of the pack. Throws 404 when the pack has no such file (no use is
 * counted), 410 as getDownload does (also when the last use was taken by a download at the same moment).
 */
export async function openDownloadFile(db: Db, files: FileStore, token: string, name: string, now = new Date()): Promise<{ file: StoredFile; contentType: string; name: string }> {
  const found = await findGoodLink(db, token, now);
  const entry = found.files.find((f) => f.name === name);
  if (!entry) {
    throw new AppError('NOT_FOUND', 404, `The pack has no file "${name}" (it has ${found.files.map((f) => f.name).join(', ') || 'no files'})`);
  }
  if ((await takeLinkUse(db, found.link.tokenHash)) === null) {
    // Another download took the last use (or the link just expired): report the reason as it stands now.
    await findGoodLink(db, token, new Date());
    throw new AppError('LINK_USED_UP', 410, 'This download link has no uses left; ask the shop for a new one');
  }
  const file = await files.open(printSetFileKey(found.printSetId, entry.name));
  if (!file) throw new AppError('NOT_FOUND', 404, `File "${name}" of the pack is missing from the file store`);
  return { file, contentType: entry.contentType, name: entry.name };
}
