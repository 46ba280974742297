/**
 * The linearity report: each junction's amplitude, normalized amplitude and figures at its worst
 * frequency, the budget, and the input scale that puts the worst junction at the budget. The Bessel
 * ratios themselves are checked against Abramowitz & Stegun's tables and mpmath in
 * test/math/bessel.test.ts and test/math/junction-nonlinearity.test.ts; here they are taken as known.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { acAnalysis } from '../../src/analysis/ac-analysis.js';
import { linearity } from '../../src/analysis/linearity.js';
import { Circuit, GROUND, operatingPoint, QuiescentError } from '../../src/index.js';
import { expectRelativelyClose } from '../support/close.js';

/** A diode biased near 1.6 mA from 0.7 V through 20 Ω, driven by `amplitude` volts peak. */
function diodeAttenuator(amplitude: number, capacitance = 0): Circuit {
  return new Circuit()
    .voltageSource('drive', 'in', GROUND, { dc: 0.7, ac: amplitude })
    .resistor('R1', 'in', 'a', 20)
    .diode('D1', 'a', GROUND, { junctionCapacitance: capacitance });
}

/** A MOSFET common-source stage: V_ov = 1 V (Vth 0.7 V, gate at 1.7 V), square law, λ = 0. */
function commonSource(amplitude: number): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vdd', GROUND, { dc: 10 })
    .voltageSource('gateDrive', 'g', GROUND, { dc: 1.7, ac: amplitude })
    .resistor('RD', 'vdd', 'd', '5k')
    .mosfet('amplifier', { drain: 'd', gate: 'g', source: GROUND }, { polarity: 'nmos' });
}

describe('linearity of a MOSFET channel', () => {
  it('gives the square law exact values x/2, x/4, 0 and x²/2 at x = v̂gs/V_ov', () => {
    // Source: the square law (Shichman & Hodges, IEEE JSSC 3(3), 1968) with cos²θ = (1 + cos 2θ)/2:
    // ½β(V_ov + v̂ cos θ)² has fundamental βV_ov·v̂, 2nd harmonic ¼βv̂², mean rise ¼βv̂², no 3rd.
    const ac = acAnalysis(operatingPoint(commonSource(0.1)), { frequencies: [1e3] });
    const [channel] = linearity(ac).junctions;
    expect(channel?.junction).toBe('channel');
    expectRelativelyClose(channel!.scale, 1, 1e-12, 'V_ov = 1.7 V − 0.7 V');
    expectRelativelyClose(channel!.amplitude, 0.1, 1e-12, 'the gate is driven directly');
    expectRelativelyClose(channel!.normalized, 0.1, 1e-12, 'x = 0.1 V / 1 V');
    expectRelativelyClose(channel!.errorBound, 0.05, 1e-12, 'x/2');
    expectRelativelyClose(channel!.secondHarmonic, 0.025, 1e-12, 'x/4');
    expect(channel!.thirdHarmonic).toBe(0);
    expectRelativelyClose(channel!.meanShift, 0.005, 1e-12, 'x²/2 of ½βV_ov²');
  });

  it('leaves out a channel in the triode region', () => {
    // Source: docs/linearity.md, "Junction entries" (channels are judged in saturation only).
    // 5 kΩ at 10 V pulls the drain to about 0.6 V with V_ov = 2.3 V: triode by the square law's own boundary vds < V_ov.
    const c = new Circuit()
      .voltageSource('supply', 'vdd', GROUND, { dc: 10 })
      .voltageSource('gateDrive', 'g', GROUND, { dc: 3, ac: 0.01 })
      .resistor('RD', 'vdd', 'd', '5k')
      .mosfet('amplifier', { drain: 'd', gate: 'g', source: GROUND }, { polarity: 'nmos' });
    const op = operatingPoint(c);
    expect(op.mosfet('amplifier').region).toBe('triode');
    expect(linearity(acAnalysis(op, { frequencies: [1] })).junctions).toEqual([]);
  });
});

