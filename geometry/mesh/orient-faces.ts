import { analyzeEdges } from './half-edges';

/** Result of orientFaces. */
export interface OrientResult {
  /** The triangles with some reversed (corners 1 and 2 swapped), Uint32Array(3F). */
  triangles: Uint32Array;
  /** Per face, 1 when it was reversed. */
  flipped: Uint8Array;
  /** Number of faces in components that cannot be oriented consistently (a Möbius-like band). */
  nonOrientableFaces: number;
  /** Number of closed components turned inside out so that they face outward. */
  shellsTurnedOutward: number;
}

/**
 * Makes the winding of every triangle agree with its neighbours, then turns each closed shell outward.
 * Breadth-first search from the lowest face of each component over edges used by exactly two faces: a
 * neighbour that runs the shared edge the same way is reversed. A component where the search meets a
 * contradiction is non-orientable; its faces keep the first assignment reached. Each component without
 * boundary is then reversed as a whole when its signed volume (divergence theorem) is negative; an open
 * component is reversed as a whole when that keeps more of its faces as they were (majority vote).
 * `positions` Float64Array(3V) mm, `triangles` Uint32Array(3F). Deterministic.
 */
export function orientFaces(positions: Float64Array, triangles: Uint32Array): OrientResult {
  const F = triangles.length / 3;
  const V = positions.length / 3;
  const { partner } = analyzeEdges(triangles, V);
  const flip = new Uint8Array(F);
  const seen = new Uint8Array(F);
  const component = new Int32Array(F).fill(-1);
  const queue = new Uint32Array(F);
  const conflictComponents = new Set<number>();
  let components = 0;
  for (let seed = 0; seed < F; seed++) {
    if (seen[seed]) continue;
    const comp = components++;
    let qh = 0;
    let qt = 0;
    queue[qt++] = seed;
    seen[seed] = 1;
    component[seed] = comp;
    while (qh < qt) {
      const f = queue[qh++];
      for (let i = 0; i < 3; i++) {
        const h = 3 * f + i;
        const p = partner[h];
        if (p < 0) continue;
        const g = (p / 3) | 0;
        // Same direction along the shared edge means opposite windings.
        const same = triangles[h] === triangles[p] ? 1 : 0;
        const want = flip[f] ^ same;
        if (!seen[g]) {
          seen[g] = 1;
          flip[g] = want;
          component[g] = comp;
          queue[qt++] = g;
        } else if (flip[g] !== want) {
          conflictComponents.add(comp);
        }
      }
    }
  }
  const out = Uint32Array.from(triangles);
  for (let f = 0; f < F; f++) {
    if (flip[f]) {
      const t = out[3 * f + 1];
      out[3 * f + 1] = out[3 * f + 2];
      out[3 * f + 2] = t;
    }
  }
  // Closed shells: no half-edge without a partner, and orientable.
  const open = new Uint8Array(components);
  const volume = new Float64Array(components);
  for (let f = 0; f < F; f++) {
    const c = component[f];
    for (let i = 0; i < 3; i++) if (partner[3 * f + i] < 0) open[c] = 1;
    // Tetrahedra from the first vertex, not the origin, so parts far from the origin keep their precision.
    const a = 3 * out[3 * f], b = 3 * out[3 * f + 1], d = 3 * out[3 * f + 2];
    const ax = positions[a] - positions[0], ay = positions[a + 1] - positions[1], az = positions[a + 2] - positions[2];
    const bx = positions[b] - positions[0], by = positions[b + 1] - positions[1], bz = positions[b + 2] - positions[2];
    const dx = positions[d] - positions[0], dy = positions[d + 1] - positions[1], dz = positions[d + 2] - positions[2];
    volume[c] += ax * (by * dz - bz * dy) - ay * (bx * dz - bz * dx) + az * (bx * dy - by * dx);
  }
  const size = new Uint32Array(components);
  const flippedIn = new Uint32Array(components);
  for (let f = 0; f < F; f++) {
    size[component[f]]++;
    flippedIn[component[f]] += flip[f];
  }
  let shellsTurnedOutward = 0;
  const turn = new Uint8Array(components);
  for (let c = 0; c < components; c++) {
    if (conflictComponents.has(c)) continue;
    if (!open[c] && volume[c] < 0) {
      turn[c] = 1;
      shellsTurnedOutward++;
    } else if (open[c] && 2 * flippedIn[c] > size[c]) {
      // An open sheet has no inside; keep the side most of its faces already had.
      turn[c] = 1;
    }
  }
  let nonOrientableFaces = 0;
  for (let f = 0; f < F; f++) {
    if (conflictComponents.has(component[f])) nonOrientableFaces++;
    if (turn[component[f]]) {
      const t = out[3 * f + 1];
      out[3 * f + 1] = out[3 * f + 2];
      out[3 * f + 2] = t;
      flip[f] ^= 1;
    }
  }
  return { triangles: out, flipped: flip, nonOrientableFaces, shellsTurnedOutward };
}
