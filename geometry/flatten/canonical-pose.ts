/**
 * Returns a copy of `uv` (2V, mm) in the canonical pose used for every flattened piece: mirrored in x
 * first if the triangles' total signed area is negative (so the pattern reads counter-clockwise, seen from
 * the visible side), then turned so the principal axis of the area's second moment lies along x (sign
 * chosen so the third moment along x is ≥ 0), then moved so the bounding box's lower-left corner is at
 * the origin. Where symmetry leaves the axis or its sign undecided (moments equal to 1e-9 relative), the
 * vertex order decides, so the pose stays the same under any rigid motion or scaling of the input. Moments are the exact ones of the triangles as uniform plane regions. `triangles` 3F.
 */
export function canonicalPose(uv: Float64Array, triangles: Uint32Array): Float64Array {
  const out = Float64Array.from(uv);
  const nf = triangles.length / 3;
  let total = 0;
  for (let f = 0; f < nf; f++) total += triangleArea(out, triangles, f);
  if (total < 0) for (let i = 0; i < out.length; i += 2) out[i] = -out[i];

  // Area, centroid and central second moments (∫x² = A/12·(Σ xk² + (Σ xk)²) per triangle).
  let area = 0;
  let mx = 0;
  let my = 0;
  for (let f = 0; f < nf; f++) {
    const a = triangleArea(out, triangles, f);
    const [sx, sy] = cornerSums(out, triangles, f);
    area += a;
    mx += (a * sx) / 3;
    my += (a * sy) / 3;
  }
  const cxm = mx / area;
  const cym = my / area;
  let ixx = 0;
  let iyy = 0;
  let ixy = 0;
  for (let f = 0; f < nf; f++) {
    const a = triangleArea(out, triangles, f);
    let sx = 0;
    let sy = 0;
    let qxx = 0;
    let qyy = 0;
    let qxy = 0;
    for (let k = 0; k < 3; k++) {
      const v = triangles[3 * f + k];
      const x = out[2 * v] - cxm;
      const y = out[2 * v + 1] - cym;
      sx += x;
      sy += y;
      qxx += x * x;
      qyy += y * y;
      qxy += x * y;
    }
    ixx += (a / 12) * (qxx + sx * sx);
    iyy += (a / 12) * (qyy + sy * sy);
    ixy += (a / 12) * (qxy + sx * sy);
  }
  // Symmetric shapes leave the axis (a disc, a square) or its direction (a rectangle, a gore) to rounding;
  // then vertex order decides, which a rigid motion or a scale of the input does not change.
  const size = Math.sqrt(area);
  const tieRel = 1e-9;
  const anisotropy = Math.hypot(ixx - iyy, 2 * ixy);
  let theta = 0.5 * Math.atan2(2 * ixy, ixx - iyy);
  if (!(anisotropy > tieRel * (ixx + iyy))) {
    theta = Math.atan2(out[1] - cym, out[0] - cxm);
  }
  let c = Math.cos(theta);
  let s = Math.sin(theta);
  // Third moment along the new x axis, from triangle centroids: picks which end of the axis is +x.
  let skew = 0;
  for (let f = 0; f < nf; f++) {
    const a = triangleArea(out, triangles, f);
    const [sx, sy] = cornerSums(out, triangles, f);
    const x = (c * (sx / 3 - cxm) + s * (sy / 3 - cym));
    skew += a * x * x * x;
  }
  let flipAxis = skew < 0;
  if (!(Math.abs(skew) > tieRel * area * size * size * size)) {
    // First vertex clearly off the centre line goes to −x.
    for (let i = 0; i < out.length; i += 2) {
      const x = c * (out[i] - cxm) + s * (out[i + 1] - cym);
      if (Math.abs(x) > 1e-6 * size) {
        flipAxis = x > 0;
        break;
      }
    }
  }
  if (flipAxis) {
    c = -c;
    s = -s;
  }
  let minX = Infinity;
  let minY = Infinity;
  for (let i = 0; i < out.length; i += 2) {
    const x = out[i] - cxm;
    const y = out[i + 1] - cym;
    out[i] = c * x + s * y;
    out[i + 1] = -s * x + c * y;
    minX = Math.min(minX, out[i]);
    minY = Math.min(minY, out[i + 1]);
  }
  for (let i = 0; i < out.length; i += 2) {
    out[i] -= minX;
    out[i + 1] -= minY;
  }
  return out;
}

function triangleArea(uv: Float64Array, triangles: Uint32Array, f: number): number {
  const a = 2 * triangles[3 * f];
  const b = 2 * triangles[3 * f + 1];
  const c = 2 * triangles[3 * f + 2];
  return 0.5 * ((uv[b] - uv[a]) * (uv[c + 1] - uv[a + 1]) - (uv[c] - uv[a]) * (uv[b + 1] - uv[a + 1]));
}

function cornerSums(uv: Float64Array, triangles: Uint32Array, f: number): [number, number] {
  const a = 2 * triangles[3 * f];
  const b = 2 * triangles[3 * f + 1];
  const c = 2 * triangles[3 * f + 2];
  return [uv[a] + uv[b] + uv[c], uv[a + 1] + uv[b + 1] + uv[c + 1]];
}
