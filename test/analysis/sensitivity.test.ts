/**
 * Sensitivities by the adjoint method, checked against closed forms (sources named beside each) and,
 * for circuits without one, against differences of independent solves of the changed circuit.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { solutionDerivatives } from '../../src/analysis/sensitivity.js';
import {
  acAnalysis,
  Circuit,
  GROUND,
  type OperatingPoint,
  operatingPoint,
  prepareCircuit,
  sensitivity,
} from '../../src/index.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

/** Tolerances tight enough that a difference of two solves measures the parameter, not the solver. */
const TIGHT = { relativeTolerance: 1e-9, voltageTolerance: 1e-12, currentTolerance: 1e-15 };

/** dy/dp by central differences of independent solves of a prepared copy, relative step h. */
function differenced(
  circuit: Circuit,
  element: string,
  parameter: string,
  read: (op: OperatingPoint) => number,
  h = 1e-4,
  options: object = {},
): number {
  const prepared = prepareCircuit(circuit);
  const p = prepared.value(element, parameter);
  const step = p === 0 ? h : h * Math.abs(p);
  prepared.setValue(element, parameter, p + step);
  const up = read(prepared.operatingPoint({ ...TIGHT, ...options }));
  prepared.setValue(element, parameter, p - step);
  const down = read(prepared.operatingPoint({ ...TIGHT, ...options }));
  return (up - down) / (2 * step);
}

