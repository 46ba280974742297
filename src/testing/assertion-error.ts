/** The error the plain assertions throw, carrying the check's outcome for programs. */
import { type CheckResult, checkMessage } from './check.js';

/**
 * Thrown by the `assert…` functions of `quiescent/testing` when a check fails. Its message names the
 * node or element, the expected value with its tolerance and the actual value with its deviation;
 * `expected` and `actual` hold the values, so runners that show a diff show them.
 */
export class QuiescentAssertionError extends Error {
  /** The check's outcome. */
  readonly result: CheckResult;
  /** The expected value (a number in SI units, or a word such as a region). */
  readonly expected: number | string;
  /** The actual value. */
  readonly actual: number | string;

  /** Builds the error from a failed check. */
  constructor(result: CheckResult) {
    super(checkMessage(result));
    this.name = 'QuiescentAssertionError';
    this.result = result;
    this.expected = result.expectedValue;
    this.actual = result.actualValue;
  }
}

/** Throw a {@link QuiescentAssertionError} unless the check passed. */
export function enforce(result: CheckResult): void {
  if (!result.pass) throw new QuiescentAssertionError(result);
}
