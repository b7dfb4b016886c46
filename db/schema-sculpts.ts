/**
 * Tables of the maker's work on a build: sculpt versions (uploaded models and their processing), the seams
 * marked on each version, and the patterns (flattened pieces) computed from a version and its seams.
 * Re-exported by db/schema.ts, which drizzle-kit reads.
 */
import { doublePrecision, index, integer, jsonb, pgEnum, pgTable, text, timestamp, unique, uuid } from 'drizzle-orm/pg-core';
import type { PatternDoc } from '../geometry/pattern/pattern-doc';
import { buildIdColumn, shopIdColumn, users } from './schema-core';

/** Where a piece of background work is: waiting for a worker, being done, finished, or failed (with a message). */
export const workStatus = pgEnum('work_status', ['queued', 'running', 'done', 'failed']);

/** Model file units a maker can choose on upload; lengths are stored in millimetres after conversion. */
export const MODEL_UNITS = ['mm', 'cm', 'm', 'in'] as const;
export type ModelUnits = (typeof MODEL_UNITS)[number];

/** What the processing job found and did (counts from geometry/mesh clean-up and reduction). */
export interface SculptReport {
  sourceTriangles: number;
  sourceVertices: number;
  weldedVertices: number;
  droppedFaces: number;
  flippedFaces: number;
  nonManifoldEdges: number;
  nonManifoldVertices: number;
  workingTriangles: number;
  workingVertices: number;
  /** Size of the working mesh's bounding box after units and wearer scale, millimetres [x, y, z]. */
  sizeMm: [number, number, number];
  warnings: string[];
}

/** A wearer's measurements used to scale a sculpt, millimetres; either may be absent. */
export interface WearerMeasure {
  headCircumferenceMm: number | null;
  headHeightMm: number | null;
}

/**
 * One uploaded version of a build's sculpt. The original file is kept under `sourceKey`; the processing job
 * writes the cleaned, reduced working mesh (the binary format of geometry/io/working-mesh.ts) under `meshKey`.
 */
export const sculpts = pgTable(
  'sculpts',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: shopIdColumn(),
    buildId: buildIdColumn(),
    version: integer('version').notNull(),
    fileName: text('file_name').notNull(),
    format: text('format').notNull(),
    sourceKey: text('source_key').notNull(),
    sourceBytes: integer('source_bytes').notNull(),
    units: text('units').$type<ModelUnits>().notNull(),
    /** Factor applied after units conversion (1 = as modelled); from the wearer's measurements or typed in. */
    scale: doublePrecision('scale').notNull().default(1),
    wearer: jsonb('wearer').$type<WearerMeasure>(),
    /** Triangle count the working mesh is reduced to (dense scans only). */
    targetTriangles: integer('target_triangles').notNull(),
    status: workStatus('status').notNull().default('queued'),
    /** 0–100 and a short word on the stage ("parsing", "cleaning", "reducing", "saving"). */
    progress: integer('progress').notNull().default(0),
    stage: text('stage'),
    error: text('error'),
    report: jsonb('report').$type<SculptReport>(),
    meshKey: text('mesh_key'),
    jobId: text('job_id'),
    createdBy: uuid('created_by').references(() => users.id, { onDelete: 'set null' }),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    startedAt: timestamp('started_at', { withTimezone: true }),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [unique('sculpts_build_version').on(t.buildId, t.version), index('sculpts_build_idx').on(t.buildId, t.version.desc())],
);

/** One seam as drawn: the picked vertices and the mesh-edge path through them (working-mesh vertex ids). */
export interface SeamLine {
  id: string;
  /** Vertices the maker clicked (or the ends of an accepted suggestion), in order. */
  picks: number[];
  /** Vertex chain along mesh edges from the first pick to the last. */
  path: number[];
  source: 'picked' | 'crease' | 'auto' | 'mirror' | 'carried';
}

/** A plane the seams are mirrored across: unit normal and offset (n·p = offsetMm). */
export interface SymmetryPlane {
  normal: [number, number, number];
  offsetMm: number;
}

/**
 * The seams of one sculpt version. `revision` rises by one on every save; a save names the revision it
 * started from, so two people editing at once cannot silently overwrite each other.
 */
export const seamSets = pgTable('seam_sets', {
  sculptId: uuid('sculpt_id')
    .primaryKey()
    .references(() => sculpts.id, { onDelete: 'cascade' }),
  shopId: shopIdColumn(),
  revision: integer('revision').notNull().default(0),
  seams: jsonb('seams').$type<SeamLine[]>().notNull().default([]),
  symmetry: jsonb('symmetry').$type<SymmetryPlane | null>(),
  stretchBudgetPct: doublePrecision('stretch_budget_pct').notNull().default(3),
  updatedBy: uuid('updated_by').references(() => users.id, { onDelete: 'set null' }),
  updatedAt: timestamp('updated_at', { withTimezone: true }).notNull().defaultNow(),
});

/**
 * A pattern: the pieces, seams and bevels computed by a worker from one sculpt version at one seam revision
 * with the build's piece settings. `doc` is the pattern document (geometry/pattern/pattern-doc.ts); the
 * per-face piece index and stretch for the 3D view are a file under `facesKey`.
 */
export const patterns = pgTable(
  'patterns',
  {
    id: uuid('id').primaryKey().defaultRandom(),
    shopId: shopIdColumn(),
    buildId: buildIdColumn(),
    sculptId: uuid('sculpt_id')
      .notNull()
      .references(() => sculpts.id, { onDelete: 'cascade' }),
    seamRevision: integer('seam_revision').notNull(),
    /** The piece settings and options the pattern was made with, as sent to the job. */
    settings: jsonb('settings').$type<Record<string, unknown>>().notNull().default({}),
    status: workStatus('status').notNull().default('queued'),
    progress: integer('progress').notNull().default(0),
    stage: text('stage'),
    error: text('error'),
    doc: jsonb('doc').$type<PatternDoc>(),
    facesKey: text('faces_key'),
    jobId: text('job_id'),
    createdAt: timestamp('created_at', { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp('finished_at', { withTimezone: true }),
  },
  (t) => [index('patterns_sculpt_idx').on(t.sculptId, t.createdAt.desc()), index('patterns_build_idx').on(t.buildId, t.createdAt.desc())],
);
