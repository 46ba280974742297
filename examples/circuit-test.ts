/**
 * Asserting a circuit in a test.
 *
 * Scenario (invented): the knock-sensor stage of transistor-stage.ts goes into a vending machine that
 * may stand in an unheated hall or in the sun, 0 °C to 70 °C. Its acceptance test says: the transistor
 * stays in forward-active operation, the collector sits between 4 V and 8 V (so the comparator's input
 * bias holds), the gain at 10 kHz is 43 dB within 1.5 dB, and the output stays within a
 * 10 % linearity budget at the sensor's 1 mV. The plain assertions of quiescent/testing work in any
 * runner; in vitest, `expect.extend(quiescentMatchers)` gives the same checks as matchers.
 *
 * Run: npx tsx examples/circuit-test.ts
 */
import { acAnalysis, dcSweep, linearity, linearSweep } from '../src/index.js';
import {
  assertDeviceRegion,
  assertGain,
  assertNodeVoltage,
  assertOutputWithinBudget,
  QuiescentAssertionError,
} from '../src/testing/index.js';
import { isMain } from './is-main.js';
import { knockSensorStage } from './transistor-stage.js';

/** The temperatures of the acceptance test, 0 °C to 70 °C in K. */
export const TEMPERATURES = linearSweep(273.15, 343.15, 8);

/**
 * Run every check at every temperature; throws a QuiescentAssertionError on the first failure.
 *
 * @returns the number of checks that passed
 */
export function acceptanceTest(): number {
  let checks = 0;
  const sweep = dcSweep(knockSensorStage('input'), { temperature: TEMPERATURES });
  for (const op of sweep.points) {
    assertDeviceRegion(op, 'Qknock', 'forward-active');
    assertNodeVoltage(op, 'collector', 6, { absolute: 2 });
    const ac = acAnalysis(op, { frequencies: [10e3] });
    assertGain(ac, { output: 'out', input: 'sensor', frequency: 10e3 }, 43, { absolute: 1.5 });
    // Judged at the output the comparator reads: the collector junction swings many n·Vt while
    // reverse-biased and harmless, so a per-junction check would mislead (docs/linearity.md).
    assertOutputWithinBudget(linearity(ac, { output: 'out' }), { budget: 0.1 });
    checks += 4;
  }
  return checks;
}

/** A check that is meant to fail, to show what a failure says. */
export function tooStrictCheck(): string {
  const op = dcSweep(knockSensorStage('input'), { temperature: [343.15] }).points[0]!;
  try {
    assertNodeVoltage(op, 'collector', 6, { absolute: '10 mV' });
  } catch (error) {
    if (error instanceof QuiescentAssertionError) return error.message;
    throw error;
  }
  return 'passed';
}

if (isMain(import.meta.url)) {
  console.log(`${acceptanceTest()} checks passed from 0 °C to 70 °C.`);
  console.log(`A check that is too strict fails like this:\n  ${tooStrictCheck()}`);
}
