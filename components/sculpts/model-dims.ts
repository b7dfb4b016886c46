/**
 * Measuring a model file before it is uploaded, so the maker sees its size and the wearer-scaled size at once.
 * Pure: runs in the upload page's web worker (model-dims-worker.ts) or, where no worker starts, on the page.
 */
import { importModel } from '../../geometry/io/import-model';
import { headSection, type HeadSection } from '../../geometry/mesh/wearer-scale';
import type { ModelUnit } from '../../geometry/units';

/** What the page needs from a model file: its bounding-box size and its head section, in millimetres. */
export interface ModelDims {
  /** Bounding-box size [x, y, z] after converting `units` to millimetres. */
  sizeMm: [number, number, number];
  /** Section at half height (y up), or null for a flat or empty model. */
  section: HeadSection | null;
  triangles: number;
  vertices: number;
}

/** Largest file measured before upload (bigger files are measured by the processing job instead), bytes. */
export const MEASURE_BEFORE_UPLOAD_MAX_BYTES = 50 * 1024 * 1024;

/**
 * Reads `bytes` (a whole OBJ, STL or PLY file named `fileName`) with geometry's importModel in `units` and
 * returns its dimensions. Throws GeometryError with the parser's message (line number for text formats) on a
 * file that does not read.
 */
export function measureModel(bytes: Uint8Array, fileName: string, units: ModelUnit): ModelDims {
  const { mesh } = importModel(bytes, fileName, { unit: units });
  const p = mesh.positions;
  const lo = [Infinity, Infinity, Infinity];
  const hi = [-Infinity, -Infinity, -Infinity];
  for (let i = 0; i < p.length; i += 3) {
    for (let k = 0; k < 3; k++) {
      const v = p[i + k];
      if (v < lo[k]) lo[k] = v;
      if (v > hi[k]) hi[k] = v;
    }
  }
  const vertices = p.length / 3;
  const sizeMm: [number, number, number] = vertices === 0 ? [0, 0, 0] : [hi[0] - lo[0], hi[1] - lo[1], hi[2] - lo[2]];
  return { sizeMm, section: headSection(p, mesh.triangles), triangles: mesh.triangles.length / 3, vertices };
}