describe('DC sensitivities', () => {
  it('of a divider equal the closed-form derivatives', () => {
    // v = V·R2/(R1 + R2): ∂v/∂R1 = −V·R2/(R1 + R2)², ∂v/∂R2 = V·R1/(R1 + R2)², ∂v/∂V = R2/(R1 + R2)
    // (voltage divider, common practice, no source).
    const circuit = new Circuit()
      .voltageSource('supply', 'top', GROUND, { dc: 9 })
      .resistor('upper', 'top', 'mid', '6k')
      .resistor('lower', 'mid', GROUND, '3k');
    const s = sensitivity(operatingPoint(circuit), { output: 'mid' });
    expect(s.value).toBeCloseTo(3, 12);
    expect(s.of('upper', 'resistance').derivative).toBeCloseTo((-9 * 3e3) / 9e3 ** 2, 9);
    expect(s.of('lower', 'resistance').derivative).toBeCloseTo((9 * 6e3) / 9e3 ** 2, 9);
    expect(s.of('supply', 'dc').derivative).toBeCloseTo(1 / 3, 9);
    // A unit relative change of R2 moves v by V·R1·R2/(R1 + R2)² = 2 V.
    expect(s.of('lower', 'resistance').relative).toBeCloseTo(2, 6);
    // A linear resistive circuit does not depend on the temperature.
    expect(s.of(null, 'temperature').derivative).toBeCloseTo(0, 12);
    // Sorted by influence: the supply (3 V per unit) first.
    expect(s.entries[0]).toMatchObject({ element: 'supply', parameter: 'dc' });
  });

  it('of a diode bias point match differences of independent solves, temperature included', () => {
    // Reference: central differences of solves of the changed circuit (common practice, no source).
    const circuit = new Circuit()
      .voltageSource('supply', 'top', GROUND, { dc: 5 })
      .resistor('feed', 'top', 'anode', '4.3k')
      .diode('sensor', 'anode', GROUND, { saturationCurrent: '2n', emissionCoefficient: 1.9 });
    const op = operatingPoint(circuit);
    const s = sensitivity(op, { output: 'anode' });
    const read = (o: OperatingPoint) => o.voltage('anode');
    for (const [element, parameter] of [
      ['feed', 'resistance'],
      ['supply', 'dc'],
      ['sensor', 'saturationCurrent'],
      ['sensor', 'emissionCoefficient'],
    ] as const) {
      const expected = differenced(circuit, element, parameter, read);
      expect(s.of(element, parameter).derivative).toBeCloseTo(
        expected,
        6 - Math.round(Math.log10(Math.abs(expected))),
      );
    }
    // The temperature: solves at T ± 0.01 K.
    const T = op.temperature;
    const up = operatingPoint(circuit, { ...TIGHT, temperature: T + 0.01 }).voltage('anode');
    const down = operatingPoint(circuit, { ...TIGHT, temperature: T - 0.01 }).voltage('anode');
    const dTemperature = (up - down) / 0.02;
    expect(Math.abs(s.of(null, 'temperature').derivative - dTemperature)).toBeLessThan(
      1e-5 * Math.abs(dTemperature),
    );
    // Every defaulted model parameter is listed; an infinite breakdown voltage is not.
    expect(s.of('sensor', 'transitTime').derivative).toBe(0);
    expectQuiescentError(() => s.of('sensor', 'breakdownVoltage'), 'invalid-value', 'breakdownVoltage');
  });

  it('of a device field follow the collector current of a bias network', () => {
    const circuit = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
      .resistor('biasTop', 'vcc', 'base', '47k')
      .resistor('biasBottom', 'base', GROUND, '10k')
      .resistor('collectorLoad', 'vcc', 'collector', '4.7k')
      .resistor('emitterSet', 'emitter', GROUND, '1k')
      .bjt(
        'amp',
        { collector: 'collector', base: 'base', emitter: 'emitter' },
        { polarity: 'npn', forwardBeta: 120, earlyVoltage: 80 },
      );
    const s = sensitivity(operatingPoint(circuit), { output: { device: 'amp', field: 'ic' } });
    const read = (o: OperatingPoint) => o.bjt('amp').ic;
    for (const [element, parameter] of [
      ['emitterSet', 'resistance'],
      ['amp', 'forwardBeta'],
      ['amp', 'saturationCurrent'],
      ['amp', 'earlyVoltage'],
      ['biasTop', 'resistance'],
    ] as const) {
      const expected = differenced(circuit, element, parameter, read);
      const got = s.of(element, parameter).derivative;
      expect(Math.abs(got - expected)).toBeLessThan(1e-5 * Math.abs(expected) + 1e-18);
    }
    // With emitter degeneration, ic ≈ (v_B − v_BE)/R_E: a unit relative change of R_E moves it by about −ic
    // (textbook bias stability; Sedra & Smith, Microelectronic Circuits, bias design section).
    const ic = s.value;
    expect(s.of('emitterSet', 'resistance').relative / ic).toBeLessThan(-0.8);
  });

  it('match differences of independent solves on random diode-resistor networks', () => {
    // Property (common practice, no source): the adjoint derivative equals the derivative of the
    // solution, whatever the network.
    const network = fc.record({
      supply: fc.double({ min: 0.5, max: 10, noNaN: true }),
      r: fc.array(fc.double({ min: 100, max: 1e5, noNaN: true }), { minLength: 3, maxLength: 3 }),
      is: fc.double({ min: 1e-15, max: 1e-9, noNaN: true }),
      pick: fc.integer({ min: 0, max: 4 }),
    });
    fc.assert(
      fc.property(network, ({ supply, r, is, pick }) => {
        const circuit = new Circuit()
          .voltageSource('supply', 'a', GROUND, { dc: supply })
          .resistor('r0', 'a', 'b', r[0]!)
          .diode('d0', 'b', 'c', { saturationCurrent: is })
          .resistor('r1', 'c', GROUND, r[1]!)
          .resistor('r2', 'b', GROUND, r[2]!);
        const [element, parameter] = (
          [
            ['r0', 'resistance'],
            ['r1', 'resistance'],
            ['r2', 'resistance'],
            ['d0', 'saturationCurrent'],
            ['supply', 'dc'],
          ] as const
        )[pick]!;
        const s = sensitivity(operatingPoint(circuit), { output: 'c' });
        const expected = differenced(circuit, element, parameter, (o) => o.voltage('c'), 1e-4);
        const got = s.of(element, parameter).derivative;
        expect(Math.abs(got - expected)).toBeLessThanOrEqual(
          1e-4 * Math.abs(expected) + 1e-9 * Math.abs(s.value / s.of(element, parameter).value),
        );
      }),
      { seed: 4242, numRuns: 40 },
    );
  });

  it('take the derivative at 0 of a parameter that adds an unknown just above 0', () => {
    const circuit = new Circuit()
      .voltageSource('supply', 'top', GROUND, { dc: 5 })
      .resistor('feed', 'top', 'anode', '1k')
      .diode('clamp', 'anode', GROUND);
    const s = sensitivity(operatingPoint(circuit), { output: 'anode' });
    // At R_s = 0 the series resistance adds i·R_s to the terminal voltage, less what the feed
    // resistor's divider takes back: dv/dR_s = i·R/(R + R_s + r_d) with R_s = 0 (small-signal
    // divider, common practice, no source).
    const d = operatingPoint(circuit).diode('clamp');
    const expected = (d.current * 1e3) / (1e3 + d.resistance);
    expect(s.of('clamp', 'seriesResistance').derivative).toBeCloseTo(expected, 4);
  });

  it('names what it cannot read', () => {
    const circuit = new Circuit()
      .voltageSource('supply', 'a', GROUND, { dc: 1 })
      .resistor('load', 'a', GROUND, 1);
    const op = operatingPoint(circuit);
    expectQuiescentError(() => sensitivity(op, { output: 'nowhere' }), 'unknown-node', 'nowhere');
    expectQuiescentError(
      () => sensitivity(op, { output: { device: 'load', field: 'ic' } }),
      'unknown-element',
      'load',
    );
    const s = sensitivity(op, { output: 'a' });
    expectQuiescentError(() => s.of('missing', 'resistance'), 'unknown-element', 'missing');
    expectQuiescentError(() => s.of('load', 'gain'), 'invalid-value', 'gain');
  });
});

