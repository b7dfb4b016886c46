/** Drizzle queries for a build's piece rows (settings and checklist) and piece notes. */
import { and, asc, count, eq, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { buildPieces, pieceNotes, type PatternSurface } from '../../db/schema-bench';
import { users } from '../../db/schema-core';

export type PieceRow = typeof buildPieces.$inferSelect;

/** Every piece row of a build, by label. */
export function selectPieceRows(db: DbExecutor, buildId: string): Promise<PieceRow[]> {
  return db.select().from(buildPieces).where(eq(buildPieces.buildId, buildId)).orderBy(asc(buildPieces.label));
}

/** Number of notes per label of a build. */
export async function selectNoteCounts(db: DbExecutor, buildId: string): Promise<Map<string, number>> {
  const rows = await db.select({ label: pieceNotes.label, n: count() }).from(pieceNotes).where(eq(pieceNotes.buildId, buildId)).groupBy(pieceNotes.label);
  return new Map(rows.map((r) => [r.label, Number(r.n)]));
}

export interface PieceChange {
  thicknessMm?: number | null;
  surface?: PatternSurface | null;
  quantity?: number | null;
  mirrored?: boolean | null;
  cut?: boolean;
  shaped?: boolean;
  glued?: boolean;
}

/** Creates or updates the row of one piece with `change`, stamping who and when; returns the row. */
export async function upsertPiece(db: DbExecutor, key: { shopId: string; buildId: string; label: string }, change: PieceChange, userId: string): Promise<PieceRow> {
  const set = { ...change, updatedBy: userId, updatedAt: sql`now()` };
  const rows = await db
    .insert(buildPieces)
    .values({ ...key, ...change, updatedBy: userId })
    .onConflictDoUpdate({ target: [buildPieces.buildId, buildPieces.label], set })
    .returning();
  return rows[0];
}

/** The notes on one piece, oldest first, with their authors' names. */
export function selectNotes(db: DbExecutor, buildId: string, label: string) {
  return db
    .select({ id: pieceNotes.id, label: pieceNotes.label, body: pieceNotes.body, authorId: pieceNotes.authorId, authorName: users.name, createdAt: pieceNotes.createdAt })
    .from(pieceNotes)
    .leftJoin(users, eq(users.id, pieceNotes.authorId))
    .where(and(eq(pieceNotes.buildId, buildId), eq(pieceNotes.label, label)))
    .orderBy(asc(pieceNotes.createdAt), asc(pieceNotes.id));
}

/** Inserts a note and returns it. */
export async function insertNote(db: DbExecutor, note: { shopId: string; buildId: string; label: string; body: string; authorId: string }) {
  const rows = await db.insert(pieceNotes).values(note).returning();
  return rows[0];
}
