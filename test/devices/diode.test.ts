import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint, thermalVoltage } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';
import { diodeSeriesResistorSolution } from '../support/diode-series-resistor.js';

const VT = thermalVoltage(298.15);
const saturationCurrent = 1e-14;

/** A supply V into a resistor R into the anode of diode D1, cathode to ground. */
function seriesLoop(supply: number, resistance: number, model: object = {}): Circuit {
  return new Circuit()
    .voltageSource('supply', 'in', GROUND, { dc: supply })
    .resistor('R1', 'in', 'a', resistance)
    .diode('D1', 'a', GROUND, { saturationCurrent, ...model });
}

/** The diode driven by a DC current source, anode to cathode. */
function currentDriven(current: number, model: object = {}): Circuit {
  return new Circuit().currentSource('bias', GROUND, 'a', { dc: current }).diode('D1', 'a', GROUND, model);
}

describe('a diode in series with a resistor', () => {
  // Banwell & Jayakumar, "Exact analytical solution for current flow through diode with series
  // resistance", Electronics Letters 36(4), 2000: i = (n·Vt/R)·W0((I_S·R/(n·Vt))·e^((V+I_S·R)/(n·Vt))) − I_S.
  // The reference has no parallel conductance, so the junction conductance is set negligible here:
  // at 0.1 V the diode carries well under a picoampere, comparable to 1e-12 S × 0.1 V.
  const exact = { junctionConductance: 1e-30, relativeTolerance: 1e-12 };
  for (const emissionCoefficient of [1, 2]) {
    for (const seriesResistance of [0, 10]) {
      it(`matches the exact Lambert-W solution from 0.1 V to 100 V (n = ${emissionCoefficient}, own series resistance ${seriesResistance} Ω)`, () => {
        for (const supply of [0.1, 0.3, 1, 3, 10, 30, 100]) {
          const op = operatingPoint(
            seriesLoop(supply, 1000, { emissionCoefficient, seriesResistance }),
            exact,
          );
          const ref = diodeSeriesResistorSolution({
            supply,
            resistance: 1000 + seriesResistance,
            saturationCurrent,
            emissionCoefficient,
            thermalVoltage: VT,
          });
          const d = op.diode('D1');
          const what = `V = ${supply} V`;
          expectRelativelyClose(d.current, ref.current, 1e-10, `current at ${what}`);
          expectRelativelyClose(d.junctionVoltage, ref.junctionVoltage, 1e-10, `junction voltage at ${what}`);
          // The terminal sits above the junction by the drop across the diode's own series resistance.
          expectRelativelyClose(
            d.voltage,
            ref.junctionVoltage + ref.current * seriesResistance,
            1e-10,
            `anode at ${what}`,
          );
          // Below 1 V the resistor drops nanovolts or less, and (V − v_a)/R cancels to a few digits.
          if (supply >= 1)
            expectRelativelyClose(op.current('R1'), ref.current, 1e-10, `resistor current at ${what}`);
        }
      });
    }
  }

  it('agrees with the Lambert-W solution to the default tolerance with the default junction conductance', () => {
    // Banwell & Jayakumar (2000) as above; from 1 V up the diode carries microamperes or more, and
    // the default 1e-12 S across the junction stays below the default relative tolerance of 1e-6.
    for (const supply of [1, 3, 10, 30, 100]) {
      for (const emissionCoefficient of [1, 2]) {
        const op = operatingPoint(seriesLoop(supply, 1000, { emissionCoefficient }));
        const ref = diodeSeriesResistorSolution({
          supply,
          resistance: 1000,
          saturationCurrent,
          emissionCoefficient,
          thermalVoltage: VT,
        });
        expectRelativelyClose(
          op.diode('D1').current,
          ref.current,
          1e-6,
          `current at ${supply} V, n = ${emissionCoefficient}`,
        );
      }
    }
  });
});

