/**
 * Automatic seams from a stretch budget: split the sculpt into as few pieces as it takes for every piece to
 * lie flat in foam within the budget.
 *
 * The method follows the idea of D-Charts (Julius et al. 2005): grow charts from seeds over the face graph,
 * attracted to faces whose normals agree with the seed (a planar-proxy term, as in variational shape
 * approximation, Cohen-Steiner et al. 2004) and held back by sharp edges (so seams settle on creases, where
 * they are least visible), then verify each chart by really flattening it (LSCM then ARAP) and measuring its
 * stretch. Sheetsmith's own schedule: every connected part starts as one chart; a chart over budget (or one
 * that cannot be flattened, such as a closed shell) is split in two by growing from its two geodesically
 * farthest faces; this repeats until every chart fits. A mirror-symmetric model is cut on one side of its
 * symmetry plane and the charts are mirrored onto the other side, so its pieces come in mirror pairs. Then neighbouring charts are merged back wherever the
 * merged chart still fits, longest shared seam first, which removes the needless cuts bisection leaves. Trial
 * flattenings use few ARAP rounds and a chart that cannot fit by the isoperimetric inequality is never flattened
 * at all; the final charts are checked with the full flattening and split again if they do not fit.
 */
import { flattenPiece } from '../flatten/flatten-piece';
import { GeometryError, isGeometryError } from '../errors';
import type { TriMesh } from '../mesh/tri-mesh';
import { MinHeap } from '../pattern/min-heap';
import { findSymmetryPlane, type SymmetryPlane } from './mirror-seams';

export interface AutoSeamOptions {
  /** Max stretch allowed per piece, percent (default 3). */
  stretchBudgetPct?: number;
  /** Stop splitting once this many pieces exist (the pieces left over budget are then reported by the caller). */
  maxPieces?: number;
  /** ARAP rounds of the quick trial flattenings while charts are split and merged (default 5). */
  trialArapIterations?: number;
  /**
   * When the model is mirror-symmetric (findSymmetryPlane), cut one half and mirror its pieces onto the other,
   * with a seam along the plane, so the pieces come in mirror pairs (one template, cut twice). Default false
   * (finding the plane costs about as much as cutting a small model); the pattern pipeline turns it on.
   */
  symmetric?: boolean;
}

/** How strongly a sharp edge resists being crossed by a growing chart (dimensionless, tuned on the test shapes). */
const CREASE_WEIGHT = 12;
/** How strongly a face whose normal departs from the seed's normal resists joining the seed's chart. */
const PROXY_WEIGHT = 2;
/** ARAP rounds of a trial flattening: enough to rank charts; the final check uses flattenPiece's default. */
const TRIAL_ARAP_ITERATIONS = 5;
/** A merge whose expected stretch exceeds this many budgets is skipped without a trial flattening. */
const MERGE_SKIP_FACTOR = 2;
/** Share of the budget the cut half of a symmetric model is held to (see autoSeams). */
const MIRROR_MARGIN = 0.98;

/**
 * Seams that cut the mesh into pieces within the stretch budget.
 *
 * @param mesh TriMesh in mm, consistently oriented.
 * @param twin Int32Array(3F) half-edge twins, −1 on a boundary (non-manifold edges unpaired).
 * @param options stretch budget (percent, > 0) and optional piece cap.
 * @returns SeamMask: Uint8Array(3F), both half-edges of every seam edge set. Every piece the mask cuts out is
 *   connected and, unless `maxPieces` stopped the splitting, flattens within the budget with flattenPiece's
 *   default settings (each final piece is checked that way; quicker trial flattenings only steer the search).
 * @throws GeometryError BAD_OPTION for a budget that is not a positive number or a piece cap below 1.
 */
