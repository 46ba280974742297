/**
 * The op-amp's output limiter: the linear output value u passed through a smooth, monotonic,
 * continuously differentiable curve that never crosses the limits [low, high].
 *
 * Between low + w and high − w it is the identity (so the output is exactly linear there); beyond
 * those knees it bends into an exponential approach to the limit with matching value and slope:
 *   y = high − w·exp(−(u − (high − w))/w)   for u > high − w,
 *   y = low  + w·exp( (u − (low + w))/w)    for u < low + w,
 * with knee width w = min(50 mV, (high − low)/4), so the two knees never overlap. Then y equals u
 * while u is more than 50 mV inside both limits, never reaches a limit, and lies within
 * w·e^(−(1 + w)/w) ≤ 50 mV·e^(−21) of a limit once u is 1 V or more beyond it (common practice, no
 * source: a piecewise exponential clamp).
 */

/** The widest knee of the limiter, in V. */
export const LIMITER_KNEE = 0.05;

/** The knee width w of a limiter with limits [low, high] (either may be infinite). */
export function limiterKnee(low: number, high: number): number {
  return Math.min(LIMITER_KNEE, (high - low) / 4);
}

/**
 * The limited value and its first three derivatives at u, written to out[0 … 3]. `knee` is
 * {@link limiterKnee}(low, high). Returns out.
 */
export function limitOutput(
  u: number,
  low: number,
  high: number,
  knee: number,
  out: Float64Array,
): Float64Array {
  if (u > high - knee) {
    // y = high − w·e^(−t), t = (u − high + w)/w: y' = e^(−t), y'' = −e^(−t)/w, y''' = e^(−t)/w².
    const e = Math.exp(-(u - high + knee) / knee);
    out[0] = high - knee * e;
    out[1] = e;
    out[2] = -e / knee;
    out[3] = e / (knee * knee);
  } else if (u < low + knee) {
    const e = Math.exp((u - low - knee) / knee);
    out[0] = low + knee * e;
    out[1] = e;
    out[2] = e / knee;
    out[3] = e / (knee * knee);
  } else {
    out[0] = u;
    out[1] = 1;
    out[2] = 0;
    out[3] = 0;
  }
  return out;
}
