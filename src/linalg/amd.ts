/**
 * Approximate minimum degree ordering of a symmetric pattern (Amestoy, Davis & Duff, "An
 * approximate minimum degree ordering algorithm", SIAM J. Matrix Anal. Appl. 17, 1996), on the
 * quotient graph with element absorption, mass elimination, supervariables found by hashing,
 * dense rows ordered last, and a postorder of the assembly tree (as CSparse's cs_amd).
 *
 * Key to the names: the graph lives in `Cp`/`Ci` (Ci with elbow room, compacted when full): for a
 * variable i, Ci[Cp[i] …] lists elen[i] elements then len[i]−elen[i] variables; for an element e,
 * its len[e] variables. `nv[i]` supervariable size (0: absorbed; negative: in the current pivot
 * element); `elen[i]` −2 for elements, −1 for absorbed/dense variables; `degree` approximate
 * external degree; `head`/`next`/`last` degree lists; `w` the |Le \ Lk| marks; `hhead` hash
 * buckets; `Cp[i] = flip(parent)` once i is absorbed; `k` pivot; `nel` variables eliminated.
 */

const flip = (i: number): number => -i - 2;

/** Reset the marks when `mark + lemax` would overflow (cs_wclear). */
function clearMarks(mark: number, lemax: number, w: Int32Array, n: number): number {
  if (mark < 2 || mark + lemax > 0x3fffffff) {
    for (let k = 0; k < n; k++) if (w[k] !== 0) w[k] = 1;
    mark = 2;
  }
  return mark;
}

/** Postorder of the tree rooted at j given as child lists head/next; writes post[k …], returns k. */
function treePostorder(
  j: number,
  k: number,
  head: Int32Array,
  next: Int32Array,
  post: Int32Array,
  stack: Int32Array,
): number {
  let top = 0;
  stack[0] = j;
  while (top >= 0) {
    const p = stack[top]!;
    const i = head[p]!;
    if (i === -1) {
      top--;
      post[k++] = p;
    } else {
      head[p] = next[i]!;
      stack[++top] = i;
    }
  }
  return k;
}

/**
 * The pattern of C = B + Bᵀ without its diagonal, where B(rowPos[i], j) = A(i, j); duplicates
 * merged. Ci gets elbow room for the ordering (nnz/5 + 2n spare entries).
 */
export function symmetrizedPattern(
  n: number,
  Ap: Int32Array,
  Ai: Int32Array,
  rowPos: Int32Array | null,
): { Cp: Int32Array; Ci: Int32Array; nnz: number } {
  const count = new Int32Array(n + 1);
  const nnzA = Ap[n]!;
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const i = rowPos === null ? Ai[p]! : rowPos[Ai[p]!]!;
      if (i === j) continue;
      count[i]!++;
      count[j]!++;
    }
  }
  const start = new Int32Array(n + 1);
  for (let j = 0; j < n; j++) start[j + 1] = start[j]! + count[j]!;
  const fill = start.slice(0, n);
  const raw = new Int32Array(Math.max(start[n]!, 1));
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const i = rowPos === null ? Ai[p]! : rowPos[Ai[p]!]!;
      if (i === j) continue;
      raw[fill[i]!++] = j;
      raw[fill[j]!++] = i;
    }
  }
  const seen = new Int32Array(n).fill(-1);
  const Cp = new Int32Array(n + 1);
  let nz = 0;
  for (let j = 0; j < n; j++) {
    Cp[j] = nz;
    for (let p = start[j]!; p < start[j + 1]!; p++) {
      const i = raw[p]!;
      if (seen[i] === j) continue;
      seen[i] = j;
      raw[nz++] = i;
    }
  }
  Cp[n] = nz;
  const Ci = new Int32Array(nz + Math.floor(nz / 5) + 2 * n + Math.floor(nnzA / 5) + 1);
  Ci.set(raw.subarray(0, nz));
  return { Cp, Ci, nnz: nz };
}

/**
 * Approximate minimum degree order of the symmetric pattern (Cp, Ci) (no diagonal, both
 * triangles, Cp of length n+1; both arrays are destroyed). Returns P with P[k] the node eliminated
 * at step k.
 */
