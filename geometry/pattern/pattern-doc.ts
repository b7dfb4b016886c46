/**
 * The pattern document: what the `pattern` command writes as pattern.json and what the print-set
 * exporters, the server and the app read. Lengths are millimetres, angles degrees (shared/DESIGN.md,
 * "The `pattern` command"). Fields beyond the documented minimum are Sheetsmith's own additions.
 */

/** A 2D point in a piece's pattern plane, millimetres. */
export type PointMm = [number, number];

export type PatternSurface = 'outer' | 'mid' | 'inner';

export interface StretchSummary {
  /** Max over triangles of max(|σ1−1|, |σ2−1|)·100 (Sander et al. 2001 singular values). */
  maxPct: number;
  /** Area-weighted root mean square of the same per-triangle value. */
  rmsPct: number;
}

/**
 * One stretch of a piece's boundary that belongs to a seam: the polyline in this piece's 2D
 * coordinates, in the order that matches the seam's 3D direction (so station `at` values measured
 * from the seam's start read the same on both pieces).
 */
export interface PieceSeamEdge {
  seam: string;
  /** Which side of the seam this piece is: 0 or 1 (a tube's self-seam has both on one piece). */
  side: 0 | 1;
  /**
   * Which of the piece's `quantity` copies this edge belongs to: 0 is the template itself, k the k-th further
   * copy. Copies alternate plain and mirrored as far as the counts allow (copy k is mirrored when k is odd,
   * while mirrored copies last), so a sheet plan that turns every second copy over puts these marks on the
   * right cut piece. `path` is always in the template's frame: a mirrored copy's edge is carried through the
   * mirror, so it lies on the template's outline and reads right once the template is turned over. Absent
   * means 0 (documents written before copies were listed).
   */
  copy?: number;
  path: PointMm[];
  /** Bevel to cut on this edge, degrees from square, and on which face it removes material. */
  bevelDeg: number;
  bevelFace: 'outer' | 'inner' | 'none';
}

export interface ScoreLine {
  path: PointMm[];
  /** Interior angle of the fold in 3D, degrees (180 = flat). */
  foldDeg: number;
}

export interface DartSuggestion {
  /** The cut from the boundary into the high-stretch region, in this piece's 2D coordinates. */
  path: PointMm[];
  /** Max stretch left once the dart is cut, percent. */
  stretchAfterPct: number;
}

export interface PatternPiece {
  label: string;
  faces: number;
  area3d: number;
  area2d: number;
  /** Outer boundary, counter-clockwise, mm. */
  outline: PointMm[];
  /** Inner boundaries (clockwise), mm. */
  holes: PointMm[][];
  stretch: StretchSummary;
  quantity: number;
  /** True when some of the `quantity` copies are mirror images (see `mirroredCopies`). */
  mirrored: boolean;
  /** How many of the `quantity` copies are cut mirrored (turn the template over), when `mirrored`. */
  mirroredCopies?: number;
  thickness: number;
  /**
   * Perimeter of this piece on the chosen `surface` minus its perimeter on the outer skin, mm (negative:
   * the pattern is shorter than the outer skin). 0 for surface 'outer'.
   */
  perimeterChangeMm?: number;
  surface?: PatternSurface;
  seamEdges?: PieceSeamEdge[];
  scoreLines?: ScoreLine[];
  darts?: DartSuggestion[];
  /** A line (two points) across the piece for the texture/grain side, when it matters. */
  textureLine?: PointMm[] | null;
}

export interface SeamStation {
  /** Distance along the seam from its start, mm. */
  at: number;
  bevel: number;
  dihedral?: number;
}

export interface PatternSeam {
  label: string;
  /** The one or two pieces the seam joins (one for a tube closed onto itself). */
  pieces: string[];
  /**
   * Length of the seam on the surface the pattern follows (the one flattened: the outer skin, or the foam's
   * middle or inner face for `surface` mid or inner), mm; both `lengths` match it within the pieces' stretch, and
   * station `at` values are measured along it.
   */
  length3d: number;
  /**
   * Length of the same seam on the sculpt's outer skin, mm, when the pattern follows another surface (absent for
   * 'outer', where it equals length3d). The difference is what the choice of surface changes (issue 3 point 8).
   */
  length3dOuter?: number;
  /** 2D length on each side, in the order of `pieces` (twice the same piece for a self-seam). */
  lengths: number[];
  /** Interior angle between the pieces, 180 = flat, < 180 outside corner, > 180 inside corner. */
  dihedral: { min: number; mean: number; max: number };
  /** (180 − dihedral)/2 from square, per side of a symmetric joint. */
  bevel: { min: number; mean: number; max: number };
  convex: boolean;
  /** Which face each edge's bevel removes material from: 'inner' at an outside corner, 'outer' at an inside one. */
  bevelFace?: 'outer' | 'inner' | 'none';
  stations: SeamStation[];
}

export interface PatternDoc {
  units: 'mm';
  name?: string;
  pieces: PatternPiece[];
  seams: PatternSeam[];
  warnings: string[];
  /** Shop-safety cautions for the steps this pattern calls for (bevel and score cuts, gluing). */
  cautions?: string[];
}