describe('the diode small-signal and capacitance report', () => {
  it('gives the dynamic resistance r_d = n·Vt/I_D', () => {
    // Sedra & Smith, Microelectronic Circuits, small-signal diode model (from memory).
    for (const n of [1, 1.8]) {
      for (const current of [1e-5, 1e-3]) {
        const d = operatingPoint(currentDriven(current, { emissionCoefficient: n })).diode('D1');
        // The default 1e-12 S takes about 1e-12 × 0.5 V of the source current: 5e-8 of 10 µA.
        expectRelativelyClose(d.resistance, (n * VT) / current, 1e-7, `r_d at n = ${n}, ${current} A`);
        expectRelativelyClose(d.current, current, 1e-9, 'the source current flows through the diode');
      }
    }
  });

  it('puts a silicon junction at 0.6–0.7 V at a milliampere', () => {
    // Common practice, no source.
    const d = operatingPoint(currentDriven(1e-3)).diode('D1');
    expect(d.voltage).toBeGreaterThan(0.6);
    expect(d.voltage).toBeLessThan(0.7);
  });

  it('reports the depletion capacitance C_j0/(1 − V/Vj)^m in reverse bias', () => {
    // The abrupt/graded junction depletion law (Sze & Ng, Physics of Semiconductor Devices, from memory).
    const model = { junctionCapacitance: 2e-12, junctionPotential: 0.8, gradingCoefficient: 0.4 };
    for (const v of [-10, -1, 0]) {
      const op = operatingPoint(
        new Circuit().voltageSource('supply', 'a', GROUND, { dc: v }).diode('D1', 'a', GROUND, model),
      );
      expectRelativelyClose(op.diode('D1').capacitance, 2e-12 / (1 - v / 0.8) ** 0.4, 1e-12, `C at ${v} V`);
    }
  });

  it('continues the depletion law by its tangent above half the junction potential', () => {
    // Common practice, no source: the law diverges at Vj, so it is continued linearly, with matching
    // value and slope, from 0.5·Vj.
    const model = { junctionCapacitance: 2e-12, junctionPotential: 0.8, gradingCoefficient: 0.5 };
    const at = (v: number) =>
      operatingPoint(
        new Circuit().voltageSource('supply', 'a', GROUND, { dc: v }).diode('D1', 'a', GROUND, model),
      ).diode('D1').capacitance;
    const knee = 0.4;
    const law = (v: number) => 2e-12 / (1 - v / 0.8) ** 0.5;
    const slope = (0.5 * 2e-12) / 0.8 / (1 - knee / 0.8) ** 1.5;
    expectRelativelyClose(at(knee), law(knee), 1e-12, 'value at the knee');
    expectRelativelyClose(at(0.6), law(knee) + slope * 0.2, 1e-12, 'tangent 0.2 V above the knee');
    expect(Number.isFinite(at(0.9))).toBe(true);
  });

  it('adds the diffusion capacitance τ·g_d in forward bias', () => {
    // Sedra & Smith, Microelectronic Circuits, diffusion capacitance C_d = τ_T·I_D/(n·Vt) (from memory).
    const d = operatingPoint(currentDriven(1e-3, { transitTime: 5e-9, emissionCoefficient: 1.5 })).diode(
      'D1',
    );
    expectRelativelyClose(d.capacitance, (5e-9 * 1e-3) / (1.5 * VT), 1e-9, 'C_d at 1 mA');
  });
});

describe('the diode in reverse breakdown', () => {
  it('conducts beyond −breakdownVoltage like a forward junction offset by the breakdown voltage', () => {
    // The breakdown term −I_S·e^(−(v+V_BR)/(n·Vt)) is the Shockley law mirrored about −V_BR, so a reverse
    // supply of V through R is the forward loop of Banwell & Jayakumar (2000) with supply V − V_BR.
    const op = operatingPoint(seriesLoop(-12, 1000, { breakdownVoltage: 5 }), { junctionConductance: 1e-30 });
    const ref = diodeSeriesResistorSolution({
      supply: 12 - 5,
      resistance: 1000,
      saturationCurrent,
      emissionCoefficient: 1,
      thermalVoltage: VT,
    });
    const d = op.diode('D1');
    expectRelativelyClose(-d.current, ref.current + saturationCurrent, 1e-9, 'breakdown current');
    expectRelativelyClose(-d.voltage, 5 + ref.junctionVoltage, 1e-9, 'voltage beyond −V_BR');
  });

  it('passes only about −I_S above −breakdownVoltage', () => {
    // Shockley law: i → −I_S in reverse bias; e^(−4/Vt) of breakdown current is negligible at 1 V above −V_BR.
    const op = operatingPoint(seriesLoop(-4, 1000, { breakdownVoltage: 5 }), { junctionConductance: 1e-30 });
    expectRelativelyClose(op.diode('D1').current, -saturationCurrent, 1e-6, 'reverse current');
  });
});

