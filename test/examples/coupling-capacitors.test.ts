import { describe, expect, it } from 'vitest';
import { designCouplingCapacitors, roundUpToE6 } from '../../examples/coupling-capacitors.js';

/** The −3 dB frequency of two first-order high-pass corners a and b, by bisection of |H|² = 1/2. */
function twoCornerEdge(a: number, b: number): number {
  let lo = 0.1;
  let hi = 1e4;
  for (let i = 0; i < 200; i++) {
    const f = Math.sqrt(lo * hi);
    const power = ((f * f) / (f * f + a * a)) * ((f * f) / (f * f + b * b));
    if (power < 0.5) lo = f;
    else hi = f;
  }
  return Math.sqrt(lo * hi);
}

describe('examples/coupling-capacitors', () => {
  const design = designCouplingCapacitors();

  it('rounds up to the E6 preferred values', () => {
    // IEC 60063, E6 series: 1.0, 1.5, 2.2, 3.3, 4.7, 6.8.
    expect(roundUpToE6(123e-9)).toBeCloseTo(150e-9, 20);
    expect(roundUpToE6(1.2366e-6)).toBeCloseTo(1.5e-6, 18);
    expect(roundUpToE6(4.7e-6)).toBeCloseTo(4.7e-6, 18);
    expect(roundUpToE6(7e-9)).toBeCloseTo(10e-9, 20);
  });

  it('places each corner so that two of them give a 20 Hz edge', () => {
    // Two equal first-order corners f_p: (f²/(f² + f_p²))² = 1/2 at f = f_p/√(√2 − 1) (common practice).
    expect(design.cornerEach).toBeCloseTo(20 * Math.sqrt(Math.SQRT2 - 1), 10);
    // C = 1/(2π·R·f_p) for a first-order RC corner (common practice, no source).
    expect(design.required.input).toBeCloseTo(1 / (2 * Math.PI * 100.6e3 * design.cornerEach), 15);
    expect(design.chosen).toEqual({ input: 150e-9, output: 1.5e-6 });
  });

  it('finds the finished preamplifier’s edge where the two-corner formula puts it, below 20 Hz', () => {
    const a = 1 / (2 * Math.PI * 100.6e3 * 150e-9);
    const b = 1 / (2 * Math.PI * 10e3 * 1.5e-6);
    expect(Math.abs(design.lowerEdge - twoCornerEdge(a, b)) / twoCornerEdge(a, b)).toBeLessThan(2e-3);
    expect(design.lowerEdge).toBeLessThan(20);
  });

  it('has the mid-band gain of a non-inverting stage of 11 behind the source divider', () => {
    // Non-inverting gain 1 + 100k/10k (common practice, no source); the 600 Ω source into 100 kΩ
    // divides by 100.6.
    expect(design.midbandGainDb).toBeCloseTo(20 * Math.log10((11 * 100e3) / 100.6e3), 2);
  });
});
