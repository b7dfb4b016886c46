/**
 * Scaling a sculpt to the person who will wear it. A helmet's fit is set by the head's circumference (taken
 * round the brow) and the head's height; the sculpt's own circumference is estimated from a horizontal
 * section of the mesh by the perimeter of the ellipse spanning the section's width and depth.
 */
import { GeometryError } from '../errors';

/**
 * Returns the perimeter of an ellipse with semi-axes `a` and `b` (mm, ≥ 0) by Ramanujan's second
 * approximation, π(a+b)(1 + 3h/(10 + √(4 − 3h))) with h = ((a−b)/(a+b))² (Ramanujan 1914, "Modular equations
 * and approximations to π", Quart. J. Pure Appl. Math. 45, pp. 350–372). Exact for a circle (2πr); its relative
 * error is about 3h⁵/2¹⁷ for round ellipses and at most about 4·10⁻⁴ for a flat one (b = 0).
 */
export function ellipsePerimeterMm(a: number, b: number): number {
  if (!(a >= 0) || !(b >= 0) || !Number.isFinite(a) || !Number.isFinite(b)) {
    throw new GeometryError('BAD_OPTION', `ellipse semi-axes must be finite and ≥ 0, got ${a} and ${b}`);
  }
  if (a + b === 0) return 0;
  const h = ((a - b) / (a + b)) ** 2;
  return Math.PI * (a + b) * (1 + (3 * h) / (10 + Math.sqrt(4 - 3 * h)));
}

/** A horizontal section of a sculpt, all lengths in mm. */
export interface HeadSection {
  /** Height of the cutting plane above the sculpt's lowest point. */
  atHeightMm: number;
  /** Extent of the section along the first horizontal axis (x for y-up) and the second (z for y-up). */
  widthMm: number;
  depthMm: number;
  /** ellipsePerimeterMm(width/2, depth/2): the circumference a tape round the section would read, about. */
  circumferenceMm: number;
  /** Vertical extent of the whole sculpt (lowest to highest point). */
  heightMm: number;
}

/** Where to cut the sculpt: `upAxis` 0 = x, 1 = y (default, as most modelling tools export), 2 = z. */
export interface HeadSectionOptions {
  upAxis?: 0 | 1 | 2;
  /** Height of the section as a fraction of the vertical extent from the lowest point; default 0.5. */
  heightFraction?: number;
}

/**
 * Returns the section of a triangle mesh by the horizontal plane at `heightFraction` of its vertical extent:
 * every triangle edge that crosses the plane contributes its crossing point, and the section's horizontal
 * extents give the ellipse whose perimeter estimates the circumference there. `positions` is (Float64|Float32)
 * Array(3V) in mm, `triangles` Uint32Array(3F). Returns null when the plane meets no edge (an empty or flat
 * mesh). Throws GeometryError BAD_OPTION for a fraction outside [0, 1] or a bad axis.
 */
export function headSection(positions: Float64Array | Float32Array, triangles: Uint32Array, opts: HeadSectionOptions = {}): HeadSection | null {
  const up = opts.upAxis ?? 1;
  const fraction = opts.heightFraction ?? 0.5;
  if (up !== 0 && up !== 1 && up !== 2) throw new GeometryError('BAD_OPTION', `upAxis must be 0, 1 or 2, got ${String(up)}`);
  if (!(fraction >= 0 && fraction <= 1)) {
    throw new GeometryError('BAD_OPTION', `the section height must be a fraction from 0 to 1 of the sculpt's height, got ${fraction}`);
  }
  const u = (up + 1) % 3;
  const w = (up + 2) % 3;
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = up; i < positions.length; i += 3) {
    if (positions[i] < lo) lo = positions[i];
    if (positions[i] > hi) hi = positions[i];
  }
  if (!(hi > lo)) return null;
  // Nudged off vertex heights by a tiny fraction, so a vertex exactly on the plane counts once per edge.
  const level = lo + fraction * (hi - lo) + (fraction < 1 ? 1e-9 : -1e-9) * (hi - lo);
  let minU = Infinity;
  let maxU = -Infinity;
  let minW = Infinity;
  let maxW = -Infinity;
  for (let h = 0; h < triangles.length; h++) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    const ya = positions[3 * a + up] - level;
    const yb = positions[3 * b + up] - level;
    if ((ya < 0) === (yb < 0)) continue;
    const t = ya / (ya - yb);
    const cu = positions[3 * a + u] + t * (positions[3 * b + u] - positions[3 * a + u]);
    const cw = positions[3 * a + w] + t * (positions[3 * b + w] - positions[3 * a + w]);
    if (cu < minU) minU = cu;
    if (cu > maxU) maxU = cu;
    if (cw < minW) minW = cw;
    if (cw > maxW) maxW = cw;
  }
  if (minU > maxU) return null;
  const widthMm = maxU - minU;
  const depthMm = maxW - minW;
  return {
    atHeightMm: fraction * (hi - lo),
    widthMm,
    depthMm,
    circumferenceMm: ellipsePerimeterMm(widthMm / 2, depthMm / 2),
    heightMm: hi - lo,
  };
}

