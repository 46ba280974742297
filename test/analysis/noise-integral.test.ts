/**
 * Integrating a sampled PSD on the log-log line between samples: exact for every power law, as
 * ∫ f^α df = f^(α+1)/(α+1) (and ln f for α = −1) says (common practice, no source).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { integratePsd, powerLawSegment } from '../../src/analysis/noise-integral.js';
import { expectRelativelyClose } from '../support/close.js';

describe('integratePsd', () => {
  it('integrates any power law exactly, between samples and across them', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -3, max: 2, noNaN: true }),
        fc.double({ min: 0.5, max: 3, noNaN: true }),
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        (alpha, decades, cut) => {
          const f = Float64Array.from({ length: 7 }, (_, k) => 10 ** ((decades * k) / 6));
          const psd = f.map((x) => 3e-18 * x ** alpha);
          const low = 10 ** (decades * cut * 0.5);
          const high = 10 ** (decades * (0.5 + cut * 0.5));
          const e = alpha + 1;
          const exact =
            Math.abs(e) < 1e-9 ? 3e-18 * Math.log(high / low) : (3e-18 * (high ** e - low ** e)) / e;
          expectRelativelyClose(integratePsd(f, psd, low, high), exact, 1e-9, `f^${alpha}`);
        },
      ),
      { numRuns: 200, seed: 77 },
    );
  });

  it('integrates 1/f to ln(high/low) per unit coefficient', () => {
    const f = Float64Array.of(1, 10, 1000);
    expectRelativelyClose(
      integratePsd(
        f,
        f.map((x) => 1 / x),
        1,
        1000,
      ),
      Math.log(1000),
      1e-14,
      '1/f',
    );
  });

  it('takes a segment with a zero end as a straight line', () => {
    expect(powerLawSegment(1, 0, 3, 2)).toBe(2);
  });
});
