/**
 * The angle a seam closes at and the bevel to cut on each edge of it.
 *
 * Interior dihedral θ (DESIGN.md): 180° where the two pieces continue flat, below 180° at an outside
 * (convex) corner, above 180° at an inside (concave) corner. For a symmetric joint each edge is cut
 * (180° − θ)/2 away from square, so the two cut faces meet on the bisecting plane (common joinery
 * practice, the mitre rule).
 *
 * Which face the bevel removes material from: the pattern follows the outer skin, so at an outside corner
 * the outer faces of the two pieces must meet at the corner line and the wedge comes off the inner face
 * ('inner'); at an inside corner the inner faces meet and the wedge comes off the outer face ('outer').
 * A seam that is flat within half a degree needs no bevel ('none').
 */

/** A bevel below this many degrees is cut square: a blade cannot hold a finer angle in foam (common practice). */
export const SQUARE_BEVEL_DEG = 0.5;
/** Spacing of bevel stations along a seam, mm (issue 3 point 7). */
export const STATION_SPACING_MM = 25;

export interface AngleStats {
  min: number;
  mean: number;
  max: number;
}

export interface BevelStation {
  /** Distance from the seam's start, mm. */
  at: number;
  /** Bevel from square at this point, degrees (magnitude; the face is the seam's `bevelFace`). */
  bevel: number;
  /** Interior dihedral at this point, degrees. */
  dihedral: number;
}

export interface SeamBevel {
  length3d: number;
  dihedral: AngleStats;
  /** Bevel magnitudes |180 − θ|/2, degrees; min/max over edges, mean weighted by edge length. */
  bevel: AngleStats;
  /** True when the length-weighted mean dihedral is below 180° (an outside corner). */
  convex: boolean;
  bevelFace: 'outer' | 'inner' | 'none';
  stations: BevelStation[];
}

/** Bevel from square for an interior dihedral angle, degrees: |180 − θ|/2 (common joinery practice). */
export const bevelFromDihedralDeg = (dihedralDeg: number): number => Math.abs(180 - dihedralDeg) / 2;

/**
 * Measures one seam.
 *
 * @param positions Float64Array(3V), mm.
 * @param vertices the chain's vertex ids, n+1 for n edges.
 * @param edgeDihedralDeg per chain edge, the interior dihedral in degrees (length n).
 * @returns length, dihedral and bevel statistics and stations. Stations sit at both ends always, and every
 *   25 mm between them when the bevel along the seam varies by more than SQUARE_BEVEL_DEG; the value at a
 *   station is interpolated linearly in arc length between edge middles (each edge's value belongs to its
 *   middle) and extrapolated linearly to the ends, so a linearly varying angle is reproduced at the ends as well
 *   as between them; a closed loop wraps round instead. min/max cover the edges and both end values; the mean
 *   is length-weighted over the edges.
 */
