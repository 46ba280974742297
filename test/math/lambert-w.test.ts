import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { lambertW0, lambertW0OfExp } from '../../src/math/lambert-w.js';
import reference from '../reference/lambert-w.json';
import { expectRelativelyClose } from '../support/close.js';

/** The accuracy promised for W0. */
const TOLERANCE = 1e-14;
const EPS = Number.EPSILON;

/** x spread evenly in log scale over the doubles, from 1e-300 to 1e300. */
const logUniform = fc.double({ min: -690, max: 690, noNaN: true }).map(Math.exp);

describe('lambertW0', () => {
  it('matches mpmath.lambertw at 50 digits within 1e-14, from 0 to the largest double', () => {
    // Source: test/reference/lambert-w.py, mpmath.lambertw at 50 digits (Johansson et al., mpmath).
    for (const p of reference.points) {
      expectRelativelyClose(lambertW0(p.x), p.w, TOLERANCE, `W0(${p.x}) vs mpmath`);
    }
  });

  it('gives the omega constant at 1 and exactly 1 at e', () => {
    // Source: Corless, Gonnet, Hare, Jeffrey and Knuth, "On the Lambert W function", 1996:
    // W(1) = Ω = 0.56714329040978387299…, and W(e) = 1 since 1·e¹ = e.
    expectRelativelyClose(lambertW0(1), 0.5671432904097838, EPS, 'W0(1)');
    expectRelativelyClose(lambertW0(Math.E), 1, 2 * EPS, 'W0(e)');
    expect(lambertW0(0)).toBe(0);
  });

  it('satisfies W·e^W = x', () => {
    // Source: the definition (Corless et al. 1996). An error δ in W moves W·e^W by (1 + W)·δ
    // relative, so the tolerance scales with 1 + W.
    fc.assert(
      fc.property(logUniform, (x) => {
        const w = lambertW0(x);
        expectRelativelyClose(w * Math.exp(w), x, 8 * (1 + w) * EPS, `W0(${x})·e^W0`);
      }),
      { numRuns: 2000 },
    );
  });

  it('inverts w ↦ w·e^w on w ≥ 0', () => {
    // Source: the definition (Corless et al. 1996), W0(w·e^w) = w for w ≥ 0.
    fc.assert(
      fc.property(fc.double({ min: 0, max: 700, noNaN: true }), (w) => {
        expectRelativelyClose(lambertW0(w * Math.exp(w)), w, 8 * EPS, `W0(${w}·e^${w})`);
      }),
      { numRuns: 2000 },
    );
  });

  it('behaves like x − x² near 0, down to the smallest subnormal', () => {
    // Source: Taylor series W0(x) = x − x² + (3/2)x³ − … (Corless et al. 1996).
    for (const x of [Number.MIN_VALUE, 1e-310, 1e-200, 1e-20, 1e-9]) {
      expectRelativelyClose(lambertW0(x), x - x * x, 2 * EPS, `W0(${x})`);
    }
  });

  it('rejects negative, infinite and NaN arguments', () => {
    // Common practice, no source: only the principal branch on x ≥ 0 is provided.
    for (const x of [-1e-300, -1, Number.NaN, Number.POSITIVE_INFINITY]) {
      expect(() => lambertW0(x)).toThrow(RangeError);
    }
  });
});

describe('lambertW0OfExp', () => {
  it('matches mpmath.lambertw(exp(L)) within 1e-14, for L from −700 to 1e300', () => {
    // Source: test/reference/lambert-w.py, mpmath at 50 digits; most of these e^L overflow a double.
    for (const p of reference.logPoints) {
      expectRelativelyClose(lambertW0OfExp(p.logX), p.w, TOLERANCE, `W0(exp(${p.logX})) vs mpmath`);
    }
  });

  it('satisfies W + ln W = L', () => {
    // Source: the logarithm of the definition W·e^W = e^L (Corless et al. 1996); the residual is
    // measured against L, the largest term.
    fc.assert(
      fc.property(fc.double({ min: 1, max: 1e12, noNaN: true }), (logX) => {
        const w = lambertW0OfExp(logX);
        expect(Math.abs(w + Math.log(w) - logX)).toBeLessThanOrEqual(4 * EPS * logX);
      }),
      { numRuns: 2000 },
    );
  });

  it('agrees with lambertW0(e^L) wherever e^L is a double', () => {
    // Common practice, no source: the two entry points must agree; W0 of a rounded e^L differs by
    // at most the rounding of e^L divided by 1 + W.
    fc.assert(
      fc.property(fc.double({ min: -700, max: 700, noNaN: true }), (logX) => {
        const direct = lambertW0(Math.exp(logX));
        expectRelativelyClose(lambertW0OfExp(logX), direct, 8 * EPS, `W0(exp(${logX}))`);
      }),
      { numRuns: 2000 },
    );
  });

  it('rejects infinite and NaN arguments', () => {
    // Common practice, no source.
    for (const logX of [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) {
      expect(() => lambertW0OfExp(logX)).toThrow(RangeError);
    }
  });
});
