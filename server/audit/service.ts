/** The audit trail: which actions are recorded and how entries are shown to a shop's owner. */
import type { DbExecutor } from '../../db/client';
import { insertAuditEntry, selectShopAudit } from './queries';

/** The recorded actions; entries are written in the same transaction as the change they describe. */
export type AuditAction = 'user.signup' | 'shop.create' | 'build.create' | 'build.rename' | 'build.delete' | 'print-set.create';

/** Records that `userId` did `action` on `target` (e.g. "build:<id>") in `shopId`, with names in `detail`. */
export function recordAudit(
  db: DbExecutor,
  entry: { shopId: string | null; userId: string | null; action: AuditAction; target: string; detail?: Record<string, unknown> },
): Promise<void> {
  return insertAuditEntry(db, entry);
}

export interface AuditEntryView {
  id: number;
  at: string;
  action: string;
  target: string;
  detail: Record<string, unknown>;
  user: { id: string; name: string } | null;
}

/** Returns the latest `limit` (default 200) entries of a shop, newest first, timestamps as ISO strings. */
export async function listShopAudit(db: DbExecutor, shopId: string, limit = 200): Promise<AuditEntryView[]> {
  const rows = await selectShopAudit(db, shopId, limit);
  return rows.map((r) => ({
    id: r.id,
    at: r.at.toISOString(),
    action: r.action,
    target: r.target,
    detail: r.detail,
    user: r.userId && r.userName !== null ? { id: r.userId, name: r.userName } : null,
  }));
}
