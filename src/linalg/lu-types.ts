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
import { TypedArena } from './typed-arena.js';

/** Column order and preferred pivot rows, computed once per pattern. */
export interface SymbolicLu {
  readonly n: number;
  /** q[k] is the original column eliminated at step k. */
  readonly q: Int32Array;
  /** prefRow[j] is the row matched to column j: the pivot preferred for column j. */
  readonly prefRow: Int32Array;
  /**
   * Entries a factorization whose pivots fall on the preferred rows stores below the diagonal of L,
   * and as many above the diagonal of U: the fill of the symmetrized pattern in the order q
   * (fill-count.ts), room a first factorization reserves at once.
   */
  readonly fill: number;
}

/** Pivot rows and the patterns of L and U of one fresh factorization (storage grows as it fills in). */
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

/** Entries to reserve in L and in U before a factorization (see {@link initialFactorCapacity}). */
export interface FactorCapacity {
  readonly lower: number;
  readonly upper: number;
}

/**
 * Room to reserve in L and in U before a first factorization of a matrix on `pattern`. With the
 * sizes an earlier factorization on the same pattern and ordering measured (the AC analyses after
 * the DC solve), those sizes plus n: the storage check before a column asks for room for that
 * column's worst case (n − k more entries), and a factorization whose pivots follow the earlier
 * one's then never grows. Without them, the entries of A plus a diagonal: circuit matrices ordered
 * by AMD fill in little (the stage chains of bench/ keep nnz(L) + nnz(U) = nnz(A)); where they fill
 * more (a mesh, about six times) the factorization grows its storage by half at a time.
 */
export function initialFactorCapacity(
  pattern: { readonly n: number; readonly Ap: Int32Array },
  measured?: FactorCapacity,
): FactorCapacity {
  const n = pattern.n;
  if (measured !== undefined) return { lower: measured.lower + n, upper: measured.upper + n };
  const size = pattern.Ap[n]! + n;
  return { lower: size, upper: size };
}

/** Allocate a real factorization of order n with room for `capacity` entries in L and in U. */
export function createNumericLu(n: number, capacity: FactorCapacity): NumericLu {
  return allocateLu(n, capacity, false);
}

/** Allocate a complex factorization of order n with room for `capacity` entries in L and in U. */
export function createComplexNumericLu(n: number, capacity: FactorCapacity): ComplexNumericLu {
  return allocateLu(n, capacity, true) as ComplexNumericLu;
}

/**
 * The arrays of order n share one buffer; L and U have their own, since a factorization that fills
 * in more than reserved replaces them with larger ones (see TypedArena).
 */
function allocateLu(n: number, capacity: FactorCapacity, complex: boolean): NumericLu | ComplexNumericLu {
  const lower = Math.max(capacity.lower, n, 1);
  const upper = Math.max(capacity.upper, n, 1);
  const arena = new TypedArena(complex ? 2 * n : n, 4 * n + 2);
  const real: NumericLu = {
    n,
    pinv: arena.int32(n),
    prow: arena.int32(n),
    Lp: arena.int32(n + 1),
    Li: new Int32Array(lower),
    Lx: new Float64Array(lower),
    Up: arena.int32(n + 1),
    Ui: new Int32Array(upper),
    Ux: new Float64Array(upper),
    Ud: arena.float64(n),
  };
  if (!complex) return real;
  return { ...real, Lz: new Float64Array(lower), Uz: new Float64Array(upper), Udz: arena.float64(n) };
}

/**
 * Before a first factorization (nothing stored yet): make room for `entries` in L and in U at once,
 * the count of the symbolic analysis plus n (see {@link initialFactorCapacity}), where the storage
 * is smaller.
 */
export function reserveFactorStorage(N: NumericLu, entries: number): void {
  const size = entries + N.n;
  const C = N as Partial<ComplexNumericLu>;
  if (N.Li.length < size) {
    N.Li = new Int32Array(size);
    N.Lx = new Float64Array(size);
    if (C.Lz !== undefined) C.Lz = new Float64Array(size);
  }
  if (N.Ui.length < size) {
    N.Ui = new Int32Array(size);
    N.Ux = new Float64Array(size);
    if (C.Uz !== undefined) C.Uz = new Float64Array(size);
  }
}

/**
 * The size storage grows to when it must hold `need` entries: half as much again (cs_sprealloc in
 * cs_lu doubles; by halves, the old and new arrays held together during the copy, and the room
 * left unused at the end, are smaller on a matrix that fills in a lot).
 */
function grownSize(size: number, need: number): number {
  return Math.max(size + (size >> 1), need);
}

/** Grow L so that it holds at least `need` entries. */
export function growL(N: NumericLu, need: number): void {
  if (need <= N.Li.length) return;
  const size = grownSize(N.Li.length, need);
  N.Li = copyInt(N.Li, size);
  N.Lx = copyFloat(N.Lx, size);
  const C = N as Partial<ComplexNumericLu>;
  if (C.Lz !== undefined) C.Lz = copyFloat(C.Lz, size);
}

/** Grow U so that it holds at least `need` entries. */
export function growU(N: NumericLu, need: number): void {
  if (need <= N.Ui.length) return;
  const size = grownSize(N.Ui.length, need);
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
