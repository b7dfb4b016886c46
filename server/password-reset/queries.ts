/** Drizzle queries for password-reset tokens. */
import { and, eq, isNull, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { users } from '../../db/schema-core';
import { passwordResets } from '../../db/schema-sharing';

/** Returns the id of the account with this (lower-case) e-mail, or null. */
export async function selectUserIdByEmail(db: DbExecutor, email: string): Promise<string | null> {
  const rows = await db.select({ id: users.id }).from(users).where(eq(users.email, email));
  return rows[0]?.id ?? null;
}

/** Inserts a reset token hash for the user. */
export async function insertPasswordReset(db: DbExecutor, row: { userId: string; tokenHash: string; expiresAt: Date }): Promise<void> {
  await db.insert(passwordResets).values(row);
}

/** Returns the reset with this token hash and its account's e-mail, locked until the transaction ends, or null. */
export async function selectResetForUpdate(db: DbExecutor, tokenHash: string) {
  const rows = await db
    .select({ id: passwordResets.id, userId: passwordResets.userId, expiresAt: passwordResets.expiresAt, usedAt: passwordResets.usedAt, email: users.email })
    .from(passwordResets)
    .innerJoin(users, eq(users.id, passwordResets.userId))
    .where(eq(passwordResets.tokenHash, tokenHash))
    .for('update', { of: passwordResets });
  return rows[0] ?? null;
}

/** Marks every unused reset of the user as used, so one new password ends all outstanding links. */
export async function useAllResetsOf(db: DbExecutor, userId: string): Promise<void> {
  await db
    .update(passwordResets)
    .set({ usedAt: new Date() })
    .where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}

/** Stores the new password hash and raises the session generation, ending every earlier session of the person. */
export async function setPasswordAndEndSessions(db: DbExecutor, userId: string, passwordHash: string): Promise<void> {
  await db
    .update(users)
    .set({ passwordHash, sessionGeneration: sql`${users.sessionGeneration} + 1` })
    .where(eq(users.id, userId));
}
