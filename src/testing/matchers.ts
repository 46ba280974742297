/**
 * vitest matchers over the same checks as the plain assertions. vitest is not imported at run time:
 * install them with `expect.extend(quiescentMatchers)` in a test or a setup file.
 */
import type { AcAnalysis } from '../analysis/ac-analysis.js';
import type { LinearityReport } from '../analysis/linearity.js';
import type { OperatingPoint } from '../analysis/operating-point.js';
import type { BjtRegion, MosfetRegion } from '../analysis/reports.js';
import type { Value } from '../values/value.js';
import {
  type CheckResult,
  checkDeviceRegion,
  checkElementCurrent,
  checkMessage,
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

/** The part of vitest's matcher context the matchers read. */
export interface MatcherContext {
  /** Whether the assertion was negated with `.not`. */
  readonly isNot: boolean;
}

/** What a matcher returns to vitest. */
export interface MatcherOutcome {
  /** Whether the check passed (vitest inverts it for `.not`). */
  readonly pass: boolean;
  /** The failure message. */
  readonly message: () => string;
  /** The actual value, for vitest's diff. */
  readonly actual: unknown;
  /** The expected value, for vitest's diff. */
  readonly expected: unknown;
}

/**
 * The matchers' signatures, as they appear on `expect(op)`. `expect.extend(quiescentMatchers)`
 * installs them at run time; for type checking, declare them once in the project (vitest is not a
 * dependency of quiescent, so the package does not declare them itself):
 *
 * ```ts no-run
 * import type { QuiescentMatchers } from 'quiescent/testing';
 * declare module 'vitest' {
 *   interface Matchers<T = any> extends QuiescentMatchers<T> {}
 * }
 * ```
 */
export interface QuiescentMatchers<R = unknown> {
  /** The received operating point has `node` within the tolerance of `expected` volts. */
  toHaveNodeVoltage(node: string, expected: Value, options: VoltageCheckOptions): R;
  /** The received operating point has the current of `element` within the tolerance of `expected` amperes. */
  toHaveElementCurrent(element: string, expected: Value, tolerance: Tolerance): R;
  /** The transistor `device` of the received operating point is in `region`. */
  toHaveDeviceRegion(device: string, region: BjtRegion | MosfetRegion): R;
  /** The received AC analysis has a gain (or level) of `expectedDb` dB at the point given. */
  toHaveGain(at: ResponsePoint, expectedDb: number, tolerance: Tolerance): R;
  /** The received AC analysis has a phase of `expectedDegrees` at the point given (modulo 360°). */
  toHavePhase(at: ResponsePoint, expectedDegrees: number, tolerance: Tolerance): R;
  /** The received linearity report has every junction of `device` (or the one named) within budget. */
  toHaveJunctionWithinBudget(device: string, options?: JunctionBudgetOptions): R;
  /** The received linearity report, taken at an output, has that output within budget. */
  toHaveOutputWithinBudget(options?: OutputBudgetOptions): R;
}

/** The outcome for vitest, with a message that fits the negation. */
function outcome(context: MatcherContext, result: CheckResult): MatcherOutcome {
  return {
    pass: result.pass,
    message: () => checkMessage(result, context.isNot),
    actual: result.actualValue,
    expected: result.expectedValue,
  };
}

function isOperatingPoint(x: unknown): x is OperatingPoint {
  const candidate = x as Partial<Record<'voltage' | 'current' | 'device', unknown>> | null;
  return (
    typeof candidate === 'object' &&
    candidate !== null &&
    typeof candidate.voltage === 'function' &&
    typeof candidate.current === 'function' &&
    typeof candidate.device === 'function'
  );
}

function isAcAnalysis(x: unknown): x is AcAnalysis {
  const candidate = x as Partial<Record<'magnitudeDb' | 'phaseDegrees' | 'frequencies', unknown>> | null;
  return (
    typeof candidate === 'object' &&
    candidate !== null &&
    candidate.frequencies instanceof Float64Array &&
    typeof candidate.magnitudeDb === 'function' &&
    typeof candidate.phaseDegrees === 'function'
  );
}

function isLinearityReport(x: unknown): x is LinearityReport {
  const candidate = x as Partial<Record<'junctions' | 'budget', unknown>> | null;
  return (
    typeof candidate === 'object' &&
    candidate !== null &&
    Array.isArray(candidate.junctions) &&
    typeof candidate.budget === 'number'
  );
}

/** What arrived instead of the expected result, for the message. */
function describeReceived(received: unknown): string {
  if (received === null) return 'null';
  return typeof received === 'object' ? received.constructor.name : typeof received;
}

/** Reject anything but an operating point as the received value, naming what arrived. */
function requireOperatingPoint(received: unknown, matcher: string): OperatingPoint {
  // Duck-typed rather than instanceof: the CommonJS build of this entry has its own copy of the class.
  if (isOperatingPoint(received)) return received;
  throw new TypeError(
    `${matcher} expects an OperatingPoint from operatingPoint(), received ${describeReceived(received)}`,
  );
}

function requireAcAnalysis(received: unknown, matcher: string): AcAnalysis {
  if (isAcAnalysis(received)) return received;
  throw new TypeError(
    `${matcher} expects an AcAnalysis from acAnalysis(), received ${describeReceived(received)}`,
  );
}

function requireLinearityReport(received: unknown, matcher: string): LinearityReport {
  if (isLinearityReport(received)) return received;
  throw new TypeError(
    `${matcher} expects a LinearityReport from linearity(), received ${describeReceived(received)}`,
  );
}

/**
 * The matchers, for `expect.extend(quiescentMatchers)`. Each failure message names the node or
 * element, the expected value and tolerance, and the actual value with its deviation.
 *
 * @example
 * ```ts no-run
 * import { expect } from 'vitest';
 * import { quiescentMatchers } from 'quiescent/testing';
 * expect.extend(quiescentMatchers);
 * expect(op).toHaveNodeVoltage('out', '2.5 V', { absolute: '10 mV' });
 * expect(op).toHaveDeviceRegion('Q1', 'forward-active');
 * expect(ac).toHaveGain({ output: 'out', input: 'in', frequency: 1e3 }, 20, { absolute: 0.5 });
 * expect(linearity(ac)).toHaveJunctionWithinBudget('Q1', { junction: 'base-emitter' });
 * expect(linearity(ac, { output: 'out' })).toHaveOutputWithinBudget({ budget: 0.01 });
 * ```
 */
export const quiescentMatchers = {
  /** See {@link QuiescentMatchers.toHaveNodeVoltage}. */
  toHaveNodeVoltage(
    this: MatcherContext,
    received: unknown,
    node: string,
    expected: Value,
    options: VoltageCheckOptions,
  ): MatcherOutcome {
    const op = requireOperatingPoint(received, 'toHaveNodeVoltage');
    return outcome(this, checkNodeVoltage(op, node, expected, options));
  },
  /** See {@link QuiescentMatchers.toHaveElementCurrent}. */
  toHaveElementCurrent(
    this: MatcherContext,
    received: unknown,
    element: string,
    expected: Value,
    tolerance: Tolerance,
  ): MatcherOutcome {
    const op = requireOperatingPoint(received, 'toHaveElementCurrent');
    return outcome(this, checkElementCurrent(op, element, expected, tolerance));
  },
  /** See {@link QuiescentMatchers.toHaveDeviceRegion}. */
  toHaveDeviceRegion(
    this: MatcherContext,
    received: unknown,
    device: string,
    region: BjtRegion | MosfetRegion,
  ): MatcherOutcome {
    const op = requireOperatingPoint(received, 'toHaveDeviceRegion');
    return outcome(this, checkDeviceRegion(op, device, region));
  },
  /** See {@link QuiescentMatchers.toHaveGain}. */
  toHaveGain(
    this: MatcherContext,
    received: unknown,
    at: ResponsePoint,
    expectedDb: number,
    tolerance: Tolerance,
  ): MatcherOutcome {
    return outcome(this, checkGain(requireAcAnalysis(received, 'toHaveGain'), at, expectedDb, tolerance));
  },
  /** See {@link QuiescentMatchers.toHavePhase}. */
  toHavePhase(
    this: MatcherContext,
    received: unknown,
    at: ResponsePoint,
    expectedDegrees: number,
    tolerance: Tolerance,
  ): MatcherOutcome {
    return outcome(
      this,
      checkPhase(requireAcAnalysis(received, 'toHavePhase'), at, expectedDegrees, tolerance),
    );
  },
  /** See {@link QuiescentMatchers.toHaveJunctionWithinBudget}. */
  toHaveJunctionWithinBudget(
    this: MatcherContext,
    received: unknown,
    device: string,
    options?: JunctionBudgetOptions,
  ): MatcherOutcome {
    const report = requireLinearityReport(received, 'toHaveJunctionWithinBudget');
    return outcome(this, checkJunctionWithinBudget(report, device, options));
  },
  /** See {@link QuiescentMatchers.toHaveOutputWithinBudget}. */
  toHaveOutputWithinBudget(
    this: MatcherContext,
    received: unknown,
    options?: OutputBudgetOptions,
  ): MatcherOutcome {
    const report = requireLinearityReport(received, 'toHaveOutputWithinBudget');
    return outcome(this, checkOutputWithinBudget(report, options));
  },
};
