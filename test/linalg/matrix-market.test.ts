import { describe, expect, it } from 'vitest';
import {
  createComplexSolver,
  createRealSolver,
  formatMatrixMarket,
  parseMatrixMarket,
} from '../../src/linalg/index.js';
import { toDense } from './mna-matrices.js';

// Files written by hand after the format's definition: Boisvert, Pozo & Remington, "The Matrix
// Market exchange formats: initial design", NIST IR 5935, 1996 (1-based indices, comment lines
// starting with %, a size line "rows columns entries", symmetric files list the lower triangle).

const realGeneral = `%%MatrixMarket matrix coordinate real general
% a 3-node conductance matrix, one entry given twice
3 3 6
1 1 2.5
2 1 -1
1 2 -1
2 2 1.5
3 3 4e-1
2 2 0.5
`;

const complexGeneral = `%%MatrixMarket matrix coordinate complex general
%
2 2 3
1 1 1 2
2 1 0 -1
2 2 3 0.5
`;

const realSymmetric = `%%MatrixMarket matrix coordinate real symmetric
3 3 5
1 1 4
2 1 -1
2 2 4
3 2 -1
3 3 4
`;

const skewSymmetric = `%%MatrixMarket matrix coordinate integer skew-symmetric
2 2 1
2 1 3
`;

const hermitian = `%%MatrixMarket matrix coordinate complex hermitian
2 2 3
1 1 2 0
2 1 1 1
2 2 3 0
`;

const pattern = `%%MatrixMarket matrix coordinate pattern general
2 2 2
1 2
2 1
`;

describe('the Matrix Market reader', () => {
  it('reads a real general file, summing a duplicate entry and adding the absent diagonal', () => {
    const m = parseMatrixMarket(realGeneral);
    expect(m.field).toBe('real');
    expect(m.symmetry).toBe('general');
    expect(m.Az).toBeNull();
    expect(toDense(m.pattern, m.Ax)).toEqual([
      [2.5, -1, 0],
      [-1, 2, 0],
      [0, 0, 0.4],
    ]);
    // The 3×3 pattern holds 5 distinct entries: the duplicate (2, 2) is merged.
    expect(m.pattern.Ap[3]).toBe(5);
  });

  it('reads a complex general file into split real and imaginary parts', () => {
    const m = parseMatrixMarket(complexGeneral);
    expect(m.field).toBe('complex');
    expect(m.Az).not.toBeNull();
    expect(toDense(m.pattern, m.Ax)).toEqual([
      [1, 0],
      [0, 3],
    ]);
    expect(toDense(m.pattern, m.Az!)).toEqual([
      [2, 0],
      [-1, 0.5],
    ]);
  });

  it('mirrors the lower triangle of a symmetric file', () => {
    const m = parseMatrixMarket(realSymmetric);
    expect(toDense(m.pattern, m.Ax)).toEqual([
      [4, -1, 0],
      [-1, 4, -1],
      [0, -1, 4],
    ]);
  });

  it('negates the mirror of a skew-symmetric file and conjugates that of a hermitian one', () => {
    expect(toDense(parseMatrixMarket(skewSymmetric).pattern, parseMatrixMarket(skewSymmetric).Ax)).toEqual([
      [0, -3],
      [3, 0],
    ]);
    const h = parseMatrixMarket(hermitian);
    expect(toDense(h.pattern, h.Ax)).toEqual([
      [2, 1],
      [1, 3],
    ]);
    expect(toDense(h.pattern, h.Az!)).toEqual([
      [0, -1],
      [1, 0],
    ]);
  });

  it('gives every entry of a pattern file the value 1', () => {
    const m = parseMatrixMarket(pattern);
    expect(toDense(m.pattern, m.Ax)).toEqual([
      [0, 1],
      [1, 0],
    ]);
  });

  // x = A⁻¹b by hand: [[2.5, −1], [−1, 2]]·x = [1, 0] gives x = [2, 1]/4, and x3 = 1/0.4.
  it('feeds the solvers: the real file solves to the hand-computed answer', () => {
    const m = parseMatrixMarket(realGeneral);
    const solver = createRealSolver(m.pattern);
    expect(solver.factor(m.Ax)).toBe(0);
    const b = Float64Array.from([1, 0, 1]);
    solver.solve(b);
    expect(b[0]).toBeCloseTo(0.5, 14);
    expect(b[1]).toBeCloseTo(0.25, 14);
    expect(b[2]).toBeCloseTo(2.5, 14);
  });

  // [[1 + 2j, 0], [−j, 3 + 0.5j]]·x = [1, 0]: x0 = 1/(1 + 2j) = (1 − 2j)/5, x1 = j·x0/(3 + 0.5j).
  it('feeds the solvers: the complex file solves to the hand-computed answer', () => {
    const m = parseMatrixMarket(complexGeneral);
    const solver = createComplexSolver(m.pattern);
    expect(solver.factor(m.Ax, m.Az!)).toBe(0);
    const br = Float64Array.from([1, 0]);
    const bi = Float64Array.from([0, 0]);
    solver.solve(br, bi);
    expect(br[0]).toBeCloseTo(0.2, 14);
    expect(bi[0]).toBeCloseTo(-0.4, 14);
    // j·x0 = (2 + j)/5 = 0.4 + 0.2j; divided by 3 + 0.5j: (0.4 + 0.2j)(3 − 0.5j)/9.25.
    expect(br[1]).toBeCloseTo((0.4 * 3 + 0.2 * 0.5) / 9.25, 14);
    expect(bi[1]).toBeCloseTo((0.2 * 3 - 0.4 * 0.5) / 9.25, 14);
  });

  it('writes what it reads: format then parse gives the same matrix', () => {
    for (const text of [realGeneral, complexGeneral, hermitian]) {
      const m = parseMatrixMarket(text);
      const again = parseMatrixMarket(formatMatrixMarket(m.pattern, m.Ax, m.Az));
      expect(Array.from(again.pattern.Ap)).toEqual(Array.from(m.pattern.Ap));
      expect(Array.from(again.pattern.Ai)).toEqual(Array.from(m.pattern.Ai));
      expect(Array.from(again.Ax)).toEqual(Array.from(m.Ax));
      expect(again.Az === null ? null : Array.from(again.Az)).toEqual(
        m.Az === null ? null : Array.from(m.Az),
      );
    }
  });

  it('rejects malformed files, naming the line', () => {
    expect(() => parseMatrixMarket('%%MatrixMarket matrix array real general\n2 2\n1\n2\n3\n4\n')).toThrow(
      /line 1/,
    );
    expect(() => parseMatrixMarket('%%MatrixMarket matrix coordinate quaternion general\n1 1 0\n')).toThrow(
      /unknown field/,
    );
    expect(() => parseMatrixMarket('%%MatrixMarket matrix coordinate real general\n2 3 0\n')).toThrow(
      /not square/,
    );
    expect(() => parseMatrixMarket('%%MatrixMarket matrix coordinate real general\n2 2 1\n3 1 1\n')).toThrow(
      /line 3: index \(3, 1\)/,
    );
    expect(() => parseMatrixMarket('%%MatrixMarket matrix coordinate real general\n2 2 1\n1 x 1\n')).toThrow(
      /line 3/,
    );
    expect(() => parseMatrixMarket('%%MatrixMarket matrix coordinate real general\n2 2 2\n1 1 1\n')).toThrow(
      /1 of 2 entries/,
    );
  });
});
