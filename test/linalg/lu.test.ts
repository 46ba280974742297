import fc from 'fast-check';
import { Matrix, solve } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { compressPattern, createRealSolver, reportSmallPivots } from '../../src/linalg/index.js';
import { mnaCases, scaledResidual, toDense, vecInf } from './mna-matrices.js';

/** Random MNA-shaped matrices from a fast-check seed: sizes 1…60 nodes, up to 8 sources, 12 gm. */
const mnaCase = mnaCases(60);

function rhs(rand: () => number, n: number): Float64Array {
  const b = new Float64Array(n + 1); // one trash slot past the end, as the MNA layer keeps
  for (let i = 0; i < n; i++) b[i] = rand() * 2 - 1;
  b[n] = 4242;
  return b;
}

function denseSolve(A: number[][], b: Float64Array, n: number): number[] {
  return solve(new Matrix(A), Matrix.columnVector(Array.from(b.subarray(0, n)))).to1DArray();
}

function relativeDifference(x: ArrayLike<number>, y: ArrayLike<number>, n: number): number {
  let d = 0;
  for (let i = 0; i < n; i++) d = Math.max(d, Math.abs(x[i]! - y[i]!));
  return d / Math.max(vecInf(y, n), Number.MIN_VALUE);
}

describe('the sparse real LU solver', () => {
  // Scaled residual below 1e-12 (Davis, CSparse cs_demo.c, 2006) and agreement with the dense
  // partial-pivoting solve of ml-matrix (mljs/ml-matrix 6.15) on random MNA-shaped matrices.
  it('solves MNA-shaped matrices with zero-diagonal branch rows to a scaled residual below 1e-12', () => {
    fc.assert(
      fc.property(mnaCase, fc.constantFrom('amd' as const, 'natural' as const), ({ rand, m }, ordering) => {
        const n = m.pattern.n;
        const solver = createRealSolver(m.pattern, { ordering });
        expect(solver.factor(m.Ax)).toBe(0);
        const b = rhs(rand, n);
        const b0 = b.slice();
        solver.solve(b);
        expect(scaledResidual(m.pattern, m.Ax, b, b0)).toBeLessThan(1e-12);
        expect(relativeDifference(b, denseSolve(toDense(m.pattern, m.Ax), b0, n), n)).toBeLessThan(1e-7);
        expect(b[n]).toBe(4242); // the trash slot is neither read nor written
      }),
      { numRuns: 150 },
    );
  });

  // Storage reserved too small must grow and change nothing (Davis, CSparse cs_lu's reallocation,
  // 2006): the solution equals that of a solver that reserved the counted fill.
  it('grows storage reserved too small and solves as a solver that reserved enough', () => {
    fc.assert(
      fc.property(mnaCase, ({ rand, m }) => {
        const n = m.pattern.n;
        const cramped = createRealSolver(m.pattern, { capacity: { lower: 0, upper: 0 } });
        const roomy = createRealSolver(m.pattern);
        expect(cramped.factor(m.Ax)).toBe(0);
        expect(roomy.factor(m.Ax)).toBe(0);
        expect(cramped.factorSizes()).toEqual(roomy.factorSizes());
        const b = rhs(rand, n);
        const c = b.slice();
        cramped.solve(b);
        roomy.solve(c);
        expect(Array.from(b)).toEqual(Array.from(c));
      }),
      { numRuns: 80 },
    );
  });

  // Aᵀx = b checked by its own scaled residual (Davis, CSparse cs_demo.c, 2006).
  it('solves the transposed system', () => {
    fc.assert(
      fc.property(mnaCase, ({ rand, m }) => {
        const n = m.pattern.n;
        const solver = createRealSolver(m.pattern);
        expect(solver.factor(m.Ax)).toBe(0);
        const b = rhs(rand, n);
        const b0 = b.slice();
        solver.solveTranspose(b);
        expect(scaledResidual(m.pattern, m.Ax, b, b0, true)).toBeLessThan(1e-12);
        expect(b[n]).toBe(4242);
      }),
      { numRuns: 80 },
    );
  });

  // A refactorization on the kept pivot order must give the same solution as a fresh solver on
  // the same values (Davis & Palamadai Natarajan, "Algorithm 907: KLU", ACM TOMS 37, 2010).
  it('refactors new values on the kept pattern to the same solution as a fresh factorization', () => {
    fc.assert(
      fc.property(mnaCase, ({ rand, m }) => {
        const n = m.pattern.n;
        const nnz = m.pattern.Ap[n]!;
        const reused = createRealSolver(m.pattern);
        expect(reused.factor(m.Ax)).toBe(0);
        // New values on the same pattern: every entry scaled by a factor in [0.5, 2).
        const Ax2 = m.Ax.slice();
        for (let p = 0; p < nnz; p++) Ax2[p]! *= 0.5 + 1.5 * rand();
        const fresh = createRealSolver(m.pattern);
        const s1 = reused.factor(Ax2);
        const s2 = fresh.factor(Ax2);
        expect(s1).toBe(s2);
        if (s2 !== 0) return;
        const b = rhs(rand, n);
        const x1 = b.slice();
        const x2 = b.slice();
        reused.solve(x1);
        fresh.solve(x2);
        expect(scaledResidual(m.pattern, Ax2, x1, b)).toBeLessThan(1e-12);
        expect(relativeDifference(x1, x2, n)).toBeLessThan(1e-8);
        const stats = reused.statistics();
        expect(stats.refactorizations + stats.fallbacks).toBe(1);
      }),
      { numRuns: 100 },
    );
  });

  // A pivot order handed from one solver to another is a pure starting state (common practice, no
  // source): whatever the receiving solver factored before, the same values on the same order give
  // the same numbers bit for bit, and the solution of a fresh factorization to rounding.
  it('refactors on a pivot order taken from another solver as that solver would, whatever came before', () => {
    fc.assert(
      fc.property(mnaCase, ({ rand, m }) => {
        const n = m.pattern.n;
        const nnz = m.pattern.Ap[n]!;
        const source = createRealSolver(m.pattern);
        expect(source.factor(m.Ax)).toBe(0);
        const order = source.pivotOrder()!;
        const scaled = (): Float64Array => {
          const Ax = m.Ax.slice();
          for (let p = 0; p < nnz; p++) Ax[p]! *= 0.5 + 1.5 * rand();
          return Ax;
        };
        const values = scaled();
        const b = rhs(rand, n);
        // One solver straight on the order, one after factoring other values first.
        const straight = createRealSolver(m.pattern, { symbolic: order.symbolic });
        const detoured = createRealSolver(m.pattern, { symbolic: order.symbolic });
        detoured.factor(scaled());
        detoured.invalidate();
        detoured.factor(scaled());
        const answers = [straight, detoured].map((solver) => {
          solver.usePivotOrder(order);
          const status = solver.factor(values);
          const x = b.slice();
          if (status === 0) solver.solve(x);
          return { status, x };
        });
        expect(answers[1]!.status).toBe(answers[0]!.status);
        expect(Array.from(answers[1]!.x)).toEqual(Array.from(answers[0]!.x));
        if (answers[0]!.status !== 0) return;
        expect(scaledResidual(m.pattern, values, answers[0]!.x, b)).toBeLessThan(1e-12);
      }),
      { numRuns: 100 },
    );
  });

  // Threshold pivoting (Duff, Erisman & Reid, "Direct Methods for Sparse Matrices", 1986, §5.4):
  // [[a, 1], [1, 1]] keeps the diagonal pivot for a = 2; at a = 1e-9 the kept pivot is below τ·1,
  // so the refactorization must give way to a fresh factorization, whose solution is exact here.
  it('falls back to a fresh factorization when a kept pivot becomes too small', () => {
    const { pattern, slots } = compressPattern(2, [0, 0, 1, 1], [0, 1, 0, 1]);
    const Ax = new Float64Array(4);
    const set = (a: number): void => {
      Ax[slots[0]!] = a;
      Ax[slots[1]!] = 1;
      Ax[slots[2]!] = 1;
      Ax[slots[3]!] = 1;
    };
    const solver = createRealSolver(pattern);
    set(2);
    expect(solver.factor(Ax)).toBe(0);
    set(1e-9);
    expect(solver.factor(Ax)).toBe(0);
    expect(solver.statistics()).toMatchObject({ factorizations: 2, refactorizations: 0, fallbacks: 1 });
    // x = A⁻¹·[1, 2]: by Cramer's rule x0 = (1 − 2)/(a − 1), x1 = (2a − 1)/(a − 1).
    const b = Float64Array.from([1, 2]);
    solver.solve(b);
    const a = 1e-9;
    expect(b[0]).toBeCloseTo((1 - 2) / (a - 1), 14);
    expect(b[1]).toBeCloseTo((2 * a - 1) / (a - 1), 14);
  });

  // A floating node pair (a resistor between nodes 1 and 2, nothing to ground) makes the nodal
  // matrix singular (Kirchhoff: the pair's voltages are fixed only up to a constant); the status
  // names one of the two unknowns. Common practice of nodal analysis, no source.
  it('reports an unknown of a floating node pair as singular', () => {
    // node 0 — 1 S — ground; nodes 1, 2 joined by 1 S only; node 3 — 2 S — node 0.
    const rows = [0, 1, 1, 2, 2, 3, 3, 0, 0];
    const cols = [0, 1, 2, 1, 2, 3, 0, 3, 0];
    const vals = [1, 1, -1, -1, 1, 2, -2, -2, 2];
    const { pattern, slots } = compressPattern(4, rows, cols);
    const Ax = new Float64Array(pattern.Ap[4]! + 1);
    vals.forEach((v, t) => {
      Ax[slots[t]!]! += v;
    });
    for (const ordering of ['amd', 'natural'] as const) {
      const status = createRealSolver(pattern, { ordering }).factor(Ax);
      expect([2, 3]).toContain(status); // unknown 1 or 2, plus one
      const report = reportSmallPivots(pattern, Ax, { ordering });
      expect(report.rank).toBe(3);
      expect(Array.from(report.unknowns)).toEqual([status - 1]);
      expect([1, 2]).toContain(report.equations[0]);
    }
  });

  // Two ideal voltage sources in parallel (a source loop) leave their branch currents undetermined:
  // the status names one of the two branch unknowns (common practice of MNA, no source).
  it('reports a branch current of a voltage-source loop as singular', () => {
    // node 0 with 1 S to ground; sources in branch rows 1 and 2 both from node 0 to ground.
    const rows = [0, 0, 1, 0, 2];
    const cols = [0, 1, 0, 2, 0];
    const vals = [1, 1, 1, 1, 1];
    const { pattern, slots } = compressPattern(3, rows, cols);
    const Ax = new Float64Array(pattern.Ap[3]!);
    vals.forEach((v, t) => {
      Ax[slots[t]!]! += v;
    });
    const status = createRealSolver(pattern).factor(Ax);
    expect([2, 3]).toContain(status);
    const report = reportSmallPivots(pattern, Ax);
    expect(report.rank).toBe(2);
    expect([1, 2]).toContain(report.unknowns[0]);
  });

  // Near singularity is judged relative to the column, not against exact zero: a node tied to
  // ground by 1e-16 S next to 1 S elements is singular at the 1e-13 default, one tied by 1e-9 S is
  // not (common practice, no source; compare the 1e-14 relative test of the dense reference).
  it('judges a nearly floating node against a relative threshold', () => {
    const build = (leak: number) => {
      // nodes 0, 1 joined by 1 S; node 0 to ground by `leak`; node 2 to ground by 1 S.
      const { pattern, slots } = compressPattern(3, [0, 0, 1, 1, 2], [0, 1, 0, 1, 2]);
      const Ax = new Float64Array(pattern.Ap[3]!);
      [1 + leak, -1, -1, 1, 1].forEach((v, t) => {
        Ax[slots[t]!]! += v;
      });
      return { pattern, Ax };
    };
    const tight = build(1e-16);
    expect([1, 2]).toContain(createRealSolver(tight.pattern).factor(tight.Ax));
    const loose = build(1e-9);
    const solver = createRealSolver(loose.pattern);
    expect(solver.factor(loose.Ax)).toBe(0);
    // 1 A into node 1: the whole current returns through the leak, so v0 = 1/leak, v1 = v0 + 1.
    const b = Float64Array.from([0, 1, 0]);
    solver.solve(b);
    expect(b[0]! / 1e9).toBeCloseTo(1, 6);
    expect((b[1]! - b[0]!) / 1).toBeCloseTo(1, 4);
  });

  // Two equal rows leave one unknown without a pivot: rank 2 of 3 (elementary linear algebra;
  // common practice, no source).
  it('reports an unknown of a matrix with two equal rows', () => {
    const { pattern, slots } = compressPattern(3, [0, 1, 2, 0], [0, 1, 1, 2]);
    const Ax = new Float64Array(pattern.Ap[3]!);
    [2, 1, 1, 1].forEach((v, t) => {
      Ax[slots[t]!]! += v;
    });
    // Column 2 holds only row 0 (value 1), its diagonal is structurally zero; column 1 holds rows 1 and 2.
    // Rows: 0 = [2 0 1], 1 = [0 1 0], 2 = [0 1 0]: rows 1 and 2 are equal, so rank 2.
    const status = createRealSolver(pattern).factor(Ax);
    expect(status).toBeGreaterThan(0);
    expect(reportSmallPivots(pattern, Ax).rank).toBe(2);
  });

  // Several right-hand sides at a stride, and in place: each column equals a single solve
  // (aliasing of output and input, planned as in gl-matrix; common practice, no source).
  it('solves several right-hand sides in place, each equal to a single solve, leaving Ax intact', () => {
    fc.assert(
      fc.property(mnaCase, fc.integer({ min: 1, max: 4 }), ({ rand, m }, count) => {
        const n = m.pattern.n;
        const solver = createRealSolver(m.pattern);
        const before = m.Ax.slice();
        expect(solver.factor(m.Ax)).toBe(0);
        expect(Array.from(m.Ax.subarray(0, -1))).toEqual(Array.from(before.subarray(0, -1)));
        const stride = n + 1;
        const B = new Float64Array(count * stride);
        for (let k = 0; k < B.length; k++) B[k] = (k + 1) % stride === 0 ? 77 : rand();
        const singles = Array.from({ length: count }, (_, r) => B.slice(r * stride, r * stride + n));
        solver.solveMany(B, count, stride);
        for (let r = 0; r < count; r++) {
          solver.solve(singles[r]!);
          expect(Array.from(B.subarray(r * stride, r * stride + n))).toEqual(Array.from(singles[r]!));
          expect(B[r * stride + n]).toBe(77);
        }
      }),
      { numRuns: 40 },
    );
  });

  // The transposed solve on several right-hand sides, each equal to a single transposed solve and
  // checked against Aᵀ by its scaled residual (Davis, CSparse cs_demo.c, 2006).
  it('solves several transposed right-hand sides, each equal to a single transposed solve', () => {
    fc.assert(
      fc.property(mnaCase, fc.integer({ min: 1, max: 3 }), ({ rand, m }, count) => {
        const n = m.pattern.n;
        const solver = createRealSolver(m.pattern);
        expect(solver.factor(m.Ax)).toBe(0);
        const stride = n + 2;
        const B = new Float64Array(count * stride);
        for (let k = 0; k < B.length; k++) B[k] = k % stride >= n ? -5 : rand();
        const originals = Array.from({ length: count }, (_, r) => B.slice(r * stride, r * stride + n));
        solver.solveMany(B, count, stride, true);
        for (let r = 0; r < count; r++) {
          const single = originals[r]!.slice();
          solver.solveTranspose(single);
          const column = B.subarray(r * stride, r * stride + n);
          expect(Array.from(column)).toEqual(Array.from(single));
          expect(scaledResidual(m.pattern, m.Ax, column, originals[r]!, true)).toBeLessThan(1e-12);
          expect([B[r * stride + n], B[r * stride + n + 1]]).toEqual([-5, -5]);
        }
      }),
      { numRuns: 40 },
    );
  });
});
