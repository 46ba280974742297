/**
 * Tolerances of the test assertions: an absolute allowance, a relative one, or both (the larger
 * wins, so a check near zero is not held to a relative tolerance it cannot meet).
 */
import { invalidValue } from '../errors/messages.js';
import { formatValue } from '../values/format.js';
import { parseValue } from '../values/parse.js';
import type { Unit } from '../values/units.js';
import type { Value } from '../values/value.js';

/**
 * How far an actual value may lie from the expected one. Give `absolute`, `relative` or both; with
 * both, the larger allowance applies.
 *
 * @example
 * ```ts
 * const tight: Tolerance = { absolute: '1 mV' };
 * const loose: Tolerance = { relative: 0.02 };            // 2 %
 * const either: Tolerance = { absolute: '5m', relative: 0.01 };
 * ```
 */
export interface Tolerance {
  /** The largest deviation allowed, in the quantity's unit (a number or a value such as `'10 mV'`). */
  readonly absolute?: Value;
  /** The largest deviation allowed as a fraction of |expected| (0.01 is 1 %). */
  readonly relative?: number;
}

/** A tolerance checked, in numbers, with the allowance it gives at the expected value. */
export interface ResolvedTolerance {
  /** The absolute allowance, 0 when not given. */
  readonly absolute: number;
  /** The relative allowance, 0 when not given. */
  readonly relative: number;
  /** max(absolute, relative·|expected|): the deviation allowed at the expected value. */
  readonly allowed: number;
  /** The tolerance in words, such as `±10 mV or ±1 %, whichever is larger`. */
  readonly text: string;
}

/**
 * Checks a tolerance and computes the deviation it allows at `expected`.
 *
 * @param tolerance - the tolerance as given
 * @param expected - the expected value, in SI units
 * @param unit - the unit of the quantity, for parsing `absolute` (undefined for dB and degrees)
 * @param show - how a value of the quantity is written (default engineering notation in `unit`)
 * @returns the tolerance in numbers and in words
 * @throws QuiescentError `invalid-value` when neither allowance is given, or one is negative or not finite
 */
export function resolveTolerance(
  tolerance: Tolerance,
  expected: number,
  unit: Unit | undefined,
  show: (value: number) => string = (value) => formatValue(value, unit),
): ResolvedTolerance {
  if (tolerance === null || typeof tolerance !== 'object') {
    throw invalidValue(
      ['tolerance'],
      tolerance,
      'a tolerance object such as { absolute: 1e-3 } or { relative: 0.01 }',
    );
  }
  if (tolerance.absolute === undefined && tolerance.relative === undefined) {
    throw invalidValue(['tolerance'], tolerance, 'a tolerance with `absolute`, `relative` or both');
  }
  const absolute =
    tolerance.absolute === undefined ? 0 : parseValue(tolerance.absolute, unit, ['tolerance', 'absolute']);
  const relative = tolerance.relative ?? 0;
  if (absolute < 0)
    throw invalidValue(['tolerance', 'absolute'], tolerance.absolute, 'a non-negative allowance');
  if (typeof relative !== 'number' || !Number.isFinite(relative) || relative < 0) {
    throw invalidValue(['tolerance', 'relative'], tolerance.relative, 'a finite non-negative fraction');
  }
  const parts: string[] = [];
  if (tolerance.absolute !== undefined) parts.push(`±${show(absolute)}`);
  if (tolerance.relative !== undefined) parts.push(`±${Number((relative * 100).toPrecision(6))} %`);
  const text = parts.length === 2 ? `${parts[0]} or ${parts[1]}, whichever is larger` : parts[0]!;
  return { absolute, relative, allowed: Math.max(absolute, relative * Math.abs(expected)), text };
}
