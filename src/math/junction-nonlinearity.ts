/**
 * How far from linear a junction or a channel runs under a sinusoidal signal of given amplitude:
 * the figures of the linearity report, as pure functions of the normalized amplitude x.
 *
 * Exponential junction, driven by v(t) = v̂·cos ωt around its bias, x = v̂/(n·Vt):
 *   i(t) = I_Q·e^(x·cos ωt) = I_Q·(I0(x) + 2·Σ_{k≥1} Ik(x)·cos kωt)      (A&S 9.6.34)
 * (I_Q the quiescent current, the −I_S term of the diode law left out), so
 * - the k-th harmonic relative to the fundamental is Ik(x)/I1(x);
 * - the mean current rises by the factor I0(x): the mean shift relative to I_Q is I0(x) − 1;
 * - the first-order Taylor remainder e^u − 1 − u, relative to the linear term u, is at most
 *   (|u|/2)·e^|u| ≤ (x/2)·e^x for |u| ≤ x (Lagrange form of the remainder).
 *
 * Square-law channel in saturation, id = ½β·(V_ov + v)², v = v̂·cos ωt, x = v̂/V_ov:
 *   id = ½β·V_ov²·(1 + x²/2) + β·V_ov·v̂·cos ωt + ¼β·v̂²·cos 2ωt,
 * so the remainder relative to the linear term is exactly v/(2V_ov), at most x/2; the second
 * harmonic is x/4 of the fundamental; there is no third; the mean shifts by x²/2 of ½β·V_ov².
 *
 * Modified Bessel functions: M. Abramowitz and I. A. Stegun, "Handbook of Mathematical Functions",
 * 1964, chapter 9.
 */
import { besselI0MinusOne, besselI2OverI1, besselI3OverI1 } from './bessel.js';
import { checkNonNegativeFinite } from './check-argument.js';
import { lambertW0, lambertW0OfExp } from './lambert-w.js';

/** The nonlinearity figures of one junction or channel at one normalized amplitude. */
export interface NonlinearityFigures {
  /** Bound on the first-order Taylor remainder relative to the linear term. */
  readonly errorBound: number;
  /** Amplitude of the second harmonic of the current relative to its fundamental. */
  readonly secondHarmonic: number;
  /** Amplitude of the third harmonic of the current relative to its fundamental. */
  readonly thirdHarmonic: number;
  /** Rise of the mean current relative to the quiescent current. */
  readonly meanShift: number;
}

/**
 * The Lagrange bound (x/2)·e^x of the first-order Taylor remainder of an exponential junction,
 * relative to its linear term, for a signal of normalized amplitude x = v̂/(n·Vt).
 *
 * @param x - the normalized amplitude, finite and ≥ 0
 * @returns (x/2)·e^x (Infinity above x ≈ 703)
 * @throws RangeError when x is negative, NaN or infinite
 *
 * @example
 * junctionErrorBound(0.1); // 0.05525854590378239
 */
export function junctionErrorBound(x: number): number {
  checkNonNegativeFinite(x, 'x');
  return 0.5 * x * Math.exp(x);
}

/**
 * The second-harmonic ratio I2(x)/I1(x) of an exponential junction's current for a sinusoidal
 * junction voltage of normalized amplitude x = v̂/(n·Vt); about x/4 for small x.
 *
 * @param x - the normalized amplitude, finite and ≥ 0
 * @returns I2(x)/I1(x), in [0, 1)
 * @throws RangeError when x is negative, NaN or infinite
 */
export function junctionSecondHarmonic(x: number): number {
  return besselI2OverI1(x);
}

/**
 * The third-harmonic ratio I3(x)/I1(x) of an exponential junction's current for a sinusoidal
 * junction voltage of normalized amplitude x = v̂/(n·Vt); about x²/24 for small x.
 *
 * @param x - the normalized amplitude, finite and ≥ 0
 * @returns I3(x)/I1(x), in [0, 1)
 * @throws RangeError when x is negative, NaN or infinite
 */
export function junctionThirdHarmonic(x: number): number {
  return besselI3OverI1(x);
}

/**
 * The rise I0(x) − 1 of an exponential junction's mean current, relative to its quiescent current,
 * under a sinusoidal junction voltage of normalized amplitude x = v̂/(n·Vt); about x²/4 for small x.
 *
 * @param x - the normalized amplitude, finite and ≥ 0
 * @returns I0(x) − 1, accurate for small x (Infinity above x ≈ 713.9)
 * @throws RangeError when x is negative, NaN or infinite
 */
export function junctionMeanShift(x: number): number {
  return besselI0MinusOne(x);
}

