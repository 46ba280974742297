/**
 * Symmetric pruning of the graph of L (Eisenstat & Liu, "Exploiting structural symmetry in sparse
 * unsymmetric symbolic factorization", SIAM J. Matrix Anal. Appl. 13, 1992), as KLU's kernel uses
 * it: once U(j, k) and L(pivot row of k, j) are both nonzero, every row of L(:, j) that is not yet
 * pivotal is also reached through column k, so the depth-first search of later columns need not
 * scan it from j. The rows of L(:, j) are partitioned, pivotal rows first, and only those are
 * scanned from then on (ws.lend[j] marks their end). The reach keeps its set and a valid
 * topological order; the numeric update still uses the whole column.
 *
 * Key to the names: `N` the factorization being built (L rows are ORIGINAL row indices here);
 * `k` the step just pivoted on original row `pivotRow`; `u0 … u1` the entries of U(:, k) (steps j);
 * `Lz` the imaginary parts of L for a complex factorization, else null.
 */
import type { NumericLu } from './lu-types.js';
import type { LuWorkspace } from './workspace.js';

/** Prune the columns j of U(:, k) whose L(:, j) holds pivotRow (see the file comment). */
export function pruneColumns(
  N: NumericLu,
  pivotRow: number,
  u0: number,
  u1: number,
  ws: LuWorkspace,
  Lz: Float64Array | null,
): void {
  const { pinv, Lp, Li, Lx, Ui } = N;
  const { lend, pruned } = ws;
  for (let p = u0; p < u1; p++) {
    const j = Ui[p]!;
    if (pruned[j] !== 0) continue;
    const start = Lp[j]!;
    const end = Lp[j + 1]!;
    let found = false;
    for (let r = start; r < end; r++) {
      if (Li[r] === pivotRow) {
        found = true;
        break;
      }
    }
    if (!found) continue;
    let head = start;
    let tail = end;
    while (head < tail) {
      const i = Li[head]!;
      if (pinv[i]! >= 0) {
        head++; // pivotal rows stay at the head
        continue;
      }
      tail--;
      Li[head] = Li[tail]!;
      Li[tail] = i;
      const v = Lx[head]!;
      Lx[head] = Lx[tail]!;
      Lx[tail] = v;
      if (Lz !== null) {
        const w = Lz[head]!;
        Lz[head] = Lz[tail]!;
        Lz[tail] = w;
      }
    }
    lend[j] = tail;
    pruned[j] = 1;
  }
}
