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
 * Compress the first `given` triplets (rows[t], cols[t]) into a sorted, duplicate-free pattern. Each
 * index lies in [0, n], and n stands for ground: a triplet in row or column n is left out of the
 * pattern and its slot is nnz, the trash entry past the last stored one. Every diagonal entry is
 * included whether or not a triplet names it, so that pivoting strategies can always look at the
 * diagonal.
 */
export function compressPattern(
  n: number,
  rows: ArrayLike<number>,
  cols: ArrayLike<number>,
  given: number = rows.length,
): CompressedPattern {
  let kept = 0;
  for (let t = 0; t < given; t++) {
    const i = rows[t]!;
    const j = cols[t]!;
    if (!(i >= 0 && i <= n && j >= 0 && j <= n)) {
      throw new RangeError(`triplet ${t} (${i}, ${j}) lies outside a matrix of order ${n}`);
    }
    if (i < n && j < n) kept++;
  }
  const total = kept + n;
  const r = new Int32Array(total);
  const c = new Int32Array(total);
  /** The kept triplet each stored one came from; the trash triplets are filled in at the end. */
  const source = new Int32Array(kept);
  kept = 0;
  for (let t = 0; t < given; t++) {
    const i = rows[t]!;
    const j = cols[t]!;
    if (i === n || j === n) continue;
    r[kept] = i;
    c[kept] = j;
    source[kept++] = t;
  }
  const count = kept;
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
  const slots = new Int32Array(given).fill(nnz);
  for (let k = 0; k < kept; k++) slots[source[k]!] = slotOf[k]!;
  return { pattern: { n, Ap, Ai: AiAll.slice(0, nnz) }, slots };
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
