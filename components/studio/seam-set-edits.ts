/**
 * Edits of a sculpt's seam set as the studio makes them: a picked seam grown click by click along mesh edges,
 * seams erased, suggestions accepted, and every seam mirrored across the symmetry plane. Each edit returns a new
 * set (the undo history keeps the old one). Vertex ids are those of the working mesh.
 */
import type { SeamLine, SymmetryPlane } from '../../db/schema-sculpts';

/** What the studio edits and saves (the body of PUT seams without the revision). */
export interface SeamSetDraft {
  seams: SeamLine[];
  symmetry: SymmetryPlane | null;
  stretchBudgetPct: number;
}

/** Least-cost vertex path along mesh edges from a to b (both included), or null when not connected. */
export type FindPath = (from: number, to: number) => ArrayLike<number> | null;

/** Maps a vertex to its mirror-image vertex across the symmetry plane, or −1 when none is near. */
export type MirrorVertex = (v: number) => number;

/** Suffix of the id of a seam's mirror copy, so erasing either erases both. */
const MIRROR_SUFFIX = '~mirror';

/**
 * Returns `path` extended by the edge path from its last vertex to `to`, without repeating the joint vertex; an
 * empty `path` becomes `[to]`. Returns null when `findPath` finds no path (the pick is on another part).
 */
export function extendPath(path: readonly number[], to: number, findPath: FindPath): number[] | null {
  if (path.length === 0) return [to];
  const last = path[path.length - 1];
  if (last === to) return [...path];
  const leg = findPath(last, to);
  if (!leg || leg.length === 0 || leg[0] !== last || leg[leg.length - 1] !== to) return null;
  const out = [...path];
  for (let i = 1; i < leg.length; i++) out.push(leg[i]);
  return out;
}

/**
 * Returns the edge path through all `picks` in order (consecutive legs joined at the picks), or null when some
 * leg has no path. Precondition: at least one pick.
 */
export function pathThroughPicks(picks: readonly number[], findPath: FindPath): number[] | null {
  let path: number[] = [];
  for (const p of picks) {
    const next = extendPath(path, p, findPath);
    if (!next) return null;
    path = next;
  }
  return path;
}

/** A fresh seam id: `prefix` plus a number one above every id of that prefix already in `seams`. */
export function nextSeamId(seams: readonly SeamLine[], prefix: string): string {
  let n = 0;
  for (const s of seams) {
    if (!s.id.startsWith(prefix)) continue;
    const k = Number(s.id.slice(prefix.length).replace(MIRROR_SUFFIX, ''));
    if (Number.isInteger(k) && k > n) n = k;
  }
  return `${prefix}${n + 1}`;
}

/**
 * The mirror image of `seam` across the symmetry plane: each path vertex mapped by `mirror`, consecutive images
 * joined by `findPath` where they are not neighbours. Returns null when a vertex has no image, a leg has no path,
 * or the image is the seam itself (a seam lying on the plane needs no copy).
 */
export function mirrorSeamLine(seam: SeamLine, mirror: MirrorVertex, findPath: FindPath): SeamLine | null {
  const images = seam.path.map(mirror);
  if (images.some((v) => v < 0)) return null;
  const path = pathThroughPicks(images, findPath);
  if (!path) return null;
  const same = path.length === seam.path.length && path.every((v, i) => v === seam.path[i]);
  const reversed = path.length === seam.path.length && path.every((v, i) => v === seam.path[seam.path.length - 1 - i]);
  if (same || reversed) return null;
  return { id: seam.id + MIRROR_SUFFIX, picks: seam.picks.map(mirror), path, source: 'mirror' };
}

/** True when `seam` is the mirror copy the studio made of another seam. */
export function isMirrorCopy(seam: SeamLine): boolean {
  return seam.source === 'mirror' && seam.id.endsWith(MIRROR_SUFFIX);
}

/**
 * Returns the draft with `seam` added (replacing a seam of the same id) and, when the draft has a symmetry plane,
 * its mirror copy `copy` (from mirrorSeamLine; null when it has none). A seam of fewer than two vertices is not
 * added.
 */
export function addSeam(draft: SeamSetDraft, seam: SeamLine, copy: SeamLine | null): SeamSetDraft {
  if (seam.path.length < 2) return draft;
  const drop = new Set([seam.id, seam.id + MIRROR_SUFFIX]);
  const seams = draft.seams.filter((s) => !drop.has(s.id));
  seams.push(seam);
  if (copy && draft.symmetry) seams.push(copy);
  return { ...draft, seams };
}

