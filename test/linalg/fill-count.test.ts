/**
 * The fill counted before a factorization (src/linalg/fill-count.ts) against the elimination-graph
 * model of symmetric elimination: eliminating a node joins all its remaining neighbours, and the
 * factor gains one entry per remaining neighbour (A. George and J. W. H. Liu, "Computer Solution of
 * Large Sparse Positive Definite Systems", 1981, ch. 5, from memory), played out on a dense
 * adjacency matrix; and against what the sparse LU stores where its pivots stay on the diagonal.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { choleskyFillCount } from '../../src/linalg/fill-count.js';
import { compressPattern, createRealSolver } from '../../src/linalg/index.js';

/** A symmetric pattern (both triangles, no diagonal) in compressed columns, from an edge list. */
function symmetricPattern(n: number, edges: readonly (readonly [number, number])[]) {
  const columns: Set<number>[] = Array.from({ length: n }, () => new Set<number>());
  for (const [i, j] of edges) {
    if (i === j) continue;
    columns[i]!.add(j);
    columns[j]!.add(i);
  }
  const Cp = new Int32Array(n + 1);
  const entries: number[] = [];
  for (let j = 0; j < n; j++) {
    entries.push(...[...columns[j]!].sort((a, b) => a - b));
    Cp[j + 1] = entries.length;
  }
  return { Cp, Ci: Int32Array.from(entries), columns };
}

/** The elimination-graph count: at each step, the eliminated node's remaining neighbours. */
function eliminationGraphFill(n: number, columns: readonly Set<number>[], q: Int32Array): number {
  const adjacent = columns.map((c) => new Set(c));
  const eliminated = new Set<number>();
  let fill = 0;
  for (let k = 0; k < n; k++) {
    const v = q[k]!;
    const remaining = [...adjacent[v]!].filter((u) => !eliminated.has(u));
    fill += remaining.length;
    for (const a of remaining) for (const b of remaining) if (a !== b) adjacent[a]!.add(b);
    eliminated.add(v);
  }
  return fill;
}

const patterns = fc.integer({ min: 1, max: 14 }).chain((n) =>
  fc.record({
    n: fc.constant(n),
    edges: fc.array(fc.tuple(fc.nat(n - 1), fc.nat(n - 1)), { maxLength: 3 * n }),
    order: fc.shuffledSubarray(
      Array.from({ length: n }, (_, k) => k),
      { minLength: n, maxLength: n },
    ),
  }),
);

describe('the fill counted before a factorization', () => {
  it('counts a tridiagonal in its own order as n − 1, and an arrow by where its hub goes', () => {
    // Worked cases of George and Liu (1981), ch. 2 (from memory): a path graph fills nothing; the
    // arrow matrix fills completely when its hub is eliminated first and not at all when last.
    const n = 7;
    const path = symmetricPattern(
      n,
      Array.from({ length: n - 1 }, (_, k) => [k, k + 1] as const),
    );
    const natural = Int32Array.from({ length: n }, (_, k) => k);
    expect(choleskyFillCount(n, path.Cp, path.Ci, natural)).toBe(n - 1);
    const arrow = symmetricPattern(
      n,
      Array.from({ length: n - 1 }, (_, k) => [0, k + 1] as const),
    );
    expect(choleskyFillCount(n, arrow.Cp, arrow.Ci, natural)).toBe((n * (n - 1)) / 2);
    const hubLast = Int32Array.from({ length: n }, (_, k) => (k + 1) % n);
    expect(choleskyFillCount(n, arrow.Cp, arrow.Ci, hubLast)).toBe(n - 1);
  });

  it('equals the elimination-graph count on random patterns and orders', () => {
    fc.assert(
      fc.property(patterns, ({ n, edges, order }) => {
        const { Cp, Ci, columns } = symmetricPattern(n, edges);
        const q = Int32Array.from(order);
        expect(choleskyFillCount(n, Cp, Ci, q)).toBe(eliminationGraphFill(n, columns, q));
      }),
      { seed: 20261204, numRuns: 300 },
    );
  });

  it('is what the sparse LU stores in L and in U when its pivots stay on the diagonal', () => {
    // A symmetric pattern with a dominant diagonal keeps every pivot on the diagonal (threshold
    // pivoting keeps a matched pivot of at least τ times the column's largest), and then the
    // patterns of L and Uᵀ are those of the Cholesky factor (George and Liu 1981, ch. 5).
    fc.assert(
      fc.property(patterns, ({ n, edges }) => {
        const { Cp, Ci } = symmetricPattern(n, edges);
        const rows: number[] = [];
        const cols: number[] = [];
        for (let j = 0; j < n; j++) {
          rows.push(j);
          cols.push(j);
          for (let p = Cp[j]!; p < Cp[j + 1]!; p++) {
            rows.push(Ci[p]!);
            cols.push(j);
          }
        }
        const { pattern, slots } = compressPattern(
          n,
          Int32Array.from(rows),
          Int32Array.from(cols),
          rows.length,
        );
        const values = new Float64Array(pattern.Ai.length + 1);
        for (let t = 0; t < rows.length; t++) values[slots[t]!]! += rows[t] === cols[t] ? 4 * n : -1;
        const solver = createRealSolver(pattern);
        expect(solver.factor(values)).toBe(0);
        const counted = solver.symbolic!.fill;
        expect(solver.factorSizes()).toEqual({ lower: counted, upper: counted });
      }),
      { seed: 20261205, numRuns: 200 },
    );
  });
});
