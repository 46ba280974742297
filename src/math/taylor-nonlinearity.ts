/**
 * The nonlinearity figures of a current known by its Taylor coefficients at the bias,
 * i = g1·v + g2·v²/2 + g3·v³/6, driven by v = v̂·cos ωt with x = v̂/scale and the normalized
 * coefficients c2 = g2·scale/g1, c3 = g3·scale²/g1. With cos²θ = (1 + cos 2θ)/2 and
 * cos³θ = (3·cos θ + cos 3θ)/4 the current is, to third order,
 *   g1·v̂·cos ωt + (g2·v̂²/4)·(1 + cos 2ωt) + (g3·v̂³/24)·(3·cos ωt + cos 3ωt)·…,
 * so, relative to the linear term g1·v̂:
 * - second harmonic c2·x/4, third harmonic c3·x²/24;
 * - mean shift c2·x²/4 relative to g1·scale (the quiescent current when scale = I/g1);
 * - the first-order remainder is (i''(ξ)/2)·v² for some |ξ| ≤ v̂, and |i''| ≤ |g2| + |g3|·v̂ to this
 *   order, so its bound relative to the linear term is (|c2|·x + |c3|·x²)/2.
 * The square law (c2 = 1, c3 = 0, scale = V_ov) gives x/4, 0 and x/2 (common practice, no source:
 * the trigonometric power identities).
 */
import { checkNonNegativeFinite } from './check-argument.js';
import type { NonlinearityFigures } from './junction-nonlinearity.js';

/** Normalized Taylor coefficients c2 = g2·scale/g1 and c3 = g3·scale²/g1 of a current at its bias. */
export interface TaylorCoefficients {
  readonly second: number;
  readonly third: number;
}

/**
 * The four figures of a current with normalized Taylor coefficients `c` at normalized amplitude x.
 *
 * @param x - the normalized amplitude v̂/scale, finite and ≥ 0
 * @param c - the normalized coefficients
 * @returns error bound, second and third harmonics, mean shift
 * @throws RangeError when x is negative, NaN or infinite
 */
export function taylorNonlinearity(x: number, c: TaylorCoefficients): NonlinearityFigures {
  checkNonNegativeFinite(x, 'x');
  return {
    errorBound: 0.5 * (Math.abs(c.second) * x + Math.abs(c.third) * x * x),
    secondHarmonic: (Math.abs(c.second) * x) / 4,
    thirdHarmonic: (Math.abs(c.third) * x * x) / 24,
    meanShift: (Math.abs(c.second) * x * x) / 4,
  };
}

/**
 * The normalized amplitude at which {@link taylorNonlinearity}'s error bound equals `budget`: the
 * positive root of (|c2|·x + |c3|·x²)/2 = budget (Infinity for a linear current).
 *
 * @param budget - the allowed bound, finite and ≥ 0
 * @param c - the normalized coefficients
 * @returns x at the budget
 */
export function taylorAmplitudeForBound(budget: number, c: TaylorCoefficients): number {
  checkNonNegativeFinite(budget, 'budget');
  const a = Math.abs(c.second);
  const b = Math.abs(c.third);
  if (b === 0) return a === 0 ? Number.POSITIVE_INFINITY : (2 * budget) / a;
  // Stable root of b·x² + a·x − 2·budget = 0.
  return (4 * budget) / (a + Math.sqrt(a * a + 8 * b * budget));
}
