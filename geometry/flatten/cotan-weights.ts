/**
 * Returns, per half-edge h = 3f+i (length 3F), the cotangent of the angle of triangle f opposite that
 * half-edge, i.e. at corner (i+2) mod 3. These are the weights of the piecewise-linear Dirichlet energy
 * (Pinkall & Polthier 1993, "Computing discrete minimal surfaces and their conjugates", Experim. Math. 2):
 * E(u) = ¼ Σ_h cot_h (u_a − u_b)² over half-edges a→b. `positions` is 3V in mm, `triangles` 3F.
 * A near-degenerate triangle's doubled area is floored at 1e-12 of its longest edge squared, which scales
 * that triangle's whole stiffness uniformly and so keeps every element matrix positive semidefinite.
 */
export function cotanWeights(positions: Float64Array, triangles: Uint32Array): Float64Array {
  const nf = triangles.length / 3;
  const cot = new Float64Array(3 * nf);
  for (let f = 0; f < nf; f++) {
    const i0 = 3 * triangles[3 * f];
    const i1 = 3 * triangles[3 * f + 1];
    const i2 = 3 * triangles[3 * f + 2];
    // Edge vectors e0 = p1−p0, e1 = p2−p1, e2 = p0−p2.
    const ax = positions[i1] - positions[i0];
    const ay = positions[i1 + 1] - positions[i0 + 1];
    const az = positions[i1 + 2] - positions[i0 + 2];
    const bx = positions[i2] - positions[i1];
    const by = positions[i2 + 1] - positions[i1 + 1];
    const bz = positions[i2 + 2] - positions[i1 + 2];
    const cx = positions[i0] - positions[i2];
    const cy = positions[i0 + 1] - positions[i2 + 1];
    const cz = positions[i0 + 2] - positions[i2 + 2];
    const nx = ay * bz - az * by;
    const ny = az * bx - ax * bz;
    const nz = ax * by - ay * bx;
    const longest = Math.max(ax * ax + ay * ay + az * az, bx * bx + by * by + bz * bz, cx * cx + cy * cy + cz * cz);
    const dbl = Math.max(Math.sqrt(nx * nx + ny * ny + nz * nz), 1e-12 * longest);
    // Angle at corner 2 (vectors p1−p2 and p0−p2) is opposite half-edge 0.
    cot[3 * f] = -(bx * cx + by * cy + bz * cz) / dbl;
    // Angle at corner 0 (vectors p1−p0 and p2−p0) is opposite half-edge 1.
    cot[3 * f + 1] = -(ax * cx + ay * cy + az * cz) / dbl;
    // Angle at corner 1 (vectors p0−p1 and p2−p1) is opposite half-edge 2.
    cot[3 * f + 2] = -(ax * bx + ay * by + az * bz) / dbl;
  }
  return cot;
}
