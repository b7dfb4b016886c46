import { GeometryError } from '../errors';

export interface TriangleStretch {
  /** Per triangle, the larger singular value of the 3D→2D map (2D length / 3D length along it). */
  sigmaMax: Float64Array;
  /** Per triangle, the smaller singular value, negative when the triangle is inverted in 2D. */
  sigmaMin: Float64Array;
  /** Per triangle, max(|σmax − 1|, |σmin − 1|)·100: percent the foam must stretch or shrink there. */
  pct: Float64Array;
  summary: {
    maxPct: number;
    /** Root mean square of pct weighted by 3D triangle area. */
    rmsPct: number;
    /** Number of inverted triangles (zero or negative signed area in 2D). */
    flipped: number;
  };
}

/**
 * Returns per-triangle stretch of a flattening: the singular values of the affine map taking each 3D
 * triangle (laid in its own plane) to its 2D image (Sander, Snyder, Gortler & Hoppe 2001, "Texture Mapping
 * Progressive Meshes", SIGGRAPH, §3, here for the 3D→2D direction), and pct = max(|σ1−1|, |σ2−1|)·100.
 * An inverted triangle gets a negative σmin, hence pct ≥ 100, and is counted in `summary.flipped`.
 * `positions` 3V (mm), `triangles` 3F, `uv` 2V (mm). Throws GeometryError FLATTEN_FAILED on mismatched
 * sizes or a zero-area 3D triangle (named by index).
 */
export function triangleStretch(positions: Float64Array, triangles: Uint32Array, uv: Float64Array): TriangleStretch {
  const nv = positions.length / 3;
  if (uv.length !== 2 * nv) {
    throw new GeometryError('FLATTEN_FAILED', `flattening has ${uv.length} values, the piece has ${nv} vertices (need ${2 * nv})`);
  }
  const nf = triangles.length / 3;
  const sigmaMax = new Float64Array(nf);
  const sigmaMin = new Float64Array(nf);
  const pct = new Float64Array(nf);
  let maxPct = 0;
  let weighted = 0;
  let totalArea = 0;
  let flipped = 0;
  for (let f = 0; f < nf; f++) {
    const i0 = triangles[3 * f];
    const i1 = triangles[3 * f + 1];
    const i2 = triangles[3 * f + 2];
    const ax = positions[3 * i1] - positions[3 * i0];
    const ay = positions[3 * i1 + 1] - positions[3 * i0 + 1];
    const az = positions[3 * i1 + 2] - positions[3 * i0 + 2];
    const bx = positions[3 * i2] - positions[3 * i0];
    const by = positions[3 * i2 + 1] - positions[3 * i0 + 1];
    const bz = positions[3 * i2 + 2] - positions[3 * i0 + 2];
    const la = Math.sqrt(ax * ax + ay * ay + az * az);
    const cx = ay * bz - az * by;
    const cy = az * bx - ax * bz;
    const cz = ax * by - ay * bx;
    const dbl = Math.sqrt(cx * cx + cy * cy + cz * cz);
    if (!(dbl > 0) || !(la > 0)) {
      throw new GeometryError('FLATTEN_FAILED', `triangle ${f} has zero area in 3D`, { face: f });
    }
    // 3D triangle in its plane: edge a = (la, 0), edge b = (bxl, byl).
    const bxl = (ax * bx + ay * by + az * bz) / la;
    const byl = dbl / la;
    const pu = uv[2 * i1] - uv[2 * i0];
    const pv = uv[2 * i1 + 1] - uv[2 * i0 + 1];
    const qu = uv[2 * i2] - uv[2 * i0];
    const qv = uv[2 * i2 + 1] - uv[2 * i0 + 1];
    // J = [p q]·[a b]⁻¹ with [a b] = [[la, bxl], [0, byl]].
    const j00 = pu / la;
    const j10 = pv / la;
    const j01 = (qu - j00 * bxl) / byl;
    const j11 = (qv - j10 * bxl) / byl;
    // Closed-form 2×2 singular values: σ = √(E²+H²) ± √(F²+G²); the difference carries det's sign.
    const e = (j00 + j11) / 2;
    const ff = (j00 - j11) / 2;
    const g = (j10 + j01) / 2;
    const h = (j10 - j01) / 2;
    const q = Math.hypot(e, h);
    const r = Math.hypot(ff, g);
    const s1 = q + r;
    const s2 = q - r;
    sigmaMax[f] = s1;
    sigmaMin[f] = s2;
    const p = Math.max(Math.abs(s1 - 1), Math.abs(s2 - 1)) * 100;
    pct[f] = p;
    if (!(s2 > 0)) flipped++;
    if (p > maxPct) maxPct = p;
    const area = dbl / 2;
    weighted += area * p * p;
    totalArea += area;
  }
  return { sigmaMax, sigmaMin, pct, summary: { maxPct, rmsPct: Math.sqrt(weighted / totalArea), flipped } };
}
