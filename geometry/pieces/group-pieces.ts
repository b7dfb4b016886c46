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

/**
 * A 2D similarity without scale, x' = a·x + b·y + tx, y' = c·x + d·y + ty (mm): a rotation, or a reflection
 * when a·d − b·c = −1, followed by a translation.
 */
export interface PlaneMotion {
  a: number;
  b: number;
  c: number;
  d: number;
  tx: number;
  ty: number;
}

export interface GroupMember {
  index: number;
  /** True when this piece is a mirror image of the representative (the template is turned over to cut it). */
  mirrored: boolean;
  /**
   * Carries this piece's flat coordinates onto the representative's (the template's frame): a rotation and
   * translation, with the reflection x → −x first for a mirrored member. The identity for the representative.
   */
  toTemplate: PlaneMotion;
}

export interface PieceGroup {
  /** Index of the piece that stands for the group (the first one in input order). */
  representative: number;
  /**
   * Every member, the representative first; the others ordered so that copies alternate plain, mirrored,
   * plain, … as far as the group allows (the order a sheet plan cuts them in; see GroupMember).
   */
  members: GroupMember[];
}

/** The motion that leaves every point in place. */
export const IDENTITY_MOTION: PlaneMotion = { a: 1, b: 0, c: 0, d: 1, tx: 0, ty: 0 };

/** `p` carried by `m` (see PlaneMotion). */
export function applyPlaneMotion(m: PlaneMotion, p: PointMm): PointMm {
  return [m.a * p[0] + m.b * p[1] + m.tx, m.c * p[0] + m.d * p[1] + m.ty];
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
    const plain: GroupMember[] = [];
    const mirrored: GroupMember[] = [];
    groupOf[i] = groups.length;
    for (let j = i + 1; j < shapes.length; j++) {
      if (groupOf[j] >= 0 || !similarMeasures(shapes[i], shapes[j], perimeters[i], perimeters[j])) continue;
      const tol = MATCH_TOLERANCE * perimeters[i];
      const direct = bestAlignment(samples[i], samples[j]);
      if (direct.rms <= tol) {
        const rough = motionOf(direct.angle, samples[i].centre, samples[j].centre, false);
        plain.push({ index: j, mirrored: false, toTemplate: refinedMotion(shapes[i].outline, shapes[j].outline, rough, false, tol) });
        groupOf[j] = groups.length;
        continue;
      }
      const flipped = bestAlignment(samples[i], mirroredSamples[j]);
      if (flipped.rms <= tol) {
        const rough = motionOf(flipped.angle, samples[i].centre, mirroredSamples[j].centre, true);
        mirrored.push({ index: j, mirrored: true, toTemplate: refinedMotion(shapes[i].outline, shapes[j].outline, rough, true, tol) });
        groupOf[j] = groups.length;
      }
    }
    // Copy k of a template is cut mirrored when k is odd (plain first), while mirrored members last.
    const members: GroupMember[] = [{ index: i, mirrored: false, toTemplate: IDENTITY_MOTION }];
    while (plain.length + mirrored.length > 0) {
      const wantMirror = members.length % 2 === 1;
      members.push((wantMirror ? mirrored.shift() : plain.shift()) ?? (wantMirror ? plain.shift()! : mirrored.shift()!));
    }
    groups.push({ representative: i, members });
  }
  return groups;
}

/**
 * The motion carrying a member's outline onto the template's: reflect x → −x (when `mirror`), move the
 * member's centre (taken in the reflected frame) to the origin, rotate by `angle`, move to the template's centre.
 */
function motionOf(angle: number, templateCentre: PointMm, memberCentre: PointMm, mirror: boolean): PlaneMotion {
  const cos = Math.cos(angle);
  const sin = Math.sin(angle);
  const s = mirror ? -1 : 1;
  const [mx, my] = memberCentre;
  // Rotation [[cos, −sin], [sin, cos]] after the reflection diag(s, 1).
  return {
    a: cos * s,
    b: -sin,
    c: sin * s,
    d: cos,
    tx: templateCentre[0] - (cos * mx - sin * my),
    ty: templateCentre[1] - (sin * mx + cos * my),
  };
}