/** A wearer's head, mm; either measure may be missing. */
export interface HeadMeasures {
  headCircumferenceMm?: number | null;
  headHeightMm?: number | null;
}

/** The scale factor for a wearer and what it does to the sculpt's size. */
export interface WearerScale {
  /** Uniform factor to apply: from the circumference, from the height, or their geometric mean when both are given. */
  factor: number;
  byCircumference: number | null;
  byHeight: number | null;
  before: { circumferenceMm: number; heightMm: number; sizeMm: [number, number, number] };
  after: { circumferenceMm: number; heightMm: number; sizeMm: [number, number, number] };
  /** Set when the two measures ask for factors more than 10 % apart (the sculpt's proportions differ from the head's). */
  disagreement: string | null;
}

/**
 * Returns the uniform factor that makes the sculpt fit the wearer: head circumference ÷ section circumference,
 * head height ÷ sculpt height, or the geometric mean of both when both are given (one uniform scale cannot
 * match two ratios; the mean splits the difference evenly in proportion). `sizeMm` is the sculpt's bounding
 * box size [x, y, z] before scaling. Returns factor 1 when no measure is given. Throws GeometryError
 * BAD_OPTION for a measure that is not a positive finite number or a section of zero size.
 */
export function wearerScale(section: HeadSection, sizeMm: [number, number, number], measures: HeadMeasures): WearerScale {
  const check = (name: string, v: number | null | undefined) => {
    if (v === null || v === undefined) return null;
    if (!Number.isFinite(v) || v <= 0) throw new GeometryError('BAD_OPTION', `${name} must be a positive number of millimetres, got ${v}`);
    return v;
  };
  const circumference = check('head circumference', measures.headCircumferenceMm);
  const height = check('head height', measures.headHeightMm);
  if (circumference !== null && !(section.circumferenceMm > 0)) {
    throw new GeometryError('BAD_OPTION', 'the sculpt has no width at the section height, so it cannot be scaled to a head circumference');
  }
  if (height !== null && !(section.heightMm > 0)) {
    throw new GeometryError('BAD_OPTION', 'the sculpt has no height, so it cannot be scaled to a head height');
  }
  const byCircumference = circumference === null ? null : circumference / section.circumferenceMm;
  const byHeight = height === null ? null : height / section.heightMm;
  const factor =
    byCircumference !== null && byHeight !== null ? Math.sqrt(byCircumference * byHeight) : (byCircumference ?? byHeight ?? 1);
  const disagreement =
    byCircumference !== null && byHeight !== null && Math.max(byCircumference, byHeight) / Math.min(byCircumference, byHeight) > 1.1
      ? `the head circumference asks for a scale of ${byCircumference.toFixed(3)} and the head height for ${byHeight.toFixed(3)}; ` +
        `the sculpt was scaled by their geometric mean ${factor.toFixed(3)}, so check the fit`
      : null;
  return {
    factor,
    byCircumference,
    byHeight,
    before: { circumferenceMm: section.circumferenceMm, heightMm: section.heightMm, sizeMm: [...sizeMm] },
    after: {
      circumferenceMm: section.circumferenceMm * factor,
      heightMm: section.heightMm * factor,
      sizeMm: [sizeMm[0] * factor, sizeMm[1] * factor, sizeMm[2] * factor],
    },
    disagreement,
  };
}
