import { GeometryError } from '../errors';

/** What the flattening steps need to know about a piece's connectivity. */
export interface PieceTopology {
  /** Per half-edge h = 3f+i, the opposite half-edge or −1 on the boundary. */
  twin: Int32Array;
  /** Half-edges with no twin, in increasing order (each runs with the piece on its left). */
  boundary: Int32Array;
  /** Number of boundary loops (1 for a disk, 1 + holes otherwise). */
  loops: number;
}

/**
 * Checks that `positions` (3V, mm) and `triangles` (3F) describe a piece the flattener can lay flat —
 * one connected, consistently wound, edge-manifold surface with at least one boundary loop, every vertex
 * used, coordinates finite, no zero-area triangle — and returns its half-edge twins and boundary.
 * Throws GeometryError FLATTEN_FAILED saying what is wrong and at which face or vertex.
 */
export function pieceTopology(positions: Float64Array, triangles: Uint32Array): PieceTopology {
  if (positions.length % 3 !== 0) {
    throw new GeometryError('FLATTEN_FAILED', `positions length ${positions.length} is not a multiple of 3`);
  }
  if (triangles.length % 3 !== 0 || triangles.length === 0) {
    throw new GeometryError('FLATTEN_FAILED', `piece has ${triangles.length} triangle indices: need a non-zero multiple of 3`);
  }
  const nv = positions.length / 3;
  const nf = triangles.length / 3;
  for (let i = 0; i < positions.length; i++) {
    if (!Number.isFinite(positions[i])) {
      throw new GeometryError('FLATTEN_FAILED', `vertex ${Math.floor(i / 3)} has a non-finite coordinate`, {
        vertex: Math.floor(i / 3),
      });
    }
  }
  const used = new Uint8Array(nv);
  let extent = 0;
  for (let i = 0; i < positions.length; i++) extent = Math.max(extent, Math.abs(positions[i]));
  for (let f = 0; f < nf; f++) {
    const a = triangles[3 * f];
    const b = triangles[3 * f + 1];
    const c = triangles[3 * f + 2];
    if (a >= nv || b >= nv || c >= nv) {
      throw new GeometryError('FLATTEN_FAILED', `triangle ${f} refers to a vertex past the last one (${nv - 1})`, { face: f });
    }
    if (a === b || b === c || c === a) {
      throw new GeometryError('FLATTEN_FAILED', `triangle ${f} repeats a vertex`, { face: f });
    }
    used[a] = used[b] = used[c] = 1;
    const ux = positions[3 * b] - positions[3 * a];
    const uy = positions[3 * b + 1] - positions[3 * a + 1];
    const uz = positions[3 * b + 2] - positions[3 * a + 2];
    const vx = positions[3 * c] - positions[3 * a];
    const vy = positions[3 * c + 1] - positions[3 * a + 1];
    const vz = positions[3 * c + 2] - positions[3 * a + 2];
    const cx = uy * vz - uz * vy;
    const cy = uz * vx - ux * vz;
    const cz = ux * vy - uy * vx;
    const cross = Math.sqrt(cx * cx + cy * cy + cz * cz);
    const longest = Math.max(ux * ux + uy * uy + uz * uz, vx * vx + vy * vy + vz * vz);
    // Zero area to within rounding of the coordinates' magnitude: no direction in the plane exists.
    if (!(cross > 1e-14 * Math.max(longest, extent * extent * 1e-12))) {
      throw new GeometryError('FLATTEN_FAILED', `triangle ${f} has zero area (its corners are in a line)`, { face: f });
    }
  }
  for (let v = 0; v < nv; v++) {
    if (!used[v]) {
      throw new GeometryError('FLATTEN_FAILED', `vertex ${v} belongs to no triangle of the piece`, { vertex: v });
    }
  }

  // Twins: bucket half-edges by their lower endpoint, then match the higher endpoint inside a bucket.
  const nh = 3 * nf;
  const start = new Int32Array(nv + 1);
  const lowOf = (h: number): number => Math.min(triangles[h], triangles[h - (h % 3) + ((h % 3) + 1) % 3]);
  const highOf = (h: number): number => Math.max(triangles[h], triangles[h - (h % 3) + ((h % 3) + 1) % 3]);
  for (let h = 0; h < nh; h++) start[lowOf(h) + 1]++;
  for (let v = 0; v < nv; v++) start[v + 1] += start[v];
  const fillAt = start.slice(0, nv);
  const bucket = new Int32Array(nh);
  for (let h = 0; h < nh; h++) bucket[fillAt[lowOf(h)]++] = h;
  const twin = new Int32Array(nh).fill(-1);
  let boundaryCount = 0;
  for (let v = 0; v < nv; v++) {
    for (let p = start[v]; p < start[v + 1]; p++) {
      const h = bucket[p];
      if (twin[h] !== -1) continue;
      const hi = highOf(h);
      let mate = -1;
      for (let q = p + 1; q < start[v + 1]; q++) {
        const g = bucket[q];
        if (highOf(g) !== hi) continue;
        if (mate !== -1 || twin[g] !== -1) {
          throw new GeometryError(
            'FLATTEN_FAILED',
            `edge ${v}–${hi} is shared by more than two triangles (${Math.floor(h / 3)}, ${Math.floor(g / 3)}, …): the piece is not a surface there`,
            { face: Math.floor(g / 3) },
          );
        }
        mate = g;
      }
      if (mate === -1) {
        boundaryCount++;
        continue;
      }
      if (triangles[h] === triangles[mate]) {
        throw new GeometryError(
          'FLATTEN_FAILED',
          `triangles ${Math.floor(h / 3)} and ${Math.floor(mate / 3)} are wound in opposite directions across edge ${v}–${hi}`,
          { face: Math.floor(mate / 3) },
        );
      }
      twin[h] = mate;
      twin[mate] = h;
    }
  }
  if (boundaryCount === 0) {
    throw new GeometryError('FLATTEN_FAILED', 'piece has no boundary: add a seam that cuts it open');
  }
  const boundary = new Int32Array(boundaryCount);
  let b = 0;
  for (let h = 0; h < nh; h++) if (twin[h] === -1) boundary[b++] = h;

  // Connectivity over faces through twins.
  const seen = new Uint8Array(nf);
  const stack = new Int32Array(nf);
  let top = 0;
  stack[top++] = 0;
  seen[0] = 1;
  let reached = 1;
  while (top > 0) {
    const f = stack[--top];
    for (let i = 0; i < 3; i++) {
      const t = twin[3 * f + i];
      if (t >= 0 && !seen[Math.floor(t / 3)]) {
        seen[Math.floor(t / 3)] = 1;
        stack[top++] = Math.floor(t / 3);
        reached++;
      }
    }
  }
  if (reached < nf) {
    const stray = seen.indexOf(0);
    throw new GeometryError(
      'FLATTEN_FAILED',
      `piece falls apart into separate parts (triangle ${stray} is not connected to triangle 0 across an edge)`,
      { face: stray },
    );
  }
  return { twin, boundary, loops: countLoops(triangles, boundary, nv) };
}

function countLoops(triangles: Uint32Array, boundary: Int32Array, nv: number): number {
  // Union-find over boundary vertices joined by boundary edges.
  const parent = new Int32Array(nv);
  for (let v = 0; v < nv; v++) parent[v] = v;
  const find = (v: number): number => {
    while (parent[v] !== v) {
      parent[v] = parent[parent[v]];
      v = parent[v];
    }
    return v;
  };
  const onBoundary = new Uint8Array(nv);
  for (const h of boundary) {
    const a = triangles[h];
    const b = triangles[h - (h % 3) + ((h % 3) + 1) % 3];
    onBoundary[a] = onBoundary[b] = 1;
    parent[find(a)] = find(b);
  }
  let loops = 0;
  for (let v = 0; v < nv; v++) if (onBoundary[v] && find(v) === v) loops++;
  return loops;
}