/** Returns the draft without the seam `id` and without its mirror partner (either way round). */
export function eraseSeam(draft: SeamSetDraft, id: string): SeamSetDraft {
  const base = id.endsWith(MIRROR_SUFFIX) ? id.slice(0, -MIRROR_SUFFIX.length) : id;
  const seams = draft.seams.filter((s) => s.id !== base && s.id !== base + MIRROR_SUFFIX);
  return seams.length === draft.seams.length ? draft : { ...draft, seams };
}

/**
 * Seams of the draft that have no mirror copy yet and are not copies themselves: the ones applySymmetry needs
 * images of.
 */
export function seamsWithoutCopy(draft: SeamSetDraft): SeamLine[] {
  const ids = new Set(draft.seams.map((s) => s.id));
  return draft.seams.filter((s) => !isMirrorCopy(s) && !ids.has(s.id + MIRROR_SUFFIX));
}

/**
 * Turns symmetry on: stores `plane` and adds the mirror copies `copies` (mirrorSeamLine of each of
 * seamsWithoutCopy(draft), null where a seam lies on the plane or has no image).
 */
export function applySymmetry(draft: SeamSetDraft, plane: SymmetryPlane, copies: readonly (SeamLine | null)[]): SeamSetDraft {
  const ids = new Set(draft.seams.map((s) => s.id));
  const seams = [...draft.seams];
  for (const c of copies) if (c && !ids.has(c.id)) seams.push(c);
  return { ...draft, symmetry: plane, seams };
}

/** Turns symmetry off: clears the plane and removes the mirror copies it made. */
export function removeSymmetry(draft: SeamSetDraft): SeamSetDraft {
  return { ...draft, symmetry: null, seams: draft.seams.filter((s) => !isMirrorCopy(s)) };
}

/**
 * Returns the draft with the suggested `lines` added as seams of `source` (ids `<source>-<n>`), skipping a line
 * whose every edge is already on a seam of the draft.
 */
export function acceptSuggestions(draft: SeamSetDraft, lines: readonly (readonly number[])[], source: 'crease' | 'auto'): SeamSetDraft {
  const onSeam = seamEdgeKeys(draft.seams);
  const seams = [...draft.seams];
  for (const line of lines) {
    if (line.length < 2) continue;
    let fresh = false;
    for (let i = 1; i < line.length && !fresh; i++) fresh = !onSeam.has(edgeKey(line[i - 1], line[i]));
    if (!fresh) continue;
    seams.push({ id: nextSeamId(seams, `${source}-`), picks: [line[0], line[line.length - 1]], path: [...line], source });
  }
  return seams.length === draft.seams.length ? draft : { ...draft, seams };
}

/** Key of the undirected edge between vertices a and b. */
export function edgeKey(a: number, b: number): number {
  return a < b ? a * 4294967296 + b : b * 4294967296 + a;
}

/** Keys (edgeKey) of every edge some seam's path runs along. */
export function seamEdgeKeys(seams: readonly SeamLine[]): Set<number> {
  const keys = new Set<number>();
  for (const s of seams) for (let i = 1; i < s.path.length; i++) keys.add(edgeKey(s.path[i - 1], s.path[i]));
  return keys;
}

/**
 * The seam nearest to the point (x, y, z) in mm, measured to its path's edges as straight segments, when that
 * distance is at most `maxDistMm`; null otherwise. `positions` are the working mesh's, length 3V.
 */
export function seamNearPoint(
  seams: readonly SeamLine[],
  positions: ArrayLike<number>,
  point: readonly [number, number, number],
  maxDistMm: number,
): SeamLine | null {
  let best: SeamLine | null = null;
  let bestD = maxDistMm;
  for (const s of seams) {
    for (let i = 0; i < s.path.length; i++) {
      const a = s.path[i];
      const b = s.path[Math.min(i + 1, s.path.length - 1)];
      const d = pointSegmentDistance(positions, a, b, point);
      if (d <= bestD) {
        bestD = d;
        best = s;
      }
    }
  }
  return best;
}

function pointSegmentDistance(P: ArrayLike<number>, a: number, b: number, p: readonly [number, number, number]): number {
  const ax = P[3 * a];
  const ay = P[3 * a + 1];
  const az = P[3 * a + 2];
  const dx = P[3 * b] - ax;
  const dy = P[3 * b + 1] - ay;
  const dz = P[3 * b + 2] - az;
  const len2 = dx * dx + dy * dy + dz * dz;
  const t = len2 > 0 ? Math.max(0, Math.min(1, ((p[0] - ax) * dx + (p[1] - ay) * dy + (p[2] - az) * dz) / len2)) : 0;
  return Math.hypot(ax + t * dx - p[0], ay + t * dy - p[1], az + t * dz - p[2]);
}

/** The same seam set, compared by content (ids, sources, paths, picks, plane and budget). */
export function sameDraft(a: SeamSetDraft, b: SeamSetDraft): boolean {
  return JSON.stringify(a) === JSON.stringify(b);
}