export function autoSeams(mesh: TriMesh, twin: Int32Array, options: AutoSeamOptions = {}): Uint8Array {
  const budget = options.stretchBudgetPct ?? 3;
  if (!(budget > 0) || !Number.isFinite(budget)) {
    throw new GeometryError('BAD_OPTION', `stretch budget must be a positive percentage, got ${budget}`);
  }
  const maxPieces = options.maxPieces ?? Infinity;
  if (!(maxPieces >= 1)) throw new GeometryError('BAD_OPTION', `maxPieces must be at least 1, got ${maxPieces}`);
  const graph = faceGraph(mesh, twin);
  const F = graph.faceCount;
  const trialIterations = options.trialArapIterations ?? TRIAL_ARAP_ITERATIONS;
  const possible = (faces: ArrayLike<number>): boolean => isoperimetricallyPossible(graph, faces, budget);
  const trialStretch = (faces: Int32Array): number =>
    possible(faces) ? chartStretchPct(mesh, faces, trialIterations) : Infinity;
  const finalStretch = (faces: Int32Array): number => (possible(faces) ? chartStretchPct(mesh, faces) : Infinity);

  // Connected parts first: each is a chart to start from. Split until the trial flattening fits, merge back,
  // then hold every chart to the real flattening and split again where it does not fit. On a symmetric model
  // only one half is cut this way and its charts are mirrored onto the other half before the final check.
  const plane = options.symmetric ? findSymmetryPlane(mesh) : null;
  const mirror = plane ? mirrorFaces(graph, plane) : null;
  const chartOf = new Int32Array(F).fill(-1);
  const start = mirror ? components(graph, mirror.inHalf) : components(graph);
  const split = splitUntilFit(graph, start, trialStretch, budget, maxPieces);
  split.charts.forEach((faces, c) => faces.forEach((f) => (chartOf[f] = c)));
  const merged = mergeCharts(graph, chartOf, split.stretches, trialStretch, budget, mirror?.inHalf);
  let charts: Int32Array[];
  if (!mirror) {
    charts = splitUntilFit(graph, merged, finalStretch, budget, maxPieces, true).charts;
  } else {
    // The half is held to a slightly tighter budget so the mirrored copies, whose flattening differs from the
    // originals only by rounding, pass the real one too; any copy that still fails is split on its own.
    const half = splitUntilFit(graph, merged, finalStretch, budget * MIRROR_MARGIN, maxPieces, true).charts;
    half.forEach((faces, c) => faces.forEach((f) => (chartOf[f] = c)));
    for (let f = 0; f < F; f++) if (!mirror.inHalf[f]) chartOf[f] = half.length + chartOf[mirror.image[f]];
    // A face whose mirror partner was matched only approximately can land in the neighbouring chart; it is
    // handed back so every copy is one piece.
    defragment(graph, chartOf, mirror.inHalf);
    const copies: number[][] = Array.from({ length: half.length }, () => []);
    for (let f = 0; f < F; f++) if (!mirror.inHalf[f]) copies[chartOf[f] - half.length].push(f);
    const checked = splitUntilFit(
      graph,
      copies.filter((c) => c.length > 0).map((c) => Int32Array.from(c)),
      finalStretch,
      budget,
      maxPieces,
      true,
    ).charts;
    charts = half.concat(checked);
  }
  charts.forEach((faces, c) => faces.forEach((f) => (chartOf[f] = c)));

  const mask = new Uint8Array(3 * F);
  for (let h = 0; h < 3 * F; h++) {
    const t = twin[h];
    if (t >= 0 && chartOf[(h / 3) | 0] !== chartOf[(t / 3) | 0]) mask[h] = 1;
  }
  return mask;
}

/**
 * Splits charts in two until each fits (or the piece cap is reached). `stretchOf` returns a chart's max stretch in
 * percent (Infinity when it cannot fit at all). A chart far over budget is split again without flattening its
 * halves first: stretch from curvature grows about in proportion to a chart's area (a spherical cap's distortion
 * grows with the square of its radius), so a half whose expected stretch — the parent's times the area ratio — is
 * still over twice the budget is split straight away. With `keepOrder`, charts are checked in the given order and
 * those that fit keep their place, so a final check changes as little as possible.
 */
