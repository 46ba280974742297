import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  type BesselOrder,
  besselI,
  besselI0MinusOne,
  besselI2OverI1,
  besselI3OverI1,
  SERIES_LIMIT,
  scaledBesselI,
} from '../../src/math/bessel.js';
import reference from '../reference/bessel.json';
import { expectRelativelyClose } from '../support/close.js';

/** The accuracy the linearity report relies on. */
const TOLERANCE = 1e-12;
const EPS = Number.EPSILON;
const ORDERS: readonly BesselOrder[] = [0, 1, 2, 3];

type Point = (typeof reference.points)[number];
const value = (p: Point, n: BesselOrder): number => [p.i0, p.i1, p.i2, p.i3][n]!;
const scaledValue = (p: Point, n: BesselOrder): number =>
  [p.scaledI0, p.scaledI1, p.scaledI2, p.scaledI3][n]!;
const scipyValue = (p: Point, n: BesselOrder): number => [p.scipy.i0, p.scipy.i1, p.scipy.i2, p.scipy.i3][n]!;
const scipyScaledValue = (p: Point, n: BesselOrder): number =>
  [p.scipy.scaledI0, p.scipy.scaledI1, p.scipy.scaledI2, p.scipy.scaledI3][n]!;

/**
 * The first four Fourier cosine coefficients of e^(x·(cos θ − 1)), by the trapezoid rule on `count`
 * points, which converges geometrically for a smooth periodic integrand. By A&S 9.6.34,
 * e^(x·cos θ) = I0(x) + 2·Σ Ik(x)·cos kθ, so coefficient k is e^-x·Ik(x).
 */
function fourierCoefficients(x: number, count: number): number[] {
  const c = [0, 0, 0, 0];
  for (let j = 0; j < count; j++) {
    const theta = (2 * Math.PI * j) / count;
    const f = Math.exp(x * (Math.cos(theta) - 1));
    for (let k = 0; k < 4; k++) {
      c[k] = c[k]! + f * Math.cos(k * theta);
    }
  }
  return c.map((v) => v / count);
}

