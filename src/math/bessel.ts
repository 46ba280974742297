/**
 * Modified Bessel functions of the first kind, I0 to I3, for real x ≥ 0, with their exponentially
 * scaled forms e^-x·In(x), the ratios I2/I1 and I3/I1, and I0(x) − 1.
 *
 * Two methods, both from M. Abramowitz and I. A. Stegun, "Handbook of Mathematical Functions",
 * National Bureau of Standards, 1964, chapter 9:
 *
 * - x ≤ {@link SERIES_LIMIT}: the ascending series (A&S 9.6.10)
 *     In(x) = (x/2)^n · Sn(x),   Sn(x) = Σ_{k≥0} (x²/4)^k / (k!·(n+k)!),
 *   whose terms are all positive, so it loses no digits to cancellation;
 * - x > {@link SERIES_LIMIT}: the asymptotic expansion for large argument (A&S 9.7.1)
 *     e^-x·In(x) ~ (2πx)^-½ · An(x),
 *     An(x) = 1 − (μ−1)/(8x) + (μ−1)(μ−9)/(2!(8x)²) − (μ−1)(μ−9)(μ−25)/(3!(8x)³) + …,  μ = 4n².
 *   Its smallest term is about e^-2x (the size of the exponentially small part that the expansion
 *   leaves out), below 1e-17 of the sum for x > 20, so the sum stopped at double precision is exact
 *   to rounding.
 *
 * The ratios use Sm/Sn or Am/An, so the exponential and (x/2)^n factors cancel before they are
 * formed: the ratios neither overflow at large x nor underflow at small x. Measured against mpmath
 * at 50 digits (test/reference/bessel.json) the relative error is a few units in the last place.
 */
import { checkNonNegativeFinite } from './check-argument.js';

/** The orders of I that this module provides. */
export type BesselOrder = 0 | 1 | 2 | 3;

/** Up to this x the ascending series is used; above it, the asymptotic expansion. */
export const SERIES_LIMIT = 20;

/** Half a unit in the last place of 1: a term below EPS·sum no longer changes the sum. */
const EPS = 2 ** -53;

/** 1/√(2π). */
const INV_SQRT_2PI = 0.3989422804014327;

/** n! for n = 0..3. */
const FACTORIAL = [1, 1, 2, 6] as const;

function checkOrder(order: number): asserts order is BesselOrder {
  if (!(order === 0 || order === 1 || order === 2 || order === 3)) {
    throw new RangeError(`order must be 0, 1, 2 or 3, got ${order}`);
  }
}

/**
 * Sn(x) = Σ_{k≥first} (x²/4)^k / (k!·(n+k)!), the ascending series of A&S 9.6.10 without its
 * (x/2)^n factor. `first` = 1 drops the k = 0 term (used for I0 − 1).
 */
function seriesSum(n: BesselOrder, x: number, first: 0 | 1): number {
  const y = 0.25 * x * x;
  // term for k = 0 is 1/n!; the ratio of consecutive terms is y/(k·(n+k)).
  let term = 1 / FACTORIAL[n];
  let sum = 0;
  if (first === 0) {
    sum = term;
  }
  for (let k = 1; k < 500; k++) {
    term *= y / (k * (n + k));
    sum += term;
    if (term <= EPS * sum) {
      break;
    }
  }
  return sum;
}

/**
 * An(x) of A&S 9.7.1: e^-x·In(x)·√(2πx), for x > SERIES_LIMIT. Term k is term k−1 times
 * ((2k−1)² − μ)/(8kx), μ = 4n².
 */
function asymptoticSum(n: BesselOrder, x: number): number {
  const mu = 4 * n * n;
  const eightX = 8 * x;
  let term = 1;
  let sum = 1;
  for (let k = 1; k < 100; k++) {
    const odd = 2 * k - 1;
    const next = (term * (odd * odd - mu)) / (k * eightX);
    // Past the smallest term the expansion diverges; stopping there is the best it can do.
    if (Math.abs(next) >= Math.abs(term)) {
      break;
    }
    term = next;
    sum += term;
    if (Math.abs(term) <= EPS * Math.abs(sum)) {
      break;
    }
  }
  return sum;
}

/** (x/2)^n, exact for n ≤ 1 and to rounding otherwise. */
function halfPower(n: BesselOrder, x: number): number {
  const h = 0.5 * x;
  switch (n) {
    case 0:
      return 1;
    case 1:
      return h;
    case 2:
      return h * h;
    case 3:
      return h * h * h;
  }
}

/** e^-x·In(x) without argument checks. */
function scaled(n: BesselOrder, x: number): number {
  if (x <= SERIES_LIMIT) {
    return Math.exp(-x) * halfPower(n, x) * seriesSum(n, x, 0);
  }
  return (INV_SQRT_2PI / Math.sqrt(x)) * asymptoticSum(n, x);
}

