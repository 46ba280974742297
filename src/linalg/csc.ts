/**
 * Building a compressed-column pattern from (row, column) triplets, duplicates merged, as CSparse's
 * cs_compress and cs_dupl do, with a slot table so that each triplet knows where its value lives.
 */
import type { CscPattern } from './types.js';

/** A pattern plus, for every triplet it was built from, the index of that triplet's value in Ax. */
export interface CompressedPattern {
  readonly pattern: CscPattern;
  /** slots[t] is the position in Ax of triplet t; duplicates share a position. */
  readonly slots: Int32Array;
}

/**
 * Compress triplets (rows[t], cols[t]), each in [0, n), into a sorted, duplicate-free pattern.
 * Every diagonal entry is included whether or not a triplet names it, so that pivoting strategies
 * can always look at the diagonal.
 */
export function compressPattern(
  n: number,
  rows: ArrayLike<number>,
  cols: ArrayLike<number>,
): CompressedPattern {
  const count = rows.length;
  const total = count + n;
  const r = new Int32Array(total);
  const c = new Int32Array(total);
  for (let t = 0; t < count; t++) {
    const i = rows[t]!;
    const j = cols[t]!;
    if (!(i >= 0 && i < n && j >= 0 && j < n)) {
      throw new RangeError(`triplet ${t} (${i}, ${j}) lies outside a matrix of order ${n}`);
    }
    r[t] = i;
    c[t] = j;
  }
  for (let k = 0; k < n; k++) {
    r[count + k] = k;
    c[count + k] = k;
  }
  // Sort triplet indices by (column, row) with a counting sort on rows then a stable one on columns.
  const order = countingSortBy(countingSortBy(identity(total), r, n), c, n);
  const Ap = new Int32Array(n + 1);
  const AiAll = new Int32Array(total);
  const slotOf = new Int32Array(total);
  let nnz = 0;
  let lastRow = -1;
  let lastCol = -1;
  for (let k = 0; k < total; k++) {
    const t = order[k]!;
    const i = r[t]!;
    const j = c[t]!;
    if (i !== lastRow || j !== lastCol) {
      AiAll[nnz] = i;
      Ap[j + 1]!++;
      nnz++;
      lastRow = i;
      lastCol = j;
    }
    slotOf[t] = nnz - 1;
  }
  for (let j = 0; j < n; j++) Ap[j + 1]! += Ap[j]!;
  return { pattern: { n, Ap, Ai: AiAll.slice(0, nnz) }, slots: slotOf.slice(0, count) };
}

function identity(size: number): Int32Array {
  const out = new Int32Array(size);
  for (let k = 0; k < size; k++) out[k] = k;
  return out;
}

/** Stable counting sort of the indices in `order` by key[index] ∈ [0, range). */
function countingSortBy(order: Int32Array, key: Int32Array, range: number): Int32Array {
  const counts = new Int32Array(range + 1);
  for (let k = 0; k < order.length; k++) counts[key[order[k]!]! + 1]!++;
  for (let v = 0; v < range; v++) counts[v + 1]! += counts[v]!;
  const out = new Int32Array(order.length);
  for (let k = 0; k < order.length; k++) {
    const t = order[k]!;
    out[counts[key[t]!]!++] = t;
  }
  return out;
}
