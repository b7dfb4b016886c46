/** Drizzle queries for print sets; reads are scoped to a shop and build so one shop's id never reaches another's. */
import { and, desc, eq, inArray, lt, or, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { printSets, type PrintSetFileEntry } from '../../db/schema';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';

const summaryColumns = {
  id: printSets.id,
  shopId: printSets.shopId,
  buildId: printSets.buildId,
  createdBy: printSets.createdBy,
  name: printSets.name,
  status: printSets.status,
  formats: printSets.formats,
  page: printSets.page,
  mode: printSets.mode,
  pieceCount: printSets.pieceCount,
  files: printSets.files,
  error: printSets.error,
  createdAt: printSets.createdAt,
  startedAt: printSets.startedAt,
  finishedAt: printSets.finishedAt,
};

export type PrintSetRow = {
  id: string;
  shopId: string;
  buildId: string;
  createdBy: string | null;
  name: string;
  status: 'queued' | 'running' | 'done' | 'failed';
  formats: string[];
  page: string;
  mode: string;
  pieceCount: number;
  files: PrintSetFileEntry[];
  error: string | null;
  createdAt: Date;
  startedAt: Date | null;
  finishedAt: Date | null;
};

export interface NewPrintSet {
  shopId: string;
  buildId: string;
  createdBy: string;
  name: string;
  formats: string[];
  page: string;
  mode: string;
  pattern: PatternDoc;
}

/** Inserts a queued print set and returns it (without the pattern). */
export async function insertPrintSet(db: DbExecutor, row: NewPrintSet): Promise<PrintSetRow> {
  const rows = await db
    .insert(printSets)
    .values({ ...row, pieceCount: row.pattern.pieces.length })
    .returning(summaryColumns);
  return rows[0];
}

/** Records the queue's job id on a print set. */
export async function setPrintSetJobId(db: DbExecutor, id: string, jobId: string): Promise<void> {
  await db.update(printSets).set({ jobId }).where(eq(printSets.id, id));
}

/** Returns the build's print sets, newest first (without patterns). */
export function selectPrintSets(db: DbExecutor, shopId: string, buildId: string): Promise<PrintSetRow[]> {
  return db
    .select(summaryColumns)
    .from(printSets)
    .where(and(eq(printSets.shopId, shopId), eq(printSets.buildId, buildId)))
    .orderBy(desc(printSets.createdAt), desc(printSets.id));
}

/** Returns one print set of the shop's build (without its pattern), or null. */
export async function selectPrintSet(db: DbExecutor, shopId: string, buildId: string, id: string): Promise<PrintSetRow | null> {
  const rows = await db
    .select(summaryColumns)
    .from(printSets)
    .where(and(eq(printSets.shopId, shopId), eq(printSets.buildId, buildId), eq(printSets.id, id)));
  return rows[0] ?? null;
}

/**
 * Marks a queued (or, after a worker crash, running) print set as running and returns what the job needs to
 * render it; null when it is gone or already finished.
 */
export async function claimPrintSet(db: DbExecutor, id: string) {
  const rows = await db
    .update(printSets)
    .set({ status: 'running', startedAt: sql`now()`, error: null })
    .where(and(eq(printSets.id, id), inArray(printSets.status, ['queued', 'running'])))
    .returning({ id: printSets.id, shopId: printSets.shopId, name: printSets.name, formats: printSets.formats, page: printSets.page, mode: printSets.mode, pattern: printSets.pattern });
  return rows[0] ?? null;
}

/**
 * Marks a running print set done with its stored files. Returns false when the row is gone (its build was
 * deleted while it rendered) or no longer running (given up on as stale, see stale-print-sets.ts), so the
 * caller can remove the files nothing points to any more.
 */
export async function markPrintSetDone(db: DbExecutor, id: string, files: PrintSetFileEntry[]): Promise<boolean> {
  const rows = await db
    .update(printSets)
    .set({ status: 'done', files, error: null, finishedAt: sql`now()` })
    .where(and(eq(printSets.id, id), eq(printSets.status, 'running')))
    .returning({ id: printSets.id });
  return rows.length > 0;
}

/** Marks a print set failed with a message for the maker; it keeps no files. */
export async function markPrintSetFailed(db: DbExecutor, id: string, error: string): Promise<void> {
  await db.update(printSets).set({ status: 'failed', files: [], error, finishedAt: sql`now()` }).where(eq(printSets.id, id));
}

/**
 * Marks failed, with `error`, every print set still queued (counted from its creation) or running (counted from
 * its last start) for more than `minutes`; returns their ids.
 */
export async function failPrintSetsOlderThan(db: DbExecutor, minutes: number, error: string): Promise<string[]> {
  const cutoff = sql`now() - make_interval(mins => ${minutes})`;
  const rows = await db
    .update(printSets)
    .set({ status: 'failed', files: [], error, finishedAt: sql`now()` })
    .where(
      or(
        and(eq(printSets.status, 'queued'), lt(printSets.createdAt, cutoff)),
        and(eq(printSets.status, 'running'), lt(printSets.startedAt, cutoff)),
      ),
    )
    .returning({ id: printSets.id });
  return rows.map((r) => r.id);
}
