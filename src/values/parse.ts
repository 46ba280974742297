/**
 * Reading a value written the way an engineer writes it: `"4.7k"`, `"10 µF"`, `"1.12eV"`.
 *
 * Grammar (surrounding white space allowed):
 *
 *   value  = number [space] [prefix] [symbol]
 *   number = [+|-] (digits [. [digits]] | . digits) [(e|E) [+|-] digits]
 *   space  = one U+0020 SPACE, U+00A0 NO-BREAK SPACE, U+2009 THIN SPACE or U+202F NARROW NO-BREAK SPACE
 *
 * No space is allowed between prefix and symbol. The rest of the text is read as a whole unit
 * symbol first, then as a prefix alone, then as a one-character prefix followed by a symbol, so
 * `"1F"` is one farad, `"1f"` one femto, `"1mS"` a millisiemens and `"1ms"` a millisecond (SI
 * symbols are case-sensitive). An `e` followed by digits is an exponent; otherwise `eV` is the
 * electronvolt: `"1e3V"` is 1000 V and `"1.12eV"` is 1.12 eV.
 *
 * The number and the prefix are combined in decimal before the one conversion to binary, so
 * `"4.7k"` is exactly the double nearest 4700 and `"10uF"` the double nearest 1e-5.
 */
import { invalidValue } from '../errors/messages.js';
import type { QuiescentError } from '../errors/quiescent-error.js';
import {
  isUnit,
  PREFIX_LIST,
  prefixExponent,
  quantityName,
  UNITS,
  type Unit,
  unitHasSymbol,
  unitOfSymbol,
  unitTakesPrefix,
} from './units.js';

/** Sign and mantissa (group 1), then the exponent digits with their sign (group 2). */
const NUMBER = /^([+-]?(?:\d+(?:\.\d*)?|\.\d+))(?:[eE]([+-]?\d+))?/;

/** The one space allowed between the number and its prefix or unit. */
const SEPARATORS = ' \u00a0\u2009\u202f';

/** Text that looks like an attempt at a non-finite number. */
const NON_FINITE_WORD = /^[+-]?(?:nan|inf)/i;

/**
 * Exponents are clamped to this size before conversion. No string can hold enough digits for a
 * larger exponent to matter: the result is already 0 or infinite.
 */
const EXPONENT_CLAMP = 1e9;

/**
 * Whether the lower end of the interval that a decimal `mantissa`·10^`exponent` stands for (half a
 * unit of its last digit below it) is a finite double: then the largest double rounds to the text.
 */
function roundsFromBelowLargest(mantissa: string, exponent: number): boolean {
  const unsigned = mantissa.replace(/^[+-]/, '');
  const point = unsigned.indexOf('.');
  const fractionDigits = point < 0 ? 0 : unsigned.length - point - 1;
  const digits = BigInt(unsigned.replace('.', '') || '0');
  // (digits − ½)·10^(exponent − fractionDigits) = (2·digits − 1)·5·10^(exponent − fractionDigits − 1)
  const lower = Number(`${(2n * digits - 1n) * 5n}e${exponent - fractionDigits - 1}`);
  return Number.isFinite(lower);
}

/** A prefix and unit read from the text after the number. */
interface Suffix {
  readonly exponent: number;
  readonly symbol: string;
  readonly unit: Unit | undefined;
}

/** Reads `text` (the part after the number and its space) as `[prefix][symbol]`. */
function readSuffix(text: string): Suffix | undefined {
  if (text === '') return { exponent: 0, symbol: '', unit: undefined };
  const whole = unitOfSymbol(text);
  if (whole !== undefined) return { exponent: 0, symbol: text, unit: whole };
  const alone = prefixExponent(text);
  if (alone !== undefined) return { exponent: alone, symbol: '', unit: undefined };
  const prefix = prefixExponent(text.charAt(0));
  const symbol = text.slice(1);
  const unit = unitOfSymbol(symbol);
  // A prefix before 1/V or V^½ would be ambiguous (milli of the quantity, or of the volt inside it).
  if (prefix !== undefined && unit !== undefined && unitTakesPrefix(unit))
    return { exponent: prefix, symbol, unit };
  return undefined;
}

/** The unit a value is read in: a {@link Unit}, `'none'` for a pure number, or undefined for any. */
export type ExpectedUnit = Unit | 'none' | undefined;

/** What a value of `unit` is, for messages: `a resistance`, or `a valid value` without a unit. */
function expected(unit: ExpectedUnit): string {
  if (unit === 'none') return 'a pure number';
  return unit === undefined ? 'a valid value' : `a ${quantityName(unit)}`;
}

/** What may follow the number, for messages. */
function suffixHelp(unit: ExpectedUnit): string {
  const prefixes = `an optional SI prefix (${PREFIX_LIST})`;
  if (unit === 'none') return `expected only ${prefixes}`;
  if (unit === undefined)
    return `expected ${prefixes} followed by an optional unit symbol such as Ω, F or Hz`;
  if (unitHasSymbol(unit)) return `expected ${prefixes} followed by an optional ${unit}`;
  return `expected only ${prefixes}`;
}

/** Why `symbol` (of `found`) does not fit `unit`. */
function mismatchReason(symbol: string, found: Unit, unit: Unit | 'none', prefixed: boolean): string {
  let reason = `${symbol} is the unit of ${quantityName(found)}`;
  if (unit === 'none') return `${reason}; write a pure number with an optional SI prefix and no unit`;
  if (found === 'K' && !prefixed) reason += '; the prefix kilo is a lowercase k';
  else if (found.toLowerCase() === unit.toLowerCase()) reason += '; unit symbols are case-sensitive';
  if (!unitHasSymbol(unit))
    reason += `; write a ${quantityName(unit)} as a number with an optional SI prefix`;
  return reason;
}

