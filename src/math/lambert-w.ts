/**
 * The principal branch W0 of the Lambert W function on x ≥ 0: the real w ≥ 0 with w·e^w = x
 * (R. M. Corless, G. H. Gonnet, D. E. G. Hare, D. J. Jeffrey and D. E. Knuth, "On the Lambert W
 * function", Advances in Computational Mathematics 5, 1996).
 *
 * Both entry points refine a starting guess by Halley's iteration (cubic convergence):
 *
 * - for x ≤ e, on f(w) = w·e^w − x, from Winitzki's uniform approximation
 *     w ≈ L·(1 − ln(1 + L)/(2 + L)),  L = ln(1 + x)
 *   (S. Winitzki, "Uniform approximations for transcendental functions", ICCSA 2003, LNCS 2667);
 * - for x > e, in the log domain on f(w) = w + ln w − ln x, from the first terms of the asymptotic
 *   series w ≈ L1 − L2 + L2/L1, L1 = ln x, L2 = ln L1 (Corless et al. 1996, section 4). Working with
 *   ln x lets {@link lambertW0OfExp} take arguments e^L far beyond the double range.
 *
 * Measured against mpmath.lambertw at 50 digits (test/reference/lambert-w.json) the relative error
 * is within a few units in the last place.
 */
import { checkFinite, checkNonNegativeFinite } from './check-argument.js';

/** Stop when a Halley step changes w by less than this fraction: the next error is its cube. */
const STEP_TOLERANCE = 1e-10;

/** Halley's iteration converges in three or four steps from either guess; this is a safety net. */
const MAX_STEPS = 20;

/** Halley on w·e^w − x = 0, for 0 < x ≤ e. */
function solveDirect(x: number): number {
  const l = Math.log1p(x);
  let w = l * (1 - Math.log1p(l) / (2 + l));
  for (let step = 0; step < MAX_STEPS; step++) {
    const ew = Math.exp(w);
    const f = w * ew - x;
    const wp1 = w + 1;
    // Halley: Δ = f / (f' − f·f''/(2f')), f' = e^w·(w + 1), f'' = e^w·(w + 2)
    const delta = f / (ew * wp1 - ((w + 2) * f) / (2 * wp1));
    w -= delta;
    if (Math.abs(delta) <= STEP_TOLERANCE * w) {
      break;
    }
  }
  return w;
}

/** Halley on w + ln w − logX = 0, for logX > 1 (so w > 1). */
function solveLog(logX: number): number {
  const l2 = Math.log(logX);
  let w = logX - l2 + l2 / logX;
  for (let step = 0; step < MAX_STEPS; step++) {
    // w − logX is exact (Sterbenz) because logX/2 ≤ w ≤ logX when logX ≥ 1.
    const f = w - logX + Math.log(w);
    const fp = 1 + 1 / w;
    const fpp = -1 / (w * w);
    // Halley: Δ = (f/f') / (1 − f·f''/(2f'²))
    const delta = f / fp / (1 - (f * fpp) / (2 * fp * fp));
    w -= delta;
    if (Math.abs(delta) <= STEP_TOLERANCE * w) {
      break;
    }
  }
  return w;
}

/**
 * W0(x), the principal branch of the Lambert W function, for real x ≥ 0: the w ≥ 0 with w·e^w = x.
 * W0(0) = 0, W0(e) = 1, W0(x) ≈ x − x² for small x and ≈ ln x − ln ln x for large x.
 *
 * @param x - the argument, finite and ≥ 0
 * @returns W0(x), to within a few units in the last place
 * @throws RangeError when x is negative, NaN or infinite
 *
 * @example
 * lambertW0(1); // 0.5671432904097838, the omega constant
 */
export function lambertW0(x: number): number {
  checkNonNegativeFinite(x, 'x');
  if (x === 0) {
    return 0;
  }
  if (x <= Math.E) {
    return solveDirect(x);
  }
  return solveLog(Math.log(x));
}

/**
 * W0(e^logX), the Lambert W function of an argument given by its natural logarithm, for any finite
 * real logX. It solves w + ln w = logX directly, so e^logX may lie far outside the double range
 * (logX > 709.78): for example the exact current of a diode in series with a resistor at a large
 * supply voltage needs W0 of exp((V + I_S·R)/(n·Vt)), an exponent of several thousand.
 *
 * @param logX - ln of the argument of W0, finite
 * @returns W0(e^logX), to within a few units in the last place (0 where e^logX underflows)
 * @throws RangeError when logX is NaN or infinite
 *
 * @example
 * lambertW0OfExp(1); // 1, since 1·e^1 = e
 */
export function lambertW0OfExp(logX: number): number {
  checkFinite(logX, 'logX');
  if (logX <= 1) {
    // e^logX ≤ e is representable (or underflows to 0, where W0 ≈ e^logX also underflows).
    return lambertW0(Math.exp(logX));
  }
  return solveLog(logX);
}
