/**
 * Why a matrix of circuit equations would not factor, told in the circuit's terms: structurally
 * (the nonzero pattern has no complete matching of equations to unknowns, whatever the values), by
 * exact dependence of the values (a controlled source whose output is its own input, say), or
 * numerically (the equations are regular but too ill-conditioned for double precision, with the
 * condition estimate that says so). Runs only after a failure, so it may allocate.
 */
import { illConditioned, singularMatrix, structurallySingular } from '../errors/messages.js';
import type { QuiescentError } from '../errors/quiescent-error.js';
import { createRealSolver, reportSmallPivots } from '../linalg/index.js';
import type { CompiledSystem } from '../mna/system.js';

/**
 * Condition numbers above this (of the row-equilibrated matrix, 1-norm) leave fewer than about
 * three correct digits in double precision (unit roundoff 1.1e-16): the equations are numerically
 * singular even though their structure is sound.
 */
export const ILL_CONDITIONED = 1e13;

/**
 * The `singular` error for a matrix with values `A` (on the system's pattern) whose factorization
 * found no pivot for unknown k.
 */
export function diagnoseSingular(
  system: CompiledSystem,
  A: Float64Array,
  k: number,
  context: string,
): QuiescentError {
  const { pattern, n } = system;
  const matching = maximumMatching(system, A);
  if (matching.size < n) {
    const equations = matching.unmatchedRows;
    const unknowns = matching.unmatchedColumns;
    return structurallySingular({
      equations: equations.map((i) => system.labels[i]!.name),
      equationKinds: equations.map((i) => system.labels[i]!.kind),
      unknowns: unknowns.map((j) => system.labels[j]!.name),
      unknownKinds: unknowns.map((j) => system.labels[j]!.kind),
      elements: namesAt(system, [...equations, ...unknowns]),
      context,
    });
  }
  // Structurally sound: factor with no singularity threshold. An exact zero pivot means the values
  // make equations dependent; otherwise the trouble is the size of the condition number.
  const exact = createRealSolver(pattern, { singularTolerance: 0 });
  const report = reportSmallPivots(pattern, A);
  const involved = report.unknowns.length > 0 ? [...report.unknowns, ...report.equations] : [k];
  const elements = namesAt(system, involved);
  const nodes = [...new Set(involved.filter((i) => i < n && system.labels[i]!.kind === 'node'))].map(
    (i) => system.labels[i]!.name,
  );
  if (exact.factor(A) !== 0) return singularMatrix(elements, nodes, context, valueRange(A, pattern.Ap[n]!));
  const condition = equilibratedCondition(system, A, exact);
  if (!(condition > ILL_CONDITIONED))
    return singularMatrix(elements, nodes, context, valueRange(A, pattern.Ap[n]!));
  return illConditioned({ elements, nodes, conditionEstimate: condition, context });
}

/** The ratio of the largest to the smallest non-zero |entry| among the first nnz entries of A. */
function valueRange(A: Float64Array, nnz: number): number {
  let largest = 0;
  let smallest = Number.POSITIVE_INFINITY;
  for (let p = 0; p < nnz; p++) {
    const a = Math.abs(A[p]!);
    if (a === 0) continue;
    if (a > largest) largest = a;
    if (a < smallest) smallest = a;
  }
  return largest === 0 ? 1 : largest / smallest;
}

/** The element names touching the given unknowns (rows or columns), each once, in order met. */
function namesAt(system: CompiledSystem, indices: readonly number[]): string[] {
  const out = new Set<string>();
  for (const i of indices) for (const name of system.elementsAt[i] ?? []) out.add(name);
  return [...out];
}

/**
 * A maximum matching of equations (rows) to unknowns (columns) on the entries of A that are not
 * exactly zero, by augmenting paths (Duff, "On algorithms for obtaining a maximum transversal",
 * ACM TOMS 7, 1981). Rows and columns left unmatched are where the structure fails.
 */
