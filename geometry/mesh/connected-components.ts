/** Connected components of a mesh's faces. */
export interface FaceComponents {
  /** Number of components. */
  count: number;
  /** Per triangle, its component index 0…count−1, numbered in order of each component's smallest face id. */
  faceComponent: Uint32Array;
}

function find(parent: Uint32Array, x: number): number {
  while (parent[x] !== x) {
    parent[x] = parent[parent[x]];
    x = parent[x];
  }
  return x;
}

function label(parent: Uint32Array): FaceComponents {
  const n = parent.length;
  const faceComponent = new Uint32Array(n);
  const ids = new Int32Array(n).fill(-1);
  let count = 0;
  for (let i = 0; i < n; i++) {
    const r = find(parent, i);
    if (ids[r] < 0) ids[r] = count++;
    faceComponent[i] = ids[r];
  }
  return { count, faceComponent };
}

/**
 * Returns the components of faces joined across paired edges (twin ≥ 0), by union–find with path halving.
 * `twin` Int32Array(3F) from `buildTwins`; a non-manifold edge (left unpaired) separates faces. When
 * `blocked` (Uint8Array(3F), e.g. a seam mask) is given, half-edges with blocked[h] ≠ 0 separate faces too.
 */
export function faceComponents(twin: Int32Array, blocked?: Uint8Array): FaceComponents {
  const F = twin.length / 3;
  const parent = new Uint32Array(F);
  for (let f = 0; f < F; f++) parent[f] = f;
  for (let h = 0; h < twin.length; h++) {
    const t = twin[h];
    if (t <= h || (blocked && (blocked[h] || blocked[t]))) continue;
    const a = find(parent, (h / 3) | 0);
    const b = find(parent, (t / 3) | 0);
    if (a !== b) parent[a < b ? b : a] = a < b ? a : b;
  }
  return label(parent);
}

/**
 * Returns the components of faces that share any vertex (so two sheets touching at one vertex or along a
 * non-manifold edge count as one). `triangles` Uint32Array(3F), `vertexCount` V.
 */
export function vertexSharingComponents(triangles: Uint32Array, vertexCount: number): FaceComponents {
  const F = triangles.length / 3;
  const parent = new Uint32Array(F);
  for (let f = 0; f < F; f++) parent[f] = f;
  const firstFace = new Int32Array(vertexCount).fill(-1);
  for (let c = 0; c < triangles.length; c++) {
    const v = triangles[c];
    const f = (c / 3) | 0;
    if (firstFace[v] < 0) {
      firstFace[v] = f;
      continue;
    }
    const a = find(parent, firstFace[v]);
    const b = find(parent, f);
    if (a !== b) parent[a < b ? b : a] = a < b ? a : b;
  }
  return label(parent);
}
