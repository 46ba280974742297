/**
 * A maximum transversal: a row for every column, each on a nonzero entry, so that the permuted
 * matrix has a zero-free diagonal (Duff, "On algorithms for obtaining a maximum transversal",
 * ACM TOMS 7, 1981; the depth-first augmenting search of CSparse's cs_maxtrans). Branch rows of
 * circuit matrices (voltage sources, amplifier outputs) have a zero diagonal; the matching pairs
 * their column with a row that holds a ±1.
 *
 * Key to the names: `Ap`/`Ai`/`Ax` the matrix (entries whose value is exactly zero count as
 * absent); `imatch[j]` the row matched to column j; `jmatch[i]` the column matched to row i;
 * `cheap[j]` where the cheap search of column j resumes; `js`, `is`, `ps` the search stacks.
 */
import type { CscPattern } from './types.js';

/**
 * Match columns to rows. A diagonal entry with |a_jj| ≥ τ·max|A(:, j)| is taken first, then the
 * remaining columns are matched by augmenting paths. Columns left unmatched (the nonzero pattern is
 * structurally singular) receive the left-over rows in increasing order. Writes imatch[j] for
 * every column and returns the size of the true matching (n when it is perfect).
 */
export function maximumMatching(A: CscPattern, Ax: Float64Array, tau: number, imatch: Int32Array): number {
  const { n, Ap, Ai } = A;
  const jmatch = new Int32Array(n).fill(-1);
  const cheap = new Int32Array(n);
  const w = new Int32Array(n).fill(-1);
  const js = new Int32Array(n);
  const is = new Int32Array(n);
  const ps = new Int32Array(n);
  const floor = new Float64Array(n);
  imatch.fill(-1);
  let matched = 0;
  for (let j = 0; j < n; j++) {
    cheap[j] = Ap[j]!;
    let colMax = 0;
    let diag = 0;
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const a = Math.abs(Ax[p]!);
      if (a > colMax) colMax = a;
      if (Ai[p] === j) diag = a;
    }
    if (diag > 0 && diag >= tau * colMax) {
      imatch[j] = j;
      jmatch[j] = j;
      matched++;
    }
  }
  // Two passes of augmenting paths: first on the entries with |a_ij| ≥ τ·max|A(:, j)|, so that the
  // preferred pivots are not tiny, then on every nonzero for the columns still unmatched.
  for (let pass = 0; pass < 2; pass++) {
    const ratio = pass === 0 ? tau : 0;
    for (let j = 0; j < n; j++) {
      cheap[j] = Ap[j]!;
      w[j] = -1;
      let colMax = 0;
      for (let p = Ap[j]!; p < Ap[j + 1]!; p++) colMax = Math.max(colMax, Math.abs(Ax[p]!));
      floor[j] = ratio * colMax;
    }
    for (let k = 0; k < n; k++) {
      if (imatch[k]! >= 0) continue;
      // Depth-first search for an augmenting path from column k.
      let found = false;
      let head = 0;
      js[0] = k;
      while (head >= 0) {
        const j = js[head]!;
        if (w[j] !== k) {
          w[j] = k; // first visit of j in this search: try a free row
          let p = cheap[j]!;
          let i = -1;
          for (; p < Ap[j + 1]! && !found; p++) {
            if (!(Math.abs(Ax[p]!) > 0 && Math.abs(Ax[p]!) >= floor[j]!)) continue;
            i = Ai[p]!;
            found = jmatch[i] === -1;
          }
          cheap[j] = p;
          if (found) {
            is[head] = i;
            break;
          }
          ps[head] = Ap[j]!;
        }
        let p = ps[head]!;
        for (; p < Ap[j + 1]!; p++) {
          if (!(Math.abs(Ax[p]!) > 0 && Math.abs(Ax[p]!) >= floor[j]!)) continue;
          const i = Ai[p]!;
          const owner = jmatch[i]!;
          if (owner < 0 || w[owner] === k) continue;
          ps[head] = p + 1;
          is[head] = i;
          js[++head] = owner;
          break;
        }
        if (p === Ap[j + 1]!) head--;
      }
      if (found) {
        for (let h = head; h >= 0; h--) {
          jmatch[is[h]!] = js[h]!;
          imatch[js[h]!] = is[h]!;
        }
        matched++;
      }
    }
  }
  // Structurally singular on the nonzeros: pair the left-over rows and columns in order.
  let free = 0;
  for (let j = 0; j < n; j++) {
    if (imatch[j]! >= 0) continue;
    while (jmatch[free]! >= 0) free++;
    imatch[j] = free;
    jmatch[free] = j;
  }
  return matched;
}
