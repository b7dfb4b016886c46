/** Build rules: create, rename and delete are recorded in the shop's audit trail in the same transaction. */
import type { Logger } from 'pino';
import type { Db } from '../../db/client';
import { recordAudit } from '../audit/service';
import { notFound } from '../errors';
import type { SessionUser } from '../http/define-route';
import { removeFilePrefixes, selectBuildFilePrefixes } from '../storage/build-files';
import type { FileStore } from '../storage/file-store';
import { benchTotals, buildStage, type BenchTotals, type BuildStage } from './build-progress';
import {
  deleteBuild,
  insertBuild,
  selectBuild,
  selectBuilds,
  selectBuildWork,
  selectPieceTicks,
  updateBuildName,
  type BuildRow,
  type BuildWorkRow,
  type PieceTickRow,
} from './queries';

export interface BuildView {
  id: string;
  shopId: string;
  name: string;
  createdAt: string;
  updatedAt: string;
}

function toView(row: BuildRow): BuildView {
  return { id: row.id, shopId: row.shopId, name: row.name, createdAt: row.createdAt.toISOString(), updatedAt: row.updatedAt.toISOString() };
}

/** Where a build stands, as the builds list shows it. */
export interface BuildSummary {
  stage: BuildStage;
  sculptVersion: number | null;
  sculptStatus: BuildWorkRow['sculptStatus'];
  /** Processing progress of the newest sculpt, 0–100 (null without a sculpt). */
  sculptProgress: number | null;
  patternStatus: BuildWorkRow['patternStatus'];
  /** Pieces of the newest finished pattern of the newest sculpt. */
  pieceCount: number;
  /** Bench checklist done, percent (see benchTotals). */
  progressPct: number;
}

export type BuildListItem = BuildView & { summary: BuildSummary };

function ticksByBuild(ticks: readonly PieceTickRow[]): Map<string, PieceTickRow[]> {
  const out = new Map<string, PieceTickRow[]>();
  for (const t of ticks) {
    const list = out.get(t.buildId);
    if (list) list.push(t);
    else out.set(t.buildId, [t]);
  }
  return out;
}

function summaryOf(work: BuildWorkRow | undefined, totals: BenchTotals): BuildSummary {
  return {
    stage: buildStage(work ?? null, totals),
    sculptVersion: work?.sculptVersion ?? null,
    sculptStatus: work?.sculptStatus ?? null,
    sculptProgress: work?.sculptProgress ?? null,
    patternStatus: work?.patternStatus ?? null,
    pieceCount: totals.pieces,
    progressPct: totals.progressPct,
  };
}

/** Returns the shop's builds, newest first, each with its summary (newest sculpt, pieces, bench progress, stage). */
export async function listBuilds(db: Db, shopId: string): Promise<BuildListItem[]> {
  const [rows, work, ticks] = await Promise.all([selectBuilds(db, shopId), selectBuildWork(db, shopId), selectPieceTicks(db, shopId)]);
  const workBy = new Map(work.map((w) => [w.buildId, w]));
  const ticksBy = ticksByBuild(ticks);
  return rows.map((row) => {
    const w = workBy.get(row.id);
    return { ...toView(row), summary: summaryOf(w, benchTotals(w?.pieceLabels ?? null, ticksBy.get(row.id) ?? [])) };
  });
}

/** Returns one build; throws 404 NOT_FOUND when the shop has no such build. */
export async function getBuild(db: Db, shopId: string, buildId: string): Promise<BuildView> {
  const row = await selectBuild(db, shopId, buildId);
  if (!row) throw notFound('Build');
  return toView(row);
}

/** Creates a build named `name` in the shop and returns it. */
export function createBuild(db: Db, user: SessionUser, shopId: string, name: string): Promise<BuildView> {
  return db.transaction(async (tx) => {
    const row = await insertBuild(tx, shopId, name);
    await recordAudit(tx, { shopId, userId: user.id, action: 'build.create', target: `build:${row.id}`, detail: { name } });
    return toView(row);
  });
}

/** Renames a build and returns it; throws 404 NOT_FOUND when the shop has no such build. */
export function renameBuild(db: Db, user: SessionUser, shopId: string, buildId: string, name: string): Promise<BuildView> {
  return db.transaction(async (tx) => {
    const before = await selectBuild(tx, shopId, buildId);
    const row = before ? await updateBuildName(tx, shopId, buildId, name) : null;
    if (!before || !row) throw notFound('Build');
    await recordAudit(tx, { shopId, userId: user.id, action: 'build.rename', target: `build:${buildId}`, detail: { from: before.name, to: name } });
    return toView(row);
  });
}

/**
 * Deletes a build; its sculpt, pattern and print-set rows go with it (foreign keys ON DELETE CASCADE). Their
 * stored files are removed from `files` only after the delete has committed, so a rolled-back delete never
 * loses files; a file that cannot be removed is logged on `log` and left behind, since the build is gone either
 * way. Throws 404 NOT_FOUND when the shop has no such build.
 */
export async function removeBuild(db: Db, files: FileStore, log: Logger, user: SessionUser, shopId: string, buildId: string): Promise<void> {
  const prefixes = await db.transaction(async (tx) => {
    const found = await selectBuildFilePrefixes(tx, shopId, buildId);
    const row = await deleteBuild(tx, shopId, buildId);
    if (!row) throw notFound('Build');
    await recordAudit(tx, { shopId, userId: user.id, action: 'build.delete', target: `build:${buildId}`, detail: { name: row.name } });
    return found;
  });
  await removeFilePrefixes(files, prefixes, (prefix, err) => log.error({ err, buildId, prefix }, "could not remove the files of a deleted build"));
}