describe('AC sensitivities', () => {
  it('at the corner of an RC low-pass are −4.343 dB and −28.65° per unit relative change of R and of C', () => {
    // H = 1/(1 + jωRC); R·∂H/∂R/H = −jωRC/(1 + jωRC) = −(1 + j)/2 at ωRC = 1: −(20/ln 10)/2 dB and
    // −90/π degrees (first-order low-pass, common practice, no source).
    const R = 1e3;
    const C = 100e-9;
    const corner = 1 / (2 * Math.PI * R * C);
    const circuit = new Circuit()
      .voltageSource('drive', 'in', GROUND, { ac: 1 })
      .resistor('series', 'in', 'out', R)
      .capacitor('shunt', 'out', GROUND, C);
    const ac = acAnalysis(operatingPoint(circuit), { frequencies: [corner / 10, corner] });
    const s = sensitivity(ac, { output: 'out', frequency: corner });
    for (const [element, parameter] of [
      ['series', 'resistance'],
      ['shunt', 'capacitance'],
    ] as const) {
      expect(s.of(element, parameter).magnitudeDb).toBeCloseTo(-10 / Math.LN10, 5);
      expect(s.of(element, parameter).phaseDegrees).toBeCloseTo(-90 / Math.PI, 4);
    }
    // The output is proportional to the drive: 20/ln 10 dB per unit relative change, no phase.
    expect(s.of('drive', 'ac').magnitudeDb).toBeCloseTo(20 / Math.LN10, 6);
    expect(s.of('drive', 'ac').phaseDegrees).toBeCloseTo(0, 9);
    expect(s.of('drive', 'dc').magnitudeDb).toBeCloseTo(0, 9);
    expectQuiescentError(
      () => sensitivity(ac, { output: 'out', frequency: 5 }),
      'invalid-value',
      'frequency',
    );
  });

  it('of a common-emitter gain count the shift of the bias, as independent analyses do', () => {
    // Reference: central differences of AC analyses of the changed circuit (common practice, no source).
    const circuit = new Circuit()
      .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
      .voltageSource('tone', 'source', GROUND, { ac: 1 })
      .capacitor('couple', 'source', 'base', '10µ')
      .resistor('biasTop', 'vcc', 'base', '47k')
      .resistor('biasBottom', 'base', GROUND, '10k')
      .resistor('collectorLoad', 'vcc', 'collector', '4.7k')
      .resistor('emitterSet', 'emitter', GROUND, '1k')
      .capacitor('bypass', 'emitter', GROUND, '10µ')
      .bjt(
        'amp',
        { collector: 'collector', base: 'base', emitter: 'emitter' },
        { polarity: 'npn', forwardBeta: 150, earlyVoltage: 90, baseCollectorCapacitance: '3p' },
      );
    const f = 20e3;
    const ac = acAnalysis(operatingPoint(circuit), { frequencies: [f] });
    const s = sensitivity(ac, { output: 'collector', frequency: f });
    const gainAt = (prepared: ReturnType<typeof prepareCircuit>) =>
      acAnalysis(prepared.operatingPoint(TIGHT), { frequencies: [f] }).voltage('collector')[0]!;
    for (const [element, parameter] of [
      ['emitterSet', 'resistance'],
      ['collectorLoad', 'resistance'],
      ['amp', 'saturationCurrent'],
      ['bypass', 'capacitance'],
      ['supply', 'dc'],
    ] as const) {
      const prepared = prepareCircuit(circuit);
      const p = prepared.value(element, parameter);
      const h = 1e-5 * p;
      prepared.setValue(element, parameter, p + h);
      const up = gainAt(prepared);
      prepared.setValue(element, parameter, p - h);
      const down = gainAt(prepared);
      const y = ac.voltage('collector')[0]!;
      const ratio = up
        .sub(down)
        .div(2 * h)
        .mul(p)
        .div(y);
      const expectedDb = (20 / Math.LN10) * ratio.re;
      const expectedDegrees = (180 / Math.PI) * ratio.im;
      const entry = s.of(element, parameter);
      expect(Math.abs(entry.magnitudeDb - expectedDb)).toBeLessThan(1e-4 * Math.abs(expectedDb) + 1e-6);
      expect(Math.abs(entry.phaseDegrees - expectedDegrees)).toBeLessThan(
        1e-4 * Math.abs(expectedDegrees) + 1e-5,
      );
    }
    // Mid-band gain ≈ −g_m·R_C: a unit relative change of R_C moves it by about 8.7 dB (20/ln 10),
    // less the share r_o takes (Sedra & Smith, Microelectronic Circuits, common-emitter amplifier).
    expect(s.of('collectorLoad', 'resistance').magnitudeDb).toBeGreaterThan(7.5);
    expect(s.of('collectorLoad', 'resistance').magnitudeDb).toBeLessThan(8.7);
  });
});