function reject(
  path: readonly (string | number)[],
  value: unknown,
  unit: ExpectedUnit,
  reason: string,
): QuiescentError {
  return invalidValue(path, value, {
    expected: expected(unit),
    ...(unit === undefined ? {} : { unit }),
    reason,
  });
}

/**
 * Reads a value in SI units from a number or from text with an optional SI prefix and unit symbol.
 *
 * A finite number is returned unchanged. Text is a decimal number (optional sign, fraction and
 * exponent), optionally one space, an optional SI prefix (`f p n u µ m k M G T`, case-sensitive;
 * micro also as U+03BC or `u`) and an optional unit symbol, with no space between prefix and
 * symbol. When `unit` is given, a symbol in the text must be that unit or an alias of it (Ω also as
 * U+2126, `ohm`, `ohms`, `Ohm`); the compound units as `formatValue` writes them (`"2 mA/V²"`,
 * also `A/V^2`; `"0.02 1/V"` and `"0.5 V^½"`, also `V^0.5`, without a prefix). Without `unit`, any
 * known symbol is accepted and ignored. Text whose magnitude rounds to a number beyond the largest
 * double but includes it within its printed digits (`"1.8e308"`) reads as the largest double.
 *
 * @param text - the value: a finite number in SI base units, or text such as `"4.7k"` or `"10 µF"`
 * @param unit - the unit the value is expected in; a symbol in the text must match it
 * @param path - where the value sits (e.g. `['R1', 'resistance']`), for the error's details and message
 * @returns the value in SI base units (ohms, farads, …)
 * @throws QuiescentError `'invalid-value'` with `details.path` and `details.value` when the text
 *   cannot be read, the unit symbol does not fit `unit`, or the value is not finite
 * @example
 * ```ts
 * parseValue('4.7k');       // 4700
 * parseValue('10uF', 'F');  // 1e-5
 * parseValue('2.2 nF');     // 2.2e-9
 * parseValue('1m');         // 0.001 (milli; "1M" is 1e6)
 * parseValue('1.12eV', 'eV'); // 1.12
 * parseValue('1ms', 's');   // 0.001
 * parseValue('10F', 'Ω', ['R1', 'resistance']);
 * // throws: R1.resistance: "10F" is not a resistance in Ω (F is the unit of capacitance)
 * ```
 */
export function parseValue(
  text: string | number,
  unit?: Unit,
  path: readonly (string | number)[] = [],
): number {
  if (unit !== undefined && !isUnit(unit)) {
    throw invalidValue(['unit'], unit, `a unit symbol (expected one of ${UNITS.join(', ')})`);
  }
  return readValue(text, unit, path);
}

/**
 * Reads a value as {@link parseValue} does, where `unit` may also be `'none'`: a pure number (a
 * gain, a current ratio, an emission coefficient), whose text takes an SI prefix but no unit symbol.
 *
 * @param text - the value
 * @param unit - the unit the value is expected in, `'none'` for a pure number
 * @param path - where the value sits, for the error's details and message
 * @returns the value in SI base units
 * @throws QuiescentError `'invalid-value'`, as {@link parseValue}; a unit symbol on a pure number too
 */
export function readValue(
  text: string | number,
  unit: ExpectedUnit,
  path: readonly (string | number)[],
): number {
  if (typeof text === 'number') {
    if (Number.isFinite(text)) return text;
    throw reject(path, text, unit, 'it must be a finite number');
  }
  if (typeof text !== 'string') {
    throw reject(path, text, unit, 'expected a number or a string such as "4.7k"');
  }
  const trimmed = text.trim();
  if (trimmed === '') throw reject(path, text, unit, 'the text is empty');

  const number = NUMBER.exec(trimmed);
  if (number === null) {
    const reason = NON_FINITE_WORD.test(trimmed)
      ? 'NaN and infinite values are not accepted'
      : 'expected a decimal number first, such as 4.7, -2, .5 or 1.5e-3';
    throw reject(path, text, unit, reason);
  }
  const mantissa = number[1]!;
  const textExponent = number[2] === undefined ? 0 : Number(number[2]);

  let rest = trimmed.slice(number[0].length);
  if (SEPARATORS.includes(rest.charAt(0))) rest = rest.slice(1);
  const suffix = readSuffix(rest);
  if (suffix === undefined) {
    const squeezed = rest.replace(/\s+/g, '');
    let reason: string;
    if (squeezed !== rest && readSuffix(squeezed) !== undefined) {
      reason = 'at most one space, between the number and its prefix or unit, and none inside them';
    } else {
      reason = `unrecognised "${rest}" after the number; ${suffixHelp(unit)}`;
    }
    throw reject(path, text, unit, reason);
  }
  if (unit !== undefined && suffix.unit !== undefined && suffix.unit !== unit) {
    const prefixed = suffix.symbol !== rest;
    throw reject(path, text, unit, mismatchReason(suffix.symbol, suffix.unit, unit, prefixed));
  }

  let exponent = textExponent + suffix.exponent;
  exponent = Math.max(-EXPONENT_CLAMP, Math.min(EXPONENT_CLAMP, exponent));
  const value = Number(`${mantissa}e${exponent}`);
  if (!Number.isFinite(value)) {
    // The text stands for every number that rounds to it: '1.8e308' (two digits) includes the
    // largest double, 1.7976931348623157e308, which it then reads as.
    if (roundsFromBelowLargest(mantissa, exponent))
      return mantissa.startsWith('-') ? -Number.MAX_VALUE : Number.MAX_VALUE;
    throw reject(path, text, unit, 'its magnitude is too large for a double-precision number');
  }
  return value;
}
