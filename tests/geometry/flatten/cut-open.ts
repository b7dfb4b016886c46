import type { TriMesh } from '../../../geometry/mesh/tri-mesh';

/**
 * Test helper: cuts a surface of revolution about the z axis (the engine's cone and cylinder shapes) open
 * along the half-plane y = 0, x > 0, by giving the triangles of the last wedge (those reaching from the
 * azimuth-0 generator back to azimuth > π) their own copies of the azimuth-0 vertices. Vertices on the
 * axis (an apex) stay shared, so a cone opens into a sector with the apex on its boundary.
 */
export function cutOpenAtAzimuthZero(mesh: TriMesh): TriMesh {
  const nv = mesh.positions.length / 3;
  const az = new Float64Array(nv);
  const onCut = new Uint8Array(nv);
  for (let v = 0; v < nv; v++) {
    const x = mesh.positions[3 * v];
    const y = mesh.positions[3 * v + 1];
    const r = Math.hypot(x, y);
    az[v] = Math.atan2(y, x);
    onCut[v] = r > 1e-9 && Math.abs(y) <= 1e-9 * r && x > 0 ? 1 : 0;
  }
  const copyOf = new Int32Array(nv).fill(-1);
  const extra: number[] = [];
  const triangles = Uint32Array.from(mesh.triangles);
  for (let f = 0; f < triangles.length / 3; f++) {
    let reachesBack = false;
    for (let k = 0; k < 3; k++) if (az[triangles[3 * f + k]] < -1e-9) reachesBack = true;
    if (!reachesBack) continue;
    for (let k = 0; k < 3; k++) {
      const v = triangles[3 * f + k];
      if (!onCut[v]) continue;
      if (copyOf[v] < 0) {
        copyOf[v] = nv + extra.length / 3;
        extra.push(mesh.positions[3 * v], mesh.positions[3 * v + 1], mesh.positions[3 * v + 2]);
      }
      triangles[3 * f + k] = copyOf[v];
    }
  }
  const positions = new Float64Array(3 * nv + extra.length);
  positions.set(mesh.positions);
  positions.set(extra, 3 * nv);
  return { positions, triangles };
}
