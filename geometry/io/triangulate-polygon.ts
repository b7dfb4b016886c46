import earcut from 'earcut';

/**
 * Triangulates one planar-ish polygon given by vertex indices into `positions` (Float64Array(3V), mm) and
 * appends the triangles to `out` as index triples, counter-clockwise about the polygon's own orientation.
 * Returns false when the polygon is degenerate (zero Newell normal, or earcut could not cover it) and a fan
 * from the first corner was written instead.
 *
 * Method: the polygon's normal is its Newell normal (Newell 1972; see Sutherland, Sproull & Schumacker 1974,
 * "A characterization of ten hidden-surface algorithms"), robust for non-planar and non-convex loops; the
 * corners are projected onto the plane perpendicular to it and triangulated by ear clipping (earcut, after
 * Eberly, "Triangulation by Ear Clipping"). A quad takes the diagonal that keeps both triangles facing the
 * normal, which is the 0–2 diagonal for any convex quad.
 */
export function triangulatePolygon(
  positions: Float64Array,
  corners: ArrayLike<number>,
  n: number,
  out: (a: number, b: number, c: number) => void,
): boolean {
  let nx = 0;
  let ny = 0;
  let nz = 0;
  for (let i = 0; i < n; i++) {
    const p = 3 * corners[i];
    const q = 3 * corners[(i + 1) % n];
    nx += (positions[p + 1] - positions[q + 1]) * (positions[p + 2] + positions[q + 2]);
    ny += (positions[p + 2] - positions[q + 2]) * (positions[p] + positions[q]);
    nz += (positions[p] - positions[q]) * (positions[p + 1] + positions[q + 1]);
  }
  const len = Math.hypot(nx, ny, nz);
  if (!(len > 0)) {
    fan(corners, n, out);
    return false;
  }
  if (n === 4) {
    if (facesNormal(positions, corners[0], corners[1], corners[2], nx, ny, nz) && facesNormal(positions, corners[0], corners[2], corners[3], nx, ny, nz)) {
      out(corners[0], corners[1], corners[2]);
      out(corners[0], corners[2], corners[3]);
    } else {
      out(corners[1], corners[2], corners[3]);
      out(corners[1], corners[3], corners[0]);
    }
    return true;
  }
  // Orthonormal basis (u, w) of the plane perpendicular to the normal, (u, w, n̂) right-handed.
  nx /= len;
  ny /= len;
  nz /= len;
  let ux: number, uy: number, uz: number;
  if (Math.abs(nx) < 0.9) {
    ux = 0; uy = nz; uz = -ny;
  } else {
    ux = -nz; uy = 0; uz = nx;
  }
  const ul = Math.hypot(ux, uy, uz);
  ux /= ul; uy /= ul; uz /= ul;
  const wx = ny * uz - nz * uy;
  const wy = nz * ux - nx * uz;
  const wz = nx * uy - ny * ux;
  const flat = new Array<number>(2 * n);
  for (let i = 0; i < n; i++) {
    const p = 3 * corners[i];
    flat[2 * i] = positions[p] * ux + positions[p + 1] * uy + positions[p + 2] * uz;
    flat[2 * i + 1] = positions[p] * wx + positions[p + 1] * wy + positions[p + 2] * wz;
  }
  const tri = earcut(flat);
  if (tri.length !== 3 * (n - 2)) {
    fan(corners, n, out);
    return false;
  }
  for (let t = 0; t < tri.length; t += 3) {
    const a = tri[t], b = tri[t + 1], c = tri[t + 2];
    // Keep the polygon's own turning direction (its Newell normal) whatever order earcut returns.
    const cross = (flat[2 * b] - flat[2 * a]) * (flat[2 * c + 1] - flat[2 * a + 1]) - (flat[2 * b + 1] - flat[2 * a + 1]) * (flat[2 * c] - flat[2 * a]);
    if (cross >= 0) out(corners[a], corners[b], corners[c]);
    else out(corners[a], corners[c], corners[b]);
  }
  return true;
}

function facesNormal(P: Float64Array, a: number, b: number, c: number, nx: number, ny: number, nz: number): boolean {
  const A = 3 * a, B = 3 * b, C = 3 * c;
  const ux = P[B] - P[A], uy = P[B + 1] - P[A + 1], uz = P[B + 2] - P[A + 2];
  const vx = P[C] - P[A], vy = P[C + 1] - P[A + 1], vz = P[C + 2] - P[A + 2];
  return (uy * vz - uz * vy) * nx + (uz * vx - ux * vz) * ny + (ux * vy - uy * vx) * nz > 0;
}

function fan(corners: ArrayLike<number>, n: number, out: (a: number, b: number, c: number) => void): void {
  for (let i = 1; i + 1 < n; i++) out(corners[0], corners[i], corners[i + 1]);
}
