import { GeometryError } from '../errors';
import { boundaryLoops } from './boundary-loops';
import { faceComponents } from './connected-components';
import { cornerFans } from './corner-fans';
import { analyzeEdges } from './half-edges';
import { boundingBoxDiagonal } from './mesh-measures';
import { orientFaces } from './orient-faces';
import type { ImportedModel } from './tri-mesh';
import { weldVertices } from './weld-vertices';

/** Options for cleanMesh. */
export interface CleanOptions {
  /** Weld distance as a fraction of the bounding-box diagonal; default 1e-6. */
  weldTolerance?: number;
}

/** A non-manifold edge found while cleaning (indices refer to the cleaned mesh). */
export interface NonManifoldEdgeNote {
  /** The edge's end vertices before splitting (first copies in the cleaned mesh). */
  vertices: [number, number];
  /** How many faces shared it. */
  faceCount: number;
  /** Midpoint in mm. */
  at: [number, number, number];
}

/** A non-manifold vertex found while cleaning (several separate fans of faces met there). */
export interface NonManifoldVertexNote {
  vertex: number;
  /** Number of fans; the vertex was split into this many. */
  fans: number;
  at: [number, number, number];
}

/** What cleanMesh changed and found, for the maker. */
export interface CleanReport {
  weldToleranceMm: number;
  verticesIn: number;
  verticesOut: number;
  facesIn: number;
  facesOut: number;
  weldedVertices: number;
  unusedVerticesRemoved: number;
  degenerateFaces: number;
  duplicateFaces: number;
  flippedFaces: number;
  shellsTurnedOutward: number;
  nonOrientableFaces: number;
  nonManifoldEdges: NonManifoldEdgeNote[];
  nonManifoldVertices: NonManifoldVertexNote[];
  components: number;
  boundaryLoops: number;
  /** Human-readable summary lines. */
  notes: string[];
}

/**
 * The positions of the vertices some face uses, Float64Array(3U). The weld distance is relative to the model's
 * size, and a stray unused vertex far away (exporters leave such points behind) must not set that size: a
 * single one 1000 m off once made the weld distance 1 m and collapsed a 60 mm part to nothing.
 */
function usedPositions(positions: Float64Array, triangles: Uint32Array): Float64Array {
  const used = new Uint8Array(positions.length / 3);
  let count = 0;
  for (let i = 0; i < triangles.length; i++) {
    if (!used[triangles[i]]) {
      used[triangles[i]] = 1;
      count++;
    }
  }
  if (count === used.length) return positions;
  const out = new Float64Array(3 * count);
  let w = 0;
  for (let v = 0; v < used.length; v++) {
    if (!used[v]) continue;
    out[w++] = positions[3 * v];
    out[w++] = positions[3 * v + 1];
    out[w++] = positions[3 * v + 2];
  }
  return out;
}

const fmt = (p: [number, number, number]) => `(${p.map((x) => x.toFixed(2)).join(', ')}) mm`;
const MAX_LISTED = 20;

/**
 * Cleans an imported model so the rest of the engine can rely on it: welds vertices closer than
 * `weldTolerance`·(bounding-box diagonal of the vertices the faces use) (spatial hash), drops degenerate faces (a repeated corner after
 * welding, or thinner than the weld distance: height over the longest side below it) and duplicate faces
 * (same three vertices in any order; the first is kept), makes the winding consistent and turns closed shells
 * outward (orientFaces), then splits every non-manifold vertex — including both ends of each non-manifold
 * edge — into one copy per fan of faces (cornerFans), so that the result is a manifold mesh. Each
 * non-manifold edge and vertex is reported with its location. Unused vertices are dropped; face tags, corner
 * UVs and seam polylines follow the faces and vertices (a polyline point at a split vertex keeps the first
 * copy). Returns a new model; the input is not modified.
 *
 * Throws GeometryError('NO_FACES') when nothing is left, ('BAD_OPTION') for a negative or non-finite tolerance.
 */
