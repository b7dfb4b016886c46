import { GeometryError } from '../errors';

/**
 * A set of seam edges as a per-half-edge mask, Uint8Array(3F): both half-edges of a seam edge are 1 (a
 * boundary edge has only one). Cheap to copy, to send to a browser, and to test per half-edge.
 */
export type SeamMask = Uint8Array;

/** Returns an empty seam mask for a mesh of `faceCount` triangles. */
export function emptySeamMask(faceCount: number): SeamMask {
  if (!Number.isInteger(faceCount) || faceCount < 0) {
    throw new GeometryError('BAD_OPTION', `face count must be a whole number ≥ 0, got ${String(faceCount)}`);
  }
  return new Uint8Array(3 * faceCount);
}

function checkHalfEdge(mask: SeamMask, h: number): void {
  if (!Number.isInteger(h) || h < 0 || h >= mask.length) {
    throw new GeometryError('BAD_SEAM', `half-edge ${String(h)} is not in this mesh (0…${mask.length - 1})`);
  }
}

/** Marks the edge of half-edge h (and its twin, if any) as a seam. Mutates and returns `mask`. */
export function addSeamEdge(mask: SeamMask, twin: Int32Array, h: number): SeamMask {
  checkHalfEdge(mask, h);
  mask[h] = 1;
  if (twin[h] >= 0) mask[twin[h]] = 1;
  return mask;
}

/** Clears the seam on the edge of half-edge h (and its twin). Mutates and returns `mask`. */
export function removeSeamEdge(mask: SeamMask, twin: Int32Array, h: number): SeamMask {
  checkHalfEdge(mask, h);
  mask[h] = 0;
  if (twin[h] >= 0) mask[twin[h]] = 0;
  return mask;
}

/** True when the edge of half-edge h is a seam (either of its half-edges marked). */
export function isSeamEdge(mask: SeamMask, twin: Int32Array, h: number): boolean {
  return mask[h] !== 0 || (twin[h] >= 0 && mask[twin[h]] !== 0);
}

/**
 * Returns one half-edge per seam edge, ascending: for a paired edge the lower of its two half-edges, for a
 * boundary edge its only half-edge. `twin` Int32Array(3F).
 */
export function seamEdgesOf(mask: SeamMask, twin: Int32Array): Uint32Array {
  const out: number[] = [];
  for (let h = 0; h < mask.length; h++) {
    const t = twin[h];
    if ((mask[h] || (t >= 0 && mask[t])) && (t < 0 || h < t)) out.push(h);
  }
  return Uint32Array.from(out);
}

/** Returns the number of seam edges in `mask`. */
export function seamEdgeCount(mask: SeamMask, twin: Int32Array): number {
  return seamEdgesOf(mask, twin).length;
}

/** Returns a copy of `mask` in which every seam edge has both half-edges set (repairs a one-sided mask). */
export function symmetricSeamMask(mask: SeamMask, twin: Int32Array): SeamMask {
  const out = Uint8Array.from(mask);
  for (let h = 0; h < mask.length; h++) if (mask[h] && twin[h] >= 0) out[twin[h]] = 1;
  return out;
}

/** Returns a new mask holding the seams of both `a` and `b` (same mesh). */
export function unionSeamMasks(a: SeamMask, b: SeamMask): SeamMask {
  if (a.length !== b.length) throw new GeometryError('BAD_SEAM', `seam masks of different meshes (${a.length} and ${b.length} half-edges)`);
  const out = new Uint8Array(a.length);
  for (let h = 0; h < a.length; h++) out[h] = a[h] | b[h];
  return out;
}
