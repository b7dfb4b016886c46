import { cornerAngles } from './corner-angles';

/**
 * Returns the angle defect of every vertex in radians, Float64Array(V) — the discrete Gaussian curvature
 * (integrated over the vertex's area). Interior vertex: 2π − Σ corner angles. Boundary vertex (start of a
 * half-edge with twin −1): π − Σ corner angles, the discrete geodesic curvature of the boundary there, so that
 * Σ over all vertices = 2πχ for any mesh, with or without boundary (discrete Gauss–Bonnet; Crane, "Discrete
 * Differential Geometry: An Applied Introduction", 2013 notes). For a closed genus-0 mesh the sum is 4π
 * (Descartes' theorem). Vertices no triangle uses get 0.
 *
 * `positions` Float64Array(3V) in mm, `triangles` Uint32Array(3F), `twin` Int32Array(3F).
 */
export function angleDefects(positions: Float64Array, triangles: Uint32Array, twin: Int32Array): Float64Array {
  const V = positions.length / 3;
  const angles = cornerAngles(positions, triangles);
  const sum = new Float64Array(V);
  const used = new Uint8Array(V);
  const boundary = new Uint8Array(V);
  for (let c = 0; c < triangles.length; c++) {
    sum[triangles[c]] += angles[c];
    used[triangles[c]] = 1;
    if (twin[c] < 0) {
      boundary[triangles[c]] = 1;
      boundary[triangles[c - (c % 3) + ((c % 3) + 1) % 3]] = 1;
    }
  }
  const out = new Float64Array(V);
  for (let v = 0; v < V; v++) {
    if (used[v]) out[v] = (boundary[v] ? Math.PI : 2 * Math.PI) - sum[v];
  }
  return out;
}
