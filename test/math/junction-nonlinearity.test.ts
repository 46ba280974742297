import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  channelAmplitudeForBound,
  channelErrorBound,
  channelMeanShift,
  channelNonlinearity,
  channelSecondHarmonic,
  channelThirdHarmonic,
  junctionAmplitudeForBound,
  junctionErrorBound,
  junctionMeanShift,
  junctionNonlinearity,
  junctionSecondHarmonic,
  junctionThirdHarmonic,
} from '../../src/math/junction-nonlinearity.js';
import bessel from '../reference/bessel.json';
import lambert from '../reference/lambert-w.json';
import { expectRelativelyClose } from '../support/close.js';

const EPS = Number.EPSILON;

/**
 * Harmonic amplitudes 0..3 of f(cos θ) by the trapezoid rule on `count` points (exact up to
 * aliasing for a smooth periodic function): a[0] is the mean, a[k] the amplitude of cos kθ.
 */
function harmonicAmplitudes(f: (c: number) => number, count: number): number[] {
  const a = [0, 0, 0, 0];
  for (let j = 0; j < count; j++) {
    const theta = (2 * Math.PI * j) / count;
    const v = f(Math.cos(theta));
    for (let k = 0; k < 4; k++) {
      a[k] = a[k]! + v * Math.cos(k * theta);
    }
  }
  return a.map((v, k) => (k === 0 ? v / count : (2 * v) / count));
}

describe('the exponential junction', () => {
  it('bounds the true first-order remainder: x/2 ≤ (e^x − 1 − x)/x ≤ errorBound(x)', () => {
    // Source: Taylor's theorem with the Lagrange remainder, e^x − 1 − x = (x²/2)·e^ξ, 0 < ξ < x, so
    // relative to the linear term x it lies between x/2 and (x/2)·e^x.
    fc.assert(
      // Below x ≈ 1e-4, expm1(x) − x is mostly rounding; the bound is checked from there up.
      fc.property(fc.double({ min: 1e-4, max: 20, noNaN: true }), (x) => {
        const remainder = (Math.expm1(x) - x) / x;
        const bound = junctionErrorBound(x);
        expect(remainder).toBeLessThanOrEqual(bound * (1 + 4 * EPS));
        expect(remainder).toBeGreaterThanOrEqual((x / 2) * (1 - 1e-9));
      }),
      { numRuns: 2000 },
    );
    expect(junctionErrorBound(0)).toBe(0);
  });

  it('has harmonic ratios equal to the Fourier content of e^(x·cos θ)', () => {
    // Source: the current of a junction driven by v̂·cos θ is I_Q·e^(x·cos θ); its harmonics are
    // computed here numerically (trapezoid rule, 128 points) and compared with I2/I1 and I3/I1
    // (A&S 9.6.34). Scaled by e^-x to stay finite.
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 60, noNaN: true }), (x) => {
        const a = harmonicAmplitudes((c) => Math.exp(x * (c - 1)), 128);
        expectRelativelyClose(junctionSecondHarmonic(x), a[2]! / a[1]!, 1e-12, `second harmonic at x = ${x}`);
        expectRelativelyClose(junctionThirdHarmonic(x), a[3]! / a[1]!, 1e-12, `third harmonic at x = ${x}`);
      }),
      { numRuns: 300 },
    );
  });

  it('has harmonic ratios and mean shift matching mpmath within 1e-12', () => {
    // Source: test/reference/bessel.py, mpmath.besseli at 50 digits.
    for (const p of bessel.points) {
      const figures = junctionNonlinearity(p.x);
      expectRelativelyClose(figures.secondHarmonic, p.ratio21, 1e-12, `I2/I1 at ${p.x}`);
      expectRelativelyClose(figures.thirdHarmonic, p.ratio31, 1e-12, `I3/I1 at ${p.x}`);
      expectRelativelyClose(figures.meanShift, p.i0MinusOne, 1e-12, `I0 − 1 at ${p.x}`);
      expectRelativelyClose(junctionMeanShift(p.x), p.i0MinusOne, 1e-12, `I0 − 1 at ${p.x}`);
      expect(figures.errorBound).toBe(junctionErrorBound(p.x));
    }
  });

  it('inverts the error bound with the Lambert W function, W0(2b)', () => {
    // Source: (x/2)·e^x = b  ⇔  x·e^x = 2b  ⇔  x = W0(2b) (Corless et al., "On the Lambert W
    // function", 1996), checked against mpmath.lambertw (test/reference/lambert-w.py).
    for (const p of lambert.points) {
      // 2b must stay within the doubles: no overflow above, no underflow to 0 below
      if (p.x >= 1e-300 && p.x <= 1e300) {
        expectRelativelyClose(
          junctionAmplitudeForBound(p.x / 2),
          p.w,
          1e-14,
          `amplitude for bound ${p.x / 2}`,
        );
      }
    }
  });

  it('round-trips between amplitude and bound', () => {
    // Common practice, no source: a relative error δ in x moves (x/2)·e^x by (1 + x)·δ relative,
    // so the tolerance on the bound grows with x, while W0 shrinks the error of 2b by 1/(1 + x).
    fc.assert(
      fc.property(fc.double({ min: 1e-300, max: 700, noNaN: true }), (x) => {
        expectRelativelyClose(junctionAmplitudeForBound(junctionErrorBound(x)), x, 8 * EPS, `x = ${x}`);
      }),
      { numRuns: 2000 },
    );
    fc.assert(
      fc.property(fc.double({ min: -300, max: 307, noNaN: true }), (exponent) => {
        const budget = 10 ** exponent;
        const x = junctionAmplitudeForBound(budget);
        expectRelativelyClose(junctionErrorBound(x), budget, 8 * (2 + x) * EPS, `budget ${budget}`);
      }),
      { numRuns: 2000 },
    );
    expect(junctionAmplitudeForBound(0)).toBe(0);
  });

  it('rejects negative, infinite and NaN amplitudes and budgets', () => {
    // Common practice, no source.
    for (const bad of [-1, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => junctionErrorBound(bad)).toThrow(RangeError);
      expect(() => junctionSecondHarmonic(bad)).toThrow(RangeError);
      expect(() => junctionThirdHarmonic(bad)).toThrow(RangeError);
      expect(() => junctionMeanShift(bad)).toThrow(RangeError);
      expect(() => junctionNonlinearity(bad)).toThrow(RangeError);
      expect(() => junctionAmplitudeForBound(bad)).toThrow(RangeError);
    }
  });
});

