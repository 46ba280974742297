import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { passBand, responsePeak } from '../../src/analysis/resonance.js';
import { Circuit, GROUND, logSweep, operatingPoint } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';

/**
 * A series RLC band-pass read across its resistor: H = R/(R + jωL + 1/(jωC)). Its peak is 0 dB at
 * f0 = 1/(2π√(LC)); Q = √(L/C)/R; the half-power bandwidth is R/(2πL) and the edges are
 * f0·(√(1 + 1/(4Q²)) ± 1/(2Q)), whose geometric mean is f0.
 * Source: J. W. Nilsson and S. A. Riedel, Electric Circuits, chapter on band-pass filters (series RLC), from memory.
 */
function seriesRlc(r: number, l: number, c: number, pointsPerDecade: number) {
  const f0 = 1 / (2 * Math.PI * Math.sqrt(l * c));
  const circuit = new Circuit()
    .voltageSource('drive', 'in', GROUND, { ac: 1 })
    .inductor('Ltank', 'in', 'a', l)
    .capacitor('Ctank', 'a', 'out', c)
    .resistor('Rsense', 'out', GROUND, r);
  const ac = acAnalysis(operatingPoint(circuit), {
    frequencies: logSweep(f0 / 10, f0 * 10, pointsPerDecade),
  });
  const q = Math.sqrt(l / c) / r;
  const half = 1 / (2 * q);
  const root = Math.sqrt(1 + half * half);
  return {
    ac,
    f0,
    q,
    bandwidth: r / (2 * Math.PI * l),
    lower: f0 * (root - half),
    upper: f0 * (root + half),
  };
}

describe('the peak and pass band of a series RLC band-pass', () => {
  // A tuned stage: 10 mH, 10 nF and 100 Ω give f0 = 15.915 kHz and Q = 10.
  const tank = seriesRlc(100, 10e-3, 10e-9, 2000);

  it('peaks at 0 dB at the resonant frequency 1/(2π√(LC))', () => {
    const peak = tank.ac.peak('out', 'in');
    expect(peak.interior).toBe(true);
    expectRelativelyClose(peak.frequency, tank.f0, 1e-6, 'peak frequency');
    expect(Math.abs(peak.levelDb)).toBeLessThan(1e-6);
    expect(Math.abs(peak.magnitude - 1)).toBeLessThan(1e-6);
  });

  it('has its half-power edges, bandwidth R/(2πL), centre f0 and Q = √(L/C)/R', () => {
    const band = tank.ac.passBand('out', 'in');
    expect(band).not.toBeNull();
    expectRelativelyClose(band!.lower, tank.lower, 1e-6, 'lower edge');
    expectRelativelyClose(band!.upper, tank.upper, 1e-6, 'upper edge');
    expectRelativelyClose(band!.bandwidth, tank.bandwidth, 1e-5, 'bandwidth');
    expectRelativelyClose(band!.centre, tank.f0, 1e-6, 'centre frequency');
    expectRelativelyClose(band!.q, tank.q, 1e-5, 'Q');
    expect(band!.dropDb).toBeCloseTo(10 * Math.log10(2), 12);
  });

  it('finds Q for any series tank from 0.7 to 50 within 0.5 % on a sweep of 400 points per decade', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e-6, max: 1e-1, noNaN: true }),
        fc.double({ min: 1e-12, max: 1e-6, noNaN: true }),
        fc.double({ min: 0.7, max: 50, noNaN: true }),
        (l, c, q) => {
          const tankAt = seriesRlc(Math.sqrt(l / c) / q, l, c, 400);
          const band = tankAt.ac.passBand('out', 'in');
          expect(band).not.toBeNull();
          expectRelativelyClose(band!.q, tankAt.q, 5e-3, 'Q');
          expectRelativelyClose(band!.centre, tankAt.f0, 1e-3, 'centre');
        },
      ),
      { seed: 18, numRuns: 25 },
    );
  });
});

describe('the peak of a parallel RLC tank driven by a current', () => {
  it('is R at f0 = 1/(2π√(LC)), with bandwidth 1/(2πRC) and Q = R·√(C/L)', () => {
    // Nilsson and Riedel, Electric Circuits, parallel RLC resonance (from memory): |Z| peaks at R.
    const [r, l, c] = [4.7e3, 1e-3, 100e-9];
    const f0 = 1 / (2 * Math.PI * Math.sqrt(l * c));
    const circuit = new Circuit()
      .currentSource('excite', GROUND, 'tank', { ac: 1 })
      .resistor('Rdamp', 'tank', GROUND, r)
      .inductor('Ltank', 'tank', GROUND, l)
      .capacitor('Ctank', 'tank', GROUND, c);
    const ac = acAnalysis(operatingPoint(circuit), { frequencies: logSweep(f0 / 10, f0 * 10, 2000) });
    const peak = ac.peak('tank');
    expectRelativelyClose(peak.frequency, f0, 1e-6, 'peak frequency');
    expectRelativelyClose(peak.magnitude, r, 1e-6, 'peak impedance');
    const band = ac.passBand('tank')!;
    expectRelativelyClose(band.bandwidth, 1 / (2 * Math.PI * r * c), 1e-4, 'bandwidth');
    expectRelativelyClose(band.q, r * Math.sqrt(c / l), 1e-4, 'Q');
  });
});

describe('responses without a pass band', () => {
  // A first-order RC low-pass (common practice, no source): highest at the lowest frequency.
  const lowPass = acAnalysis(
    operatingPoint(
      new Circuit()
        .voltageSource('drive', 'in', GROUND, { ac: 1 })
        .resistor('R1', 'in', 'out', '1k')
        .capacitor('C1', 'out', GROUND, '100n'),
    ),
    { frequencies: logSweep(10, 1e5, 20) },
  );

  it('put the peak of a low-pass at the start of the sweep and give no band', () => {
    const peak = lowPass.peak('out', 'in');
    expect(peak.interior).toBe(false);
    expect(peak.frequency).toBe(10);
    expect(lowPass.passBand('out', 'in')).toBeNull();
  });

  it('refuse a drop that is not above 0 dB, and a response that is zero everywhere', () => {
    const f = Float64Array.of(1, 2, 3);
    const level = Float64Array.of(0, 1, 0);
    for (const dropDb of [0, -3, Number.NaN]) {
      expect(() => passBand(f, level, { dropDb })).toThrow(
        expect.objectContaining({ code: 'invalid-value' }),
      );
    }
    expect(() => responsePeak(f, Float64Array.of(-Infinity, -Infinity, -Infinity))).toThrow(
      expect.objectContaining({ code: 'invalid-value' }),
    );
  });

  it('refuse frequencies that are not ascending', () => {
    const unordered = acAnalysis(lowPass.operatingPoint, { frequencies: [100, 10, 1000] });
    expect(() => unordered.peak('out')).toThrow(expect.objectContaining({ code: 'invalid-value' }));
  });
});
