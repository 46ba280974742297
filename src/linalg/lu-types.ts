/**
 * The pieces an LU factorization P·A·Q = L·U is made of, kept apart as CSparse keeps css and csn:
 * the symbolic part (column order and preferred pivot rows) is computed once per pattern, the
 * numeric part (pivot rows and values on the L and U patterns) once per fresh factorization, and
 * its values are overwritten by every refactorization.
 *
 * Key to the names: `q[k]` the original column eliminated at step k; `prefRow[j]` the row the
 * ordering matched to column j; `pinv[i]` the step at which original row i became pivotal and
 * `prow[k]` its inverse; `Lp`/`Li`/`Lx` the strictly lower part of L by columns (unit diagonal
 * implied, row indices are steps); `Up`/`Ui`/`Ux` the strictly upper part of U by columns, each
 * column in the topological order the sparse triangular solve visited it; `Ud` the diagonal of U.
 * A trailing `z` (Lz, Uz, Udz) is the imaginary part of the array it follows.
 */

/** Column order and preferred pivot rows, computed once per pattern. */
export interface SymbolicLu {
  readonly n: number;
  /** q[k] is the original column eliminated at step k. */
  readonly q: Int32Array;
  /** prefRow[j] is the row matched to column j: the pivot preferred for column j. */
  readonly prefRow: Int32Array;
}

/** Pivot rows and the patterns of L and U of one fresh factorization (storage grows by doubling). */
interface LuPattern {
  readonly n: number;
  readonly pinv: Int32Array;
  readonly prow: Int32Array;
  readonly Lp: Int32Array;
  Li: Int32Array;
  readonly Up: Int32Array;
  Ui: Int32Array;
}

/** A real factorization: LuPattern plus the values. */
export interface NumericLu extends LuPattern {
  Lx: Float64Array;
  Ux: Float64Array;
  readonly Ud: Float64Array;
}

/** A complex factorization with split real and imaginary parts. */
export interface ComplexNumericLu extends NumericLu {
  Lz: Float64Array;
  Uz: Float64Array;
  readonly Udz: Float64Array;
}

/** Tolerances that steer pivoting and singularity detection. */
export interface PivotTolerances {
  /** Accept the preferred (diagonal) row while its magnitude is ≥ this times the column's largest. */
  readonly pivotTolerance: number;
  /** A column whose largest candidate is ≤ this times the column's scale has no acceptable pivot. */
  readonly singularTolerance: number;
}

/**
 * Room to reserve in each of L and U before a first factorization of a matrix on `pattern`: the
 * entries of A plus a diagonal. Circuit matrices ordered by AMD fill in little (the stage chains of
 * bench/ keep nnz(L) + nnz(U) = nnz(A)); where they fill more (a mesh, about six times), the
 * factorization grows its storage by doubling, once per fresh factorization at most a few times.
 */
export function initialFactorCapacity(pattern: { readonly n: number; readonly Ap: Int32Array }): number {
  return pattern.Ap[pattern.n]! + pattern.n;
}

/** Allocate a real factorization of order n with room for about `capacity` entries in L and in U. */
export function createNumericLu(n: number, capacity: number): NumericLu {
  const cap = Math.max(capacity, n, 1);
  return {
    n,
    pinv: new Int32Array(n),
    prow: new Int32Array(n),
    Lp: new Int32Array(n + 1),
    Li: new Int32Array(cap),
    Lx: new Float64Array(cap),
    Up: new Int32Array(n + 1),
    Ui: new Int32Array(cap),
    Ux: new Float64Array(cap),
    Ud: new Float64Array(n),
  };
}

/** Allocate a complex factorization of order n with room for about `capacity` entries in L and in U. */
export function createComplexNumericLu(n: number, capacity: number): ComplexNumericLu {
  const real = createNumericLu(n, capacity);
  return {
    ...real,
    Lz: new Float64Array(real.Lx.length),
    Uz: new Float64Array(real.Ux.length),
    Udz: new Float64Array(n),
  };
}

/** Grow L so that it holds at least `need` entries, doubling (cs_sprealloc in cs_lu). */
export function growL(N: NumericLu, need: number): void {
  if (need <= N.Li.length) return;
  const size = Math.max(2 * N.Li.length, need);
  N.Li = copyInt(N.Li, size);
  N.Lx = copyFloat(N.Lx, size);
  const C = N as Partial<ComplexNumericLu>;
  if (C.Lz !== undefined) C.Lz = copyFloat(C.Lz, size);
}

/** Grow U so that it holds at least `need` entries, doubling. */
export function growU(N: NumericLu, need: number): void {
  if (need <= N.Ui.length) return;
  const size = Math.max(2 * N.Ui.length, need);
  N.Ui = copyInt(N.Ui, size);
  N.Ux = copyFloat(N.Ux, size);
  const C = N as Partial<ComplexNumericLu>;
  if (C.Uz !== undefined) C.Uz = copyFloat(C.Uz, size);
}

function copyInt(a: Int32Array, size: number): Int32Array {
  const out = new Int32Array(size);
  out.set(a);
  return out;
}

function copyFloat(a: Float64Array, size: number): Float64Array {
  const out = new Float64Array(size);
  out.set(a);
  return out;
}
