/**
 * Reading a response: decibels, phase unwrapping and level crossings, on synthetic responses whose
 * values are known in closed form.
 */
import Complex from 'complex.js';
import { describe, expect, it } from 'vitest';
import { crossings, decibels, unwrappedPhase } from '../../src/analysis/frequency-response.js';
import { expectRelativelyClose } from '../support/close.js';

describe('decibels', () => {
  it('is 20·log10|h|, −Infinity for an exact zero', () => {
    // Source: definition of the decibel for amplitude ratios (common practice, no source).
    const db = decibels([new Complex(10, 0), new Complex(0, -0.1), new Complex(3, 4), new Complex(0, 0)]);
    expect(Array.from(db)).toEqual([20, -20, 20 * Math.log10(5), Number.NEGATIVE_INFINITY]);
  });
});

describe('unwrappedPhase', () => {
  it('continues past ±180° instead of jumping by 360°', () => {
    // Source: a phase sequence −170°, −190°, −250°, −350°, −370° read modulo 360° (common practice,
    // no source).
    const degrees = [-170, -190, -250, -350, -370];
    const h = degrees.map((d) => new Complex({ abs: 1, arg: (d * Math.PI) / 180 }));
    const phase = unwrappedPhase(h);
    for (const [k, d] of degrees.entries()) expect(Math.abs(phase[k]! - d)).toBeLessThan(1e-9);
  });

  it('starts in (−180°, 180°] and unwraps upwards as well', () => {
    // Source: the principal value of arg lies in (−180°, 180°] (common practice, no source).
    const degrees = [170, 190, 300, 370];
    const h = degrees.map((d) => new Complex({ abs: 2, arg: (d * Math.PI) / 180 }));
    const phase = unwrappedPhase(h);
    for (const [k, d] of degrees.entries()) expect(Math.abs(phase[k]! - d)).toBeLessThan(1e-9);
    expect(unwrappedPhase([new Complex(-1, 0)])[0]).toBe(180);
  });
});

describe('crossings', () => {
  it('interpolates linearly in dB against log f, exact on a straight Bode asymptote', () => {
    // Source: a −20 dB/decade line through 0 dB at 1 kHz crosses −3 dB at 10^(3 + 3/20) Hz (common
    // practice, no source).
    const f = Float64Array.of(100, 1e3, 1e4, 1e5);
    const level = Float64Array.from(f, (x) => -20 * Math.log10(x / 1e3));
    const at = crossings(f, level, -3);
    expect(at).toHaveLength(1);
    expectRelativelyClose(at[0]!, 10 ** (3 + 3 / 20), 1e-13, '−3 dB crossing');
  });

  it('finds every crossing of a band-pass, rising and falling, and none when the level is never reached', () => {
    // Source: −10 dB lies halfway in dB between −20 and 0 dB, so at the geometric mean of the decade's
    // ends: √10 and 1000·√10 Hz (common practice, no source).
    const f = Float64Array.of(1, 10, 100, 1e3, 1e4);
    const level = Float64Array.of(-20, 0, 0, 0, -20);
    const at = crossings(f, level, -10);
    expect(at).toHaveLength(2);
    expectRelativelyClose(at[0]!, Math.sqrt(10), 1e-13, 'rising');
    expectRelativelyClose(at[1]!, 1e3 * Math.sqrt(10), 1e-13, 'falling');
    expect(crossings(f, level, 5)).toEqual([]);
  });

  it('reports a point that lies exactly on the level once, and interpolates linearly from 0 Hz', () => {
    // Source: linear interpolation on a segment from 0 Hz, where log f is undefined (common practice,
    // no source).
    const f = Float64Array.of(0, 10, 20);
    const level = Float64Array.of(-6, 0, 6);
    expect(crossings(f, level, -3)).toEqual([5]);
    expect(crossings(f, level, 0)).toEqual([10]);
    expect(crossings(f, level, 6)).toEqual([20]);
  });
});
