/**
 * Integrating a power spectral density known at discrete frequencies: between two neighbouring
 * frequencies the PSD is taken as the power law through both points (a straight line on log-log axes),
 * and that power law is integrated exactly. Noise spectra are sums of power laws (white, 1/f, the
 * slopes of poles), so this is exact on each segment where one of them dominates.
 */
import { invalidValue } from '../errors/messages.js';

/**
 * ∫ S df from f1 to f2 for the power law S = s1·(f/f1)^α through (f1, s1) and (f2, s2):
 * s1·f1·((f2/f1)^(α+1) − 1)/(α + 1), and s1·f1·ln(f2/f1) when α = −1. Where either PSD is 0 the power
 * law does not exist and the segment is integrated as a straight line (the trapezoid).
 */
export function powerLawSegment(f1: number, s1: number, f2: number, s2: number): number {
  if (f2 <= f1) return 0;
  if (!(s1 > 0) || !(s2 > 0)) return 0.5 * (s1 + s2) * (f2 - f1);
  const logRatio = Math.log(f2 / f1);
  const e = Math.log(s2 / s1) / logRatio + 1;
  // expm1(e·L)/e tends to L as e → 0, the 1/f case, without a branch on exact equality.
  const scale = Math.abs(e * logRatio) < 1e-12 ? logRatio : Math.expm1(e * logRatio) / e;
  return s1 * f1 * scale;
}

/** The PSD at f in [f1, f2] on the segment's power law (the straight line where either end is 0). */
export function powerLawAt(f: number, f1: number, s1: number, f2: number, s2: number): number {
  if (f2 <= f1) return s1;
  if (!(s1 > 0) || !(s2 > 0)) return s1 + ((s2 - s1) * (f - f1)) / (f2 - f1);
  const alpha = Math.log(s2 / s1) / Math.log(f2 / f1);
  return s1 * (f / f1) ** alpha;
}

/**
 * ∫ S df over [low, high] for a PSD sampled at ascending `frequencies`, interpolated log-log between
 * them (see {@link powerLawSegment}).
 *
 * @throws QuiescentError `invalid-value` when low ≥ high or either lies outside the sampled range
 */
export function integratePsd(
  frequencies: Float64Array,
  psd: Float64Array,
  low: number,
  high: number,
): number {
  const first = frequencies[0]!;
  const last = frequencies[frequencies.length - 1]!;
  const range = `a frequency inside the analysed range [${first}, ${last}] Hz`;
  if (typeof low !== 'number' || !(low >= first && low <= last)) throw invalidValue(['low'], low, range);
  if (typeof high !== 'number' || !(high >= first && high <= last)) throw invalidValue(['high'], high, range);
  if (!(low < high)) throw invalidValue(['high'], high, `a frequency above low (${low} Hz)`);
  let sum = 0;
  for (let k = 0; k + 1 < frequencies.length; k++) {
    const f1 = frequencies[k]!;
    const f2 = frequencies[k + 1]!;
    if (f2 <= low || f1 >= high || f2 <= f1) continue;
    const s1 = psd[k]!;
    const s2 = psd[k + 1]!;
    const a = Math.max(f1, low);
    const b = Math.min(f2, high);
    const sa = a === f1 ? s1 : powerLawAt(a, f1, s1, f2, s2);
    const sb = b === f2 ? s2 : powerLawAt(b, f1, s1, f2, s2);
    sum += powerLawSegment(a, sa, b, sb);
  }
  return sum;
}