function splitUntilFit(
  graph: FaceGraph,
  start: Int32Array[],
  stretchOf: (faces: Int32Array) => number,
  budget: number,
  maxPieces: number,
  keepOrder = false,
): { charts: Int32Array[]; stretches: number[] } {
  const areaOf = (faces: Int32Array): number => {
    let a = 0;
    for (const f of faces) a += graph.areas[f];
    return a;
  };
  const pending: Array<{ faces: Int32Array; expected: number | null }> = (keepOrder ? start.slice().reverse() : start).map(
    (faces) => ({ faces, expected: null }),
  );
  const accepted: Int32Array[] = [];
  const stretches: number[] = [];
  while (pending.length > 0) {
    const { faces, expected } = pending.pop()!;
    const room = accepted.length + pending.length + 1 < maxPieces;
    if (faces.length === 1 || !room) {
      accepted.push(faces);
      stretches.push(faces.length === 1 ? 0 : Infinity);
      continue;
    }
    let stretch: number | null = null;
    if (!isClosed(graph, faces) && !(expected !== null && expected > 2 * budget)) {
      stretch = stretchOf(faces);
      if (stretch <= budget) {
        accepted.push(faces);
        stretches.push(stretch);
        continue;
      }
    }
    const known = stretch !== null && Number.isFinite(stretch) ? stretch : expected;
    const total = areaOf(faces);
    const halves = splitChart(graph, faces);
    const guess = (half: Int32Array): number | null => (known === null || total <= 0 ? null : (known * areaOf(half)) / total);
    pending.push({ faces: halves[1], expected: guess(halves[1]) }, { faces: halves[0], expected: guess(halves[0]) });
  }
  return { charts: accepted, stretches };
}

/**
 * The half of a mirror-symmetric mesh on the positive side of `plane` (by face centroid) and, for each face of
 * the other half, the face of the first half it mirrors onto (nearest mirrored centroid, through a uniform grid).
 * Null unless the pairing is one to one — that is, unless the triangulation itself is mirror-symmetric with a
 * loop of edges in the plane, as a sculpt modelled with a mirror is; otherwise the mirrored pieces' edges would
 * zigzag differently from the originals, and the caller cuts the whole model instead.
 */
function mirrorFaces(g: FaceGraph, plane: SymmetryPlane): { inHalf: Uint8Array; image: Int32Array } | null {
  const F = g.faceCount;
  const [nx, ny, nz] = plane.normal;
  const c = g.centroids;
  const side = (f: number): number => c[3 * f] * nx + c[3 * f + 1] * ny + c[3 * f + 2] * nz - plane.offset;
  const inHalf = new Uint8Array(F);
  let meanEdge = 0;
  for (let f = 0; f < F; f++) {
    if (side(f) >= 0) inHalf[f] = 1;
    meanEdge += g.edgeLengths[3 * f] + g.edgeLengths[3 * f + 1] + g.edgeLengths[3 * f + 2];
  }
  meanEdge /= 3 * F;
  const cell = meanEdge > 0 ? meanEdge : 1;
  const key = (x: number, y: number, z: number): string => `${Math.floor(x / cell)},${Math.floor(y / cell)},${Math.floor(z / cell)}`;
  const grid = new Map<string, number[]>();
  for (let f = 0; f < F; f++) {
    if (!inHalf[f]) continue;
    const k = key(c[3 * f], c[3 * f + 1], c[3 * f + 2]);
    const list = grid.get(k);
    if (list) list.push(f);
    else grid.set(k, [f]);
  }
  const image = new Int32Array(F).fill(-1);
  const used = new Uint8Array(F);
  const limit = meanEdge / 2;
  for (let f = 0; f < F; f++) {
    if (inHalf[f]) continue;
    const d = 2 * side(f);
    const x = c[3 * f] - d * nx, y = c[3 * f + 1] - d * ny, z = c[3 * f + 2] - d * nz;
    let best = -1;
    let bestDist = limit;
    const ix = Math.floor(x / cell), iy = Math.floor(y / cell), iz = Math.floor(z / cell);
    for (let a = -1; a <= 1; a++) {
      for (let b = -1; b <= 1; b++) {
        for (let e = -1; e <= 1; e++) {
          for (const h of grid.get(`${ix + a},${iy + b},${iz + e}`) ?? []) {
            const dist = Math.hypot(c[3 * h] - x, c[3 * h + 1] - y, c[3 * h + 2] - z);
            if (dist < bestDist) {
              bestDist = dist;
              best = h;
            }
          }
        }
      }
    }
    if (best < 0 || used[best]) return null;
    used[best] = 1;
    image[f] = best;
  }
  for (let f = 0; f < F; f++) if (inHalf[f] && !used[f]) return null;
  return { inHalf, image };
}

