/**
 * Argument checks shared by the special functions. They throw a plain RangeError: these functions
 * sit below the public API, and the analyses that call them turn a failure into a QuiescentError.
 */

/**
 * Throw a RangeError unless `value` is a finite number ≥ 0.
 *
 * @param value - the argument to check
 * @param name - the argument's name, for the message
 * @throws RangeError when `value` is NaN, infinite or negative
 */
export function checkNonNegativeFinite(value: number, name: string): void {
  if (!(Number.isFinite(value) && value >= 0)) {
    throw new RangeError(`${name} must be a finite number ≥ 0, got ${value}`);
  }
}

/**
 * Throw a RangeError unless `value` is a finite number.
 *
 * @param value - the argument to check
 * @param name - the argument's name, for the message
 * @throws RangeError when `value` is NaN or infinite
 */
export function checkFinite(value: number, name: string): void {
  if (!Number.isFinite(value)) {
    throw new RangeError(`${name} must be a finite number, got ${value}`);
  }
}