describe('the diode temperature law', () => {
  it('gives I_S itself at the reference temperature', () => {
    // docs/devices.md, "Temperature law of the saturation current": the law is 1 at T = Tref.
    // Shockley: at 1 mA the junction sits at n·Vt·ln(I/I_S + 1).
    const model = { saturationCurrent: 3e-15, referenceTemperature: 320 };
    const d = operatingPoint(currentDriven(1e-3, model), {
      temperature: 320,
      junctionConductance: 1e-30,
    }).diode('D1');
    const vt = thermalVoltage(320);
    expectRelativelyClose(d.voltage, vt * Math.log1p(1e-3 / 3e-15), 1e-10, 'junction voltage at Tref');
  });

  it('follows ln I_S(T) = ln I_S + (p/n)·ln(T/Tref) + (q·E_g/(n·k))·(1/Tref − 1/T), p the temperature exponent, at another temperature', () => {
    // Sze & Ng, Physics of Semiconductor Devices (3rd ed., 2007), from the intrinsic carrier density,
    // written in its Arrhenius form (from memory), with the exact SI 2019 constants.
    const k = 1.380649e-23;
    const q = 1.602176634e-19;
    const [n, p, eg, tref, t] = [1.3, 3, 1.12, 298.15, 360];
    const isT = 1e-14 * Math.exp((p / n) * Math.log(t / tref) + ((q * eg) / (n * k)) * (1 / tref - 1 / t));
    const d = operatingPoint(currentDriven(1e-3, { emissionCoefficient: n }), {
      temperature: t,
      junctionConductance: 1e-30,
    }).diode('D1');
    expectRelativelyClose(
      d.voltage,
      n * thermalVoltage(t) * Math.log1p(1e-3 / isT),
      1e-10,
      'junction voltage at 360 K',
    );
  });

  it('lowers the forward voltage by about 2 mV per kelvin at constant current', () => {
    // Common practice, no source: silicon diodes at a milliampere drift by about −2 mV/K.
    const v = (t: number) => operatingPoint(currentDriven(1e-3), { temperature: t }).diode('D1').voltage;
    const slope = (v(310.15) - v(290.15)) / 20;
    expect(slope).toBeGreaterThan(-2.5e-3);
    expect(slope).toBeLessThan(-1.5e-3);
  });
});

describe('the junction conductance option', () => {
  it('does not visibly change a forward-biased answer', () => {
    // Common practice, no source: 1e-12 S next to a junction carrying 1 mA (r_d ≈ 26 Ω) is invisible.
    const tight = { relativeTolerance: 1e-12 };
    const a = operatingPoint(seriesLoop(5, 1000), tight);
    const b = operatingPoint(seriesLoop(5, 1000), { ...tight, junctionConductance: 1e-30 });
    expectRelativelyClose(a.voltage('a'), b.voltage('a'), 1e-10, 'anode voltage');
    expectRelativelyClose(a.current('R1'), b.current('R1'), 1e-10, 'current');
  });

  it('is included in the reported conductance and carries the reverse current', () => {
    // Common practice, no source: in reverse bias the junction passes −I_S plus g·v.
    const op = operatingPoint(seriesLoop(-10, 1000), { junctionConductance: 1e-9 });
    const d = op.diode('D1');
    expectRelativelyClose(d.current, -saturationCurrent + 1e-9 * d.voltage, 1e-6, 'reverse current');
    expectRelativelyClose(d.conductance, 1e-9, 1e-6, 'reverse conductance');
  });
});
