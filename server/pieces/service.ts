/**
 * Piece rules: the pieces of a build are the newest finished pattern's labels, each with the maker's settings
 * and the crew's checklist; a row for a label the pattern no longer has is kept and shown as stale, so a re-seam
 * never loses anybody's ticks. Changing a setting queues the pattern again; ticking does not.
 */
import type { Db } from '../../db/client';
import type { PieceNoteBody, PieceProgressBody, PieceSettingsBody } from '../../db/validation-bench';
import type { PatternDoc } from '../../geometry/pattern/pattern-doc';
import { selectBuild } from '../builds/queries';
import { notFound } from '../errors';
import type { SessionUser } from '../http/define-route';
import type { JobSender } from '../jobs/job-sender';
import { queuePattern } from '../patterns/queue-pattern';
import { selectNewestDonePattern, selectNewestSculpt } from '../patterns/queries';
import { patternView, type PatternView } from '../patterns/service';
import { insertNote, selectNoteCounts, selectNotes, selectPieceRows, upsertPiece, type PieceRow } from './queries';

export interface PieceStateView {
  label: string;
  thicknessMm: number;
  surface: 'outer' | 'mid' | 'inner';
  quantity: number;
  mirrored: boolean;
  cut: boolean;
  shaped: boolean;
  glued: boolean;
  /** True when the newest pattern has no piece of this label (kept for its ticks and notes). */
  stale: boolean;
  updatedAt: string | null;
  updatedBy: string | null;
  notes: number;
}

export interface PieceNoteView {
  id: string;
  label: string;
  body: string;
  authorId: string | null;
  authorName: string | null;
  createdAt: string;
}

/**
 * Returns one piece's state: the maker's setting where there is one, else the pattern's figure (else the
 * engine's defaults, 6 mm on the outer skin, one copy).
 */
function pieceState(label: string, docPiece: PatternDoc['pieces'][number] | undefined, row: PieceRow | undefined, notes: number): PieceStateView {
  return {
    label,
    thicknessMm: row?.thicknessMm ?? docPiece?.thickness ?? 6,
    surface: row?.surface ?? docPiece?.surface ?? 'outer',
    quantity: row?.quantity ?? docPiece?.quantity ?? 1,
    mirrored: row?.mirrored ?? docPiece?.mirrored ?? false,
    cut: row?.cut ?? false,
    shaped: row?.shaped ?? false,
    glued: row?.glued ?? false,
    stale: !docPiece,
    updatedAt: row?.updatedAt.toISOString() ?? null,
    updatedBy: row?.updatedBy ?? null,
    notes,
  };
}

/** Returns the build's pieces in pattern order, stale rows after them; throws 404 NOT_FOUND for no such build. */
export async function listPieces(db: Db, shopId: string, buildId: string): Promise<PieceStateView[]> {
  if (!(await selectBuild(db, shopId, buildId))) throw notFound('Build');
  const [pattern, rows, notes] = await Promise.all([selectNewestDonePattern(db, shopId, buildId), selectPieceRows(db, buildId), selectNoteCounts(db, buildId)]);
  const docPieces = pattern?.doc?.pieces ?? [];
  const rowOf = new Map(rows.map((r) => [r.label, r]));
  const known = new Set(docPieces.map((p) => p.label));
  return [
    ...docPieces.map((p) => pieceState(p.label, p, rowOf.get(p.label), notes.get(p.label) ?? 0)),
    ...rows.filter((r) => !known.has(r.label)).map((r) => pieceState(r.label, undefined, r, notes.get(r.label) ?? 0)),
  ];
}

/** Throws 404 NOT_FOUND unless the build exists and has a piece `label` (in its pattern, or a kept row). */
async function requirePiece(db: Db, shopId: string, buildId: string, label: string): Promise<PieceStateView> {
  const piece = (await listPieces(db, shopId, buildId)).find((p) => p.label === label);
  if (!piece) throw notFound(`Piece ${label} of the build`);
  return piece;
}

/**
 * Stores the maker's settings of piece `label` (null puts the engine's default back), queues the pattern of the
 * build's newest sculpt again, and returns the piece and that pattern (null when none could be queued yet).
 */
export async function changePieceSettings(
  db: Db,
  jobs: JobSender | null,
  user: SessionUser,
  shopId: string,
  buildId: string,
  label: string,
  body: PieceSettingsBody,
): Promise<{ piece: PieceStateView; pattern: PatternView | null }> {
  await requirePiece(db, shopId, buildId, label);
  await upsertPiece(db, { shopId, buildId, label }, body, user.id);
  const sculpt = await selectNewestSculpt(db, shopId, buildId);
  const queued = sculpt ? await queuePattern(db, jobs, { shopId, buildId, sculptId: sculpt.id }) : null;
  return { piece: await requirePiece(db, shopId, buildId, label), pattern: queued ? patternView(queued) : null };
}

/** Stores the crew's ticks on piece `label` and returns the piece (with who ticked and when). */
export async function changePieceProgress(db: Db, user: SessionUser, shopId: string, buildId: string, label: string, body: PieceProgressBody): Promise<PieceStateView> {
  await requirePiece(db, shopId, buildId, label);
  await upsertPiece(db, { shopId, buildId, label }, body, user.id);
  return requirePiece(db, shopId, buildId, label);
}

/** Returns the notes on piece `label`, oldest first. */
export async function listPieceNotes(db: Db, shopId: string, buildId: string, label: string): Promise<PieceNoteView[]> {
  await requirePiece(db, shopId, buildId, label);
  return (await selectNotes(db, buildId, label)).map((n) => ({ ...n, createdAt: n.createdAt.toISOString() }));
}

/** Adds a note to piece `label` and returns it. */
export async function addPieceNote(db: Db, user: SessionUser, shopId: string, buildId: string, label: string, body: PieceNoteBody): Promise<PieceNoteView> {
  await requirePiece(db, shopId, buildId, label);
  const note = await insertNote(db, { shopId, buildId, label, body: body.body, authorId: user.id });
  return { id: note.id, label: note.label, body: note.body, authorId: note.authorId, authorName: user.name, createdAt: note.createdAt.toISOString() };
}