/**
 * Makes each chart label on the faces outside `fixed` one connected region: every smaller fragment of a label
 * takes the label most common among its faces' neighbours outside the fragment. Repeats until nothing changes
 * (at most a few rounds; each round only merges fragments into neighbours).
 */
function defragment(g: FaceGraph, chartOf: Int32Array, fixed: Uint8Array): void {
  const F = g.faceCount;
  for (let round = 0; round < 8; round++) {
    const comp = new Int32Array(F).fill(-1);
    const sizes: number[] = [];
    const labelOfComp: number[] = [];
    for (let s = 0; s < F; s++) {
      if (fixed[s] || comp[s] >= 0) continue;
      const id = sizes.length;
      const stack = [s];
      comp[s] = id;
      let size = 0;
      while (stack.length > 0) {
        const f = stack.pop()!;
        size++;
        for (let k = 0; k < 3; k++) {
          const t = g.twin[3 * f + k];
          if (t < 0) continue;
          const n = (t / 3) | 0;
          if (!fixed[n] && comp[n] < 0 && chartOf[n] === chartOf[s]) {
            comp[n] = id;
            stack.push(n);
          }
        }
      }
      sizes.push(size);
      labelOfComp.push(chartOf[s]);
    }
    const largest = new Map<number, number>();
    sizes.forEach((size, id) => {
      const best = largest.get(labelOfComp[id]);
      if (best === undefined || size > sizes[best]) largest.set(labelOfComp[id], id);
    });
    let changed = false;
    const votes = new Map<number, Map<number, number>>();
    for (let f = 0; f < F; f++) {
      if (fixed[f] || largest.get(chartOf[f]) === comp[f]) continue;
      for (let k = 0; k < 3; k++) {
        const t = g.twin[3 * f + k];
        if (t < 0) continue;
        const n = (t / 3) | 0;
        if (fixed[n] || comp[n] === comp[f]) continue;
        const tally = votes.get(comp[f]) ?? new Map<number, number>();
        tally.set(chartOf[n], (tally.get(chartOf[n]) ?? 0) + 1);
        votes.set(comp[f], tally);
      }
    }
    const newLabel = new Map<number, number>();
    for (const [id, tally] of votes) {
      let best = -1;
      let bestCount = 0;
      for (const [label, count] of tally) if (count > bestCount || (count === bestCount && label < best)) [best, bestCount] = [label, count];
      if (best >= 0) newLabel.set(id, best);
    }
    for (let f = 0; f < F; f++) {
      const l = newLabel.get(comp[f]);
      if (!fixed[f] && l !== undefined && l !== chartOf[f]) {
        chartOf[f] = l;
        changed = true;
      }
    }
    if (!changed) return;
  }
}

/**
 * A necessary condition for a chart to flatten within ε = budget/100: the planar isoperimetric inequality
 * L² ≥ 4πA must hold for the flat piece, whose boundary is at most (1+ε) times as long and whose area is at
 * least (1−ε)² times as large as in 3D (every length scales by at most σmax ≤ 1+ε, every area by at least
 * σmin² ≥ (1−ε)²). So a chart with (1+ε)²·L² < 4π·(1−ε)²·A cannot fit and is split without trying; a cap of a
 * sphere or a closed-up region fails this long before a flattening would be worth its cost.
 */