/**
 * All four figures of an exponential junction at normalized amplitude x = v̂/(n·Vt).
 *
 * @param x - the normalized amplitude, finite and ≥ 0
 * @returns the error bound, the second and third harmonic ratios and the mean shift
 * @throws RangeError when x is negative, NaN or infinite
 */
export function junctionNonlinearity(x: number): NonlinearityFigures {
  return {
    errorBound: junctionErrorBound(x),
    secondHarmonic: besselI2OverI1(x),
    thirdHarmonic: besselI3OverI1(x),
    meanShift: besselI0MinusOne(x),
  };
}

/**
 * The first-order Taylor remainder of a square-law channel relative to its linear term, x/2, for a
 * gate-source signal of normalized amplitude x = v̂gs/V_ov. For the square law it is exact at the
 * signal's peak, not only a bound.
 *
 * @param x - the normalized amplitude, finite and ≥ 0
 * @returns x/2
 * @throws RangeError when x is negative, NaN or infinite
 */
export function channelErrorBound(x: number): number {
  checkNonNegativeFinite(x, 'x');
  return 0.5 * x;
}

/**
 * The second-harmonic ratio x/4 of a square-law channel's drain current for a sinusoidal
 * gate-source voltage of normalized amplitude x = v̂gs/V_ov.
 *
 * @param x - the normalized amplitude, finite and ≥ 0
 * @returns x/4
 * @throws RangeError when x is negative, NaN or infinite
 */
export function channelSecondHarmonic(x: number): number {
  checkNonNegativeFinite(x, 'x');
  return 0.25 * x;
}

/**
 * The third-harmonic ratio of a square-law channel: 0, since a quadratic makes no third harmonic.
 *
 * @param x - the normalized amplitude, finite and ≥ 0 (checked, otherwise unused)
 * @returns 0
 * @throws RangeError when x is negative, NaN or infinite
 */
export function channelThirdHarmonic(x: number): number {
  checkNonNegativeFinite(x, 'x');
  return 0;
}

/**
 * The rise x²/2 of a square-law channel's mean drain current, relative to its quiescent current
 * ½β·V_ov², for a sinusoidal gate-source voltage of normalized amplitude x = v̂gs/V_ov.
 *
 * @param x - the normalized amplitude, finite and ≥ 0
 * @returns x²/2
 * @throws RangeError when x is negative, NaN or infinite
 */
export function channelMeanShift(x: number): number {
  checkNonNegativeFinite(x, 'x');
  return 0.5 * x * x;
}

/**
 * All four figures of a square-law channel at normalized amplitude x = v̂gs/V_ov.
 *
 * @param x - the normalized amplitude, finite and ≥ 0
 * @returns the error bound x/2, the harmonic ratios x/4 and 0, and the mean shift x²/2
 * @throws RangeError when x is negative, NaN or infinite
 */
export function channelNonlinearity(x: number): NonlinearityFigures {
  return {
    errorBound: channelErrorBound(x),
    secondHarmonic: 0.25 * x,
    thirdHarmonic: 0,
    meanShift: 0.5 * x * x,
  };
}

/**
 * The normalized amplitude x at which a junction's error bound (x/2)·e^x reaches `budget`: the
 * inverse of {@link junctionErrorBound}, x = W0(2·budget) with the Lambert W function. Dividing it
 * by a junction's actual normalized amplitude gives the factor by which its signal may grow.
 *
 * @param budget - the allowed error bound b, finite and ≥ 0
 * @returns the x ≥ 0 with (x/2)·e^x = b
 * @throws RangeError when budget is negative, NaN or infinite
 *
 * @example
 * junctionAmplitudeForBound(0.1); // 0.16891597349910956, about 4.4 mV peak at n·Vt = 25.9 mV
 */
export function junctionAmplitudeForBound(budget: number): number {
  checkNonNegativeFinite(budget, 'budget');
  // 2·budget overflows above 8.9e307; ln(2·budget) does not.
  return budget <= 1e300 ? lambertW0(2 * budget) : lambertW0OfExp(Math.LN2 + Math.log(budget));
}

/**
 * The normalized amplitude x at which a channel's error bound x/2 reaches `budget`: x = 2·budget,
 * the inverse of {@link channelErrorBound}.
 *
 * @param budget - the allowed error bound b, finite and ≥ 0
 * @returns 2·b
 * @throws RangeError when budget is negative, NaN or infinite
 */
export function channelAmplitudeForBound(budget: number): number {
  checkNonNegativeFinite(budget, 'budget');
  return 2 * budget;
}