export function cleanMesh(model: ImportedModel, opts: CleanOptions = {}): { model: ImportedModel; report: CleanReport } {
  const rel = opts.weldTolerance ?? 1e-6;
  if (!Number.isFinite(rel) || rel < 0) {
    throw new GeometryError('BAD_OPTION', `weldTolerance must be a finite number ≥ 0, got ${String(rel)}`);
  }
  const srcPos = model.mesh.positions;
  const srcTri = model.mesh.triangles;
  const Vin = srcPos.length / 3;
  const Fin = srcTri.length / 3;
  const diag = boundingBoxDiagonal(usedPositions(srcPos, srcTri));
  const tol = rel * diag;

  // 1. Weld.
  const weld = weldVertices(srcPos, tol);
  const P = weld.positions;

  // 2. Degenerate and duplicate faces.
  const keep: number[] = [];
  let degenerate = 0;
  let duplicate = 0;
  let size = 1;
  while (size < 2 * Fin) size <<= 1;
  const table = new Int32Array(size).fill(-1);
  const keptTri: number[] = [];
  for (let f = 0; f < Fin; f++) {
    const a = weld.remap[srcTri[3 * f]];
    const b = weld.remap[srcTri[3 * f + 1]];
    const c = weld.remap[srcTri[3 * f + 2]];
    if (a === b || b === c || c === a || isThin(P, a, b, c, tol)) {
      degenerate++;
      continue;
    }
    const lo = Math.min(a, b, c);
    const hi = Math.max(a, b, c);
    const mid = a + b + c - lo - hi;
    let slot = (Math.imul(lo, 73856093) ^ Math.imul(mid, 19349663) ^ Math.imul(hi, 83492791)) & (size - 1);
    let dup = false;
    while (table[slot] >= 0) {
      const k = table[slot];
      const x = keptTri[3 * k], y = keptTri[3 * k + 1], z = keptTri[3 * k + 2];
      if (Math.min(x, y, z) === lo && Math.max(x, y, z) === hi && x + y + z - lo - hi === mid) {
        dup = true;
        break;
      }
      slot = (slot + 1) & (size - 1);
    }
    if (dup) {
      duplicate++;
      continue;
    }
    table[slot] = keep.length;
    keep.push(f);
    keptTri.push(a, b, c);
  }
  if (keep.length === 0) {
    throw new GeometryError('NO_FACES', `no faces left after welding at ${tol.toPrecision(3)} mm: every face was degenerate or a duplicate`);
  }

  // 3. Winding.
  const oriented = orientFaces(P, Uint32Array.from(keptTri));
  let tris = oriented.triangles;
  let flippedFaces = 0;
  for (let i = 0; i < oriented.flipped.length; i++) flippedFaces += oriented.flipped[i];

  // 4. Non-manifold edges and vertices: split each vertex into one copy per fan.
  const Vw = P.length / 3;
  const edges = analyzeEdges(tris, Vw);
  const nonManifoldEdges: NonManifoldEdgeNote[] = [];
  const edgeFaceCount = (a: number, b: number) => {
    let n = 0;
    for (let h = 0; h < tris.length; h++) {
      const x = tris[h];
      const y = tris[h - (h % 3) + ((h % 3) + 1) % 3];
      if ((x === a && y === b) || (x === b && y === a)) n++;
    }
    return n;
  };
  for (let i = 0; i < edges.nonManifoldEdges.length; i += 2) {
    const a = edges.nonManifoldEdges[i];
    const b = edges.nonManifoldEdges[i + 1];
    nonManifoldEdges.push({
      vertices: [a, b],
      faceCount: nonManifoldEdges.length < MAX_LISTED ? edgeFaceCount(a, b) : 0,
      at: [0, 1, 2].map((k) => (P[3 * a + k] + P[3 * b + k]) / 2) as [number, number, number],
    });
  }
  const fans = cornerFans(tris, edges.twin);
  const fansAt = new Uint32Array(Vw);
  for (let k = 0; k < fans.fanCount; k++) fansAt[fans.fanVertex[k]]++;
  const nonManifoldVertices: NonManifoldVertexNote[] = [];
  const firstFanSeen = new Int32Array(Vw).fill(-1);
  const fanTarget = new Uint32Array(fans.fanCount);
  const extra: number[] = [];
  for (let k = 0; k < fans.fanCount; k++) {
    const v = fans.fanVertex[k];
    if (firstFanSeen[v] < 0) {
      firstFanSeen[v] = k;
      fanTarget[k] = v;
      if (fansAt[v] > 1) nonManifoldVertices.push({ vertex: v, fans: fansAt[v], at: [P[3 * v], P[3 * v + 1], P[3 * v + 2]] });
    } else {
      fanTarget[k] = Vw + extra.length;
      extra.push(v);
    }
  }
  let positions = P;
  if (extra.length > 0) {
    positions = new Float64Array(P.length + 3 * extra.length);
    positions.set(P);
    for (let i = 0; i < extra.length; i++) positions.set(P.subarray(3 * extra[i], 3 * extra[i] + 3), P.length + 3 * i);
    tris = Uint32Array.from(tris);
    for (let c = 0; c < tris.length; c++) tris[c] = fanTarget[fans.fanOfCorner[c]];
  }

  // 5. Drop unused vertices and compact.
  const Vs = positions.length / 3;
  const newIndex = new Int32Array(Vs).fill(-1);
  let used = 0;
  for (let c = 0; c < tris.length; c++) {
    if (newIndex[tris[c]] < 0) newIndex[tris[c]] = -2;
  }
  for (let v = 0; v < Vs; v++) if (newIndex[v] === -2) newIndex[v] = used++;
  const outPos = new Float64Array(3 * used);
  for (let v = 0; v < Vs; v++) if (newIndex[v] >= 0) outPos.set(positions.subarray(3 * v, 3 * v + 3), 3 * newIndex[v]);
  const outTri = new Uint32Array(tris.length);
  for (let c = 0; c < tris.length; c++) outTri[c] = newIndex[tris[c]];
  for (const e of nonManifoldEdges) e.vertices = [newIndex[e.vertices[0]], newIndex[e.vertices[1]]];
  for (const n of nonManifoldVertices) n.vertex = newIndex[n.vertex];

  // 6. Carry face tags, UVs and seam polylines along.
  const F = keep.length;
  const faceTags = new Uint32Array(F);
  for (let i = 0; i < F; i++) faceTags[i] = model.faceTags[keep[i]] ?? 0;
  let cornerUVs: Float64Array | null = null;
  if (model.cornerUVs) {
    cornerUVs = new Float64Array(6 * F);
    for (let i = 0; i < F; i++) {
      const f = keep[i];
      const order = oriented.flipped[i] ? [0, 2, 1] : [0, 1, 2];
      for (let k = 0; k < 3; k++) {
        cornerUVs[6 * i + 2 * k] = model.cornerUVs[6 * f + 2 * order[k]];
        cornerUVs[6 * i + 2 * k + 1] = model.cornerUVs[6 * f + 2 * order[k] + 1];
      }
    }
  }
  const seamPolylines: Uint32Array[] = [];
  let droppedPolylinePoints = 0;
  for (const line of model.seamPolylines) {
    const mapped: number[] = [];
    for (const v of line) {
      const w = v < Vin ? newIndex[weld.remap[v]] : -1;
      if (w < 0) {
        droppedPolylinePoints++;
        continue;
      }
      if (mapped[mapped.length - 1] !== w) mapped.push(w);
    }
    if (mapped.length >= 2) seamPolylines.push(Uint32Array.from(mapped));
  }

  const finalEdges = analyzeEdges(outTri, used);
  const components = faceComponents(finalEdges.twin).count;
  const loops = boundaryLoops(outTri, finalEdges.twin).length;
  const report: CleanReport = {
    weldToleranceMm: tol,
    verticesIn: Vin,
    verticesOut: used,
    facesIn: Fin,
    facesOut: F,
    weldedVertices: Vin - Vw,
    unusedVerticesRemoved: Vs - used,
    degenerateFaces: degenerate,
    duplicateFaces: duplicate,
    flippedFaces,
    shellsTurnedOutward: oriented.shellsTurnedOutward,
    nonOrientableFaces: oriented.nonOrientableFaces,
    nonManifoldEdges,
    nonManifoldVertices,
    components,
    boundaryLoops: loops,
    notes: [],
  };
  const notes = report.notes;
  if (report.weldedVertices > 0) notes.push(`welded ${report.weldedVertices} vertices closer than ${tol.toPrecision(3)} mm`);
  if (degenerate > 0) notes.push(`dropped ${degenerate} degenerate faces (zero area or thinner than ${tol.toPrecision(3)} mm)`);
  if (duplicate > 0) notes.push(`dropped ${duplicate} duplicate faces`);
  if (flippedFaces > 0) notes.push(`reversed ${flippedFaces} faces so that the winding is consistent and closed shells face outward`);
  if (oriented.nonOrientableFaces > 0) notes.push(`${oriented.nonOrientableFaces} faces lie on a surface that cannot be oriented (like a Möbius band); their seams may need checking`);
  for (const e of nonManifoldEdges.slice(0, MAX_LISTED)) {
    notes.push(`non-manifold edge between vertices ${e.vertices[0]} and ${e.vertices[1]} at ${fmt(e.at)}, shared by ${e.faceCount} faces: the faces were separated there`);
  }
  if (nonManifoldEdges.length > MAX_LISTED) notes.push(`… and ${nonManifoldEdges.length - MAX_LISTED} more non-manifold edges`);
  for (const n of nonManifoldVertices.slice(0, MAX_LISTED)) {
    notes.push(`non-manifold vertex ${n.vertex} at ${fmt(n.at)}: ${n.fans} separate fans of faces met there; it was split into ${n.fans}`);
  }
  if (nonManifoldVertices.length > MAX_LISTED) notes.push(`… and ${nonManifoldVertices.length - MAX_LISTED} more non-manifold vertices`);
  if (report.unusedVerticesRemoved > 0) {
    const n = report.unusedVerticesRemoved;
    notes.push(n === 1 ? 'removed 1 vertex that no face uses' : `removed ${n} vertices that no face uses`);
  }
  if (droppedPolylinePoints > 0) notes.push(`${droppedPolylinePoints} seam polyline points were on no face and were dropped`);
  notes.push(`${components} connected ${components === 1 ? 'part' : 'parts'}, ${loops} boundary ${loops === 1 ? 'loop' : 'loops'}`);

  return {
    model: {
      mesh: { positions: outPos, triangles: outTri },
      faceTags,
      tagNames: [...model.tagNames],
      seamPolylines,
      cornerUVs,
      notes: [...model.notes],
    },
    report,
  };
}

/** True when triangle abc's height over its longest side is at most `tol` (zero area included). */
function isThin(P: Float64Array, a: number, b: number, c: number, tol: number): boolean {
  const A = 3 * a, B = 3 * b, C = 3 * c;
  const ux = P[B] - P[A], uy = P[B + 1] - P[A + 1], uz = P[B + 2] - P[A + 2];
  const vx = P[C] - P[A], vy = P[C + 1] - P[A + 1], vz = P[C + 2] - P[A + 2];
  const wx = P[C] - P[B], wy = P[C + 1] - P[B + 1], wz = P[C + 2] - P[B + 2];
  const twiceArea = Math.hypot(uy * vz - uz * vy, uz * vx - ux * vz, ux * vy - uy * vx);
  const longest = Math.sqrt(Math.max(ux * ux + uy * uy + uz * uz, vx * vx + vy * vy + vz * vz, wx * wx + wy * wy + wz * wz));
  return twiceArea <= tol * longest;
}
