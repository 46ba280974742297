import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Draws, NORMAL_LIMIT } from '../../src/statistics/draws.js';
import { philox4x32 } from '../../src/statistics/philox.js';

const hex = (words: Uint32Array) => [...words].map((w) => w.toString(16).padStart(8, '0'));

describe('the Philox4x32-10 generator', () => {
  // Known-answer vectors of J. K. Salmon, M. A. Moraes, R. O. Dror and D. E. Shaw, "Parallel random
  // numbers: as easy as 1, 2, 3" (SC '11, 2011), as published with their Random123 library.
  it('reproduces the published known-answer vectors', () => {
    const out = new Uint32Array(4);
    expect(hex(philox4x32(0, 0, 0, 0, 0, 0, out))).toEqual(['6627e8d5', 'e169c58d', 'bc57ac4c', '9b00dbd8']);
    const ones = 0xffffffff;
    expect(hex(philox4x32(ones, ones, ones, ones, ones, ones, out))).toEqual([
      '408f276d',
      '41c83b0e',
      'a20bc7c6',
      '6d5451fd',
    ]);
    expect(
      hex(philox4x32(0x243f6a88, 0x85a308d3, 0x13198a2e, 0x03707344, 0xa4093822, 0x299f31d0, out)),
    ).toEqual(['d16cfe09', '94fdcceb', '5001e420', '24126ea1']);
  });
});

describe('draws', () => {
  it('depend only on seed, sample and stream, whatever was drawn before (property)', () => {
    // Common practice, no source: a counter-based generator has no state between draws.
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: Number.MAX_SAFE_INTEGER }),
        fc.array(fc.tuple(fc.nat(1_000_000), fc.nat(50)), { minLength: 1, maxLength: 20 }),
        (seed, order) => {
          const first = new Draws(seed);
          const fresh = order.map(([k, j]) => [first.uniform(k, j), first.normal(k, j)]);
          const other = new Draws(seed);
          const reversed = [...order].reverse().map(([k, j]) => [other.uniform(k, j), other.normal(k, j)]);
          expect(reversed.reverse()).toEqual(fresh);
        },
      ),
      { seed: 14, numRuns: 100 },
    );
  });

  it('give uniform numbers in [0, 1) with the mean and variance of the uniform distribution', () => {
    // Common practice, no source: mean 1/2 and variance 1/12, within 4 standard errors over 100,000 draws.
    const draws = new Draws(2026);
    const n = 100_000;
    let sum = 0;
    let squares = 0;
    let inside = 0;
    for (let k = 0; k < n; k++) {
      const u = draws.uniform(k, 3);
      if (u >= 0 && u < 1) inside++;
      sum += u;
      squares += u * u;
    }
    expect(inside).toBe(n);
    const mean = sum / n;
    expect(Math.abs(mean - 0.5)).toBeLessThan(4 * Math.sqrt(1 / 12 / n));
    expect(Math.abs(squares / n - mean * mean - 1 / 12)).toBeLessThan(4 * Math.sqrt(1 / 180 / n));
  });

  it('give normal numbers truncated to [−3, 3] with the truncated variance', () => {
    // The variance of the standard normal truncated to [−a, a] is 1 − 2a·φ(a)/(2Φ(a) − 1) (N. L. Johnson,
    // S. Kotz and N. Balakrishnan, Continuous Univariate Distributions vol. 1, 2nd ed., 1994, ch. 13): 0.973336 for a = 3.
    const phi3 = Math.exp(-4.5) / Math.sqrt(2 * Math.PI);
    const variance = 1 - (2 * 3 * phi3) / 0.9973002039367398;
    const draws = new Draws(5);
    const n = 100_000;
    let sum = 0;
    let squares = 0;
    let largest = 0;
    for (let k = 0; k < n; k++) {
      const z = draws.normal(k, 0);
      largest = Math.max(largest, Math.abs(z));
      sum += z;
      squares += z * z;
    }
    expect(largest).toBeLessThanOrEqual(NORMAL_LIMIT);
    expect(largest).toBeGreaterThan(2.9);
    expect(Math.abs(sum / n)).toBeLessThan(4 * Math.sqrt(variance / n));
    // The fourth moment of the truncated normal is below 3, so √(2/n) bounds the variance's standard error.
    expect(Math.abs(squares / n - variance)).toBeLessThan(4 * Math.sqrt(2 / n));
  });

  it('differ between seeds, samples and streams', () => {
    const a = new Draws(1);
    const b = new Draws(2);
    expect(a.uniform(0, 0)).not.toBe(b.uniform(0, 0));
    expect(a.uniform(0, 0)).not.toBe(a.uniform(1, 0));
    expect(a.uniform(0, 0)).not.toBe(a.uniform(0, 1));
    // Seeds above 2³² use the key's second word.
    expect(new Draws(2 ** 32).uniform(0, 0)).not.toBe(new Draws(0).uniform(0, 0));
  });
});
