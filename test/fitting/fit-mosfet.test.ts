import { describe, expect, it } from 'vitest';
import { fitMosfet } from '../../src/index.js';
import { normalDeviates } from '../support/seeded-noise.js';

const T = 300.15;
const VT = (1.380649e-23 * T) / 1.602176634e-19;

function within(
  fit: { model: object; standardErrors: Readonly<Record<string, number>> },
  truth: Record<string, number>,
) {
  for (const [key, value] of Object.entries(truth)) {
    const fitted = Number((fit.model as Record<string, unknown>)[key]);
    const se = fit.standardErrors[key]!;
    expect(Math.abs(fitted - value), `${key}: ${fitted} ± ${se}`).toBeLessThan(2 * se);
  }
}

describe('fitMosfet', () => {
  it('recovers the square law’s threshold, gain factor and λ from output curves within two standard errors', () => {
    // Shichman and Hodges (IEEE J. Solid-State Circuits 3(3), 1968), written out here; 0.5 % noise
    // on the current plus 20 nA of offset noise.
    const truth = { thresholdVoltage: 0.62, gainFactor: 1.6e-3, channelLengthModulation: 0.04 };
    const deviate = normalDeviates(1968);
    const data = {
      gateSourceVoltage: [] as number[],
      drainSourceVoltage: [] as number[],
      drainCurrent: [] as number[],
    };
    for (const vds of [0.3, 1, 2, 3.5]) {
      for (let k = 0; k < 10; k++) {
        const vgs = 0.8 + 0.15 * k;
        const vov = vgs - truth.thresholdVoltage;
        const clm = 1 + truth.channelLengthModulation * vds;
        const id =
          vds >= vov
            ? 0.5 * truth.gainFactor * vov * vov * clm
            : truth.gainFactor * (vov * vds - 0.5 * vds * vds) * clm;
        data.gateSourceVoltage.push(vgs);
        data.drainSourceVoltage.push(vds);
        data.drainCurrent.push(id * (1 + 0.005 * deviate()) + 2e-8 * deviate());
      }
    }
    within(fitMosfet(data, { temperature: T }), truth);
  });

  it('recovers the slope factor, threshold and gain factor of the charge-based law from a weak-to-strong sweep', () => {
    // Enz, Krummenacher and Vittoz (Analog Integrated Circuits and Signal Processing 8, 1995),
    // written out here, in saturation at vds = 1.2 V; 1 % noise.
    const truth = { slopeFactor: 1.32, thresholdVoltage: 0.42, gainFactor: 3e-4 };
    const F = (a: number) => Math.log1p(Math.exp(a)) ** 2;
    const deviate = normalDeviates(1995);
    const data = {
      gateSourceVoltage: [] as number[],
      drainSourceVoltage: [] as number[],
      drainCurrent: [] as number[],
    };
    for (let k = 0; k < 40; k++) {
      const vgs = 0.05 + 0.03 * k;
      const vp = (vgs - truth.thresholdVoltage) / truth.slopeFactor;
      const id =
        2 * truth.slopeFactor * truth.gainFactor * VT * VT * (F(vp / (2 * VT)) - F((vp - 1.2) / (2 * VT)));
      data.gateSourceVoltage.push(vgs);
      data.drainSourceVoltage.push(1.2);
      data.drainCurrent.push(id * (1 + 0.01 * deviate()));
    }
    const fit = fitMosfet(data, { temperature: T, law: 'charge-based' });
    within(fit, truth);
    // The drain-source voltage did not vary, so λ was held at 0.
    expect(fit.model.channelLengthModulation).toBe(0);
  });

  it('fits a pmos from magnitudes and returns its threshold with its sign', () => {
    const data = {
      gateSourceVoltage: [] as number[],
      drainSourceVoltage: [] as number[],
      drainCurrent: [] as number[],
    };
    for (let k = 0; k < 8; k++) {
      const vsg = 1 + 0.2 * k;
      data.gateSourceVoltage.push(vsg);
      data.drainSourceVoltage.push(3);
      data.drainCurrent.push(0.5 * 8e-4 * (vsg - 0.75) ** 2);
    }
    const fit = fitMosfet(data, { temperature: T, polarity: 'pmos' });
    expect(Number(fit.model.thresholdVoltage)).toBeCloseTo(-0.75, 9);
  });
});