export function amdOrder(n: number, Cp: Int32Array, Ci: Int32Array): Int32Array {
  const P = new Int32Array(n + 1);
  if (n === 0) return P.subarray(0, 0);
  const len = new Int32Array(n + 1);
  const nv = new Int32Array(n + 1);
  const next = new Int32Array(n + 1);
  const head = new Int32Array(n + 1);
  const elen = new Int32Array(n + 1);
  const degree = new Int32Array(n + 1);
  const w = new Int32Array(n + 1);
  const hhead = new Int32Array(n + 1);
  const last = P; // shares storage with P until the postorder
  const nzmax = Ci.length;
  let cnz = Cp[n]!;
  let dense = Math.max(16, 10 * Math.sqrt(n));
  dense = Math.min(n - 2, dense);

  // --- Initialize the quotient graph --------------------------------------------------------
  for (let k = 0; k < n; k++) len[k] = Cp[k + 1]! - Cp[k]!;
  len[n] = 0;
  for (let i = 0; i <= n; i++) {
    head[i] = -1;
    last[i] = -1;
    next[i] = -1;
    hhead[i] = -1;
    nv[i] = 1;
    w[i] = 1;
    elen[i] = 0;
    degree[i] = len[i]!;
  }
  let mark = clearMarks(0, 0, w, n);
  elen[n] = -2; // n is the root of the dense rows
  Cp[n] = -1;
  w[n] = 0;

  // --- Initialize the degree lists ----------------------------------------------------------
  let nel = 0;
  for (let i = 0; i < n; i++) {
    const d = degree[i]!;
    if (d === 0) {
      elen[i] = -2; // an empty node is eliminated at once
      nel++;
      Cp[i] = -1;
      w[i] = 0;
    } else if (d > dense) {
      nv[i] = 0; // a dense node is absorbed into the root and ordered last
      elen[i] = -1;
      nel++;
      Cp[i] = flip(n);
      nv[n]!++;
    } else {
      if (head[d] !== -1) last[head[d]!] = i;
      next[i] = head[d]!;
      head[d] = i;
    }
  }

  let mindeg = 0;
  let lemax = 0;
  while (nel < n) {
    // --- Select a pivot of minimum approximate degree --------------------------------------
    while (mindeg < n && head[mindeg] === -1) mindeg++;
    const k = head[mindeg]!;
    if (next[k] !== -1) last[next[k]!] = -1;
    head[mindeg] = next[k]!;
    const elenk = elen[k]!;
    let nvk = nv[k]!;
    nel += nvk;

    // --- Garbage collection ----------------------------------------------------------------
    if (elenk > 0 && cnz + mindeg >= nzmax) {
      for (let j = 0; j < n; j++) {
        const p = Cp[j]!;
        if (p >= 0) {
          Cp[j] = Ci[p]!; // save the first entry of j
          Ci[p] = flip(j); // and put j's flipped index in its place
        }
      }
      let qq = 0;
      for (let p = 0; p < cnz; ) {
        const j = flip(Ci[p++]!);
        if (j >= 0) {
          Ci[qq] = Cp[j]!;
          Cp[j] = qq++;
          for (let k3 = 0; k3 < len[j]! - 1; k3++) Ci[qq++] = Ci[p++]!;
        }
      }
      cnz = qq;
    }

    // --- Construct the new element Lk -------------------------------------------------------
    let dk = 0;
    nv[k] = -nvk;
    let p = Cp[k]!;
    const pk1 = elenk === 0 ? p : cnz;
    let pk2 = pk1;
    for (let k1 = 1; k1 <= elenk + 1; k1++) {
      let e: number;
      let pj: number;
      let ln: number;
      if (k1 > elenk) {
        e = k; // search the variables of k itself
        pj = p;
        ln = len[k]! - elenk;
      } else {
        e = Ci[p++]!; // search the variables of element e
        pj = Cp[e]!;
        ln = len[e]!;
      }
      for (let k2 = 1; k2 <= ln; k2++) {
        const i = Ci[pj++]!;
        const nvi = nv[i]!;
        if (nvi <= 0) continue; // already in Lk, or absorbed
        dk += nvi;
        nv[i] = -nvi; // i is now in Lk
        Ci[pk2++] = i;
        if (next[i] !== -1) last[next[i]!] = last[i]!;
        if (last[i] !== -1) next[last[i]!] = next[i]!;
        else head[degree[i]!] = next[i]!;
      }
      if (e !== k) {
        Cp[e] = flip(k); // element e is absorbed into k
        w[e] = 0;
      }
    }
    if (elenk !== 0) cnz = pk2;
    degree[k] = dk;
    Cp[k] = pk1;
    len[k] = pk2 - pk1;
    elen[k] = -2; // k is now an element

    // --- Find the set differences |Le \ Lk| ----------------------------------------------------
    mark = clearMarks(mark, lemax, w, n);
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk]!;
      const eln = elen[i]!;
      if (eln <= 0) continue;
      const nvi = -nv[i]!;
      const wnvi = mark - nvi;
      for (let q = Cp[i]!; q <= Cp[i]! + eln - 1; q++) {
        const e = Ci[q]!;
        if (w[e]! >= mark) w[e]! -= nvi;
        else if (w[e] !== 0) w[e] = degree[e]! + wnvi;
      }
    }

    // --- Degree update and element absorption ---------------------------------------------------
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk]!;
      const p1 = Cp[i]!;
      const p2 = p1 + elen[i]! - 1;
      let pn = p1;
      let h = 0;
      let d = 0;
      for (let q = p1; q <= p2; q++) {
        const e = Ci[q]!;
        if (w[e] !== 0) {
          const dext = w[e]! - mark;
          if (dext > 0) {
            d += dext;
            Ci[pn++] = e;
            h += e;
          } else {
            Cp[e] = flip(k); // aggressive absorption: Le ⊆ Lk
            w[e] = 0;
          }
        }
      }
      elen[i] = pn - p1 + 1;
      const p3 = pn;
      const p4 = p1 + len[i]!;
      for (let q = p2 + 1; q < p4; q++) {
        const j = Ci[q]!;
        const nvj = nv[j]!;
        if (nvj <= 0) continue;
        d += nvj;
        Ci[pn++] = j;
        h += j;
      }
      if (d === 0) {
        Cp[i] = flip(k); // mass elimination: i is adjacent to k only
        const nvi = -nv[i]!;
        dk -= nvi;
        nvk += nvi;
        nel += nvi;
        nv[i] = 0;
        elen[i] = -1;
      } else {
        degree[i] = Math.min(degree[i]!, d);
        Ci[pn] = Ci[p3]!; // move the first variable to the end
        Ci[p3] = Ci[p1]!; // move the first element to the end of the element list
        Ci[p1] = k; // add k as the first element
        len[i] = pn - p1 + 1;
        h = (h < 0 ? -h : h) % n;
        next[i] = hhead[h]!;
        hhead[h] = i;
        last[i] = h; // save the hash of i
      }
    }
    degree[k] = dk;
    lemax = Math.max(lemax, dk);
    mark = clearMarks(mark + lemax, lemax, w, n);

    // --- Supervariable detection ------------------------------------------------------------
    for (let pk = pk1; pk < pk2; pk++) {
      let i = Ci[pk]!;
      if (nv[i]! >= 0) continue;
      const h = last[i]!;
      i = hhead[h]!;
      hhead[h] = -1;
      for (; i !== -1 && next[i] !== -1; i = next[i]!, mark++) {
        const ln = len[i]!;
        const eln = elen[i]!;
        for (let q = Cp[i]! + 1; q <= Cp[i]! + ln - 1; q++) w[Ci[q]!] = mark;
        let jlast = i;
        for (let j = next[i]!; j !== -1; ) {
          let ok = len[j] === ln && elen[j] === eln;
          for (let q = Cp[j]! + 1; ok && q <= Cp[j]! + ln - 1; q++) if (w[Ci[q]!] !== mark) ok = false;
          if (ok) {
            Cp[j] = flip(i); // j is absorbed into supervariable i
            nv[i]! += nv[j]!;
            nv[j] = 0;
            elen[j] = -1;
            j = next[j]!;
            next[jlast] = j;
          } else {
            jlast = j;
            j = next[j]!;
          }
        }
      }
    }

    // --- Finalize the new element -----------------------------------------------------------
    let pout = pk1;
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk]!;
      const nvi = -nv[i]!;
      if (nvi <= 0) continue;
      nv[i] = nvi;
      let d = degree[i]! + dk - nvi;
      d = Math.min(d, n - nel - nvi);
      if (head[d] !== -1) last[head[d]!] = i;
      next[i] = head[d]!;
      last[i] = -1;
      head[d] = i;
      mindeg = Math.min(mindeg, d);
      degree[i] = d;
      Ci[pout++] = i;
    }
    nv[k] = nvk;
    len[k] = pout - pk1;
    if (len[k] === 0) {
      Cp[k] = -1; // k is a root of the assembly tree
      w[k] = 0;
    }
    if (elenk !== 0) cnz = pout;
  }

  // --- Postorder the assembly tree ---------------------------------------------------------------
  for (let i = 0; i < n; i++) Cp[i] = flip(Cp[i]!);
  for (let j = 0; j <= n; j++) head[j] = -1;
  for (let j = n; j >= 0; j--) {
    if (nv[j]! > 0) continue; // variables absorbed into their parent
    next[j] = head[Cp[j]!]!;
    head[Cp[j]!] = j;
  }
  for (let e = n; e >= 0; e--) {
    if (nv[e]! <= 0) continue; // elements, in their parent's list
    if (Cp[e] !== -1) {
      next[e] = head[Cp[e]!]!;
      head[Cp[e]!] = e;
    }
  }
  let kk = 0;
  for (let i = 0; i <= n; i++) if (Cp[i] === -1) kk = treePostorder(i, kk, head, next, P, w);
  return P.subarray(0, n);
}
