/**
 * The common step of every fit: named parameters, some fitted on a logarithmic scale (those that
 * span decades and must stay positive: saturation currents, gain factors), mapped to the vector θ of
 * the least-squares routine and back, with each parameter's standard error.
 */

import { invalidValue } from '../errors/messages.js';
import { QuiescentError } from '../errors/quiescent-error.js';
import { levenbergMarquardt } from './levenberg-marquardt.js';

/**
 * The junction conductance of the solves inside a fit, in S: negligible, since it is a numerical aid
 * of the operating point rather than part of a measured part's law (every node of a fit's circuit is
 * held by a source or a resistance, so the equations stay regular without it).
 */
export const FIT_JUNCTION_CONDUCTANCE = 1e-30;

/** One fitted parameter: its name, whether θ is its logarithm, and its starting value. */
export interface FittedParameter {
  readonly name: string;
  readonly logarithmic: boolean;
  readonly start: number;
}

/** The outcome of a fit, before it is dressed as a model. */
export interface ParameterFit {
  /** Fitted values by name. */
  readonly values: Readonly<Record<string, number>>;
  /** Standard error of each fitted value, in its unit (by the delta method for logarithmic ones). */
  readonly standardErrors: Readonly<Record<string, number>>;
  /** Σ r² at the minimum. */
  readonly sumOfSquares: number;
  /** √(Σ r²/m). */
  readonly rms: number;
  readonly iterations: number;
  readonly converged: boolean;
}

/** The residual at a fit. */
export interface FitResidual {
  /** √(Σr²/m) over the m residuals. */
  readonly rms: number;
  /** Σr². */
  readonly sumOfSquares: number;
  /** What one residual measures, e.g. `'ln(I_model/I_measured)'`. */
  readonly measure: string;
}

/** Every fit's report: the model for the builder, its standard errors, the residual, what was left out. */
export interface FitResult<M> {
  /** The fitted model, ready for the builder (held parameters included as given). */
  readonly model: M;
  /** The standard error of each fitted parameter, in its unit. */
  readonly standardErrors: Readonly<Record<string, number>>;
  /** The residual at the fit: root mean square, sum of squares, and what one residual measures. */
  readonly residual: FitResidual;
  /** Indices of the points the fit ignored (see each fit for its rule). */
  readonly ignored: readonly number[];
  /** Iterations of the least-squares routine. */
  readonly iterations: number;
}

/**
 * Fit named parameters. `residuals` receives the values by name (fitted ones at the trial point) and
 * writes m residuals, returning false where the model rejects them (a value out of its range, no
 * operating point).
 *
 * @throws QuiescentError `invalid-value` naming `path` when there are too few points or the model
 * cannot be evaluated at the starting values
 */
export function fitParameters(
  parameters: readonly FittedParameter[],
  residualCount: number,
  residuals: (values: Readonly<Record<string, number>>, out: Float64Array) => boolean,
  path: readonly (string | number)[],
): ParameterFit {
  const p = parameters.length;
  if (residualCount < p + 1) {
    throw invalidValue(path, residualCount, `at least ${p + 1} usable residuals to fit ${p} parameters`);
  }
  const values: Record<string, number> = {};
  const toValues = (theta: Float64Array): Record<string, number> => {
    parameters.forEach((parameter, j) => {
      values[parameter.name] = parameter.logarithmic ? Math.exp(theta[j]!) : theta[j]!;
    });
    return values;
  };
  const guarded = (theta: Float64Array, out: Float64Array): boolean => {
    try {
      if (!residuals(toValues(theta), out)) return false;
    } catch (error) {
      if (error instanceof QuiescentError) return false;
      throw error;
    }
    for (let i = 0; i < out.length; i++) if (!Number.isFinite(out[i]!)) return false;
    return true;
  };
  const start = Float64Array.from(parameters, (q) => (q.logarithmic ? Math.log(q.start) : q.start));
  if (!guarded(start, new Float64Array(residualCount))) {
    throw invalidValue(
      path,
      Object.fromEntries(parameters.map((q) => [q.name, q.start])),
      'data the model can be evaluated on from its starting values',
    );
  }
  const solution = levenbergMarquardt({ parameterCount: p, residualCount, residuals: guarded }, start);
  const fitted = { ...toValues(solution.theta) };
  const standardErrors: Record<string, number> = {};
  parameters.forEach((parameter, j) => {
    const variance = solution.covariance[j * p + j]!;
    const se = Math.sqrt(Math.max(variance, 0));
    const value = parameter.logarithmic ? fitted[parameter.name]! * se : se;
    standardErrors[parameter.name] = Number.isFinite(value) ? value : Number.POSITIVE_INFINITY;
  });
  return {
    values: fitted,
    standardErrors,
    sumOfSquares: solution.sumOfSquares,
    rms: Math.sqrt(solution.sumOfSquares / residualCount),
    iterations: solution.iterations,
    converged: solution.converged,
  };
}

/** Ordinary least-squares line y = a + b·x through the points (for starting values). */
export function straightLine(
  x: readonly number[],
  y: readonly number[],
): { intercept: number; slope: number } {
  const n = x.length;
  let sx = 0;
  let sy = 0;
  for (let i = 0; i < n; i++) {
    sx += x[i]!;
    sy += y[i]!;
  }
  const mx = sx / n;
  const my = sy / n;
  let sxx = 0;
  let sxy = 0;
  for (let i = 0; i < n; i++) {
    sxx += (x[i]! - mx) ** 2;
    sxy += (x[i]! - mx) * (y[i]! - my);
  }
  const slope = sxx > 0 ? sxy / sxx : 0;
  return { intercept: my - slope * mx, slope };
}
