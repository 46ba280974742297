/**
 * Statistics of a measure over the solved samples, and the yield against a specification with the
 * score interval of E. B. Wilson ("Probable inference, the law of succession, and statistical
 * inference", J. Amer. Statist. Assoc. 22, 1927).
 */

/** Mean, spread and percentiles of one measure over the solved samples. */
export interface MeasureSummary {
  /** How many samples solved (the entries the statistics are taken over). */
  readonly count: number;
  /** The arithmetic mean. */
  readonly mean: number;
  /** The sample standard deviation, with n − 1 (NaN below two samples). */
  readonly standardDeviation: number;
  /** The smallest value. */
  readonly min: number;
  /** The largest value. */
  readonly max: number;
  /** The 1st percentile: linear interpolation between sorted values at (n − 1)·p/100, zero-based. */
  readonly p1: number;
  /** The 5th percentile. */
  readonly p5: number;
  /** The median. */
  readonly p50: number;
  /** The 95th percentile. */
  readonly p95: number;
  /** The 99th percentile. */
  readonly p99: number;
}

/** The yield of a run: the fraction of samples within specification and its 95 % Wilson interval. */
export interface YieldEstimate {
  /** Samples within every limit, over all samples (failed samples count as out of spec). */
  readonly fraction: number;
  /** The lower end of the Wilson score interval. */
  readonly low: number;
  /** The upper end of the Wilson score interval. */
  readonly high: number;
  /** Samples within specification. */
  readonly passed: number;
  /** Samples counted (solved and failed). */
  readonly total: number;
}

/** The 0.975 quantile of the standard normal distribution, for a two-sided 95 % interval. */
export const WILSON_Z = 1.959963984540054;

/**
 * The summary of `values` (in sample order). With no value every statistic is NaN (count 0): there
 * is nothing to summarize.
 */
export function summarize(values: Float64Array): MeasureSummary {
  const n = values.length;
  const sorted = Float64Array.from(values).sort();
  let sum = 0;
  for (let k = 0; k < n; k++) sum += values[k]!;
  const mean = n > 0 ? sum / n : Number.NaN;
  let squares = 0;
  for (let k = 0; k < n; k++) squares += (values[k]! - mean) ** 2;
  const percentile = (p: number): number => {
    if (n === 0) return Number.NaN;
    const position = ((n - 1) * p) / 100;
    const below = Math.floor(position);
    const above = Math.min(below + 1, n - 1);
    const fraction = position - below;
    return sorted[below]! + fraction * (sorted[above]! - sorted[below]!);
  };
  return {
    count: n,
    mean,
    standardDeviation: n > 1 ? Math.sqrt(squares / (n - 1)) : Number.NaN,
    min: n > 0 ? sorted[0]! : Number.NaN,
    max: n > 0 ? sorted[n - 1]! : Number.NaN,
    p1: percentile(1),
    p5: percentile(5),
    p50: percentile(50),
    p95: percentile(95),
    p99: percentile(99),
  };
}

/** The Wilson score interval of `passed` successes in `total` trials, z = {@link WILSON_Z}. */
export function wilsonInterval(passed: number, total: number): YieldEstimate {
  if (total === 0) return { fraction: Number.NaN, low: 0, high: 1, passed, total };
  const z = WILSON_Z;
  const p = passed / total;
  const z2n = (z * z) / total;
  const centre = (p + z2n / 2) / (1 + z2n);
  const half = (z / (1 + z2n)) * Math.sqrt((p * (1 - p)) / total + z2n / (4 * total));
  return {
    fraction: p,
    low: Math.max(0, centre - half),
    high: Math.min(1, centre + half),
    passed,
    total,
  };
}
