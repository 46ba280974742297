/**
 * The nonzero pattern of the solution of a sparse lower-triangular system, found by depth-first
 * search in the graph of L (Gilbert & Peierls, "Sparse partial pivoting in time proportional to
 * arithmetic operations", SIAM J. Sci. Stat. Comput. 9, 1988), as CSparse's cs_reach and cs_dfs.
 *
 * Key to the names: `Lp`/`Li` the columns of L found so far, holding ORIGINAL row indices;
 * `pinv[i]` the pivot step of row i, or −1 while row i has no pivot (it is then a leaf);
 * `Ap`/`Ai` the matrix whose column `col` is the right-hand side; `xi` output and stack (length n);
 * `pstack` saved edge positions (stack[n + head]); `mark`/`gen` visit marks; ws.lend[j] the end of
 * the part of column j of L that must be scanned (symmetric pruning, prune.ts).
 */
import { type LuWorkspace, nextGeneration } from './workspace.js';

/**
 * Rows reachable in the graph of L from the rows of A(:, col). On return the rows are
 * ws.stack[top … n), in topological order (a row comes before every row its column of L updates).
 * Each reached row i has ws.mark[i] === ws.generation. Returns top.
 */
export function reach(
  n: number,
  Lp: Int32Array,
  Li: Int32Array,
  pinv: Int32Array,
  Ap: Int32Array,
  Ai: Int32Array,
  col: number,
  ws: LuWorkspace,
): number {
  const gen = nextGeneration(ws);
  const xi = ws.stack;
  const mark = ws.mark;
  const lend = ws.lend;
  let top = n;
  for (let p = Ap[col]!; p < Ap[col + 1]!; p++) {
    const start = Ai[p]!;
    if (mark[start] === gen) continue;
    // Non-recursive depth-first search from `start` (cs_dfs): xi[0 … head] is the stack.
    let head = 0;
    xi[0] = start;
    while (head >= 0) {
      const j = xi[head]!;
      const jnew = pinv[j]!;
      if (mark[j] !== gen) {
        mark[j] = gen; // first visit: start at the head of column jnew of L
        xi[n + head] = jnew < 0 ? 0 : Lp[jnew]!;
      }
      let done = true;
      const p2 = jnew < 0 ? 0 : lend[jnew]!; // the pruned extent of L(:, jnew) (prune.ts)
      for (let q = xi[n + head]!; q < p2; q++) {
        const i = Li[q]!;
        if (mark[i] === gen) continue;
        xi[n + head] = q + 1; // resume after this edge
        xi[++head] = i; // descend into i
        done = false;
        break;
      }
      if (done) {
        head--; // every child finished: j goes to the output
        xi[--top] = j;
      }
    }
  }
  return top;
}
