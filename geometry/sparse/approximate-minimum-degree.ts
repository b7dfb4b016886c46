import type { SparseSymmetricMatrix } from './sparse-symmetric-matrix';

const VARIABLE = 0;
const ELEMENT = 1;
const DEAD = 2;

/**
 * Returns an approximate-minimum-degree elimination order for a symmetric matrix (perm[k] = original index
 * of pivot k). Amestoy, Davis & Duff 1996, "An approximate minimum degree ordering algorithm", SIAM J.
 * Matrix Anal. Appl. 17(4): elimination runs on the quotient graph (eliminated pivots become "elements"
 * whose variable lists stand for the cliques their elimination creates), each step takes a variable of
 * least approximate external degree — the paper's bound |A_i| + |L_p \ i| + Σ_e |L_e \ L_p|, never above
 * the previous degree plus |L_p| — absorbs every element whose variables all lie in the new element
 * (aggressive absorption), eliminates at once the variables left with no outside neighbours (mass
 * elimination), and merges variables with identical lists into supervariables found by hashing.
 * Deterministic (ties go to the most recently listed variable of least degree). Written for this engine
 * from the paper's description; the graph is the matrix pattern without its diagonal.
 */
export function approximateMinimumDegree(a: SparseSymmetricMatrix): Int32Array {
  const n = a.n;
  const order = new Int32Array(n);
  if (n === 0) return order;
  const { colPtr, rowIdx } = a;

  // Each live object (variable or element) owns the slice iw[pe[i], pe[i] + len[i]); a variable's slice
  // starts with its elen[i] adjacent elements, then its adjacent variables. New elements are appended at
  // `free`; when space runs short the live slices are copied into a fresh array.
  let nnz = 0;
  for (let j = 0; j < n; j++) for (let p = colPtr[j]; p < colPtr[j + 1]; p++) if (rowIdx[p] !== j) nnz++;
  let iw = new Int32Array(Math.max(nnz + (nnz >> 2) + 2 * n, 16));
  const pe = new Int32Array(n);
  const len = new Int32Array(n);
  const elen = new Int32Array(n);
  const kind = new Uint8Array(n);
  const nv = new Int32Array(n).fill(1);
  const degree = new Int32Array(n);
  const w = new Int32Array(n);
  const tag = new Int32Array(n);
  const head = new Int32Array(n + 1).fill(-1);
  const next = new Int32Array(n).fill(-1);
  const prev = new Int32Array(n).fill(-1);
  const hashOf = new Int32Array(n);
  const hashHead = new Int32Array(n).fill(-1);
  const hashNext = new Int32Array(n).fill(-1);
  // Members of each supervariable, as a chain: chainNext[i] after i, chainLast[i] the chain's tail.
  const chainNext = new Int32Array(n).fill(-1);
  const chainLast = new Int32Array(n);
  let free = 0;
  for (let j = 0; j < n; j++) {
    pe[j] = free;
    for (let p = colPtr[j]; p < colPtr[j + 1]; p++) if (rowIdx[p] !== j) iw[free++] = rowIdx[p];
    len[j] = free - pe[j];
    degree[j] = len[j];
    chainLast[j] = j;
  }

  const listInsert = (i: number, d: number): void => {
    prev[i] = -1;
    next[i] = head[d];
    if (head[d] !== -1) prev[head[d]] = i;
    head[d] = i;
  };
  const listRemove = (i: number): void => {
    if (prev[i] !== -1) next[prev[i]] = next[i];
    else head[degree[i]] = next[i];
    if (next[i] !== -1) prev[next[i]] = prev[i];
  };
  for (let i = 0; i < n; i++) listInsert(i, degree[i]);

  let out = 0;
  const emit = (i: number): void => {
    for (let j = i; j !== -1; j = chainNext[j]) order[out++] = j;
  };
  const compact = (need: number): void => {
    let size = 0;
    for (let i = 0; i < n; i++) if (kind[i] !== DEAD) size += len[i];
    const fresh = new Int32Array(Math.max(iw.length, 2 * (size + need) + 16));
    let q = 0;
    for (let i = 0; i < n; i++) {
      if (kind[i] === DEAD) continue;
      fresh.set(iw.subarray(pe[i], pe[i] + len[i]), q);
      pe[i] = q;
      q += len[i];
    }
    iw = fresh;
    free = q;
  };

  let mark = 1;
  let tagMark = 0;
  let lemax = 0;
  let mindeg = 0;
  let eliminated = 0;
  while (eliminated < n) {
    // 1. Pivot: a variable of least approximate degree.
    while (head[mindeg] === -1) mindeg++;
    const piv = head[mindeg];
    listRemove(piv);
    const nvPiv = nv[piv];
    eliminated += nvPiv;
    emit(piv);

    // 2. New element L_p: the variables adjacent to piv directly or through its elements, which it absorbs.
    let bound = len[piv] - elen[piv];
    for (let q = pe[piv]; q < pe[piv] + elen[piv]; q++) bound += len[iw[q]];
    if (free + bound > iw.length) compact(bound);
    const lpStart = free;
    let lpEnd = free;
    let dk = 0;
    nv[piv] = -nvPiv;
    for (let q = pe[piv]; q < pe[piv] + len[piv]; q++) {
      const e = iw[q];
      if (q < pe[piv] + elen[piv]) {
        if (kind[e] !== ELEMENT) continue;
        for (let r = pe[e]; r < pe[e] + len[e]; r++) {
          const i = iw[r];
          if (nv[i] <= 0 || kind[i] !== VARIABLE) continue;
          dk += nv[i];
          nv[i] = -nv[i];
          iw[lpEnd++] = i;
          listRemove(i);
        }
        kind[e] = DEAD;
      } else {
        const i = e;
        if (nv[i] <= 0 || kind[i] !== VARIABLE) continue;
        dk += nv[i];
        nv[i] = -nv[i];
        iw[lpEnd++] = i;
        listRemove(i);
      }
    }
    free = lpEnd;
    kind[piv] = ELEMENT;
    pe[piv] = lpStart;
    len[piv] = lpEnd - lpStart;
    elen[piv] = 0;

    // 3. |L_e \ L_p| for every element e next to a variable of L_p, kept in w[e] − mark.
    if (mark + lemax + dk + 2 > 0x3fffffff) {
      w.fill(0);
      mark = 1;
    }
    for (let q = lpStart; q < lpEnd; q++) {
      const i = iw[q];
      const nvi = -nv[i];
      for (let r = pe[i]; r < pe[i] + elen[i]; r++) {
        const e = iw[r];
        if (kind[e] !== ELEMENT || e === piv) continue;
        if (w[e] >= mark) w[e] -= nvi;
        else w[e] = degree[e] + mark - nvi;
      }
    }

    // 4. Degree update, list pruning, aggressive absorption and mass elimination.
    for (let q = lpStart; q < lpEnd; q++) {
      const i = iw[q];
      const start = pe[i];
      let keep = start;
      let d = 0;
      let hash = 0;
      // Elements first (piv goes in front afterwards), then variables outside L_p.
      for (let r = start; r < start + elen[i]; r++) {
        const e = iw[r];
        if (kind[e] !== ELEMENT || e === piv) continue;
        const dext = w[e] - mark;
        if (dext > 0) {
          d += dext;
          iw[keep++] = e;
          hash += e;
        } else {
          kind[e] = DEAD; // every variable of e is in L_p: e is absorbed into piv
        }
      }
      const newElen = keep - start + 1;
      for (let r = start + elen[i]; r < start + len[i]; r++) {
        const j = iw[r];
        if (nv[j] <= 0 || kind[j] !== VARIABLE) continue;
        d += nv[j];
        iw[keep++] = j;
        hash += j;
      }
      if (d === 0) {
        // Mass elimination: i is only adjacent to L_p through piv.
        const nvi = -nv[i];
        dk -= nvi;
        eliminated += nvi;
        nv[i] = 0;
        kind[i] = DEAD;
        emit(i);
        continue;
      }
      degree[i] = Math.min(degree[i], d);
      // Put piv first among the elements: move the first variable to the end, the first element to its place.
      // There is room: piv, or an element absorbed into it, was in i's list before.
      iw[keep] = iw[start + newElen - 1];
      iw[start + newElen - 1] = iw[start];
      iw[start] = piv;
      len[i] = keep - start + 1;
      elen[i] = newElen;
      const h = (hash + piv) % n;
      hashOf[i] = h;
      hashNext[i] = hashHead[h];
      hashHead[h] = i;
    }
    degree[piv] = dk;
    lemax = Math.max(lemax, dk);
    mark += lemax + 1;

    // 5. Supervariables: variables of L_p with identical element and variable lists merge.
    for (let q = lpStart; q < lpEnd; q++) {
      const first = iw[q];
      if (nv[first] >= 0) continue; // dead, or its bucket was already handled
      const h = hashOf[first];
      let i = hashHead[h];
      hashHead[h] = -1;
      for (; i !== -1; i = hashNext[i]) {
        if (nv[i] >= 0) continue;
        tagMark++;
        for (let r = pe[i]; r < pe[i] + len[i]; r++) tag[iw[r]] = tagMark;
        let before = i;
        for (let j = hashNext[i]; j !== -1; j = hashNext[j]) {
          let same = nv[j] < 0 && len[j] === len[i] && elen[j] === elen[i];
          for (let r = pe[j]; same && r < pe[j] + len[j]; r++) if (tag[iw[r]] !== tagMark) same = false;
          if (same) {
            nv[i] += nv[j]; // both negative while in L_p
            nv[j] = 0;
            kind[j] = DEAD;
            chainNext[chainLast[i]] = j;
            chainLast[i] = chainLast[j];
            hashNext[before] = hashNext[j];
          } else {
            before = j;
          }
        }
      }
    }

    // 6. Finish: surviving variables of L_p get their new degree; L_p keeps only them.
    let keep = lpStart;
    for (let q = lpStart; q < lpEnd; q++) {
      const i = iw[q];
      if (nv[i] >= 0) continue;
      const nvi = -nv[i];
      nv[i] = nvi;
      const d = Math.min(degree[i] + dk - nvi, n - eliminated - nvi);
      degree[i] = d;
      listInsert(i, d);
      if (d < mindeg) mindeg = d;
      iw[keep++] = i;
    }
    len[piv] = keep - lpStart;
    nv[piv] = nvPiv;
    if (len[piv] === 0) kind[piv] = DEAD;
    free = keep;
  }
  return order;
}
