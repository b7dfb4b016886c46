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
 *   station is interpolated linearly in arc length between vertex values, a vertex taking the length-weighted
 *   mean of its two edges (an end vertex takes its one edge).
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

  // Vertex values and their arc-length positions.
  const at = new Float64Array(n + 1);
  const vertexDihedral = new Float64Array(n + 1);
  for (let k = 0; k <= n; k++) {
    if (k > 0) at[k] = at[k - 1] + lengths[k - 1];
    if (k === 0) vertexDihedral[k] = edgeDihedralDeg[0];
    else if (k === n) vertexDihedral[k] = edgeDihedralDeg[n - 1];
    else {
      const wl = lengths[k - 1];
      const wr = lengths[k];
      vertexDihedral[k] =
        wl + wr > 0 ? (wl * edgeDihedralDeg[k - 1] + wr * edgeDihedralDeg[k]) / (wl + wr) : edgeDihedralDeg[k];
    }
  }
  const dihedralAt = (s: number): number => {
    let k = 0;
    while (k < n - 1 && at[k + 1] < s) k++;
    const span = at[k + 1] - at[k];
    const t = span > 0 ? Math.min(1, Math.max(0, (s - at[k]) / span)) : 0;
    return vertexDihedral[k] * (1 - t) + vertexDihedral[k + 1] * t;
  };
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
