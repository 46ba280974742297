/**
 * A Monte Carlo sample starts from the nominal solution moved to first order by the sample's
 * changes, each taken in the function of its parameter the solution follows most nearly linearly
 * (1/β for a current gain, ln I_S for a saturation current: docs/tolerances.md, "How a sample is
 * solved"). The reference for the answers is an independent solve of the drawn values; the
 * iteration counts are this library's own (common practice, no source: a first-order start in
 * the right variable leaves Newton only its quadratic tail).
 */
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint } from '../../src/index.js';
import { Draws } from '../../src/statistics/draws.js';
import { SampleEvaluator } from '../../src/statistics/evaluate-sample.js';
import { MeasureSet } from '../../src/statistics/measures.js';
import { drawValue, resolveTolerances } from '../../src/statistics/tolerances.js';

/** A sensor's bias stage: a divider-fed transistor with emitter degeneration and a diode clamp. */
function biasStage(beta: number, saturation: number, clamp: number): Circuit {
  return new Circuit()
    .voltageSource('supply', 'vcc', GROUND, { dc: 12 })
    .resistor('biasTop', 'vcc', 'base', '56k')
    .resistor('biasBottom', 'base', GROUND, '10k')
    .bjt(
      'amplifier',
      { collector: 'out', base: 'base', emitter: 'emitter' },
      { polarity: 'npn', forwardBeta: beta, saturationCurrent: saturation, earlyVoltage: 80 },
    )
    .resistor('collectorLoad', 'vcc', 'out', '4.7k')
    .resistor('degeneration', 'emitter', GROUND, '1k')
    .resistor('clampFeed', 'out', 'clamp', '10k')
    .diode('clamp', 'clamp', GROUND, { saturationCurrent: clamp });
}

describe('a Monte Carlo sample', () => {
  const tolerances = [
    { element: { kind: 'bjt' }, parameter: 'forwardBeta', min: 60, max: 400 },
    { element: { kind: 'bjt' }, parameter: 'saturationCurrent', min: 2e-16, max: 5e-15 },
    { element: { kind: 'diode' }, parameter: 'saturationCurrent', min: 1e-15, max: 1e-13 },
  ] as const;
  const nominal = biasStage(150, 1e-15, 1e-14);
  const varied = resolveTolerances(tolerances, nominal.elements, 298.15);
  const evaluator = new SampleEvaluator(nominal.elements, {}, varied, new MeasureSet({ out: 'out' }));
  const draws = new Draws(20261204);
  const values = new Float64Array(varied.length);

  it('starts where two Newton solves suffice, for β and saturation currents drawn over decades', () => {
    let most = 0;
    for (let sample = 0; sample < 300; sample++) {
      for (let j = 0; j < varied.length; j++) values[j] = drawValue(varied[j]!, draws, sample, j);
      const solved = evaluator.solve(values);
      most = Math.max(most, solved.iterations);
      const [beta, saturation, clamp] = values;
      const fresh = operatingPoint(biasStage(beta!, saturation!, clamp!));
      for (const node of ['base', 'out', 'emitter', 'clamp']) {
        expect(Math.abs(solved.voltage(node) - fresh.voltage(node))).toBeLessThanOrEqual(
          1e-6 * Math.abs(fresh.voltage(node)) + 1e-9,
        );
      }
    }
    expect(most).toBeLessThanOrEqual(2);
  });
});
