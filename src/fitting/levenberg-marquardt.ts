/**
 * Nonlinear least squares by the method of K. Levenberg (Quart. Appl. Math. 2, 1944) and
 * D. W. Marquardt (J. SIAM 11(2), 1963): minimize Σ r_i(θ)² by steps δ solving
 * (JᵀJ + μ·diag(JᵀJ))·δ = −Jᵀr, shrinking μ after a step that lowers the sum and growing it after one
 * that does not. The Jacobian is taken by central differences, since the residuals come from full
 * operating-point solves. At the minimum the covariance of θ is s²·(JᵀJ)⁻¹ with
 * s² = Σr²/(m − p) (the usual asymptotic estimate; e.g. Bates & Watts, Nonlinear Regression Analysis
 * and Its Applications, 1988, ch. 2).
 *
 * A routine of our own rather than a package: the fits need the Jacobian at the solution for the
 * standard errors, steps that a model rejects (a parameter leaving its range) must count as
 * failures, and the available packages report neither.
 */
import { Matrix, pseudoInverse, solve } from 'ml-matrix';

/** A least-squares problem: residuals r(θ) of m points for p parameters. */
export interface LeastSquaresProblem {
  /** p, the number of parameters. */
  readonly parameterCount: number;
  /** m, the number of residuals (at least p + 1). */
  readonly residualCount: number;
  /** Write r(θ) into `out`; return false when the model cannot be evaluated at θ (a rejected step). */
  residuals(theta: Float64Array, out: Float64Array): boolean;
}

/** What the minimization reached. */
export interface LeastSquaresSolution {
  /** θ at the minimum. */
  readonly theta: Float64Array;
  /** Σ r_i² there. */
  readonly sumOfSquares: number;
  /** The residuals there. */
  readonly residuals: Float64Array;
  /** s²·(JᵀJ)⁻¹, p×p row-major (a pseudo-inverse where JᵀJ is singular). */
  readonly covariance: Float64Array;
  /** Iterations taken. */
  readonly iterations: number;
  /** Whether the relative step or decrease fell below the tolerance before the iteration limit. */
  readonly converged: boolean;
}

/** Options of {@link levenbergMarquardt}. */
export interface LeastSquaresOptions {
  /** The most iterations (default 200). */
  readonly maxIterations?: number;
  /** Relative step size and relative decrease of Σr² taken as converged (default 1e-10). */
  readonly tolerance?: number;
}

/** Central-difference Jacobian of the residuals at θ, m×p. Returns false if a neighbour is rejected. */
function jacobian(problem: LeastSquaresProblem, theta: Float64Array, J: Matrix): boolean {
  const m = problem.residualCount;
  const plus = new Float64Array(m);
  const minus = new Float64Array(m);
  const probe = theta.slice();
  for (let j = 0; j < problem.parameterCount; j++) {
    const h = 1e-6 * Math.max(Math.abs(theta[j]!), 1e-3);
    probe[j] = theta[j]! + h;
    const okPlus = problem.residuals(probe, plus);
    probe[j] = theta[j]! - h;
    const okMinus = problem.residuals(probe, minus);
    probe[j] = theta[j]!;
    if (okPlus && okMinus) {
      for (let i = 0; i < m; i++) J.set(i, j, (plus[i]! - minus[i]!) / (2 * h));
    } else if (okPlus || okMinus) {
      // At the edge of the admissible range: a one-sided difference.
      const r0 = new Float64Array(m);
      if (!problem.residuals(theta, r0)) return false;
      const side = okPlus ? plus : minus;
      const s = okPlus ? h : -h;
      for (let i = 0; i < m; i++) J.set(i, j, (side[i]! - r0[i]!) / s);
    } else {
      return false;
    }
  }
  return true;
}

function sumOfSquares(r: Float64Array): number {
  let s = 0;
  for (let i = 0; i < r.length; i++) s += r[i]! * r[i]!;
  return s;
}

/**
 * Minimize Σ r_i(θ)² from `start`.
 *
 * @param problem - the residuals
 * @param start - the starting parameters (residuals must be computable there)
 * @param options - iteration limit and tolerance
 * @returns the minimum, its residuals and the covariance estimate
 * @throws Error when the residuals cannot be computed at `start` (callers check their start first)
 */
export function levenbergMarquardt(
  problem: LeastSquaresProblem,
  start: Float64Array,
  options: LeastSquaresOptions = {},
): LeastSquaresSolution {
  const maxIterations = options.maxIterations ?? 200;
  const tolerance = options.tolerance ?? 1e-10;
  const p = problem.parameterCount;
  const m = problem.residualCount;
  let theta = start.slice();
  let r = new Float64Array(m);
  if (!problem.residuals(theta, r)) throw new Error('the residuals cannot be computed at the start');
  let ssr = sumOfSquares(r);
  const J = new Matrix(m, p);
  let mu = 1e-3;
  let iterations = 0;
  let converged = false;
  const trial = new Float64Array(m);
  while (iterations < maxIterations && !converged) {
    iterations++;
    if (!jacobian(problem, theta, J)) break;
    const JtJ = J.transpose().mmul(J);
    const Jtr = J.transpose().mmul(Matrix.columnVector(Array.from(r)));
    let accepted = false;
    // Grow μ until a step lowers the sum (or μ is so large that the step vanishes).
    while (mu < 1e16) {
      const A = JtJ.clone();
      for (let j = 0; j < p; j++) A.set(j, j, JtJ.get(j, j) * (1 + mu) + 1e-300);
      const delta = solve(A, Jtr.clone().mul(-1));
      const next = theta.slice();
      let stepSmall = true;
      for (let j = 0; j < p; j++) {
        const d = delta.get(j, 0);
        next[j] = theta[j]! + d;
        if (Math.abs(d) > tolerance * (Math.abs(theta[j]!) + tolerance)) stepSmall = false;
      }
      if (problem.residuals(next, trial)) {
        const trialSsr = sumOfSquares(trial);
        if (trialSsr <= ssr) {
          const decrease = ssr - trialSsr;
          theta = next;
          r = trial.slice();
          converged = stepSmall || decrease <= tolerance * ssr || trialSsr === 0;
          ssr = trialSsr;
          mu = Math.max(mu / 3, 1e-12);
          accepted = true;
          break;
        }
      }
      if (stepSmall) {
        converged = true;
        break;
      }
      mu *= 4;
    }
    if (!accepted && !converged) break;
  }
  jacobian(problem, theta, J);
  const dof = Math.max(m - p, 1);
  const scale = ssr / dof;
  const inverse = pseudoInverse(J.transpose().mmul(J));
  const covariance = new Float64Array(p * p);
  for (let i = 0; i < p; i++) for (let j = 0; j < p; j++) covariance[i * p + j] = scale * inverse.get(i, j);
  return { theta, sumOfSquares: ssr, residuals: r, covariance, iterations, converged };
}
