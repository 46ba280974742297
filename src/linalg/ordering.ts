/**
 * Symbolic analysis: the column order and preferred pivot rows of a sparse LU, computed once per
 * pattern. First a maximum transversal on the nonzero values (Duff 1981) puts a nonzero on every
 * diagonal, which circuit branch rows lack; then approximate minimum degree (Amestoy, Davis & Duff
 * 1996) orders the pattern of B + Bᵀ, B the matched matrix, so that fill stays low when the pivots
 * fall on the matched entries.
 *
 * Key to the names: `A` the pattern, `Ax` values used only to decide which entries are nonzero;
 * `imatch[j]` the row matched to column j; `rowPos[i]` the column whose matched row is i.
 */
import { amdOrder, symmetrizedPattern } from './amd.js';
import { choleskyFillCount } from './fill-count.js';
import type { SymbolicLu } from './lu-types.js';
import { maximumMatching } from './matching.js';
import type { CscPattern } from './types.js';

/** Fill-reducing orderings: approximate minimum degree, or the caller's own column order. */
export type Ordering = 'amd' | 'natural';

/**
 * Analyse the pattern A (with values Ax, of which only the first nnz are read). With 'amd', the
 * columns are matched to rows on the nonzero values and ordered by AMD on the matched pattern;
 * with 'natural', q is the identity and every column prefers its own diagonal.
 */
export function analyzePattern(A: CscPattern, Ax: Float64Array, ordering: Ordering, tau: number): SymbolicLu {
  const { n, Ap, Ai } = A;
  const imatch = new Int32Array(n);
  if (ordering === 'natural') {
    const q = new Int32Array(n);
    for (let k = 0; k < n; k++) {
      q[k] = k;
      imatch[k] = k;
    }
    const { Cp, Ci } = symmetrizedPattern(n, Ap, Ai, null);
    return { n, q, prefRow: imatch, fill: choleskyFillCount(n, Cp, Ci, q) };
  }
  maximumMatching(A, Ax, tau, imatch);
  const rowPos = new Int32Array(n);
  for (let j = 0; j < n; j++) rowPos[imatch[j]!] = j;
  const { Cp, Ci, nnz } = symmetrizedPattern(n, Ap, Ai, rowPos);
  // The ordering destroys its input: the count reads a copy of the pattern.
  const CpKept = Cp.slice();
  const CiKept = Ci.slice(0, nnz);
  const q = amdOrder(n, Cp, Ci).slice(); // slice: amdOrder returns a view on n+1 entries
  return { n, q, prefRow: imatch, fill: choleskyFillCount(n, CpKept, CiKept, q) };
}