/**
 * The modified Bessel function of the first kind In(x) (A&S 9.6.3), for n = 0..3 and real x ≥ 0.
 *
 * In(x) grows like e^x/√(2πx) and overflows to Infinity above x ≈ 713.9; use
 * {@link scaledBesselI} or the ratios where x may be large.
 *
 * @param order - n, the order: 0, 1, 2 or 3
 * @param x - the argument, finite and ≥ 0
 * @returns In(x), to a few units in the last place
 * @throws RangeError when the order is not 0..3 or x is negative, NaN or infinite
 *
 * @example
 * besselI(0, 1); // 1.2660658777520082
 */
export function besselI(order: BesselOrder, x: number): number {
  checkOrder(order);
  checkNonNegativeFinite(x, 'x');
  if (x <= SERIES_LIMIT) {
    return halfPower(order, x) * seriesSum(order, x, 0);
  }
  // e^x = e^(x/2)·e^(x/2), so that the product stays finite wherever In(x) itself is (x < 713.9).
  const half = Math.exp(0.5 * x);
  return scaled(order, x) * half * half;
}

/**
 * The exponentially scaled modified Bessel function e^-x·In(x), for n = 0..3 and real x ≥ 0. It is
 * finite for every finite x and behaves like 1/√(2πx) for large x (A&S 9.7.1).
 *
 * @param order - n, the order: 0, 1, 2 or 3
 * @param x - the argument, finite and ≥ 0
 * @returns e^-x·In(x)
 * @throws RangeError when the order is not 0..3 or x is negative, NaN or infinite
 *
 * @example
 * scaledBesselI(1, 10); // 0.1212626813844555
 */
export function scaledBesselI(order: BesselOrder, x: number): number {
  checkOrder(order);
  checkNonNegativeFinite(x, 'x');
  return scaled(order, x);
}

/**
 * The ratio I2(x)/I1(x) for real x ≥ 0: the amplitude of the second harmonic relative to the
 * fundamental in e^(x·cos θ) (A&S 9.6.34). It is 0 at x = 0, about x/4 for small x, increases with
 * x and tends to 1 (as 1 − 3/(2x)) for large x; in double precision it rounds to 1 above x ≈ 1e16.
 *
 * @param x - the argument, finite and ≥ 0
 * @returns I2(x)/I1(x), never overflowing
 * @throws RangeError when x is negative, NaN or infinite
 */
export function besselI2OverI1(x: number): number {
  checkNonNegativeFinite(x, 'x');
  if (x <= SERIES_LIMIT) {
    if (x === 0) {
      return 0;
    }
    // I2/I1 = (x/2)²·S2 / ((x/2)·S1) = (x/2)·S2/S1
    return (0.5 * x * seriesSum(2, x, 0)) / seriesSum(1, x, 0);
  }
  return asymptoticSum(2, x) / asymptoticSum(1, x);
}

/**
 * The ratio I3(x)/I1(x) for real x ≥ 0: the amplitude of the third harmonic relative to the
 * fundamental in e^(x·cos θ) (A&S 9.6.34). It is 0 at x = 0, about x²/24 for small x, increases
 * with x and tends to 1 (as 1 − 4/x) for large x.
 *
 * @param x - the argument, finite and ≥ 0
 * @returns I3(x)/I1(x), never overflowing
 * @throws RangeError when x is negative, NaN or infinite
 */
export function besselI3OverI1(x: number): number {
  checkNonNegativeFinite(x, 'x');
  if (x <= SERIES_LIMIT) {
    if (x === 0) {
      return 0;
    }
    // I3/I1 = (x/2)³·S3 / ((x/2)·S1) = (x/2)²·S3/S1
    const h = 0.5 * x;
    return (h * h * seriesSum(3, x, 0)) / seriesSum(1, x, 0);
  }
  return asymptoticSum(3, x) / asymptoticSum(1, x);
}

/**
 * I0(x) − 1 for real x ≥ 0, accurate for small x: it sums the series of A&S 9.6.12 from its second
 * term, Σ_{k≥1} (x²/4)^k/(k!)², instead of subtracting 1 from I0. For small x it is about x²/4.
 *
 * @param x - the argument, finite and ≥ 0
 * @returns I0(x) − 1 (Infinity above x ≈ 713.9)
 * @throws RangeError when x is negative, NaN or infinite
 */
export function besselI0MinusOne(x: number): number {
  checkNonNegativeFinite(x, 'x');
  if (x <= SERIES_LIMIT) {
    return seriesSum(0, x, 1);
  }
  // Here I0(x) > 4e7, so subtracting 1 costs nothing.
  return besselI(0, x) - 1;
}
