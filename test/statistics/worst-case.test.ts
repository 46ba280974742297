import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint, type Tolerance, worstCase } from '../../src/index.js';
import { expectQuiescentError } from '../support/quiescent-error.js';

/** Every combination of the two ends of each range, as value lists. */
function corners(ends: readonly (readonly [number, number])[]): number[][] {
  return ends.reduce<number[][]>(
    (acc, [low, high]) =>
      acc.flatMap((c) => [
        [...c, low],
        [...c, high],
      ]),
    [[]],
  );
}

describe('worstCase of a divider', () => {
  const circuit = new Circuit()
    .voltageSource('supply', 'top', GROUND, { dc: 12 })
    .resistor('upper', 'top', 'out', '6.8k')
    .resistor('lower', 'out', GROUND, '3.3k');
  const tolerances: Tolerance[] = [
    { element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.05 },
    { element: 'supply', parameter: 'dc', min: 11.4, max: 12.6 },
  ];

  it.each(['vertices', 'sensitivity'] as const)(
    'finds the extremes of exhaustive enumeration of the closed form (%s)',
    (method) => {
      // out = V·Rl/(Ru + Rl) (Ohm's law), enumerated over all 8 corners here, independently of the library.
      const outs = corners([
        [6800 * 0.95, 6800 * 1.05],
        [3300 * 0.95, 3300 * 1.05],
        [11.4, 12.6],
      ]).map(([ru, rl, v]) => ({ value: (v! * rl!) / (ru! + rl!), ru, rl, v }));
      const min = outs.reduce((a, b) => (b.value < a.value ? b : a));
      const max = outs.reduce((a, b) => (b.value > a.value ? b : a));
      const wc = worstCase(circuit, { tolerances, measures: { out: 'out' }, method });
      expect(wc.out!.min.value).toBeCloseTo(min.value, 9);
      expect(wc.out!.max.value).toBeCloseTo(max.value, 9);
      expect(wc.out!.max.parameters).toEqual({
        'upper.resistance': max.ru,
        'lower.resistance': max.rl,
        'supply.dc': max.v,
      });
      expect(wc.out!.min.parameters['upper.resistance']).toBe(min.ru);
    },
  );

  it('refuses more than 16 parameters for vertices, and an end out of range', () => {
    const many = new Circuit().voltageSource('supply', 'n0', GROUND, { dc: 1 });
    for (let k = 0; k < 17; k++) many.resistor(`R${k + 1}`, `n${k}`, `n${k + 1}`, 100);
    many.resistor('R0', 'n17', GROUND, 100);
    expectQuiescentError(
      () =>
        worstCase(many, {
          tolerances: [{ element: { kind: 'resistor' }, parameter: 'resistance', relative: 0.01 }],
          measures: { mid: 'n8' },
          method: 'vertices',
        }),
      'invalid-value',
      '16',
    );
    expectQuiescentError(
      () =>
        worstCase(circuit, {
          tolerances: [{ element: 'lower', parameter: 'resistance', relative: 1.5 }],
          measures: { out: 'out' },
        }),
      'invalid-value',
      'lower',
    );
  });
});

describe('worstCase of a bias network', () => {
  // A common-emitter stage biased by a divider and an emitter resistor (a scenario of our own).
  const build = (values: Record<string, number> = {}) =>
    new Circuit()
      .voltageSource('supply', 'rail', GROUND, { dc: 12 })
      .resistor('biasTop', 'rail', 'base', values['biasTop.resistance'] ?? 47e3)
      .resistor('biasBottom', 'base', GROUND, values['biasBottom.resistance'] ?? 10e3)
      .resistor('load', 'rail', 'collector', values['load.resistance'] ?? 4.7e3)
      .resistor('degeneration', 'emitter', GROUND, values['degeneration.resistance'] ?? 1e3)
      .bjt(
        'Q1',
        { collector: 'collector', base: 'base', emitter: 'emitter' },
        { polarity: 'npn', forwardBeta: values['Q1.forwardBeta'] ?? 150 },
      );
  const tolerances: Tolerance[] = [
    { element: 'biasTop', parameter: 'resistance', relative: 0.05 },
    { element: 'biasBottom', parameter: 'resistance', relative: 0.05 },
    { element: 'degeneration', parameter: 'resistance', relative: 0.05 },
    { element: 'Q1', parameter: 'forwardBeta', min: 80, max: 300 },
    { parameter: 'temperature', min: 273.15, max: 358.15 },
  ];

  it.each(['vertices', 'sensitivity'] as const)(
    'finds the collector current extremes of exhaustive enumeration with independent solves (%s)',
    (method) => {
      // Exhaustive enumeration: a fresh circuit and operating point for each of the 32 corners.
      const keys = [
        'biasTop.resistance',
        'biasBottom.resistance',
        'degeneration.resistance',
        'Q1.forwardBeta',
      ];
      const ends: [number, number][] = [
        [47e3 * 0.95, 47e3 * 1.05],
        [10e3 * 0.95, 10e3 * 1.05],
        [1e3 * 0.95, 1e3 * 1.05],
        [80, 300],
        [273.15, 358.15],
      ];
      const currents = corners(ends).map((c) => {
        const values = Object.fromEntries(keys.map((k, j) => [k, c[j]!]));
        return operatingPoint(build(values), { temperature: c[4]! }).bjt('Q1').ic;
      });
      const wc = worstCase(build(), { tolerances, measures: { ic: { device: 'Q1', field: 'ic' } }, method });
      expect(wc.ic!.min.value).toBeCloseTo(Math.min(...currents), 12);
      expect(wc.ic!.max.value).toBeCloseTo(Math.max(...currents), 12);
      expect(wc.ic!.max.parameters['Q1.forwardBeta']).toBe(300);
      expect(wc.ic!.max.parameters.temperature).toBe(358.15);
    },
  );
});
