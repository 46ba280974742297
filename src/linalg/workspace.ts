/**
 * The scratch space of the sparse LU kernels, allocated once per solver and reused by every
 * factorization, refactorization and solve (CSparse sizes the same pieces once per call: a dense
 * value vector and a 2n integer vector, cs_lu.c).
 *
 * Key to the names: `n` order; `x`/`z` dense real/imaginary accumulators, all zero between uses;
 * `rowScale` reciprocal row maxima, `rowScaleCurrent` whether they belong to the values being factored,
 * `stepScale` the same indexed by pivot step (the real refactorization's);
 * `entryStep` the pivot step of the row of each entry of A (pinv[Ai[p]], refreshed by every fresh
 * factorization, so that the refactorization scatters A with one indirection fewer); `stack` 2n integers, [0, n) the depth-first output and stack, [n, 2n) the saved edge positions;
 * `mark` visit marks, a node j counts as visited when mark[j] === generation; `lend`/`pruned` the
 * pruned extent of each column of L during a fresh factorization (prune.ts).
 */

import { TypedArena } from './typed-arena.js';

/** Scratch arrays owned by one solver; nothing in the kernels allocates beyond these. */
export interface LuWorkspace {
  readonly n: number;
  /** Dense real accumulator, length n, zero between uses. */
  readonly x: Float64Array;
  /** Dense imaginary accumulator, length n for complex solvers, 0 for real ones. */
  readonly z: Float64Array;
  /** Right-hand-side scratch, length n (real part). */
  readonly y: Float64Array;
  /** Right-hand-side scratch, imaginary part (length n for complex solvers). */
  readonly yz: Float64Array;
  /** 2n integers: reach output and depth-first stack in [0, n), edge positions in [n, 2n). */
  readonly stack: Int32Array;
  /** 1 / max|A(i, :)| for each row i: the row scaling the pivot search compares magnitudes under. */
  readonly rowScale: Float64Array;
  /**
   * Whether rowScale belongs to the values now being factored: the solvers clear it on every
   * factor() call (the AC analysis hands the complex solver its row maxima), and the complex
   * refactorization computes the scales only when a pivot is not the largest of its column outright
   * (at transistor columns), so a refactorization of a circuit without transistors skips that pass
   * over A. The real refactorization keeps its scales by pivot step instead (`stepScale`).
   */
  rowScaleCurrent: boolean;
  /** The reciprocal row maxima indexed by pivot step, for the refactorization's scaled test. */
  readonly stepScale: Float64Array;
  /** entryStep[p] = pinv[Ai[p]] of the last fresh factorization, for each of the nnz entries. */
  readonly entryStep: Int32Array;
  /** End of the part of L(:, j) the depth-first search scans (Lp[j+1] until j is pruned). */
  readonly lend: Int32Array;
  /** 1 once L(:, j) has been pruned (prune.ts). */
  readonly pruned: Uint8Array;
  /** Visit marks compared with `generation`, so clearing costs nothing. */
  readonly mark: Int32Array;
  /** Current visit generation; advance it with {@link nextGeneration}. */
  generation: number;
}

/** Allocate the workspace of a solver of order n for nnz entries; `complex` adds the imaginary vectors. */
export function createLuWorkspace(n: number, nnz: number, complex: boolean): LuWorkspace {
  const c = complex ? n : 0;
  // One buffer for all of them: they live and die with the solver (see TypedArena).
  const arena = new TypedArena(4 * n + 2 * c, 4 * n + nnz, n);
  return {
    n,
    x: arena.float64(n),
    z: arena.float64(c),
    y: arena.float64(n),
    yz: arena.float64(c),
    stack: arena.int32(2 * n),
    rowScale: arena.float64(n),
    rowScaleCurrent: false,
    stepScale: arena.float64(n),
    entryStep: arena.int32(nnz),
    lend: arena.int32(n),
    pruned: arena.uint8(n),
    mark: arena.int32(n),
    generation: 0,
  };
}

/** ws.entryStep[p] = pinv[Ai[p]] over the first nnz entries, after a complete fresh factorization. */
export function recordEntrySteps(Ai: Int32Array, pinv: Int32Array, ws: LuWorkspace): void {
  const E = ws.entryStep;
  const nnz = E.length;
  for (let p = 0; p < nnz; p++) E[p] = pinv[Ai[p]!]!;
}

/** Start a new visit: returns a generation that no mark holds yet. */
export function nextGeneration(ws: LuWorkspace): number {
  if (ws.generation >= 0x3fffffff) {
    ws.mark.fill(0);
    ws.generation = 0;
  }
  ws.generation++;
  return ws.generation;
}

/** ws.rowScale[i] = 1 / max_j |A(i, j)| (1 for an all-zero row), over the first nnz values. */
export function computeRowScale(Ap: Int32Array, Ai: Int32Array, Ax: Float64Array, ws: LuWorkspace): void {
  const r = ws.rowScale;
  r.fill(0);
  const nnz = Ap[ws.n]!;
  for (let p = 0; p < nnz; p++) {
    const a = Math.abs(Ax[p]!);
    const i = Ai[p]!;
    if (a > r[i]!) r[i] = a;
  }
  for (let i = 0; i < ws.n; i++) r[i] = r[i]! > 0 ? 1 / r[i]! : 1;
  ws.rowScaleCurrent = true;
}

/** ws.rowScale[i] = 1 / max_j (|Re A(i, j)| + |Im A(i, j)|) (1 for an all-zero row), over the first nnz values. */
export function computeRowScaleComplex(
  Ap: Int32Array,
  Ai: Int32Array,
  Ax: Float64Array,
  Az: Float64Array,
  ws: LuWorkspace,
): void {
  const r = ws.rowScale;
  r.fill(0);
  const nnz = Ap[ws.n]!;
  for (let p = 0; p < nnz; p++) {
    const a = Math.abs(Ax[p]!) + Math.abs(Az[p]!);
    const i = Ai[p]!;
    if (a > r[i]!) r[i] = a;
  }
  for (let i = 0; i < ws.n; i++) r[i] = r[i]! > 0 ? 1 / r[i]! : 1;
  ws.rowScaleCurrent = true;
}
