/**
 * Tolerance checks for numerical tests: relative error with an explicit scale, and a message that
 * prints both numbers, the error and what was being compared.
 */
import { expect } from 'vitest';

/**
 * |actual − expected| / |expected|, or |actual| when expected is 0.
 *
 * @param actual - the computed value
 * @param expected - the reference value
 * @returns the relative error (absolute where the reference is 0)
 */
export function relativeError(actual: number, expected: number): number {
  if (expected === 0) {
    return Math.abs(actual);
  }
  if (actual === expected) {
    return 0;
  }
  return Math.abs(actual - expected) / Math.abs(expected);
}

/**
 * Expect `actual` within `tolerance` relative error of `expected`, naming `what` on failure.
 *
 * @param actual - the computed value
 * @param expected - the reference value
 * @param tolerance - the largest relative error allowed
 * @param what - a description of the check for the failure message (function, argument, source)
 */
export function expectRelativelyClose(
  actual: number,
  expected: number,
  tolerance: number,
  what: string,
): void {
  const error = relativeError(actual, expected);
  expect(
    error,
    `${what}: got ${actual}, expected ${expected}, relative error ${error.toExponential(2)} > ${tolerance}`,
  ).toBeLessThanOrEqual(tolerance);
}
