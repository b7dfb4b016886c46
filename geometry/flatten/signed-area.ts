/**
 * Returns each triangle's signed area in the plane (Float64Array F, mm²): positive when its corners run
 * counter-clockwise in `uv` (2V), by the shoelace formula. Inverted (flipped) triangles are ≤ 0.
 */
export function signedAreas(uv: Float64Array, triangles: Uint32Array): Float64Array {
  const nf = triangles.length / 3;
  const out = new Float64Array(nf);
  for (let f = 0; f < nf; f++) {
    const a = 2 * triangles[3 * f];
    const b = 2 * triangles[3 * f + 1];
    const c = 2 * triangles[3 * f + 2];
    out[f] = 0.5 * ((uv[b] - uv[a]) * (uv[c + 1] - uv[a + 1]) - (uv[c] - uv[a]) * (uv[b + 1] - uv[a + 1]));
  }
  return out;
}
