import { describe, expect, it } from 'vitest';
import { fitBjtEarlyVoltage, fitBjtGummel } from '../../src/index.js';
import { normalDeviates } from '../support/seeded-noise.js';

const T = 300.15;
const VT = (1.380649e-23 * T) / 1.602176634e-19;
const TRUE = {
  saturationCurrent: 4e-16,
  forwardEmissionCoefficient: 1.01,
  forwardBeta: 220,
  kneeCurrent: 15e-3,
};

/**
 * A synthetic forward Gummel sweep (vbc = 0) from the transport model with the forward base charge
 * of H. K. Gummel and H. C. Poon (Bell Syst. Tech. J. 49, 1970), written out here:
 * I_C = I_S·(e_f − 1)/q_h, I_B = (I_S/β_F)·(e_f − 1); 0.5 % Gaussian noise on each current.
 */
function gummel(seed: number) {
  const deviate = normalDeviates(seed);
  const baseEmitterVoltage: number[] = [];
  const collectorCurrent: number[] = [];
  const baseCurrent: number[] = [];
  for (let k = 0; k < 32; k++) {
    const v = 0.45 + (0.5 * k) / 31;
    const f = TRUE.saturationCurrent * Math.expm1(v / (TRUE.forwardEmissionCoefficient * VT));
    const qh = 0.5 * (1 + Math.sqrt(1 + (4 * f) / TRUE.kneeCurrent));
    baseEmitterVoltage.push(v);
    collectorCurrent.push((f / qh) * (1 + 0.005 * deviate()));
    baseCurrent.push((f / TRUE.forwardBeta) * (1 + 0.005 * deviate()));
  }
  return { baseEmitterVoltage, collectorCurrent, baseCurrent };
}

describe('fitBjtGummel', () => {
  it('recovers I_S, n_F, β_F and the knee current within two standard errors', () => {
    const fit = fitBjtGummel(gummel(1970), { temperature: T });
    for (const key of Object.keys(TRUE) as (keyof typeof TRUE)[]) {
      const error = Math.abs(Number(fit.model[key]) - TRUE[key]);
      expect(error, `${key}: ${fit.model[key]} ± ${fit.standardErrors[key]}`).toBeLessThan(
        2 * fit.standardErrors[key]!,
      );
    }
    expect(fit.model.polarity).toBe('npn');
    expect(fit.ignored).toEqual([]);
  });
});

describe('fitBjtEarlyVoltage', () => {
  it('recovers the Early voltage from output curves at stepped base currents within two standard errors', () => {
    // Output curves at forced base current, from the transport model with the Early factor
    // (J. M. Early, Proc. IRE 40, 1952) and the same knee: at fixed I_B, e_f is fixed, so
    // I_C = β_F·I_B·(1 + V_CE/V_A)/q_h in forward-active operation (vbc well below 0).
    const earlyVoltage = 45;
    const deviate = normalDeviates(1952);
    const data = {
      collectorEmitterVoltage: [] as number[],
      collectorCurrent: [] as number[],
      baseCurrent: [] as number[],
    };
    for (const ib of [2e-6, 6e-6, 20e-6]) {
      const f = ib * TRUE.forwardBeta;
      const qh = 0.5 * (1 + Math.sqrt(1 + (4 * f) / TRUE.kneeCurrent));
      for (let k = 0; k < 12; k++) {
        const vce = 0.1 + k * 0.9;
        data.collectorEmitterVoltage.push(vce);
        data.baseCurrent.push(ib);
        data.collectorCurrent.push(((f * (1 + vce / earlyVoltage)) / qh) * (1 + 0.002 * deviate()));
      }
    }
    const model = { polarity: 'npn' as const, ...TRUE, referenceTemperature: T };
    const fit = fitBjtEarlyVoltage(data, model, { temperature: T, minimumCollectorEmitterVoltage: 0.9 });
    const error = Math.abs(Number(fit.model.earlyVoltage) - earlyVoltage);
    expect(error, `V_A ${fit.model.earlyVoltage} ± ${fit.standardErrors.earlyVoltage}`).toBeLessThan(
      2 * fit.standardErrors.earlyVoltage!,
    );
    // The first point of each curve (0.1 V, saturated) is left out.
    expect(fit.ignored).toEqual([0, 12, 24]);
  });
});
