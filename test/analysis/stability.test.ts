/**
 * The stability report's verdict on a loop of three equal poles at three gains: stable, stable with
 * too little phase margin, and unstable with the right-half-plane pair of the closed form.
 */
import { describe, expect, it } from 'vitest';
import { logSweep, operatingPoint, stabilityReport } from '../../src/index.js';
import { expectQuiescentError } from '../support/quiescent-error.js';
import { threePoleLoop } from '../support/three-pole-loop.js';

const frequencies = logSweep(1e3, 1e8, 50);
const tau = 1e-6;

describe('stabilityReport on a loop of three equal poles', () => {
  it('calls K = 1.5 stable: phase margin 180° − 3·atan(√(K^(2/3) − 1)) ≈ 93°', () => {
    // Source: |T| = K/(1 + (ωτ)²)^(3/2) = 1 at the crossover (common practice, no source).
    const report = stabilityReport(operatingPoint(threePoleLoop(1.5)), { probe: 'loopBreak', frequencies });
    expect(report.verdict).toBe('stable');
    const x = Math.sqrt(1.5 ** (2 / 3) - 1);
    expect(Math.abs(report.loop.phaseMargin! - (180 - (3 * Math.atan(x) * 180) / Math.PI))).toBeLessThan(
      0.05,
    );
    expect(report.unstablePoles).toEqual([]);
    expect(report.allPolesExamined).toBe(true);
  });

  it('calls K = 4 short of margin: about 27°, below 45°', () => {
    const report = stabilityReport(operatingPoint(threePoleLoop(4)), { probe: 'loopBreak', frequencies });
    expect(report.verdict).toBe('low-margin');
    expect(report.loop.phaseMargin!).toBeGreaterThan(0);
    expect(report.loop.phaseMargin!).toBeLessThan(45);
  });

  it('calls K = 10 unstable, with the right-half-plane pair s = (K^(1/3)·e^(±jπ/3) − 1)/τ', () => {
    // Source: 1 + K/(1 + sτ)³ = 0 gives 1 + sτ = K^(1/3)·e^(j(2k+1)π/3); beyond K = 8 the pair
    // k = 0, −1 lies in the right half-plane (the Routh-Hurwitz limit of the phase-shift loop).
    const report = stabilityReport(operatingPoint(threePoleLoop(10)), { probe: 'loopBreak', frequencies });
    expect(report.verdict).toBe('unstable');
    expect(report.unstablePoles).toHaveLength(2);
    const k3 = 10 ** (1 / 3);
    const re = (k3 * 0.5 - 1) / tau / (2 * Math.PI);
    const im = (k3 * Math.sin(Math.PI / 3)) / tau / (2 * Math.PI);
    const [upper, lower] = report.unstablePoles;
    expect(Math.abs(upper!.real - re) / Math.hypot(re, im)).toBeLessThan(1e-9);
    expect(Math.abs(upper!.imaginary - im) / Math.hypot(re, im)).toBeLessThan(1e-9);
    expect(lower!.imaginary).toBe(-upper!.imaginary);
    expect(upper!.q).toBeLessThan(0);
    // The gain margin is negative: the loop gain is above 1 where the phase reaches −180°.
    expect(report.loop.gainMargin!).toBeCloseTo(20 * Math.log10(8 / 10), 3);
  });

  it('writes verdict, loop and poles into its JSON', () => {
    const report = stabilityReport(operatingPoint(threePoleLoop(10)), { probe: 'loopBreak', frequencies });
    const json = JSON.parse(JSON.stringify(report));
    expect(json.verdict).toBe('unstable');
    expect(json.unstablePoles).toHaveLength(2);
    expect(json.loop.phaseMargin).toBe(report.loop.phaseMargin);
    expect(json.dominantPoles.length).toBe(report.dominantPoles.length);
  });

  it('refuses a count of dominant poles that is not a whole number', () => {
    const op = operatingPoint(threePoleLoop(1.5));
    expectQuiescentError(
      () => stabilityReport(op, { probe: 'loopBreak', frequencies, dominantPoles: -1 }),
      'invalid-value',
      'dominantPoles',
    );
  });
});