describe('derivatives of the whole solution (the Monte Carlo predictor)', () => {
  it('of a divider equal the closed form at every node', () => {
    // v = V·R2/(R1 + R2): ∂v/∂R1 = −V·R2/(R1 + R2)², ∂v/∂V = R2/(R1 + R2); the supply node moves only
    // with V (voltage divider, common practice, no source).
    const circuit = new Circuit()
      .voltageSource('supply', 'top', GROUND, { dc: 9 })
      .resistor('upper', 'top', 'mid', '6k')
      .resistor('lower', 'mid', GROUND, '3k');
    const op = operatingPoint(circuit);
    const [upper, supply] = solutionDerivatives(op, [
      { element: 1, parameter: 'resistance' },
      { element: 0, parameter: 'dc' },
    ]);
    const mid = op.system.nodeIndex.get('mid')!;
    const top = op.system.nodeIndex.get('top')!;
    expect(upper![mid]).toBeCloseTo((-9 * 3e3) / 9e3 ** 2, 9);
    expect(upper![top]).toBeCloseTo(0, 12);
    expect(supply![mid]).toBeCloseTo(1 / 3, 9);
    expect(supply![top]).toBeCloseTo(1, 9);
  });

  it('match differences of independent solves, the temperature included', () => {
    // A diode bias network (common practice, no source): central differences of two solves.
    const network = new Circuit()
      .voltageSource('supply', 'top', GROUND, { dc: 5 })
      .resistor('feed', 'top', 'anode', '4.7k')
      .diode('reference', 'anode', 'mid', { saturationCurrent: '2n', emissionCoefficient: 1.8 })
      .resistor('sink', 'mid', GROUND, '1k');
    const op = operatingPoint(network, TIGHT);
    const anode = op.system.nodeIndex.get('anode')!;
    const [feed, saturation, temperature] = solutionDerivatives(op, [
      { element: 1, parameter: 'resistance' },
      { element: 2, parameter: 'saturationCurrent' },
      { element: null, parameter: 'temperature' },
    ]);
    const read = (o: OperatingPoint) => o.voltage('anode');
    expect(feed![anode]).toBeCloseTo(differenced(network, 'feed', 'resistance', read), 9);
    const bySaturation = differenced(network, 'reference', 'saturationCurrent', read);
    expect(Math.abs(saturation![anode]! - bySaturation)).toBeLessThan(1e-5 * Math.abs(bySaturation));
    const h = 0.01;
    const T = op.temperature;
    const up = read(operatingPoint(network, { ...TIGHT, temperature: T + h }));
    const down = read(operatingPoint(network, { ...TIGHT, temperature: T - h }));
    expect(temperature![anode]).toBeCloseTo((up - down) / (2 * h), 8);
  });
});