function maximumMatching(
  system: CompiledSystem,
  A: Float64Array,
): { size: number; unmatchedRows: number[]; unmatchedColumns: number[] } {
  const { n, pattern } = system;
  const { Ap, Ai } = pattern;
  const rowOf = new Int32Array(n).fill(-1); // column → matched row
  const colOf = new Int32Array(n).fill(-1); // row → matched column
  const visited = new Int32Array(n).fill(-1);
  const augment = (j: number, stamp: number): boolean => {
    // Iterative depth-first search with explicit stacks (chains of ten thousand stages are deep).
    const stackColumn: number[] = [j];
    const stackPosition: number[] = [Ap[j]!];
    const pathRow: number[] = [];
    while (stackColumn.length > 0) {
      const top = stackColumn.length - 1;
      const c = stackColumn[top]!;
      let p = stackPosition[top]!;
      let advanced = false;
      for (; p < Ap[c + 1]!; p++) {
        const i = Ai[p]!;
        if (A[p] === 0 || visited[i] === stamp) continue;
        visited[i] = stamp;
        stackPosition[top] = p + 1;
        pathRow.push(i);
        if (colOf[i]! < 0) {
          // Flip the path: every column on the stack takes the row it reached.
          for (let s = stackColumn.length - 1; s >= 0; s--) {
            const row = pathRow[s]!;
            const col = stackColumn[s]!;
            rowOf[col] = row;
            colOf[row] = col;
          }
          return true;
        }
        stackColumn.push(colOf[i]!);
        stackPosition.push(Ap[colOf[i]!]!);
        advanced = true;
        break;
      }
      if (!advanced) {
        stackColumn.pop();
        stackPosition.pop();
        pathRow.pop();
      }
    }
    return false;
  };
  let size = 0;
  for (let j = 0; j < n; j++) if (augment(j, j)) size++;
  const unmatchedRows: number[] = [];
  const unmatchedColumns: number[] = [];
  for (let i = 0; i < n; i++) if (colOf[i]! < 0) unmatchedRows.push(i);
  for (let j = 0; j < n; j++) if (rowOf[j]! < 0) unmatchedColumns.push(j);
  return { size, unmatchedRows, unmatchedColumns };
}

/**
 * An estimate of the 1-norm condition number of D·A, D scaling every row of A to a largest entry
 * of 1 (the scaling the factorization's pivot tests use), by Hager's method as refined by Higham
 * ("FORTRAN codes for estimating the one-norm of a real or complex matrix", ACM TOMS 14, 1988):
 * a few solves with A and Aᵀ on the factors already computed.
 */
function equilibratedCondition(
  system: CompiledSystem,
  A: Float64Array,
  solver: { solve(b: Float64Array): void; solveTranspose(b: Float64Array): void },
): number {
  const { n, pattern } = system;
  const { Ap, Ai } = pattern;
  const rowMax = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const i = Ai[p]!;
      rowMax[i] = Math.max(rowMax[i]!, Math.abs(A[p]!));
    }
  }
  // ‖D·A‖₁: the largest column sum of the scaled entries.
  let norm = 0;
  for (let j = 0; j < n; j++) {
    let sum = 0;
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) sum += Math.abs(A[p]!) / rowMax[Ai[p]!]!;
    norm = Math.max(norm, sum);
  }
  // ‖(D·A)⁻¹‖₁ estimated: (D·A)⁻¹·v = A⁻¹·(D⁻¹·v) and (D·A)⁻ᵀ·v = D⁻¹·(A⁻ᵀ·v).
  const x = new Float64Array(n + 1).fill(1 / n);
  const y = new Float64Array(n + 1);
  let estimate = 0;
  let lastIndex = -1;
  for (let round = 0; round < 5; round++) {
    for (let i = 0; i < n; i++) y[i] = x[i]! * rowMax[i]!;
    y[n] = 0;
    solver.solve(y);
    let sum = 0;
    for (let i = 0; i < n; i++) sum += Math.abs(y[i]!);
    if (!Number.isFinite(sum)) return Number.POSITIVE_INFINITY;
    if (round > 0 && sum <= estimate) break;
    estimate = sum;
    const z = new Float64Array(n + 1);
    for (let i = 0; i < n; i++) z[i] = y[i]! >= 0 ? 1 : -1;
    solver.solveTranspose(z);
    let best = 0;
    let index = 0;
    for (let i = 0; i < n; i++) {
      const zi = Math.abs(z[i]! * rowMax[i]!);
      if (zi > best) {
        best = zi;
        index = i;
      }
    }
    if (index === lastIndex) break;
    lastIndex = index;
    x.fill(0);
    x[index] = 1;
  }
  return norm * estimate;
}
