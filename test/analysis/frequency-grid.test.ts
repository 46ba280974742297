/**
 * Frequency grids: logSweep and linearSweep endpoints and spacing, and the checks on their arguments.
 */
import { describe, expect, it } from 'vitest';
import { linearSweep, logSweep } from '../../src/analysis/frequency-grid.js';
import { expectRelativelyClose } from '../support/close.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

function expectInvalid(run: () => unknown, mentions: string): void {
  expectQuiescentError(run, 'invalid-value', mentions);
}

describe('logSweep', () => {
  it('includes both ends exactly and spaces the points by a constant ratio', () => {
    // Source: a logarithmic grid of p points per decade has ratio 10^(1/p) between neighbours
    // (common practice, no source).
    const f = logSweep(10, 1e5, 10);
    expect(f).toHaveLength(41);
    expect(f[0]).toBe(10);
    expect(f[40]).toBe(1e5);
    for (let k = 1; k < f.length; k++)
      expectRelativelyClose(f[k]! / f[k - 1]!, 10 ** 0.1, 1e-12, `ratio ${k}`);
    // Every decade boundary lands on a power of ten (to rounding).
    expectRelativelyClose(f[10]!, 100, 1e-14, '100 Hz');
    expectRelativelyClose(f[30]!, 1e4, 1e-14, '10 kHz');
  });

  it('rounds the point count up over a fractional number of decades', () => {
    // Source: 2 decades and log10(5) ≈ 0.699 more at 3 per decade need ⌈8.097⌉ = 9 intervals
    // (common practice, no source).
    const f = logSweep(2, 1e3, 3);
    expect(f).toHaveLength(10);
    expect(f[0]).toBe(2);
    expect(f[9]).toBe(1e3);
    const ratio = (1e3 / 2) ** (1 / 9);
    for (let k = 1; k < f.length; k++) expectRelativelyClose(f[k]! / f[k - 1]!, ratio, 1e-12, `ratio ${k}`);
    expect(ratio).toBeLessThanOrEqual(10 ** (1 / 3));
  });

  it('gives one point when start equals stop, and two for less than a step', () => {
    // Source: a log grid keeps both ends and never spaces wider than asked (common practice, no source).
    expect(Array.from(logSweep(50, 50, 10))).toEqual([50]);
    expect(Array.from(logSweep(100, 101, 10))).toEqual([100, 101]);
  });

  it('refuses zero, negative, non-finite and reversed arguments', () => {
    // Source: docs/analyses-ac.md, "Options" (`invalid-value` for every bad argument).
    expectInvalid(() => logSweep(0, 10, 10), 'start');
    expectInvalid(() => logSweep(-1, 10, 10), 'start');
    expectInvalid(() => logSweep(1, Number.POSITIVE_INFINITY, 10), 'stop');
    expectInvalid(() => logSweep(1, 10, 0), 'pointsPerDecade');
    expectInvalid(() => logSweep(1, 10, Number.NaN), 'pointsPerDecade');
    expectInvalid(() => logSweep(10, 1, 10), 'stop');
  });
});

describe('linearSweep', () => {
  it('includes both ends exactly and spaces the points evenly', () => {
    // Source: an arithmetic grid (common practice, no source).
    const f = linearSweep(0, 1e3, 11);
    expect(Array.from(f)).toEqual([0, 100, 200, 300, 400, 500, 600, 700, 800, 900, 1000]);
    const g = linearSweep(1, 2, 4);
    expect(g[0]).toBe(1);
    expect(g[3]).toBe(2);
    for (let k = 1; k < g.length; k++) expectRelativelyClose(g[k]! - g[k - 1]!, 1 / 3, 1e-14, `step ${k}`);
  });

  it('allows a descending grid and a single point where start equals stop', () => {
    // Source: an arithmetic grid runs either way (common practice, no source).
    expect(Array.from(linearSweep(3, 1, 3))).toEqual([3, 2, 1]);
    expect(Array.from(linearSweep(5, 5, 1))).toEqual([5]);
  });

  it('refuses non-finite ends and a count that is not a whole number of at least 2', () => {
    // Source: docs/analyses-ac.md, "Options" (`invalid-value` for every bad argument).
    expectInvalid(() => linearSweep(Number.NaN, 1, 3), 'start');
    expectInvalid(() => linearSweep(0, Number.POSITIVE_INFINITY, 3), 'stop');
    expectInvalid(() => linearSweep(0, 1, 1), 'count');
    expectInvalid(() => linearSweep(0, 1, 2.5), 'count');
    expectInvalid(() => linearSweep(0, 1, 0), 'count');
  });
});