describe('linearity of a diode', () => {
  it('reads the junction amplitude of the small-signal divider R1 : r_d and normalizes by n·Vt', () => {
    // Source: the small-signal divider v̂ = A·r_d/(R + r_d) (Ohm's law on the linearized circuit), and
    // the Lagrange remainder bound (x/2)·e^x (Taylor's theorem); 2nd-harmonic series x/4 − x³/96 from
    // A&S 9.6.10 (I2/I1 to third order).
    const op = operatingPoint(diodeAttenuator(0.002));
    const rd = op.diode('D1').resistance;
    const [pn] = linearity(acAnalysis(op, { frequencies: [50] })).junctions;
    const amplitude = (0.002 * rd) / (20 + rd);
    expectRelativelyClose(pn!.amplitude, amplitude, 1e-9, 'divider amplitude');
    const x = amplitude / op.thermalVoltage;
    expectRelativelyClose(pn!.normalized, x, 1e-9, 'x = v̂/(n·Vt)');
    expectRelativelyClose(pn!.errorBound, (x / 2) * Math.exp(x), 1e-9, '(x/2)·e^x');
    expectRelativelyClose(pn!.secondHarmonic, x / 4 - x ** 3 / 96, x ** 4, 'I2/I1 series');
    expect(pn!.withinBudget).toBe(pn!.errorBound <= 0.1);
    expect(pn!.device).toBe('D1');
    expect(pn!.kind).toBe('diode');
  });

  it('reports the frequency of the largest amplitude, the lowest one on a tie', () => {
    // Source: the worst frequency as docs/linearity.md, "Junction entries", defines it. Without
    // capacitance every frequency gives the same amplitude; with 10 nF across the junction the amplitude falls with frequency.
    const flat = linearity(
      acAnalysis(operatingPoint(diodeAttenuator(0.001)), { frequencies: [1e3, 10, 100] }),
    );
    expect(flat.junctions[0]!.frequency).toBe(10);
    const falling = linearity(
      acAnalysis(operatingPoint(diodeAttenuator(0.001, 1e-6)), { frequencies: [1e5, 1e3, 1e4] }),
    );
    expect(falling.junctions[0]!.frequency).toBe(1e3);
    const amplitudes = falling.junctions[0]!.amplitudes;
    expect(amplitudes[1]).toBeGreaterThan(amplitudes[2]!);
    expect(amplitudes[2]).toBeGreaterThan(amplitudes[0]!);
  });

  it('bounds the true first-order remainder |e^±x − 1 ∓ x|/x at every drive level', () => {
    // Source: Taylor's theorem with the Lagrange remainder: e^u − 1 − u = (u²/2)·e^ξ with ξ between 0
    // and u, so for |u| ≤ x the remainder relative to the linear term is at most (x/2)·e^x.
    fc.assert(
      fc.property(fc.double({ min: 1e-5, max: 0.2, noNaN: true }), (amplitude) => {
        const [pn] = linearity(
          acAnalysis(operatingPoint(diodeAttenuator(amplitude)), { frequencies: [1] }),
        ).junctions;
        const x = pn!.normalized;
        expect(Math.abs(Math.expm1(x) - x) / x).toBeLessThanOrEqual(pn!.errorBound);
        expect(Math.abs(Math.expm1(-x) + x) / x).toBeLessThanOrEqual(pn!.errorBound);
      }),
      { numRuns: 40 },
    );
  });
});

/** Two diodes at different currents and a MOSFET, all driven by one source. */
function mixedCircuit(amplitude: number): Circuit {
  return new Circuit()
    .voltageSource('drive', 'in', GROUND, { dc: 2, ac: amplitude })
    .resistor('R1', 'in', 'a', '1k')
    .diode('D1', 'a', GROUND)
    .resistor('R2', 'in', 'b', '100k')
    .diode('D2', 'b', GROUND, { emissionCoefficient: 2 })
    .voltageSource('supply', 'vdd', GROUND, { dc: 10 })
    .resistor('RG1', 'in', 'g', '1k')
    .resistor('RG2', 'g', GROUND, '1k')
    .resistor('RD', 'vdd', 'd', '10k')
    .mosfet('amplifier', { drain: 'd', gate: 'g', source: GROUND }, { polarity: 'nmos', gainFactor: 2e-4 });
}