function isoperimetricallyPossible(g: FaceGraph, faces: ArrayLike<number>, budget: number): boolean {
  enterChart(g, faces);
  let area = 0;
  let boundary = 0;
  for (let i = 0; i < faces.length; i++) {
    const f = faces[i];
    area += g.areas[f];
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t < 0 || !inCurrentChart(g, (t / 3) | 0)) boundary += g.edgeLengths[3 * f + k];
    }
  }
  const e = budget / 100;
  return (1 + e) ** 2 * boundary * boundary >= 4 * Math.PI * (1 - e) ** 2 * area;
}

interface FaceGraph {
  faceCount: number;
  twin: Int32Array;
  normals: Float64Array;
  centroids: Float64Array;
  areas: Float64Array;
  /** Length of each half-edge's edge, mm. */
  edgeLengths: Float64Array;
  /**
   * Scratch: position of each face in the chart being examined, valid where `stampOf[f] === stamp`. Replaces a
   * Set/Map per chart (the searches run hundreds of times on small charts).
   */
  localIndex: Int32Array;
  stampOf: Int32Array;
  stamp: number;
}

/** Marks `faces` as the current chart in the graph's scratch arrays (see FaceGraph.localIndex). */
function enterChart(g: FaceGraph, faces: ArrayLike<number>): void {
  g.stamp++;
  for (let i = 0; i < faces.length; i++) {
    g.stampOf[faces[i]] = g.stamp;
    g.localIndex[faces[i]] = i;
  }
}

const inCurrentChart = (g: FaceGraph, f: number): boolean => g.stampOf[f] === g.stamp;

function faceGraph(mesh: TriMesh, twin: Int32Array): FaceGraph {
  const { positions: p, triangles: t } = mesh;
  const F = t.length / 3;
  const normals = new Float64Array(3 * F);
  const centroids = new Float64Array(3 * F);
  const areas = new Float64Array(F);
  const edgeLengths = new Float64Array(3 * F);
  for (let f = 0; f < F; f++) {
    const a = 3 * t[3 * f];
    const b = 3 * t[3 * f + 1];
    const c = 3 * t[3 * f + 2];
    const ux = p[b] - p[a], uy = p[b + 1] - p[a + 1], uz = p[b + 2] - p[a + 2];
    const vx = p[c] - p[a], vy = p[c + 1] - p[a + 1], vz = p[c + 2] - p[a + 2];
    const nx = uy * vz - uz * vy, ny = uz * vx - ux * vz, nz = ux * vy - uy * vx;
    const len = Math.hypot(nx, ny, nz) || 1;
    areas[f] = len / 2;
    const corner = [a, b, c];
    for (let k = 0; k < 3; k++) {
      const i = corner[k];
      const j = corner[(k + 1) % 3];
      edgeLengths[3 * f + k] = Math.hypot(p[j] - p[i], p[j + 1] - p[i + 1], p[j + 2] - p[i + 2]);
    }
    normals[3 * f] = nx / len;
    normals[3 * f + 1] = ny / len;
    normals[3 * f + 2] = nz / len;
    for (let k = 0; k < 3; k++) centroids[3 * f + k] = (p[a + k] + p[b + k] + p[c + k]) / 3;
  }
  return {
    faceCount: F,
    twin,
    normals,
    centroids,
    areas,
    edgeLengths,
    localIndex: new Int32Array(F),
    stampOf: new Int32Array(F),
    stamp: 0,
  };
}

const dot = (n: Float64Array, f: number, g: number): number =>
  n[3 * f] * n[3 * g] + n[3 * f + 1] * n[3 * g + 1] + n[3 * f + 2] * n[3 * g + 2];

function centroidDistance(g: FaceGraph, f: number, h: number): number {
  const c = g.centroids;
  return Math.hypot(c[3 * f] - c[3 * h], c[3 * f + 1] - c[3 * h + 1], c[3 * f + 2] - c[3 * h + 2]);
}

