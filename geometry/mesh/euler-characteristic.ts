/**
 * Returns the Euler characteristic χ = V − E + F of a triangle mesh, counting only vertices that some triangle
 * uses. `triangles` Uint32Array(3F), `twin` Int32Array(3F) from `buildTwins`: a paired edge counts once, an
 * unpaired half-edge (boundary) counts as one edge. For a closed connected orientable surface χ = 2 − 2g
 * (g = genus); a disc has χ = 1, an open tube χ = 0 (Euler–Poincaré formula).
 */
export function eulerCharacteristic(triangles: Uint32Array, twin: Int32Array): number {
  const used = new Set<number>();
  for (let i = 0; i < triangles.length; i++) used.add(triangles[i]);
  let edges = 0;
  for (let h = 0; h < twin.length; h++) if (twin[h] < 0 || twin[h] > h) edges++;
  return used.size - edges + triangles.length / 3;
}

/**
 * Returns the genus g of a closed orientable surface made of `components` connected shells with total Euler
 * characteristic `chi`, from χ = Σ(2 − 2gᵢ), i.e. g = (2·components − χ)/2 summed over shells.
 */
export function genusOfClosedSurface(chi: number, components = 1): number {
  return (2 * components - chi) / 2;
}
