/**
 * The fill of a factorization, counted before it runs: the entries of the Cholesky factor L of the
 * symmetric pattern C eliminated in the order q, from C's elimination tree (each row of L is the
 * set of tree nodes on the paths from the row's entries of C up to the row; Liu, "The role of
 * elimination trees in sparse factorization", SIAM J. Matrix Anal. Appl. 11(1), 1990; the
 * row-subtree walk as in Davis, "Direct Methods for Sparse Linear Systems", 2006, §4.1 and §4.3).
 * When the LU's pivots fall on the matched entries whose pattern C symmetrizes, L and Uᵀ lie within
 * that pattern, so the count is the storage a first factorization needs: reserving it once avoids
 * growing the storage (and the copies and the memory they hold) while the factorization fills in.
 *
 * Time O(nnz(L)), space O(n).
 */

/**
 * Entries strictly below the diagonal of the Cholesky factor of the symmetric pattern (Cp, Ci)
 * (both triangles, any diagonal entries ignored) eliminated in the order q (q[k] the node
 * eliminated at step k).
 */
export function choleskyFillCount(n: number, Cp: Int32Array, Ci: Int32Array, q: Int32Array): number {
  const step = new Int32Array(n);
  for (let k = 0; k < n; k++) step[q[k]!] = k;
  // Elimination tree of the permuted pattern, with path compression through `ancestor`.
  const parent = new Int32Array(n).fill(-1);
  const ancestor = new Int32Array(n).fill(-1);
  for (let k = 0; k < n; k++) {
    const j = q[k]!;
    for (let p = Cp[j]!; p < Cp[j + 1]!; p++) {
      let i = step[Ci[p]!]!;
      while (i !== -1 && i < k) {
        const next = ancestor[i]!;
        ancestor[i] = k;
        if (next === -1) parent[i] = k;
        i = next;
      }
    }
  }
  // Row k of L: the nodes met walking up the tree from each entry of row k, stopping at a node
  // already met for this row (`mark[i] === k`).
  const mark = ancestor.fill(-1);
  let count = 0;
  for (let k = 0; k < n; k++) {
    mark[k] = k;
    const j = q[k]!;
    for (let p = Cp[j]!; p < Cp[j + 1]!; p++) {
      let i = step[Ci[p]!]!;
      if (i >= k) continue;
      while (mark[i] !== k) {
        mark[i] = k;
        count++;
        i = parent[i]!;
      }
    }
  }
  return count;
}