/** Connected parts of the face graph (restricted to faces with `only[f]` set when given). */
function components(g: FaceGraph, only?: Uint8Array): Int32Array[] {
  const seen = new Uint8Array(g.faceCount);
  if (only) for (let f = 0; f < g.faceCount; f++) if (!only[f]) seen[f] = 1;
  const out: Int32Array[] = [];
  for (let s = 0; s < g.faceCount; s++) {
    if (seen[s]) continue;
    const list = [s];
    seen[s] = 1;
    for (let i = 0; i < list.length; i++) {
      const f = list[i];
      for (let k = 0; k < 3; k++) {
        const t = g.twin[3 * f + k];
        if (t < 0) continue;
        const n = (t / 3) | 0;
        if (!seen[n]) {
          seen[n] = 1;
          list.push(n);
        }
      }
    }
    out.push(Int32Array.from(list));
  }
  return out.reverse();
}

function isClosed(g: FaceGraph, faces: Int32Array): boolean {
  enterChart(g, faces);
  for (const f of faces) {
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t < 0 || !inCurrentChart(g, (t / 3) | 0)) return false;
    }
  }
  return true;
}

/**
 * Multi-source Dijkstra over the faces of one chart. Returns per face (indexed by position in `faces`) the
 * distance and the seed it was reached from. `proxy` adds the planar-proxy and crease terms.
 */
function growFrom(g: FaceGraph, faces: Int32Array, seeds: number[], proxy: boolean): { dist: Float64Array; label: Int32Array } {
  enterChart(g, faces);
  const n = faces.length;
  const dist = new Float64Array(n).fill(Infinity);
  const label = new Int32Array(n).fill(-1);
  const heap = new MinHeap(n);
  seeds.forEach((s, k) => {
    const i = g.localIndex[s];
    dist[i] = 0;
    label[i] = k;
    heap.push(i, 0);
  });
  const done = new Uint8Array(n);
  while (heap.size > 0) {
    const i = heap.pop();
    if (done[i]) continue;
    done[i] = 1;
    const f = faces[i];
    const seed = seeds[label[i]];
    for (let k = 0; k < 3; k++) {
      const t = g.twin[3 * f + k];
      if (t < 0) continue;
      const nf = (t / 3) | 0;
      if (!inCurrentChart(g, nf)) continue;
      const j = g.localIndex[nf];
      if (done[j]) continue;
      let w = centroidDistance(g, f, nf);
      if (proxy) {
        w *= 1 + CREASE_WEIGHT * (1 - dot(g.normals, f, nf)) + PROXY_WEIGHT * (1 - dot(g.normals, seed, nf));
      }
      const d = dist[i] + w;
      if (d < dist[j]) {
        dist[j] = d;
        label[j] = label[i];
        heap.push(j, d);
      }
    }
  }
  return { dist, label };
}

/** Splits a connected chart in two, grown from its two geodesically farthest faces. */
function splitChart(g: FaceGraph, faces: Int32Array): [Int32Array, Int32Array] {
  const farthest = (from: number): number => {
    const { dist } = growFrom(g, faces, [from], false);
    let best = 0;
    for (let i = 1; i < dist.length; i++) if (dist[i] > dist[best] && Number.isFinite(dist[i])) best = i;
    return faces[best];
  };
  const a = farthest(faces[0]);
  const b = farthest(a);
  const { label } = growFrom(g, faces, [a, b === a ? faces[faces.length - 1] : b], true);
  const first: number[] = [];
  const second: number[] = [];
  faces.forEach((f, i) => (label[i] === 0 ? first : second).push(f));
  return [Int32Array.from(first), Int32Array.from(second)];
}

