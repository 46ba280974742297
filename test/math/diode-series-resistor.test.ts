import { describe, expect, it } from 'vitest';
import reference from '../reference/diode-series.json';
import { expectRelativelyClose } from '../support/close.js';
import {
  type DiodeSeriesResistorCircuit,
  diodeSeriesResistorCurrent,
  diodeSeriesResistorSolution,
} from '../support/diode-series-resistor.js';

const EPS = Number.EPSILON;

/** Vt = k·T/q at 298.15 K (25 °C, the default temperature of docs/analyses.md) with the exact SI 2019 constants. */
const THERMAL_VOLTAGE = (1.380649e-23 * 298.15) / 1.602176634e-19;

function circuitOf(c: (typeof reference.cases)[number]): DiodeSeriesResistorCircuit {
  return {
    supply: c.supply,
    resistance: c.totalResistance,
    saturationCurrent: c.saturationCurrent,
    emissionCoefficient: c.emissionCoefficient,
    thermalVoltage: THERMAL_VOLTAGE,
  };
}

describe('diodeSeriesResistorSolution, the outside reference for a diode and a resistor', () => {
  it('uses the thermal voltage that the reference was generated with', () => {
    // Source: test/reference/diode-series.py, k·T/q at 50 digits with k and q exact (SI 2019).
    expectRelativelyClose(THERMAL_VOLTAGE, reference.thermalVoltage, 2 * EPS, 'Vt at 298.15 K');
  });

  it('matches mpmath.lambertw at 50 digits within 1e-12 from 0.1 V to 100 V', () => {
    // Source: test/reference/diode-series.py, the Banwell and Jayakumar (Electronics Letters 36(4),
    // 2000) formula evaluated with mpmath at 50 digits; R = 1 kΩ and 1 kΩ + 10 Ω, n = 1 and 2.
    for (const c of reference.cases) {
      const what = `V = ${c.supply}, R = ${c.totalResistance}, n = ${c.emissionCoefficient}`;
      const solution = diodeSeriesResistorSolution(circuitOf(c));
      expectRelativelyClose(solution.current, c.current, 1e-12, `current at ${what}`);
      expectRelativelyClose(
        solution.junctionVoltage,
        c.junctionVoltage,
        1e-12,
        `junction voltage at ${what}`,
      );
      expectRelativelyClose(
        solution.junctionVoltage + solution.current * c.diodeSeriesResistance,
        c.anodeVoltage,
        1e-12,
        `anode voltage at ${what}`,
      );
      expect(diodeSeriesResistorCurrent(circuitOf(c))).toBe(solution.current);
    }
  });

  it('satisfies both circuit equations: V = i·R + vj and i = I_S·(e^(vj/(n·Vt)) − 1)', () => {
    // Source: Kirchhoff's voltage law and the Shockley diode law, the equations the formula solves.
    for (const supply of [-100, -1, -1e-3, 0, 1e-3, 0.2, 0.5, 0.7, 2, 50, 1e3, 1e5]) {
      for (const emissionCoefficient of [1, 1.5, 2]) {
        const circuit = {
          supply,
          resistance: 470,
          saturationCurrent: 2.5e-15,
          emissionCoefficient,
          thermalVoltage: THERMAL_VOLTAGE,
        };
        const { current, junctionVoltage } = diodeSeriesResistorSolution(circuit);
        const nvt = emissionCoefficient * THERMAL_VOLTAGE;
        const scale = Math.abs(supply) + Math.abs(junctionVoltage);
        expect(Math.abs(supply - current * circuit.resistance - junctionVoltage)).toBeLessThanOrEqual(
          8 * EPS * scale,
        );
        // An error δ in vj moves the diode current by δ/(n·Vt) relative.
        const diodeLaw = circuit.saturationCurrent * Math.expm1(junctionVoltage / nvt);
        const tolerance = 8 * EPS * (1 + Math.abs(junctionVoltage) / nvt);
        // Near zero supply i = (n·Vt/R)·W − I_S cancels down to a few eps·I_S of absolute error.
        const floor = 64 * EPS * circuit.saturationCurrent;
        expect(Math.abs(current - diodeLaw)).toBeLessThanOrEqual(tolerance * Math.abs(current) + floor);
      }
    }
  });

  it('passes −I_S at a large reverse supply and nothing at zero supply', () => {
    // Source: the Shockley law, i → −I_S as vj → −∞, and i = 0 at vj = 0.
    const base = {
      resistance: 1000,
      saturationCurrent: 1e-14,
      emissionCoefficient: 1,
      thermalVoltage: THERMAL_VOLTAGE,
    };
    expectRelativelyClose(
      diodeSeriesResistorCurrent({ ...base, supply: -50 }),
      -1e-14,
      1e-12,
      'reverse current',
    );
    // (n·Vt/R)·W − I_S cancels at zero supply, leaving a few eps·I_S.
    expect(Math.abs(diodeSeriesResistorCurrent({ ...base, supply: 0 }))).toBeLessThanOrEqual(
      1e-14 * 64 * EPS,
    );
  });

  it('rejects a non-finite supply and non-positive parameters', () => {
    // Common practice, no source.
    const good = circuitOf(reference.cases[0]!);
    expect(() => diodeSeriesResistorSolution({ ...good, supply: Number.NaN })).toThrow(RangeError);
    expect(() => diodeSeriesResistorSolution({ ...good, resistance: 0 })).toThrow(RangeError);
    expect(() => diodeSeriesResistorSolution({ ...good, saturationCurrent: -1e-14 })).toThrow(RangeError);
    expect(() =>
      diodeSeriesResistorSolution({ ...good, emissionCoefficient: Number.POSITIVE_INFINITY }),
    ).toThrow(RangeError);
    expect(() => diodeSeriesResistorSolution({ ...good, thermalVoltage: 0 })).toThrow(RangeError);
  });
});
