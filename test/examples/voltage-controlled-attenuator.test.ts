import { describe, expect, it } from 'vitest';
import {
  ATTENUATOR,
  attenuationCurve,
  batDetectorAttenuator,
} from '../../examples/voltage-controlled-attenuator.js';
import { Circuit, quasiStaticHarmonics } from '../../src/index.js';

// Vt = k·T/q at 298.15 K (25 °C, the default temperature) with the exact SI 2019 constants (BIPM, SI Brochure, 9th ed., 2019).
const VT = (1.380649e-23 * 298.15) / 1.602176634e-19;
const { seriesResistance, controlResistance: RC, saturationCurrent, emissionCoefficient: N } = ATTENUATOR;

/** The diode current from KVL around control, 22 kΩ and the diode (Shockley's law), by bisection. */
function diodeCurrent(control: number): number {
  let lo = 0;
  let hi = control / RC;
  for (let i = 0; i < 200; i++) {
    const mid = (lo + hi) / 2;
    const residual = RC * mid + N * VT * Math.log(mid / saturationCurrent + 1) - control;
    if (residual > 0) hi = mid;
    else lo = mid;
  }
  return (lo + hi) / 2;
}

describe('examples/voltage-controlled-attenuator', () => {
  const curve = attenuationCurve(20);

  it('biases the diode as KVL and the Shockley law say', () => {
    for (const s of curve)
      expect(Math.abs(s.diodeCurrent - diodeCurrent(s.control)) / s.diodeCurrent).toBeLessThan(1e-6);
  });

  it('attenuates as the divider of 4.7 kΩ and r_d ‖ 22 kΩ, with r_d = n·Vt/(I_D + I_S)', () => {
    // Small-signal diode resistance (Sedra & Smith, Microelectronic Circuits, 7th ed., 2015, §4.3; from memory).
    for (const s of curve) {
      const rd = (N * VT) / (diodeCurrent(s.control) + saturationCurrent);
      const shunt = (rd * RC) / (rd + RC);
      expect(s.gainDb).toBeCloseTo(20 * Math.log10(shunt / (seriesResistance + shunt)), 3);
    }
  });

  it('attenuates more as the control voltage rises', () => {
    for (let k = 1; k < curve.length; k++) expect(curve[k]!.gainDb).toBeLessThan(curve[k - 1]!.gainDb);
  });

  it('gives the output 2nd harmonic the held large-signal check finds, at every setting', () => {
    // Source: the large-signal check (64 phases, the input capacitor held at its operating-point
    // voltage). Tolerance: 5 %, the next term of the series at the diode's x ≤ 0.4 (docs/linearity.md).
    for (const setting of attenuationCurve(4)) {
      const document = batDetectorAttenuator().toJSON();
      const elements = document.elements.map((e) =>
        e.name === 'control' ? { ...e, dc: setting.control } : e,
      );
      const circuit = Circuit.fromJSON({ ...document, elements } as typeof document);
      const check = quasiStaticHarmonics(circuit, { output: 'shunt' });
      expect(Math.abs(setting.secondHarmonic / check.secondHarmonic - 1)).toBeLessThan(0.05);
    }
  });
});