export function seamBevel(positions: Float64Array, vertices: Uint32Array, edgeDihedralDeg: Float64Array): SeamBevel {
  const n = vertices.length - 1;
  if (n < 1 || edgeDihedralDeg.length !== n) {
    throw new RangeError(`seamBevel: ${n} edges but ${edgeDihedralDeg.length} dihedral values`);
  }
  const lengths = new Float64Array(n);
  let total = 0;
  for (let k = 0; k < n; k++) {
    const a = 3 * vertices[k];
    const b = 3 * vertices[k + 1];
    const l = Math.hypot(positions[b] - positions[a], positions[b + 1] - positions[a + 1], positions[b + 2] - positions[a + 2]);
    lengths[k] = l;
    total += l;
  }
  let dMin = Infinity;
  let dMax = -Infinity;
  let bMin = Infinity;
  let bMax = -Infinity;
  let dSum = 0;
  let bSum = 0;
  for (let k = 0; k < n; k++) {
    const d = edgeDihedralDeg[k];
    const b = bevelFromDihedralDeg(d);
    dMin = Math.min(dMin, d);
    dMax = Math.max(dMax, d);
    bMin = Math.min(bMin, b);
    bMax = Math.max(bMax, b);
    const w = total > 0 ? lengths[k] / total : 1 / n;
    dSum += w * d;
    bSum += w * b;
  }
  const convex = dSum < 180;
  const bevelFace = bSum < SQUARE_BEVEL_DEG ? 'none' : convex ? 'inner' : 'outer';

  // The angle along the seam: each edge's value belongs to its middle; between middles it is interpolated
  // linearly, and beyond the first and last middles extrapolated along the same line, so an angle that varies
  // linearly along the seam reads right at its ends too (an end edge's own value lies half an edge inward). The
  // extrapolation moves at most as far as the end pair of edges differ, so one odd edge of a scan cannot throw
  // an end far off, and stops at flat. A closed loop has no ends: it wraps round through its first and last middles.
  const closed = vertices[0] === vertices[n];
  const mid = new Float64Array(n);
  for (let k = 0, s = 0; k < n; s += lengths[k], k++) mid[k] = s + lengths[k] / 2;
  const knotAt: number[] = [];
  const knotValue: number[] = [];
  if (n === 1) {
    knotAt.push(0, total);
    knotValue.push(edgeDihedralDeg[0], edgeDihedralDeg[0]);
  } else {
    const endValue = (inner: number, outer: number, distance: number, spacing: number): number => {
      if (closed) return inner;
      const step = edgeDihedralDeg[inner] - edgeDihedralDeg[outer];
      const reach = spacing > 0 ? (step * distance) / spacing : 0;
      const value = edgeDihedralDeg[inner] + Math.max(-Math.abs(step), Math.min(Math.abs(step), reach));
      // Nor does it carry an end across flat: an outside corner stays one (and an inside corner) to its end.
      // The side is the end edge's, or the next edge's when the end edge itself is flat.
      const sideOf = Math.abs(edgeDihedralDeg[inner] - 180) > 1e-9 ? edgeDihedralDeg[inner] : edgeDihedralDeg[outer];
      return (value - 180) * (sideOf - 180) < 0 ? 180 : value;
    };
    const wrapValue = (): number => {
      // Value at the loop's joint, between the last middle and the first (both half an edge away).
      const a = lengths[n - 1] / 2;
      const b = lengths[0] / 2;
      return a + b > 0 ? (b * edgeDihedralDeg[n - 1] + a * edgeDihedralDeg[0]) / (a + b) : edgeDihedralDeg[0];
    };
    knotAt.push(0);
    knotValue.push(closed ? wrapValue() : endValue(0, 1, mid[0], mid[1] - mid[0]));
    for (let k = 0; k < n; k++) {
      knotAt.push(mid[k]);
      knotValue.push(edgeDihedralDeg[k]);
    }
    knotAt.push(total);
    knotValue.push(closed ? wrapValue() : endValue(n - 1, n - 2, total - mid[n - 1], mid[n - 1] - mid[n - 2]));
  }
  const dihedralAt = (s: number): number => {
    let k = 0;
    while (k < knotAt.length - 2 && knotAt[k + 1] < s) k++;
    const span = knotAt[k + 1] - knotAt[k];
    const t = span > 0 ? Math.min(1, Math.max(0, (s - knotAt[k]) / span)) : 0;
    return knotValue[k] * (1 - t) + knotValue[k + 1] * t;
  };
  // The ends are points along the seam too: the range reported covers them.
  for (const d of [knotValue[0], knotValue[knotValue.length - 1]]) {
    const b = bevelFromDihedralDeg(d);
    dMin = Math.min(dMin, d);
    dMax = Math.max(dMax, d);
    bMin = Math.min(bMin, b);
    bMax = Math.max(bMax, b);
  }
  const marks = [0];
  if (bMax - bMin > SQUARE_BEVEL_DEG) {
    for (let s = STATION_SPACING_MM; s < total - 1e-9; s += STATION_SPACING_MM) marks.push(s);
  }
  if (total > 0) marks.push(total);
  const stations = marks.map((s) => {
    const d = dihedralAt(s);
    return { at: s, bevel: bevelFromDihedralDeg(d), dihedral: d };
  });
  return {
    length3d: total,
    dihedral: { min: dMin, mean: dSum, max: dMax },
    bevel: { min: bMin, mean: bSum, max: bMax },
    convex,
    bevelFace,
    stations,
  };
}
