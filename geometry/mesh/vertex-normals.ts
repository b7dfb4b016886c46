import { cornerAngles } from './corner-angles';
import { unitFaceNormals } from './face-normals';

/**
 * Returns unit vertex normals, Float64Array(3V): the sum of the incident face normals weighted by the corner
 * angle at the vertex (Thürmer & Wüthrich 1998, "Computing vertex normals from polygonal facets"), which does
 * not depend on how a surface is triangulated. `positions` Float64Array(3V), `triangles` Uint32Array(3F),
 * counter-clockwise from outside so normals point outward. A vertex with no (non-degenerate) face gets (0,0,0).
 */
export function vertexNormals(positions: Float64Array, triangles: Uint32Array): Float64Array {
  const out = new Float64Array(positions.length);
  const normals = unitFaceNormals(positions, triangles);
  const angles = cornerAngles(positions, triangles);
  for (let c = 0; c < triangles.length; c++) {
    const p = 3 * triangles[c];
    const n = c - (c % 3);
    const w = angles[c];
    out[p] += w * normals[n];
    out[p + 1] += w * normals[n + 1];
    out[p + 2] += w * normals[n + 2];
  }
  for (let i = 0; i < out.length; i += 3) {
    const l = Math.hypot(out[i], out[i + 1], out[i + 2]);
    if (l > 0) {
      out[i] /= l;
      out[i + 1] /= l;
      out[i + 2] /= l;
    }
  }
  return out;
}
