/**
 * Which stored files belong to a build, so deleting the build can delete them too ("deletes follow the
 * database"): the uploaded model and working mesh of every sculpt version (`sculpts/<id>/`), the per-face
 * data of every pattern (`patterns/<id>/`) and the files of every print set (`print-sets/<id>/`). Pack covers
 * belong to packs, which keep their print set (and so the build) from being deleted while they exist.
 */
import { and, eq } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { printSets } from '../../db/schema-core';
import { patterns, sculpts } from '../../db/schema-sculpts';
import { printSetFilePrefix } from '../print-sets/print-set-files';
import { sculptFilePrefix } from '../sculpts/sculpt-files';
import type { FileStore } from './file-store';

/** Prefix of a pattern's files (server/patterns/pattern-job.ts writes `patterns/<id>/faces.bin`). */
export const patternFilePrefix = (patternId: string): string => `patterns/${patternId}`;

/**
 * Returns the file-store prefixes of everything stored for build `buildId` of shop `shopId`: sculpts first,
 * then patterns, then print sets. Call it inside the delete's transaction, before the rows go (the foreign
 * keys cascade), and remove the prefixes only after the transaction commits.
 */
export async function selectBuildFilePrefixes(db: DbExecutor, shopId: string, buildId: string): Promise<string[]> {
  const [sculptRows, patternRows, printSetRows] = await Promise.all([
    db.select({ id: sculpts.id }).from(sculpts).where(and(eq(sculpts.shopId, shopId), eq(sculpts.buildId, buildId))),
    db.select({ id: patterns.id }).from(patterns).where(and(eq(patterns.shopId, shopId), eq(patterns.buildId, buildId))),
    db.select({ id: printSets.id }).from(printSets).where(and(eq(printSets.shopId, shopId), eq(printSets.buildId, buildId))),
  ]);
  return [
    ...sculptRows.map((r) => sculptFilePrefix(r.id)),
    ...patternRows.map((r) => patternFilePrefix(r.id)),
    ...printSetRows.map((r) => printSetFilePrefix(r.id)),
  ];
}

/**
 * Removes every prefix from `files`, carrying on past failures, and returns the prefixes that could not be
 * removed (each also passed to `onFailure` with its error, for the log). Never throws.
 */
export async function removeFilePrefixes(files: FileStore, prefixes: readonly string[], onFailure: (prefix: string, err: unknown) => void): Promise<string[]> {
  const left: string[] = [];
  for (const prefix of prefixes) {
    try {
      await files.removePrefix(prefix);
    } catch (err) {
      left.push(prefix);
      onFailure(prefix, err);
    }
  }
  return left;
}
