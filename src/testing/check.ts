/**
 * The checks behind the assertions and the matchers: each reads one result and returns what it found,
 * so that a plain assertion can throw and a vitest matcher can report, with the same words.
 */
import type { OperatingPoint } from '../analysis/operating-point.js';
import { probeLabel } from '../analysis/probe-label.js';
import type { BjtRegion, MosfetRegion } from '../analysis/reports.js';
import { GROUND } from '../circuit/elements.js';
import { formatValue } from '../values/format.js';
import { parseValue } from '../values/parse.js';
import type { Unit } from '../values/units.js';
import type { Value } from '../values/value.js';
import { resolveTolerance, type Tolerance } from './tolerance.js';

/** The outcome of one check, with everything a failure message shows. */
export interface CheckResult {
  /** Whether the actual value met the expectation. */
  readonly pass: boolean;
  /** What was checked, such as `out`, `out − midrail`, `current in Rload` or `region of Q1`. */
  readonly subject: string;
  /** The expected value or word, formatted (`2.5 V`, `forward-active`). */
  readonly expected: string;
  /** The actual value or word, formatted. */
  readonly actual: string;
  /** The tolerance in words, with the deviation it allows (absent for exact checks such as a region). */
  readonly tolerance?: string;
  /** How far off the actual value is, formatted with its sign (absent for exact checks). */
  readonly deviation?: string;
  /** The expected value as data (a number in SI units or a word). */
  readonly expectedValue: number | string;
  /** The actual value as data. */
  readonly actualValue: number | string;
}

/** Options of a node-voltage check: the tolerance and the reference node. */
export interface VoltageCheckOptions extends Tolerance {
  /** The node the voltage is measured against (default ground). */
  readonly reference?: string;
}

/**
 * The failure message of a check, for a plain assertion (`negated` false) or a negated matcher.
 *
 * @param result - the check's outcome
 * @param negated - whether the expectation was that the check fails (`expect(op).not…`)
 * @returns one line: what, expected (with tolerance), actual (with its deviation)
 */
export function checkMessage(result: CheckResult, negated = false): string {
  const tolerance = result.tolerance === undefined ? '' : ` ${result.tolerance}`;
  const deviation = result.deviation === undefined ? '' : ` (off by ${result.deviation})`;
  return `${result.subject}: expected ${negated ? 'not ' : ''}${result.expected}${tolerance}, actual ${result.actual}${deviation}`;
}

/**
 * Compares a number with an expected value within a tolerance.
 *
 * @param subject - what is compared, for the message
 * @param actual - the actual value, in SI units
 * @param expected - the expected value, a number in SI units or a value such as `'2.5 V'`
 * @param tolerance - the allowances
 * @param unit - the unit of the quantity
 * @returns the outcome
 * @throws QuiescentError `invalid-value` for an unreadable expected value or tolerance
 */
export function checkNumber(
  subject: string,
  actual: number,
  expected: Value,
  tolerance: Tolerance,
  unit: Unit | undefined,
): CheckResult {
  const want = parseValue(expected, unit, ['expected']);
  return compare(subject, actual, want, actual - want, tolerance, unit, (value) => formatValue(value, unit));
}

/**
 * The outcome of comparing `actual` with `want`, `off` being their difference as the quantity
 * measures it (modulo 360° for a phase, say), each value written with `show`.
 *
 * @param subject - what is compared, for the message
 * @param actual - the actual value
 * @param want - the expected value
 * @param off - the deviation to judge
 * @param tolerance - the allowances
 * @param unit - the unit for parsing an absolute allowance (undefined for dB and degrees)
 * @param show - how a value is written
 * @returns the outcome
 */
export function compare(
  subject: string,
  actual: number,
  want: number,
  off: number,
  tolerance: Tolerance,
  unit: Unit | undefined,
  show: (value: number) => string,
): CheckResult {
  const resolved = resolveTolerance(tolerance, want, unit, show);
  const allowed = `± ${show(resolved.allowed)}`;
  return {
    pass: Number.isFinite(off) && Math.abs(off) <= resolved.allowed,
    subject,
    expected: show(want),
    actual: show(actual),
    tolerance: resolved.text === `±${show(resolved.allowed)}` ? allowed : `${allowed} (${resolved.text})`,
    deviation: (off > 0 ? '+' : '') + show(off),
    expectedValue: want,
    actualValue: actual,
  };
}

/**
 * Checks a node voltage of an operating point.
 *
 * @param op - the operating point
 * @param node - the node
 * @param expected - the expected voltage (`2.5`, `'2.5 V'`, `'2500 mV'`)
 * @param options - the tolerance, and `reference` (default ground)
 * @returns the outcome
 * @throws QuiescentError `unknown-node`, or `invalid-value` for an unreadable expectation
 */
export function checkNodeVoltage(
  op: OperatingPoint,
  node: string,
  expected: Value,
  options: VoltageCheckOptions,
): CheckResult {
  const reference = options.reference ?? GROUND;
  return checkNumber(probeLabel({ node, reference }), op.voltage(node, reference), expected, options, 'V');
}

/**
 * Checks the current of an element, by the sign conventions of docs/building-circuits.md.
 *
 * @param op - the operating point
 * @param element - the element (any with a current: two-terminal elements, sources, op-amps)
 * @param expected - the expected current (`1e-3`, `'1 mA'`)
 * @param tolerance - the allowances
 * @returns the outcome
 * @throws QuiescentError `unknown-element`, or `invalid-value` for an unreadable expectation
 */
export function checkElementCurrent(
  op: OperatingPoint,
  element: string,
  expected: Value,
  tolerance: Tolerance,
): CheckResult {
  return checkNumber(probeLabel({ element }), op.current(element), expected, tolerance, 'A');
}

/**
 * Checks the operating region of a bipolar transistor or MOSFET. A failure shows the terminal
 * voltages that decided the region.
 *
 * @param op - the operating point
 * @param device - the transistor
 * @param region - the expected region (`'forward-active'`, `'saturation'`, `'triode'`, …)
 * @returns the outcome
 * @throws QuiescentError `unknown-element` when `device` is not a transistor
 */
export function checkDeviceRegion(
  op: OperatingPoint,
  device: string,
  region: BjtRegion | MosfetRegion,
): CheckResult {
  const report = op.device(device);
  if (report.kind === 'diode') {
    return {
      pass: false,
      subject: `region of ${device}`,
      expected: region,
      actual: 'none (a diode has no region)',
      expectedValue: region,
      actualValue: '',
    };
  }
  const bias =
    report.kind === 'bjt'
      ? `vbe ${formatValue(report.vbe, 'V', { digits: 4 })}, vbc ${formatValue(report.vbc, 'V', { digits: 4 })}`
      : report.kind === 'op-amp'
        ? `input ${formatValue(report.differentialInput, 'V', { digits: 4 })}, output ${formatValue(report.outputVoltage, 'V', { digits: 4 })}`
        : `vgs ${formatValue(report.vgs, 'V', { digits: 4 })}, vds ${formatValue(report.vds, 'V', { digits: 4 })}, ` +
          `Vth ${formatValue(report.thresholdVoltage, 'V', { digits: 4 })}`;
  return {
    pass: report.region === region,
    subject: `region of ${device}`,
    expected: region,
    actual: `${report.region} (${bias})`,
    expectedValue: region,
    actualValue: report.region,
  };
}
