import { describe, expect, it } from 'vitest';
import {
  BOLTZMANN,
  Circuit,
  ELEMENTARY_CHARGE,
  GROUND,
  operatingPoint,
  thermalVoltage,
} from '../../src/index.js';

describe('the thermal voltage k·T/q', () => {
  it('uses the exact SI 2019 constants', () => {
    // BIPM, The International System of Units (SI brochure, 9th ed., 2019): k and q are exact.
    expect(BOLTZMANN).toBe(1.380649e-23);
    expect(ELEMENTARY_CHARGE).toBe(1.602176634e-19);
  });

  it('is 25.85 mV at 300 K', () => {
    // k·300/q = 25.852 mV with the exact SI 2019 constants (a fact of the trade).
    expect(thermalVoltage(300)).toBeCloseTo(25.85e-3, 5);
  });

  it('is about 26 mV at room temperature, the rule of thumb', () => {
    // Common practice, no source: "Vt ≈ 26 mV".
    expect(Math.abs(thermalVoltage(298.15) / 26e-3 - 1)).toBeLessThan(0.02); // 25.69 mV at 25 °C
  });

  it('is what an operating point reports at its temperature', () => {
    // docs/devices.md, introduction, and docs/analyses.md, "Results": op.thermalVoltage = k·T/q at
    // the analysis temperature.
    const c = new Circuit().voltageSource('supply', 'a', GROUND, { dc: 1 }).resistor('R1', 'a', GROUND, 1);
    expect(operatingPoint(c, { temperature: 350 }).thermalVoltage).toBe(
      (BOLTZMANN * 350) / ELEMENTARY_CHARGE,
    );
    expect(operatingPoint(c).thermalVoltage).toBe(thermalVoltage(298.15));
  });
});