describe('the square-law channel', () => {
  it('has the harmonic content and mean shift of (1 + x·cos θ)²', () => {
    // Source: id/I_Q = (1 + x·cos θ)² for id = ½β·(V_ov + v̂·cos θ)² (Shichman and Hodges square
    // law), whose harmonics are computed here numerically (trapezoid rule, 16 points).
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 10, noNaN: true }), (x) => {
        const a = harmonicAmplitudes((c) => (1 + x * c) ** 2, 16);
        const figures = channelNonlinearity(x);
        // a[2] = x²/2 carries rounding of about eps·(1 + x)² from the other terms
        const tolerance = (16 * EPS * (1 + x) ** 2) / (x * x);
        expectRelativelyClose(channelSecondHarmonic(x), a[2]! / a[1]!, tolerance, `second harmonic at ${x}`);
        // a[3] is zero but for rounding, about eps·(1 + x)² against a[1] = 2x
        expect(Math.abs(a[3]! / a[1]!)).toBeLessThanOrEqual((16 * EPS * (1 + x) ** 2) / x);
        expect(channelThirdHarmonic(x)).toBe(0);
        // a[0] − 1 loses digits to cancellation for small x: allow eps·(1 + x)² against x²/2
        expectRelativelyClose(
          channelMeanShift(x),
          a[0]! - 1,
          (64 * EPS * (1 + x) ** 2) / (x * x),
          `mean at ${x}`,
        );
        expect(figures).toEqual({
          errorBound: channelErrorBound(x),
          secondHarmonic: channelSecondHarmonic(x),
          thirdHarmonic: 0,
          meanShift: channelMeanShift(x),
        });
      }),
      { numRuns: 300 },
    );
  });

  it('has a first-order remainder of exactly x/2 of the linear term at the peak', () => {
    // Source: (1 + u)² − 1 − 2u = u², and u²/(2u) = u/2, largest at u = x.
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 10, noNaN: true }), (x) => {
        // the subtraction leaves about eps·(1 + x)² of absolute error against x²
        const remainder = ((1 + x) ** 2 - 1 - 2 * x) / (2 * x);
        expectRelativelyClose(
          channelErrorBound(x),
          remainder,
          (8 * EPS * (1 + x) ** 2) / (x * x),
          `x = ${x}`,
        );
      }),
      { numRuns: 500 },
    );
  });

  it('inverts the error bound as x = 2b', () => {
    // Source: x/2 = b  ⇔  x = 2b.
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e300, noNaN: true }), (budget) => {
        expect(channelErrorBound(channelAmplitudeForBound(budget))).toBe(budget);
      }),
      { numRuns: 500 },
    );
  });

  it('rejects negative, infinite and NaN amplitudes and budgets', () => {
    // Common practice, no source.
    for (const bad of [-1, Number.NaN, Number.NEGATIVE_INFINITY]) {
      expect(() => channelErrorBound(bad)).toThrow(RangeError);
      expect(() => channelSecondHarmonic(bad)).toThrow(RangeError);
      expect(() => channelThirdHarmonic(bad)).toThrow(RangeError);
      expect(() => channelMeanShift(bad)).toThrow(RangeError);
      expect(() => channelNonlinearity(bad)).toThrow(RangeError);
      expect(() => channelAmplitudeForBound(bad)).toThrow(RangeError);
    }
  });
});