describe('besselI and scaledBesselI', () => {
  it('match mpmath at 50 digits from x = 1e-6 to 700 within 1e-12', () => {
    // Source: test/reference/bessel.py, mpmath.besseli at 50 digits (Johansson et al., mpmath).
    for (const p of reference.points) {
      for (const n of ORDERS) {
        expectRelativelyClose(besselI(n, p.x), value(p, n), TOLERANCE, `I${n}(${p.x}) vs mpmath`);
        expectRelativelyClose(
          scaledBesselI(n, p.x),
          scaledValue(p, n),
          TOLERANCE,
          `e^-x·I${n}(${p.x}) vs mpmath`,
        );
      }
    }
  });

  it('match scipy.special.iv and ive within 1e-12', () => {
    // Source: test/reference/bessel.py, scipy.special.iv / ive (Cephes and AMOS), a second library.
    for (const p of reference.points) {
      for (const n of ORDERS) {
        expectRelativelyClose(besselI(n, p.x), scipyValue(p, n), TOLERANCE, `I${n}(${p.x}) vs scipy iv`);
        expectRelativelyClose(
          scaledBesselI(n, p.x),
          scipyScaledValue(p, n),
          TOLERANCE,
          `e^-x·I${n}(${p.x}) vs scipy ive`,
        );
      }
    }
  });

  it('are the Fourier coefficients of e^(x·cos θ) (A&S 9.6.34)', () => {
    // Source: Abramowitz and Stegun 1964, 9.6.34, evaluated by the trapezoid rule on 128 points.
    // Below x ≈ 0.5 the small coefficients drown in the rounding of the sum, so start there.
    fc.assert(
      fc.property(fc.double({ min: 0.5, max: 60, noNaN: true }), (x) => {
        const c = fourierCoefficients(x, 128);
        for (const n of ORDERS) {
          expectRelativelyClose(scaledBesselI(n, x), c[n]!, TOLERANCE, `e^-x·I${n}(${x}) vs Fourier sum`);
        }
      }),
      { numRuns: 200 },
    );
  });

  it('satisfy the recurrence I(n−1) − I(n+1) = (2n/x)·In (A&S 9.6.26)', () => {
    // Source: Abramowitz and Stegun 1964, 9.6.26. The difference cancels for large x, so the
    // residual is measured against I(n−1), the largest term.
    fc.assert(
      fc.property(fc.double({ min: 1e-3, max: 1e4, noNaN: true }), (x) => {
        for (const n of [1, 2] as const) {
          const below = scaledBesselI((n - 1) as BesselOrder, x);
          const above = scaledBesselI((n + 1) as BesselOrder, x);
          const middle = scaledBesselI(n, x);
          expect(Math.abs(below - above - ((2 * n) / x) * middle)).toBeLessThanOrEqual(32 * EPS * below);
        }
      }),
      { numRuns: 500 },
    );
  });

  it('start from I0(0) = 1 and In(0) = 0 for n ≥ 1 (A&S 9.6.10)', () => {
    // Source: Abramowitz and Stegun 1964, 9.6.10 at x = 0.
    expect(besselI(0, 0)).toBe(1);
    expect(besselI(1, 0)).toBe(0);
    expect(besselI(2, 0)).toBe(0);
    expect(besselI(3, 0)).toBe(0);
  });

  it('stay finite in scaled form far beyond the overflow of In(x)', () => {
    // Source: A&S 9.7.1, e^-x·In(x) → 1/√(2πx) as x → ∞.
    for (const x of [1e3, 1e6, 1e12, 1e300]) {
      for (const n of ORDERS) {
        expectRelativelyClose(scaledBesselI(n, x), 1 / Math.sqrt(2 * Math.PI * x), 5 / x, `e^-x·I${n}(${x})`);
      }
    }
    expect(besselI(0, 720)).toBe(Number.POSITIVE_INFINITY);
  });

  it('reject negative, infinite and NaN arguments and orders outside 0..3', () => {
    // Common practice, no source.
    for (const x of [-1, -Number.MIN_VALUE, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => besselI(0, x)).toThrow(RangeError);
      expect(() => scaledBesselI(1, x)).toThrow(RangeError);
      expect(() => besselI2OverI1(x)).toThrow(RangeError);
      expect(() => besselI3OverI1(x)).toThrow(RangeError);
      expect(() => besselI0MinusOne(x)).toThrow(RangeError);
    }
    expect(() => besselI(4 as BesselOrder, 1)).toThrow(RangeError);
    expect(() => scaledBesselI(0.5 as BesselOrder, 1)).toThrow(RangeError);
  });
});

