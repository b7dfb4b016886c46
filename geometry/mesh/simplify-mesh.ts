import { MeshoptSimplifier } from 'meshoptimizer';
import { GeometryError } from '../errors';
import { nextHalfEdge } from './half-edges';
import type { ImportedModel } from './tri-mesh';

/** Result of simplifyMesh. */
export interface SimplifyResult {
  model: ImportedModel;
  /** The seams carried over to the reduced mesh (SeamMask over its triangles), or null when none were given. */
  seamMask: Uint8Array | null;
  /** Seam edges of the input that are no longer single edges of the output (0 when every seam survived). */
  seamEdgesLost: number;
  /** meshoptimizer's relative error of the result (deviation ÷ mesh extent). */
  relativeError: number;
}

/**
 * Reduces a dense mesh to about `targetTriangles` triangles with meshoptimizer's quadric edge-collapse
 * simplifier (after Garland & Heckbert 1997, "Surface simplification using quadric error metrics"), keeping
 * every vertex on a seam and every open border fixed (vertex_lock and LockBorder), so marked seams and
 * boundaries survive exactly. `lockedSeams` is a SeamMask over the input's triangles (Uint8Array(3F), both
 * half-edges of a seam edge set) or null; `model.seamPolylines` vertices are locked too. Face tags follow by
 * majority of the corners' original tags; corner UVs are dropped (the reduced mesh has new corners).
 * Async because the WebAssembly module must be ready first. Throws GeometryError('BAD_OPTION') for a target
 * below 4 or a mask of the wrong length.
 */
export async function simplifyMesh(model: ImportedModel, targetTriangles: number, lockedSeams: Uint8Array | null): Promise<SimplifyResult> {
  const { positions, triangles } = model.mesh;
  const F = triangles.length / 3;
  const V = positions.length / 3;
  if (!Number.isInteger(targetTriangles) || targetTriangles < 4) {
    throw new GeometryError('BAD_OPTION', `target triangle count must be an integer ≥ 4, got ${String(targetTriangles)}`);
  }
  if (lockedSeams && lockedSeams.length !== triangles.length) {
    throw new GeometryError('BAD_OPTION', `seam mask has ${lockedSeams.length} entries but the mesh has ${triangles.length} half-edges`);
  }
  await MeshoptSimplifier.ready;
  const lock = new Uint8Array(V);
  const seamPairs = new Set<number>();
  const pairKey = (a: number, b: number) => (a < b ? a * V + b : b * V + a);
  if (lockedSeams) {
    for (let h = 0; h < triangles.length; h++) {
      if (!lockedSeams[h]) continue;
      const a = triangles[h];
      const b = triangles[nextHalfEdge(h)];
      lock[a] = 1;
      lock[b] = 1;
      seamPairs.add(pairKey(a, b));
    }
  }
  for (const line of model.seamPolylines) for (const v of line) if (v < V) lock[v] = 1;
  if (targetTriangles >= F) {
    return { model, seamMask: lockedSeams ? Uint8Array.from(lockedSeams) : null, seamEdgesLost: 0, relativeError: 0 };
  }
  const pos32 = new Float32Array(positions);
  const [indices, relativeError] = MeshoptSimplifier.simplifyWithAttributes(
    Uint32Array.from(triangles), pos32, 3, new Float32Array(0), 0, [], lock, 3 * targetTriangles, 1, ['LockBorder'],
  );
  // Compact to the vertices still in use.
  const remap = new Int32Array(V).fill(-1);
  let used = 0;
  for (let i = 0; i < indices.length; i++) if (remap[indices[i]] < 0) remap[indices[i]] = used++;
  const outPos = new Float64Array(3 * used);
  for (let v = 0; v < V; v++) if (remap[v] >= 0) outPos.set(positions.subarray(3 * v, 3 * v + 3), 3 * remap[v]);
  const outTri = new Uint32Array(indices.length);
  for (let i = 0; i < indices.length; i++) outTri[i] = remap[indices[i]];
  // A vertex's tag is that of the first face using it; each new face takes its corners' majority tag.
  const vertexTag = new Uint32Array(V);
  for (let f = F - 1; f >= 0; f--) for (let k = 0; k < 3; k++) vertexTag[triangles[3 * f + k]] = model.faceTags[f] ?? 0;
  const Fo = indices.length / 3;
  const faceTags = new Uint32Array(Fo);
  for (let f = 0; f < Fo; f++) {
    const [a, b, c] = [vertexTag[indices[3 * f]], vertexTag[indices[3 * f + 1]], vertexTag[indices[3 * f + 2]]];
    faceTags[f] = b === c ? b : a;
  }
  let seamMask: Uint8Array | null = null;
  let seamEdgesLost = 0;
  if (lockedSeams) {
    seamMask = new Uint8Array(indices.length);
    const survived = new Set<number>();
    for (let h = 0; h < indices.length; h++) {
      const key = pairKey(indices[h], indices[nextHalfEdge(h)]);
      if (seamPairs.has(key)) {
        seamMask[h] = 1;
        survived.add(key);
      }
    }
    seamEdgesLost = seamPairs.size - survived.size;
  }
  const seamPolylines = model.seamPolylines.map((line) => Uint32Array.from(Array.from(line).filter((v) => v < V && remap[v] >= 0).map((v) => remap[v])));
  const notes = [...model.notes, `reduced from ${F} to ${Fo} triangles (relative error ${relativeError.toExponential(2)})`];
  if (seamEdgesLost > 0) notes.push(`${seamEdgesLost} seam edges did not survive the reduction as single edges`);
  return {
    model: { mesh: { positions: outPos, triangles: outTri }, faceTags, tagNames: [...model.tagNames], seamPolylines, cornerUVs: null, notes },
    seamMask,
    seamEdgesLost,
    relativeError,
  };
}
