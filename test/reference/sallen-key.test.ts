import { describe, expect, it } from 'vitest';
import reference from './sallen-key.json';

const EPS = Number.EPSILON;

describe('the Sallen-Key reference data (sallen-key.json)', () => {
  const { R1, R2, C1, C2 } = reference.components;

  it('describes a Butterworth design: Q = 1/√2 and f0 = 1/(2π√(R1R2C1C2))', () => {
    // Source: Sallen and Kearns, "A practical method of designing RC active filters", IRE Trans.
    // Circuit Theory 2(1), 1955, unity-gain low-pass: Q = √(R1R2C1C2)/(C2(R1 + R2)).
    const product = Math.sqrt(R1 * R2 * C1 * C2);
    expect(Math.abs(product / (C2 * (R1 + R2)) - Math.SQRT1_2)).toBeLessThanOrEqual(4 * EPS);
    expect(Math.abs(reference.q - Math.SQRT1_2)).toBeLessThanOrEqual(4 * EPS);
    expect(Math.abs(reference.naturalFrequency * 2 * Math.PI * product - 1)).toBeLessThanOrEqual(8 * EPS);
  });

  it('has the maximally flat magnitude 1/√(1 + (f/f0)⁴) and the phase −atan2(√2·u, 1 − u²)', () => {
    // Source: S. Butterworth, "On the theory of filter amplifiers", Experimental Wireless 7, 1930:
    // second order, H(s) = 1/(s² + √2·s + 1) in s/ω0, so with u = f/f0 the magnitude is
    // 1/√(1 + u⁴) and the phase −atan2(√2·u, 1 − u²).
    reference.frequencies.forEach((f, i) => {
      const u = f / reference.naturalFrequency;
      const magnitudeDb = -10 * Math.log10(1 + u ** 4);
      const phaseDeg = (-Math.atan2(Math.SQRT2 * u, 1 - u * u) * 180) / Math.PI;
      expect(Math.abs(reference.output.magnitudeDb[i]! - magnitudeDb)).toBeLessThanOrEqual(1e-9);
      expect(Math.abs(reference.output.phaseDeg[i]! - phaseDeg)).toBeLessThanOrEqual(1e-9);
    });
    expect(Math.abs(reference.atNaturalFrequency.magnitudeDb + 10 * Math.log10(2))).toBeLessThanOrEqual(
      1e-12,
    );
    expect(Math.abs(reference.atNaturalFrequency.phaseDeg + 90)).toBeLessThanOrEqual(1e-12);
  });

  it('places the poles at ω0·(−1 ± j)/√2', () => {
    // Source: Butterworth 1930, poles equally spaced on the circle of radius ω0 in the left half-plane.
    const w0 = reference.angularNaturalFrequency;
    const expected = [-1, 1].map((sign) => ({ re: -w0 * Math.SQRT1_2, im: sign * w0 * Math.SQRT1_2 }));
    reference.poles.forEach((p, i) => {
      expect(Math.abs(p.re - expected[i]!.re)).toBeLessThanOrEqual(1e-9 * w0);
      expect(Math.abs(p.im - expected[i]!.im)).toBeLessThanOrEqual(1e-9 * w0);
    });
  });
});
