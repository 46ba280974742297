/**
 * The magnitudes a circuit value may have. Every element value and model parameter lies in
 * [1e-60, 1e60] (or is exactly 0 where the parameter allows it): wide enough for the saturation
 * current of a wide-bandgap junction (about 1e-45 A) and for any physical resistance, capacitance
 * or gain, and narrow enough that the products and quotients the models form (an Early voltage
 * inverted, a current times a resistance, three factors at once) stay far from overflow (1.8e308)
 * and from subnormal underflow (2.2e-308), where they would come out Infinity, NaN or 0.
 */
import { invalidValue } from '../errors/messages.js';

/** The smallest non-zero magnitude of a value. */
export const SMALLEST_MAGNITUDE = 1e-60;
/** The largest finite magnitude of a value. */
export const LARGEST_MAGNITUDE = 1e60;

/**
 * Throw `invalid-value` at `path` (showing `given`, what the user wrote) when the finite number
 * `value` is non-zero and outside [{@link SMALLEST_MAGNITUDE}, {@link LARGEST_MAGNITUDE}].
 */
export function checkMagnitude(value: number, path: readonly (string | number)[], given: unknown): void {
  const size = Math.abs(value);
  if (value === 0 || !Number.isFinite(value)) return;
  if (size < SMALLEST_MAGNITUDE || size > LARGEST_MAGNITUDE) {
    throw invalidValue(
      path,
      given,
      `a value of magnitude between ${SMALLEST_MAGNITUDE} and ${LARGEST_MAGNITUDE} (or 0 where allowed): ` +
        'outside that range the models overflow or underflow',
    );
  }
}
