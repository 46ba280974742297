/**
 * Plain assertion functions for any test runner: each throws a {@link QuiescentAssertionError} with
 * a message naming the node or element, the expectation, the tolerance and the actual value.
 */
import type { AcAnalysis } from '../analysis/ac-analysis.js';
import type { LinearityReport } from '../analysis/linearity.js';
import type { OperatingPoint } from '../analysis/operating-point.js';
import type { BjtRegion, MosfetRegion } from '../analysis/reports.js';
import type { Value } from '../values/value.js';
import { enforce } from './assertion-error.js';
import {
  checkDeviceRegion,
  checkElementCurrent,
  checkNodeVoltage,
  type VoltageCheckOptions,
} from './check.js';
import { checkOutputWithinBudget, type OutputBudgetOptions } from './linearity-checks.js';
import {
  checkGain,
  checkJunctionWithinBudget,
  checkPhase,
  type JunctionBudgetOptions,
  type ResponsePoint,
} from './response-checks.js';
import type { Tolerance } from './tolerance.js';

/**
 * Asserts that a node voltage lies within a tolerance of the expected value.
 *
 * @param op - the operating point
 * @param node - the node
 * @param expected - the expected voltage (`2.5`, `'2.5 V'`)
 * @param options - `absolute` and/or `relative` tolerance; `reference` node (default ground)
 * @throws QuiescentAssertionError when the voltage is outside the tolerance
 * @throws QuiescentError `unknown-node`, or `invalid-value` for an unreadable expectation or tolerance
 * @example
 * ```ts
 * assertNodeVoltage(op, 'out', '2.5 V', { absolute: '10 mV' });
 * ```
 */
export function assertNodeVoltage(
  op: OperatingPoint,
  node: string,
  expected: Value,
  options: VoltageCheckOptions,
): void {
  enforce(checkNodeVoltage(op, node, expected, options));
}

/**
 * Asserts that an element's current lies within a tolerance of the expected value.
 *
 * @param op - the operating point
 * @param element - the element
 * @param expected - the expected current (`1e-3`, `'1 mA'`), by the sign conventions of docs/building-circuits.md
 * @param tolerance - `absolute` and/or `relative`
 * @throws QuiescentAssertionError when the current is outside the tolerance
 * @throws QuiescentError `unknown-element`, or `invalid-value` for an unreadable expectation or tolerance
 * @example
 * ```ts
 * assertElementCurrent(op, 'Rload', '1 mA', { relative: 0.01 });
 * ```
 */
export function assertElementCurrent(
  op: OperatingPoint,
  element: string,
  expected: Value,
  tolerance: Tolerance,
): void {
  enforce(checkElementCurrent(op, element, expected, tolerance));
}

/**
 * Asserts that a transistor operates in the expected region.
 *
 * @param op - the operating point
 * @param device - the bipolar transistor or MOSFET
 * @param region - `'cutoff'`, `'forward-active'`, `'reverse-active'` or `'saturation'` for a bipolar
 *   transistor; `'cutoff'`, `'triode'` or `'saturation'` for a MOSFET
 * @throws QuiescentAssertionError when the region differs
 * @throws QuiescentError `unknown-element` when `device` is missing
 * @example
 * ```ts
 * assertDeviceRegion(op, 'Q1', 'forward-active');
 * ```
 */
export function assertDeviceRegion(
  op: OperatingPoint,
  device: string,
  region: BjtRegion | MosfetRegion,
): void {
  enforce(checkDeviceRegion(op, device, region));
}

/**
 * Asserts a gain (output/input, or the output's own level) in dB at one analysed frequency.
 *
 * @param ac - the AC analysis
 * @param at - `output`, optional `input`, and `frequency` (one of the analysed frequencies), Hz
 * @param expectedDb - the expected level, in dB
 * @param tolerance - in dB, such as `{ absolute: 0.5 }`
 * @throws QuiescentAssertionError when the gain is outside the tolerance
 * @throws QuiescentError `invalid-value` for a frequency that was not analysed; `unknown-node`, `unknown-element`
 * @example
 * ```ts no-run
 * assertGain(ac, { output: 'out', input: 'in', frequency: 1e3 }, 20, { absolute: 0.5 });
 * ```
 */
export function assertGain(
  ac: AcAnalysis,
  at: ResponsePoint,
  expectedDb: number,
  tolerance: Tolerance,
): void {
  enforce(checkGain(ac, at, expectedDb, tolerance));
}

/**
 * Asserts a phase in degrees at one analysed frequency (compared modulo 360°).
 *
 * @param ac - the AC analysis
 * @param at - `output`, optional `input`, and `frequency`, Hz
 * @param expectedDegrees - the expected phase, in degrees
 * @param tolerance - in degrees, such as `{ absolute: 2 }`
 * @throws QuiescentAssertionError when the phase is outside the tolerance
 * @throws QuiescentError `invalid-value` for a frequency that was not analysed; `unknown-node`, `unknown-element`
 * @example
 * ```ts no-run
 * assertPhase(ac, { output: 'out', input: 'in', frequency: 1e3 }, -45, { absolute: 1 });
 * ```
 */
export function assertPhase(
  ac: AcAnalysis,
  at: ResponsePoint,
  expectedDegrees: number,
  tolerance: Tolerance,
): void {
  enforce(checkPhase(ac, at, expectedDegrees, tolerance));
}

/**
 * Asserts that a device's junctions stay within a linearity budget (every error bound at most it).
 *
 * @param report - the linearity report
 * @param device - the diode or transistor
 * @param options - `junction` to judge one junction only; `budget` other than the report's
 * @throws QuiescentAssertionError when a junction exceeds the budget
 * @throws QuiescentError `unknown-element` when the report has no such junction
 * @example
 * ```ts no-run
 * assertJunctionWithinBudget(linearity(ac), 'Q1', { junction: 'base-emitter', budget: 0.05 });
 * ```
 */
export function assertJunctionWithinBudget(
  report: LinearityReport,
  device: string,
  options?: JunctionBudgetOptions,
): void {
  enforce(checkJunctionWithinBudget(report, device, options));
}

/**
 * Asserts that the output named in a linearity report stays within a budget (its error bound at most it).
 *
 * @param report - a report taken with an output, `linearity(ac, { output })`
 * @param options - a budget other than the report's
 * @throws QuiescentAssertionError when the output exceeds the budget
 * @throws QuiescentError `invalid-value` for a report without an output
 * @example
 * ```ts no-run
 * assertOutputWithinBudget(linearity(ac, { output: 'out' }), { budget: 0.01 });
 * ```
 */
export function assertOutputWithinBudget(report: LinearityReport, options?: OutputBudgetOptions): void {
  enforce(checkOutputWithinBudget(report, options));
}
