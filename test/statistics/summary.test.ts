import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { summarize, WILSON_Z, wilsonInterval } from '../../src/statistics/summary.js';

const reference = JSON.parse(
  readFileSync(new URL('../reference/monte-carlo-moments.json', import.meta.url), 'utf8'),
) as { wilson: { passed: number; total: number; low: number; high: number }[] };

describe('the summary of a measure', () => {
  it('takes the standard deviation with n − 1 and interpolates percentiles at (n − 1)·p/100', () => {
    // Worked by hand (docs/tolerances.md, "Reading the result"): values 1…5 have mean 3, variance 10/4,
    // and the 1st percentile lies 0.04 of the way from 1 to 2.
    const s = summarize(Float64Array.from([5, 1, 4, 2, 3]));
    expect(s.count).toBe(5);
    expect(s.mean).toBe(3);
    expect(s.standardDeviation).toBeCloseTo(Math.sqrt(2.5), 15);
    expect([s.min, s.max, s.p50]).toEqual([1, 5, 3]);
    expect(s.p1).toBeCloseTo(1.04, 14);
    expect(s.p5).toBeCloseTo(1.2, 14);
    expect(s.p95).toBeCloseTo(4.8, 14);
    expect(s.p99).toBeCloseTo(4.96, 14);
  });

  it('says NaN, with a count of 0, when no sample solved', () => {
    const s = summarize(new Float64Array(0));
    expect(s.count).toBe(0);
    expect(s.mean).toBeNaN();
  });
});

describe('the Wilson interval', () => {
  it('uses the 0.975 normal quantile', () => {
    // scipy.stats.norm.ppf(0.975) = 1.959963984540054.
    expect(WILSON_Z).toBe(1.959963984540054);
  });

  it.each(reference.wilson)('matches scipy for $passed of $total', ({ passed, total, low, high }) => {
    // scipy.stats.binomtest(k, n).proportion_ci(method='wilson'), test/reference/monte-carlo-moments.py;
    // 81 of 263 is the worked example of R. G. Newcombe, "Two-sided confidence intervals for the single
    // proportion", Statistics in Medicine 17, 1998 (0.2553 to 0.3662).
    const w = wilsonInterval(passed, total);
    expect(w.fraction).toBe(passed / total);
    expect(w.low).toBeCloseTo(low, 12);
    expect(w.high).toBeCloseTo(high, 12);
  });
});
