/**
 * A report on a matrix that failed to factor: which unknowns got no acceptable pivot and which
 * equations were left without one. It runs the fresh factorization of lu.ts in a mode that skips a
 * column without an acceptable pivot instead of stopping, so every deficient column is found in one
 * pass (a threshold rank estimate in the spirit of rank-revealing LU; it is not a guaranteed rank).
 *
 * Key to the names: `skipped` the original columns (unknowns) left without a pivot; `pinv` as in
 * lu.ts, −1 for a row (equation) that never became a pivot.
 */
import { luFactor } from './lu.js';
import { createNumericLu, initialFactorCapacity } from './lu-types.js';
import { analyzePattern } from './ordering.js';
import { type SparseSolverOptions, tolerancesOf } from './solver.js';
import type { CscPattern } from './types.js';
import { computeRowScale, createLuWorkspace } from './workspace.js';

/** What {@link reportSmallPivots} found. */
export interface SmallPivotReport {
  /** n minus the number of unknowns without an acceptable pivot. */
  readonly rank: number;
  /** Unknowns (original column indices, increasing) that got no acceptable pivot. */
  readonly unknowns: Int32Array;
  /** Equations (original row indices, increasing) that no pivot used. */
  readonly equations: Int32Array;
}

/**
 * Find every unknown of A (values Ax, first nnz read) that gets no acceptable pivot under the
 * solver's tolerances, and the equations left over. Allocates; meant for after a failure, e.g.
 * when factor() returned k+1, to name all unknowns involved rather than the first. An empty list
 * means the matrix factors. The unknown reported by factor() is always among `unknowns` when the
 * same options and values are used.
 */
export function reportSmallPivots(
  pattern: CscPattern,
  Ax: Float64Array,
  options: SparseSolverOptions = {},
): SmallPivotReport {
  const n = pattern.n;
  const tol = tolerancesOf(options);
  const S = options.symbolic ?? analyzePattern(pattern, Ax, options.ordering ?? 'amd', tol.pivotTolerance);
  const N = createNumericLu(n, initialFactorCapacity(pattern));
  const ws = createLuWorkspace(n, pattern.Ap[n]!, false);
  const skipped = new Int32Array(n);
  computeRowScale(pattern.Ap, pattern.Ai, Ax, ws);
  const count = luFactor(pattern, Ax, S, N, ws, tol, skipped);
  const unknowns = skipped.slice(0, count).sort();
  const equations = new Int32Array(count);
  let e = 0;
  for (let i = 0; i < n; i++) if (N.pinv[i]! < 0) equations[e++] = i;
  return { rank: n - count, unknowns, equations };
}
