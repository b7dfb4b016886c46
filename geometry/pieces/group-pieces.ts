/**
 * Finds pieces that are cut from the same template: identical up to a rigid motion of the pattern, or a
 * mirror image of each other (the left and right halves of a symmetric sculpt). They are listed once with a
 * quantity, which saves the maker tracing the same shape twice.
 */
import type { PointMm } from '../pattern/pattern-doc';

/** What grouping needs to know about a flattened piece. */
export interface PieceShape {
  /** Outer boundary, counter-clockwise, mm. */
  outline: PointMm[];
  area2d: number;
  area3d: number;
  faces: number;
  holes: number;
}

export interface PieceGroup {
  /** Index of the piece that stands for the group (the first one in input order). */
  representative: number;
  /** Every member (the representative first) and whether it is a mirror image of the representative. */
  members: { index: number; mirrored: boolean }[];
}

/** Outline samples compared per piece; the start points of two copies differ by at most half a spacing
 * (P/512), which stays well inside the tolerance below. */
const SAMPLES = 256;
/** Shapes match when the RMS distance between aligned outlines is under this share of the perimeter P. */
const MATCH_TOLERANCE = 0.005;

/**
 * Groups identical and mirror-image pieces.
 *
 * @param shapes one entry per piece, outlines in mm, counter-clockwise (as flattenPiece returns them).
 * @returns groups in order of their representatives; every piece appears in exactly one group. Two pieces match
 *   when hole count, face count (within 5 %), 3D and 2D area (within 1 %) agree and their outlines, resampled to 256 points
 *   by arc length, align under a 2D rotation and translation (the orthogonal Procrustes fit, Kabsch 1976) with
 *   RMS distance below 0.5 % of the perimeter — a tolerance relative to size, so the test does not depend on
 *   the unit. A mirror image is tested by reflecting the outline (and reversing it to keep it CCW).
 */
export function groupPieces(shapes: PieceShape[]): PieceGroup[] {
  const samples = shapes.map((s) => resampleOutline(s.outline, SAMPLES));
  const mirroredSamples = shapes.map((s) => resampleOutline(mirrorOutline(s.outline), SAMPLES));
  const perimeters = shapes.map((s) => perimeter(s.outline));
  const groupOf = new Int32Array(shapes.length).fill(-1);
  const groups: PieceGroup[] = [];
  for (let i = 0; i < shapes.length; i++) {
    if (groupOf[i] >= 0) continue;
    const group: PieceGroup = { representative: i, members: [{ index: i, mirrored: false }] };
    groupOf[i] = groups.length;
    for (let j = i + 1; j < shapes.length; j++) {
      if (groupOf[j] >= 0 || !similarMeasures(shapes[i], shapes[j], perimeters[i], perimeters[j])) continue;
      const tol = MATCH_TOLERANCE * perimeters[i];
      if (bestAlignmentRms(samples[i], samples[j]) <= tol) {
        group.members.push({ index: j, mirrored: false });
        groupOf[j] = groups.length;
      } else if (bestAlignmentRms(samples[i], mirroredSamples[j]) <= tol) {
        group.members.push({ index: j, mirrored: true });
        groupOf[j] = groups.length;
      }
    }
    groups.push(group);
  }
  return groups;
}

function similarMeasures(a: PieceShape, b: PieceShape, pa: number, pb: number): boolean {
  const close = (x: number, y: number): boolean => Math.abs(x - y) <= 0.01 * Math.max(Math.abs(x), Math.abs(y));
  // Face counts only need to be close: a mirror image of a piece is often triangulated differently (a quad's
  // diagonal flips in the mirror), and the shape is what the maker cuts.
  return (
    Math.abs(a.faces - b.faces) <= 0.05 * Math.max(a.faces, b.faces) &&
    a.holes === b.holes &&
    close(a.area2d, b.area2d) &&
    close(a.area3d, b.area3d) &&
    close(pa, pb)
  );
}

function perimeter(outline: PointMm[]): number {
  let sum = 0;
  for (let i = 0; i < outline.length; i++) {
    const p = outline[i];
    const q = outline[(i + 1) % outline.length];
    sum += Math.hypot(q[0] - p[0], q[1] - p[1]);
  }
  return sum;
}

function mirrorOutline(outline: PointMm[]): PointMm[] {
  return outline.map(([x, y]): PointMm => [-x, y]).reverse();
}

/** `count` points evenly spaced by arc length around the closed outline, as x,y pairs centred on their mean. */
function resampleOutline(outline: PointMm[], count: number): Float64Array {
  const total = perimeter(outline);
  const out = new Float64Array(2 * count);
  let seg = 0;
  let segStart = 0;
  const segLen = (i: number): number => {
    const p = outline[i];
    const q = outline[(i + 1) % outline.length];
    return Math.hypot(q[0] - p[0], q[1] - p[1]);
  };
  let len = segLen(0);
  for (let k = 0; k < count; k++) {
    const s = (k * total) / count;
    while (segStart + len < s && seg < outline.length - 1) {
      segStart += len;
      seg++;
      len = segLen(seg);
    }
    const t = len > 0 ? Math.min(1, (s - segStart) / len) : 0;
    const p = outline[seg];
    const q = outline[(seg + 1) % outline.length];
    out[2 * k] = p[0] + t * (q[0] - p[0]);
    out[2 * k + 1] = p[1] + t * (q[1] - p[1]);
  }
  let cx = 0;
  let cy = 0;
  for (let k = 0; k < count; k++) {
    cx += out[2 * k];
    cy += out[2 * k + 1];
  }
  cx /= count;
  cy /= count;
  for (let k = 0; k < count; k++) {
    out[2 * k] -= cx;
    out[2 * k + 1] -= cy;
  }
  return out;
}

/**
 * Smallest RMS distance between centred point sets a and b over every cyclic shift of b and the best rotation
 * for that shift (2D orthogonal Procrustes: the angle is atan2 of the summed cross and dot products).
 */
function bestAlignmentRms(a: Float64Array, b: Float64Array): number {
  const n = a.length / 2;
  let normA = 0;
  let normB = 0;
  for (let k = 0; k < 2 * n; k++) {
    normA += a[k] * a[k];
    normB += b[k] * b[k];
  }
  let best = Infinity;
  for (let shift = 0; shift < n; shift++) {
    let dot = 0;
    let cross = 0;
    for (let k = 0; k < n; k++) {
      const j = (k + shift) % n;
      const ax = a[2 * k];
      const ay = a[2 * k + 1];
      const bx = b[2 * j];
      const by = b[2 * j + 1];
      dot += ax * bx + ay * by;
      cross += bx * ay - by * ax;
    }
    // Σ|a − R b|² = |a|² + |b|² − 2·(dot cosφ + cross sinφ), minimised at φ = atan2(cross, dot).
    const residual = normA + normB - 2 * Math.hypot(dot, cross);
    if (residual < best) best = residual;
  }
  return Math.sqrt(Math.max(0, best) / n);
}