describe('the ratios I2/I1 and I3/I1', () => {
  it('match mpmath at 50 digits within 1e-12', () => {
    // Source: test/reference/bessel.py, mpmath.besseli(2, x)/besseli(1, x) at 50 digits.
    for (const p of reference.points) {
      expectRelativelyClose(besselI2OverI1(p.x), p.ratio21, TOLERANCE, `I2/I1 at ${p.x} vs mpmath`);
      expectRelativelyClose(besselI3OverI1(p.x), p.ratio31, TOLERANCE, `I3/I1 at ${p.x} vs mpmath`);
    }
  });

  it('lie in [0, 1) wherever 1 − ratio is representable', () => {
    // From memory: I(n+1)(x) < In(x) for x > 0 (R. P. Soni, "On an inequality for modified Bessel
    // functions", J. Math. and Phys. 44, 1965), so I3 < I2 < I1. Above x ≈ 1e16, 1 − 3/(2x) rounds to 1.
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1e12, noNaN: true }), (x) => {
        for (const r of [besselI2OverI1(x), besselI3OverI1(x)]) {
          expect(r).toBeGreaterThanOrEqual(0);
          expect(r).toBeLessThan(1);
        }
      }),
      { numRuns: 1000 },
    );
  });

  it('increase with x', () => {
    // From memory: I(n+1)/In is increasing in x for x > 0 (a classical result on Bessel-function
    // ratios); I3/I1 = (I3/I2)·(I2/I1) is a product of two such positive increasing ratios.
    // A few units in the last place of slack cover rounding and the change of method at x = 20.
    const slack = 16 * EPS;
    fc.assert(
      fc.property(
        fc.double({ min: 0, max: 1e4, noNaN: true }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (x, step) => {
          const y = x + step * (1 + x);
          expect(besselI2OverI1(x)).toBeLessThanOrEqual(besselI2OverI1(y) * (1 + slack));
          expect(besselI3OverI1(x)).toBeLessThanOrEqual(besselI3OverI1(y) * (1 + slack));
        },
      ),
      { numRuns: 1000 },
    );
    let previous2 = 0;
    let previous3 = 0;
    for (let x = SERIES_LIMIT - 0.5; x <= SERIES_LIMIT + 0.5; x += 1e-3) {
      const r2 = besselI2OverI1(x);
      const r3 = besselI3OverI1(x);
      expect(r2).toBeGreaterThanOrEqual(previous2 * (1 - slack));
      expect(r3).toBeGreaterThanOrEqual(previous3 * (1 - slack));
      previous2 = r2;
      previous3 = r3;
    }
  });

  it('follow their small-x series I2/I1 ≈ (x/4)(1 − x²/24) and I3/I1 ≈ (x²/24)(1 − x²/16)', () => {
    // Derived from the ascending series (A&S 9.6.10) with y = x²/4:
    //   I1 = (x/2)·(1 + y/2 + y²/12 + …),  I2 = (x²/8)·(1 + y/3 + y²/24 + …),
    //   I3 = (x³/48)·(1 + y/4 + …),
    //   I2/I1 = (x/4)·(1 + y/3 + y²/24)(1 − y/2 + y²/6 + …) = (x/4)·(1 − y/6 + y²/24 + …)
    //         = (x/4)·(1 − x²/24 + x⁴/384 − …),
    //   I3/I1 = (x²/24)·(1 + y/4)(1 − y/2 + …) = (x²/24)·(1 − x²/16 + …).
    // The neglected terms are O(x⁴), so for x ≤ 0.1 the bound x⁴/100 (plus rounding) is generous
    // and still fails if a coefficient of x² is wrong.
    fc.assert(
      fc.property(fc.double({ min: 1e-150, max: 0.1, noNaN: true }), (x) => {
        const slack = x ** 4 / 100 + 8 * EPS;
        expect(Math.abs(besselI2OverI1(x) / (x / 4) - (1 - (x * x) / 24))).toBeLessThanOrEqual(slack);
        expect(Math.abs(besselI3OverI1(x) / ((x * x) / 24) - (1 - (x * x) / 16))).toBeLessThanOrEqual(slack);
      }),
      { numRuns: 500 },
    );
    expect(besselI2OverI1(0)).toBe(0);
    expect(besselI3OverI1(0)).toBe(0);
  });

  it('tend to 1 − 3/(2x) and 1 − 4/x for large x', () => {
    // Derived from A&S 9.7.1: In ∝ 1 − (4n² − 1)/(8x) + O(x⁻²), so
    // I2/I1 = 1 − (15 − 3)/(8x) + O(x⁻²) and I3/I1 = 1 − (35 − 3)/(8x) + O(x⁻²).
    for (const x of [1e4, 1e6, 1e8]) {
      expect(Math.abs(1 - besselI2OverI1(x) - 3 / (2 * x))).toBeLessThanOrEqual(10 / (x * x) + 4 * EPS);
      expect(Math.abs(1 - besselI3OverI1(x) - 4 / x)).toBeLessThanOrEqual(20 / (x * x) + 4 * EPS);
    }
  });
});

describe('besselI0MinusOne', () => {
  it('matches the mpmath sum of A&S 9.6.12 from k = 1 within 1e-12', () => {
    // Source: test/reference/bessel.py, the series summed at 50 digits with mpmath.
    for (const p of reference.points) {
      expectRelativelyClose(besselI0MinusOne(p.x), p.i0MinusOne, TOLERANCE, `I0(${p.x}) − 1 vs mpmath`);
    }
  });

  it('keeps every digit for small x, where subtracting 1 from I0(x) would leave none', () => {
    // Derived from A&S 9.6.12: I0(x) − 1 = x²/4 + x⁴/64 + …, so it is x²/4 within x²/16 relative.
    expect(besselI(0, 1e-9) - 1).toBe(0);
    for (const x of [1e-5, 1e-8, 1e-12, 1e-100]) {
      expectRelativelyClose(besselI0MinusOne(x), (x * x) / 4, (x * x) / 16 + 2 * EPS, `I0(${x}) − 1`);
    }
  });
});
