import { describe, expect, it } from 'vitest';
import { Circuit, fitDiode, GROUND, operatingPoint } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { expectQuiescentError } from '../support/quiescent-error.js';
import { normalDeviates } from '../support/seeded-noise.js';

const T = 300.15;
const VT = (1.380649e-23 * T) / 1.602176634e-19;
const TRUE = { saturationCurrent: 3e-14, emissionCoefficient: 1.65, seriesResistance: 1.8 };

/**
 * A synthetic forward sweep from Shockley's law with a series resistance written out here
 * (W. Shockley, Bell Syst. Tech. J. 28, 1949): the current is set in 36 steps over five decades and
 * the voltage follows as n·Vt·ln(1 + I/I_S) + I·R_S; 0.5 % Gaussian noise on the measured current.
 */
function sweep(seed: number, noise = 0.005) {
  const deviate = normalDeviates(seed);
  const voltage: number[] = [];
  const current: number[] = [];
  for (let k = 0; k < 36; k++) {
    const i = 1e-7 * 10 ** ((5 * k) / 35);
    voltage.push(
      TRUE.emissionCoefficient * VT * Math.log1p(i / TRUE.saturationCurrent) + i * TRUE.seriesResistance,
    );
    current.push(i * (1 + noise * deviate()));
  }
  return { voltage, current };
}

describe('fitDiode', () => {
  it('recovers I_S, n and R_S from a noisy sweep within two standard errors', () => {
    const fit = fitDiode(sweep(2016), { temperature: T });
    for (const key of ['saturationCurrent', 'emissionCoefficient', 'seriesResistance'] as const) {
      const error = Math.abs(Number(fit.model[key]) - TRUE[key]);
      expect(error, `${key}: ${fit.model[key]} ± ${fit.standardErrors[key]}`).toBeLessThan(
        2 * fit.standardErrors[key]!,
      );
    }
    // The residual is the noise: about 0.5 % in ln(I).
    expect(fit.residual.rms).toBeGreaterThan(0.003);
    expect(fit.residual.rms).toBeLessThan(0.007);
    expect(fit.model.referenceTemperature).toBe(T);
  });

  it('gives n exactly from the semilog slope of an ideal diode', () => {
    // An ideal diode (no series resistance, no noise): ln I is linear in V with slope 1/(n·Vt).
    const voltage = [0.42, 0.47, 0.52, 0.57, 0.62, 0.67];
    const current = voltage.map((v) => 2e-15 * Math.expm1(v / (1.07 * VT)));
    const fit = fitDiode({ voltage, current }, { temperature: T, fixed: { seriesResistance: 0 } });
    expectRelativelyClose(Number(fit.model.emissionCoefficient), 1.07, 1e-9, 'n of the ideal diode');
    expectRelativelyClose(Number(fit.model.saturationCurrent), 2e-15, 1e-8, 'I_S of the ideal diode');
  });

  it('returns a model the builder takes, that reproduces the measured curve', () => {
    const data = sweep(7, 0);
    const fit = fitDiode(data, { temperature: T });
    const op = operatingPoint(
      new Circuit()
        .voltageSource('sweep', 'a', GROUND, { dc: data.voltage[30]! })
        .diode('D1', 'a', GROUND, fit.model),
      { temperature: T },
    );
    expectRelativelyClose(op.diode('D1').current, data.current[30]!, 1e-6, 'current at the 31st point');
  });

  it('reads CSV text with units in the headings, and lists the points it ignored', () => {
    const { voltage, current } = sweep(11);
    const rows = voltage.map((v, k) => `${v},${current[k]}`);
    rows.splice(3, 0, '0.1,0', '0.2,');
    const fit = fitDiode(`Voltage (V),Current [A]\n${rows.join('\n')}`, { temperature: T });
    expect(fit.ignored).toEqual([3, 4]);
    expectRelativelyClose(
      Number(fit.model.emissionCoefficient),
      TRUE.emissionCoefficient,
      0.01,
      'n from CSV',
    );
  });

  it('rejects a missing column and too few points with invalid-value', () => {
    expectQuiescentError(() => fitDiode({ voltage: [0.5, 0.6] } as never), 'invalid-value', 'current');
    expectQuiescentError(
      () => fitDiode({ voltage: [0.5, 0.6, 0.7], current: [1e-6, 1e-5, 0] }),
      'invalid-value',
      'usable residuals',
    );
  });
});
