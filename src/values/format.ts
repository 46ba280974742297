/**
 * Writing a value in engineering notation: a mantissa from 1 to below 1000, an SI prefix for the
 * power of 1000 and the unit symbol, as in `"4.7 kΩ"` (prefixes per BIPM, The International System
 * of Units (SI Brochure), 9th edition, 2019, Table 7; a space between number and unit per §5.4.3).
 *
 * The value is rounded once, in decimal, to the requested significant digits; the prefix is chosen
 * after rounding, so a value that rounds up to the next power of 1000 takes the next prefix
 * (999.9999999 → `"1 k"`). Everything after that moves the decimal point in the digit string,
 * so `parseValue` reads back exactly the rounded decimal.
 */
import { invalidValue } from '../errors/messages.js';
import {
  isUnit,
  MAX_PREFIX_EXPONENT,
  MIN_PREFIX_EXPONENT,
  prefixSymbol,
  UNITS,
  type Unit,
  unitTakesPrefix,
} from './units.js';

/**
 * Significant digits when none are asked for, by {@link formatValue} and by every report table alike:
 * four, enough to tell components of the E96 series apart and short enough to read at a glance.
 */
export const DEFAULT_DIGITS = 4;

/** The most significant digits `toExponential` can give (its limit is 100 fraction digits). */
const MAX_DIGITS = 101;

/**
 * Options of {@link formatValue}.
 *
 * @example
 * ```ts
 * const options: FormatOptions = { digits: 3 };
 * formatValue(1234567, 'Hz', options); // '1.23 MHz'
 * ```
 */
export interface FormatOptions {
  /** Significant digits, an integer from 1 to 101; trailing zeros are dropped. Default {@link DEFAULT_DIGITS} (4). */
  readonly digits?: number;
}

/** `number`, then a space and the prefix and unit when either is present. */
function join(number: string, prefix: string, unit: Unit | undefined): string {
  const symbol = prefix + (unit ?? '');
  return symbol === '' ? number : `${number} ${symbol}`;
}

/** Places a decimal point after `integerDigits` digits of `digits`, padding and trimming zeros. */
function placePoint(digits: string, integerDigits: number): string {
  const integer = digits.slice(0, integerDigits).padEnd(integerDigits, '0');
  const fraction = digits.slice(integerDigits).replace(/0+$/, '');
  return fraction === '' ? integer : `${integer}.${fraction}`;
}

/**
 * Formats a value in engineering notation with an SI prefix from femto to tera and an optional unit.
 *
 * The magnitude is rounded to `digits` significant digits (default 4, {@link DEFAULT_DIGITS}, as in
 * the report tables) and trailing zeros are
 * dropped. Values outside the prefix range are written with an exponent (`"1e-18 A"`); zero is
 * `"0"`; non-finite values are `"Infinity"`, `"-Infinity"` and `"NaN"`, each followed by the
 * unit. Micro is written `µ` (U+00B5). Values in `'1/V'` and `'V^½'` take no prefix (it would read
 * as a prefix of the volt inside them) and are written as plain numbers. The output of a finite
 * value without those two units is read back by {@link parseValue} to the printed precision.
 *
 * @param value - the value in SI base units
 * @param unit - the unit symbol to append, if any
 * @param options - the significant digits, an integer from 1 to 101 (default 4), as a number or as
 *   `{ digits }`
 * @returns the formatted text
 * @throws QuiescentError `'invalid-value'` when `value` is not a number, `unit` is not a
 *   {@link Unit}, `options` is neither a number nor an object, or the digits are not an integer from 1
 *   to 101
 * @example
 * ```ts
 * formatValue(4700, 'Ω');     // '4.7 kΩ'
 * formatValue(1e-5, 'F');     // '10 µF'
 * formatValue(-0.0123, 'A');  // '-12.3 mA'
 * formatValue(1234567);       // '1.235 M'
 * formatValue(1234567, undefined, { digits: 3 }); // '1.23 M'
 * formatValue(0.0123456, 'A', 6);                 // '12.3456 mA'
 * formatValue(0, 'V');        // '0 V'
 * formatValue(1e-18, 'A');    // '1e-18 A'
 * ```
 */
export function formatValue(value: number, unit?: Unit, options?: FormatOptions | number): string {
  if (typeof value !== 'number') throw invalidValue(['value'], value, 'a number');
  if (unit !== undefined && !isUnit(unit)) {
    throw invalidValue(['unit'], unit, `a unit symbol (expected one of ${UNITS.join(', ')})`);
  }
  if (
    options !== undefined &&
    typeof options !== 'number' &&
    (typeof options !== 'object' || options === null)
  ) {
    throw invalidValue(['options'], options, 'a number of significant digits or { digits }');
  }
  const digits = (typeof options === 'number' ? options : options?.digits) ?? DEFAULT_DIGITS;
  if (!(Number.isInteger(digits) && digits >= 1 && digits <= MAX_DIGITS)) {
    throw invalidValue(
      ['digits'],
      digits,
      `a number of significant digits (an integer from 1 to ${MAX_DIGITS})`,
    );
  }

  if (!Number.isFinite(value)) return join(String(value), '', unit);
  if (value === 0) return join('0', '', unit);

  const sign = value < 0 ? '-' : '';
  const [mantissa = '', exponentText = ''] = Math.abs(value)
    .toExponential(digits - 1)
    .split('e');
  const exponent = Number(exponentText);
  const significand = mantissa.replace('.', '');

  if (unit !== undefined && !unitTakesPrefix(unit)) {
    const plain = Number(`${mantissa}e${exponent}`);
    // A value that rounds past the largest double keeps its digits (parseValue reads it back).
    if (Number.isFinite(plain)) return join(sign + String(plain), '', unit);
    return join(`${sign}${placePoint(significand, 1)}e${exponent}`, '', unit);
  }
  const prefixExponent = 3 * Math.floor(exponent / 3);
  if (prefixExponent < MIN_PREFIX_EXPONENT || prefixExponent > MAX_PREFIX_EXPONENT) {
    return join(`${sign}${placePoint(significand, 1)}e${exponent}`, '', unit);
  }
  const number = placePoint(significand, exponent - prefixExponent + 1);
  return join(sign + number, prefixSymbol(prefixExponent), unit);
}
