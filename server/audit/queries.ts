/** Drizzle queries for the audit log. */
import { desc, eq } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { auditLog, users } from '../../db/schema';

export interface AuditEntryInput {
  shopId: string | null;
  userId: string | null;
  action: string;
  target: string;
  detail?: Record<string, unknown>;
}

/** Inserts one audit entry (inside the caller's transaction when `db` is one). */
export async function insertAuditEntry(db: DbExecutor, entry: AuditEntryInput): Promise<void> {
  await db.insert(auditLog).values({ ...entry, detail: entry.detail ?? {} });
}

/** Returns a shop's audit entries, newest first, at most `limit`, with the acting person's name when known. */
export function selectShopAudit(db: DbExecutor, shopId: string, limit: number) {
  return db
    .select({
      id: auditLog.id,
      at: auditLog.at,
      action: auditLog.action,
      target: auditLog.target,
      detail: auditLog.detail,
      userId: auditLog.userId,
      userName: users.name,
    })
    .from(auditLog)
    .leftJoin(users, eq(users.id, auditLog.userId))
    .where(eq(auditLog.shopId, shopId))
    .orderBy(desc(auditLog.at), desc(auditLog.id))
    .limit(limit);
}