/** Max stretch of a chart after flattening, percent; Infinity when it cannot be flattened. */
function chartStretchPct(mesh: TriMesh, faces: Int32Array, arapIterations?: number): number {
  const remap = new Map<number, number>();
  const triangles = new Uint32Array(3 * faces.length);
  const coords: number[] = [];
  faces.forEach((f, i) => {
    for (let k = 0; k < 3; k++) {
      const v = mesh.triangles[3 * f + k];
      let lv = remap.get(v);
      if (lv === undefined) {
        lv = remap.size;
        remap.set(v, lv);
        coords.push(mesh.positions[3 * v], mesh.positions[3 * v + 1], mesh.positions[3 * v + 2]);
      }
      triangles[3 * i + k] = lv;
    }
  });
  try {
    const flat = flattenPiece(
      { positions: Float64Array.from(coords), triangles },
      arapIterations === undefined ? undefined : { arapIterations },
    );
    return flat.flipped > 0 ? Infinity : flat.stretch.maxPct;
  } catch (e) {
    if (isGeometryError(e)) return Infinity;
    throw e;
  }
}

/**
 * Greedy merge of neighbouring charts, in rounds: each round tries every pair of neighbouring charts once, the
 * pairs with the fewest faces together first (a small union is cheap to flatten and most likely to fit), and a
 * chart takes part in at most one merge per round. A merge is kept when the union fits; a pair that failed is
 * not tried again until one of the two has grown. Rounds repeat until none merges. Returns the merged charts
 * in order of their smallest face.
 */
function mergeCharts(
  g: FaceGraph,
  chartOf: Int32Array,
  initialStretch: number[],
  stretchOf: (faces: Int32Array) => number,
  budget: number,
  only?: Uint8Array,
): Int32Array[] {
  const chartCount = initialStretch.length;
  const stretch = initialStretch.slice();
  const area = new Float64Array(chartCount);
  for (let f = 0; f < g.faceCount; f++) if (chartOf[f] >= 0) area[chartOf[f]] += g.areas[f];
  const members: number[][] = Array.from({ length: chartCount }, () => []);
  for (let f = 0; f < g.faceCount; f++) if (chartOf[f] >= 0) members[chartOf[f]].push(f);
  const label = Int32Array.from(chartOf);
  const failed = new Set<string>();
  for (let merged = true; merged; ) {
    merged = false;
    const pairs = new Map<string, [number, number]>();
    for (let f = 0; f < g.faceCount; f++) {
      for (let k = 0; k < 3; k++) {
        const t = g.twin[3 * f + k];
        if (t < 0) continue;
        const a = label[f];
        const b = label[(t / 3) | 0];
        if (a < 0 || (only && (!only[f] || !only[(t / 3) | 0]))) continue;
        if (a < b) pairs.set(`${a}:${b}:${members[a].length}:${members[b].length}`, [a, b]);
      }
    }
    const order = [...pairs.entries()].sort(
      ([, [a1, b1]], [, [a2, b2]]) =>
        members[a1].length + members[b1].length - members[a2].length - members[b2].length || a1 - a2 || b1 - b2,
    );
    const touched = new Uint8Array(chartCount);
    for (const [key, [a, b]] of order) {
      if (touched[a] || touched[b] || failed.has(key)) continue;
      // Expected stretch of the union: each part's stretch grown with the area it would become (see
      // splitUntilFit); a union expected well over budget is not worth a trial flattening.
      const unionArea = area[a] + area[b];
      const expected = Math.max(stretch[a] * (unionArea / area[a]), stretch[b] * (unionArea / area[b]));
      if (expected > MERGE_SKIP_FACTOR * budget) {
        failed.add(key);
        continue;
      }
      const union = Int32Array.from([...members[a], ...members[b]]);
      const unionStretch = stretchOf(union);
      if (!(unionStretch <= budget)) {
        failed.add(key);
        continue;
      }
      stretch[a] = unionStretch;
      area[a] = unionArea;
      for (const f of members[b]) label[f] = a;
      members[a] = Array.from(union);
      members[b] = [];
      touched[a] = touched[b] = 1;
      merged = true;
    }
  }
  const out: Int32Array[] = [];
  const seen = new Uint8Array(chartCount);
  for (let f = 0; f < g.faceCount; f++) {
    const c = label[f];
    if (c < 0) continue;
    if (!seen[c]) {
      seen[c] = 1;
      out.push(Int32Array.from(members[c]));
    }
  }
  return out;
}