/**
 * The fitted motion made exact where the two outlines have corresponding corners: the sampled fit is only as
 * good as the sample spacing (the samples of two copies start at different points), so when the member's
 * outline vertices, carried by `rough`, each land within `tol` of the template's vertices in cyclic order
 * (reversed for a mirror image, whose outline was reversed to stay counter-clockwise), the motion is fitted
 * again on those vertex pairs (2D orthogonal Procrustes, Kabsch 1976). Otherwise `rough` is returned.
 */
function refinedMotion(template: PointMm[], member: PointMm[], rough: PlaneMotion, mirror: boolean, tol: number): PlaneMotion {
  const n = template.length;
  if (member.length !== n || n < 3) return rough;
  const first = applyPlaneMotion(rough, member[0]);
  let start = 0;
  for (let k = 1; k < n; k++) {
    if (Math.hypot(template[k][0] - first[0], template[k][1] - first[1]) < Math.hypot(template[start][0] - first[0], template[start][1] - first[1])) start = k;
  }
  const step = mirror ? n - 1 : 1;
  const partner = (k: number): PointMm => template[(start + k * step) % n];
  const s = mirror ? -1 : 1;
  const reflected = member.map(([x, y]): PointMm => [s * x, y]);
  let tcx = 0, tcy = 0, mcx = 0, mcy = 0;
  for (let k = 0; k < n; k++) {
    const q = applyPlaneMotion(rough, member[k]);
    const t = partner(k);
    if (Math.hypot(q[0] - t[0], q[1] - t[1]) > tol) return rough;
    tcx += t[0];
    tcy += t[1];
    mcx += reflected[k][0];
    mcy += reflected[k][1];
  }
  tcx /= n;
  tcy /= n;
  mcx /= n;
  mcy /= n;
  let dot = 0;
  let cross = 0;
  for (let k = 0; k < n; k++) {
    const t = partner(k);
    const ax = t[0] - tcx, ay = t[1] - tcy;
    const bx = reflected[k][0] - mcx, by = reflected[k][1] - mcy;
    dot += ax * bx + ay * by;
    cross += bx * ay - by * ax;
  }
  return motionOf(Math.atan2(cross, dot), [tcx, tcy], [mcx, mcy], mirror);
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

/** Outline samples centred on their mean (`xy`, x,y pairs) and the mean they were centred on. */
interface Samples {
  xy: Float64Array;
  centre: PointMm;
}

/** `count` points evenly spaced by arc length around the closed outline, centred on their mean. */
function resampleOutline(outline: PointMm[], count: number): Samples {
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
  return { xy: out, centre: [cx, cy] };
}

interface Alignment {
  /** RMS distance of the aligned samples, mm. */
  rms: number;
  /** Rotation (radians, counter-clockwise) that carries the member's centred samples onto the template's. */
  angle: number;
}

/**
 * Smallest RMS distance between centred point sets a and b over every cyclic shift of b and the best rotation
 * for that shift (2D orthogonal Procrustes: the angle is atan2 of the summed cross and dot products).
 */
function bestAlignment(sa: Samples, sb: Samples): Alignment {
  const a = sa.xy;
  const b = sb.xy;
  const n = a.length / 2;
  let normA = 0;
  let normB = 0;
  for (let k = 0; k < 2 * n; k++) {
    normA += a[k] * a[k];
    normB += b[k] * b[k];
  }
  let best = Infinity;
  let angle = 0;
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
    if (residual < best) {
      best = residual;
      angle = Math.atan2(cross, dot);
    }
  }
  return { rms: Math.sqrt(Math.max(0, best) / n), angle };
}
