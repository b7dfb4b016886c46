/** Drizzle queries for builds; every query is scoped to a shop so one shop's id never reaches another's build. */
import { and, desc, eq, sql } from 'drizzle-orm';
import type { DbExecutor } from '../../db/client';
import { builds } from '../../db/schema';

const buildColumns = { id: builds.id, shopId: builds.shopId, name: builds.name, createdAt: builds.createdAt, updatedAt: builds.updatedAt };

export type BuildRow = { id: string; shopId: string; name: string; createdAt: Date; updatedAt: Date };

/** Returns the shop's builds, newest first. */
export function selectBuilds(db: DbExecutor, shopId: string): Promise<BuildRow[]> {
  return db.select(buildColumns).from(builds).where(eq(builds.shopId, shopId)).orderBy(desc(builds.createdAt), desc(builds.id));
}

/** Returns one build of the shop, or null. */
export async function selectBuild(db: DbExecutor, shopId: string, buildId: string): Promise<BuildRow | null> {
  const rows = await db.select(buildColumns).from(builds).where(and(eq(builds.shopId, shopId), eq(builds.id, buildId)));
  return rows[0] ?? null;
}

/** Inserts a build and returns it. */
export async function insertBuild(db: DbExecutor, shopId: string, name: string): Promise<BuildRow> {
  const rows = await db.insert(builds).values({ shopId, name }).returning(buildColumns);
  return rows[0];
}

/** Renames a build of the shop and returns it (null when there is no such build). */
export async function updateBuildName(db: DbExecutor, shopId: string, buildId: string, name: string): Promise<BuildRow | null> {
  const rows = await db
    .update(builds)
    .set({ name, updatedAt: sql`now()` })
    .where(and(eq(builds.shopId, shopId), eq(builds.id, buildId)))
    .returning(buildColumns);
  return rows[0] ?? null;
}

/** Deletes a build of the shop and returns what it was (null when there was none). */
export async function deleteBuild(db: DbExecutor, shopId: string, buildId: string): Promise<BuildRow | null> {
  const rows = await db.delete(builds).where(and(eq(builds.shopId, shopId), eq(builds.id, buildId))).returning(buildColumns);
  return rows[0] ?? null;
}