describe('maxInputScale', () => {
  for (const budget of [0.01, 0.1, 0.5]) {
    it(`puts the worst junction exactly at a budget of ${budget} when every source is scaled by it`, () => {
      // Source: the definition of maxInputScale; checked by re-running the AC analysis with the source
      // scaled, outside the inverse of the bound that computed it.
      const amplitude = 0.01;
      const report = linearity(acAnalysis(operatingPoint(mixedCircuit(amplitude)), { frequencies: [1e3] }), {
        budget,
      });
      expect(report.junctions.map((j) => `${j.device}:${j.junction}`)).toEqual([
        'D1:pn',
        'D2:pn',
        'amplifier:channel',
      ]);
      const s = report.maxInputScale;
      expect(Number.isFinite(s)).toBe(true);
      const scaled = linearity(
        acAnalysis(operatingPoint(mixedCircuit(amplitude * s)), { frequencies: [1e3] }),
        {
          budget,
        },
      );
      const worst = Math.max(...scaled.junctions.map((j) => j.errorBound));
      expectRelativelyClose(worst, budget, 1e-9, 'worst error bound at the scaled drive');
      expect(scaled.junctions.every((j) => j.errorBound <= budget * (1 + 1e-9))).toBe(true);
    });
  }

  it('is Infinity when no junction carries signal', () => {
    // Source: docs/linearity.md, "Junction entries" (Infinity where no junction carries signal).
    const c = new Circuit()
      .voltageSource('drive', 'in', GROUND, { dc: 0.7 })
      .resistor('R1', 'in', 'a', 20)
      .diode('D1', 'a', GROUND);
    const report = linearity(acAnalysis(operatingPoint(c), { frequencies: [1] }));
    expect(report.maxInputScale).toBe(Number.POSITIVE_INFINITY);
    expect(report.junctions[0]!.normalized).toBe(0);
    expect(report.withinBudget).toBe(true);
  });
});

describe('the linearity budget', () => {
  it('defaults to 0.1 and flags each junction by errorBound ≤ budget', () => {
    // Source: docs/linearity.md, "Junction entries" (default budget 0.1).
    const report = linearity(acAnalysis(operatingPoint(mixedCircuit(0.05)), { frequencies: [1] }));
    expect(report.budget).toBe(0.1);
    for (const j of report.junctions) expect(j.withinBudget).toBe(j.errorBound <= 0.1);
    expect(report.withinBudget).toBe(report.junctions.every((j) => j.withinBudget));
    expect(report.worst?.errorBound).toBe(Math.max(...report.junctions.map((j) => j.errorBound)));
  });

  for (const budget of [0, -0.1, Number.NaN, Number.POSITIVE_INFINITY, '0.1']) {
    it(`refuses a budget of ${String(budget)} with invalid-value naming the budget`, () => {
      // Source: docs/linearity.md, "The verdict at an output" (a budget out of range is invalid-value).
      const ac = acAnalysis(operatingPoint(diodeAttenuator(0.001)), { frequencies: [1] });
      try {
        linearity(ac, { budget: budget as number });
        expect.unreachable('linearity accepted a bad budget');
      } catch (error) {
        expect(error).toBeInstanceOf(QuiescentError);
        expect((error as QuiescentError).code).toBe('invalid-value');
        expect((error as QuiescentError).message).toContain('budget');
      }
    });
  }
});

describe('junction bias', () => {
  for (const polarity of ['npn', 'pnp'] as const) {
    it(`marks the reverse-biased collector junction of an ${polarity} stage and scales the drive without it`, () => {
      // Source: docs/devices.md, "Bipolar transistor" (vbe, vbc in the forward sense are vbe/vbc for
      // npn and veb/vcb for pnp); forward-active operation has the emitter junction on and the collector one off
      // (common practice, no source).
      const s = polarity === 'npn' ? 1 : -1;
      const c = new Circuit()
        .voltageSource('supply', 'vcc', GROUND, { dc: 10 * s })
        .voltageSource('baseDrive', 'b', GROUND, { dc: 0.65 * s, ac: 0.001 })
        .resistor('RC', 'vcc', 'c', '4.7k')
        .bjt('Q1', { collector: 'c', base: 'b', emitter: GROUND }, { polarity });
      const op = operatingPoint(c);
      const report = linearity(acAnalysis(op, { frequencies: [1] }));
      const [be, bc] = report.junctions;
      expectRelativelyClose(be!.bias, 0.65, 1e-12, 'vbe in the forward sense');
      expectRelativelyClose(bc!.bias, s * op.bjt('Q1').vbc, 1e-12, 'vbc in the forward sense');
      expect(be!.forwardBiased).toBe(true);
      expect(bc!.forwardBiased).toBe(false);
      // The collector swings with the stage's gain, far more n·Vt than the base-emitter junction.
      expect(bc!.normalized).toBeGreaterThan(10 * be!.normalized);
      // Without an output the screen counts forward-biased junctions only (docs/linearity.md, "The verdict").
      expect(bc!.maxInputScale).toBeLessThan(be!.maxInputScale);
      expect(report.maxInputScale).toBe(be!.maxInputScale);
      expect(report.maxInputScaleForwardBiased).toBe(be!.maxInputScale);
      expect(report.worst).toBe(be);
    });
  }
});
