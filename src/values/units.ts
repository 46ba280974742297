/**
 * SI prefixes and the unit symbols of the quantities a circuit is built from.
 *
 * Prefixes and their powers of ten follow BIPM, The International System of Units (SI Brochure),
 * 9th edition, 2019, Table 7; symbols are case-sensitive (§3: "m" is milli, "M" is mega). Only the
 * prefixes from femto to tera are used: smaller and larger values are written with an exponent.
 */
import { invalidValue } from '../errors/messages.js';

/**
 * A unit symbol. The first ten are the units of the quantities a value may carry; `'A/V²'` (the
 * gain factor of a field-effect transistor), `'1/V'`, `'V^½'`, `'V/K'`, `'V/√Hz'` and `'A/√Hz'` are the
 * compound units, which {@link parseValue} reads back as `formatValue` writes them.
 *
 * @example
 * ```ts
 * const unit: Unit = 'Ω';
 * formatValue(4700, unit); // '4.7 kΩ'
 * ```
 */
export type Unit =
  | 'Ω'
  | 'F'
  | 'H'
  | 'V'
  | 'A'
  | 'Hz'
  | 's'
  | 'S'
  | 'K'
  | 'eV'
  | 'A/V²'
  | '1/V'
  | 'V^½'
  | 'V/K'
  | 'V/√Hz'
  | 'A/√Hz';

/**
 * Every {@link Unit}, in the order of the type.
 *
 * @example
 * ```ts
 * UNITS.includes('Hz'); // true
 * ```
 */
export const UNITS: readonly Unit[] = [
  'Ω',
  'F',
  'H',
  'V',
  'A',
  'Hz',
  's',
  'S',
  'K',
  'eV',
  'A/V²',
  '1/V',
  'V^½',
  'V/K',
  'V/√Hz',
  'A/√Hz',
];

const QUANTITIES: Readonly<Record<Unit, string>> = {
  Ω: 'resistance',
  F: 'capacitance',
  H: 'inductance',
  V: 'voltage',
  A: 'current',
  Hz: 'frequency',
  s: 'time',
  S: 'conductance',
  K: 'temperature',
  eV: 'energy',
  'A/V²': 'gain factor',
  '1/V': 'reciprocal voltage',
  'V^½': 'square root of voltage',
  'V/K': 'temperature coefficient of voltage',
  'V/√Hz': 'voltage noise density',
  'A/√Hz': 'current noise density',
};

/**
 * The name of the quantity measured in `unit`, in lower case, for messages.
 *
 * @param unit - a unit symbol
 * @returns the quantity's name, such as `'resistance'` for `'Ω'`
 * @example
 * ```ts
 * quantityName('F'); // 'capacitance'
 * quantityName('S'); // 'conductance'
 * ```
 */
export function quantityName(unit: Unit): string {
  if (!isUnit(unit)) throw invalidValue(['unit'], unit, `a unit symbol (one of ${UNITS.join(', ')})`);
  return QUANTITIES[unit];
}

/**
 * Whether `value` is one of the {@link Unit} symbols (exactly as spelled in the type, not an alias).
 *
 * @param value - anything
 * @returns true when `value` is a `Unit`
 * @example
 * ```ts
 * isUnit('Ω');   // true
 * isUnit('ohm'); // false: an alias accepted in text, not a Unit
 * ```
 */
export function isUnit(value: unknown): value is Unit {
  return typeof value === 'string' && Object.hasOwn(QUANTITIES, value);
}

/**
 * The symbols accepted in text for each unit. Ω also has the OHM SIGN U+2126 and spelled-out forms;
 * the compound units are read as formatValue writes them (`1/V` and `V^½` without a prefix).
 */
const UNIT_SYMBOLS = new Map<string, Unit>([
  ['Ω', 'Ω'], // U+03A9 GREEK CAPITAL LETTER OMEGA, the form the SI Brochure prints
  ['\u2126', 'Ω'], // U+2126 OHM SIGN, canonically equivalent to U+03A9
  ['ohm', 'Ω'],
  ['ohms', 'Ω'],
  ['Ohm', 'Ω'],
  ['Ohms', 'Ω'],
  ['F', 'F'],
  ['H', 'H'],
  ['V', 'V'],
  ['A', 'A'],
  ['Hz', 'Hz'],
  ['s', 's'],
  ['S', 'S'],
  ['K', 'K'],
  ['eV', 'eV'],
  // The compound units, as formatValue writes them, so that every formatted value reads back.
  ['A/V²', 'A/V²'],
  ['A/V^2', 'A/V²'],
  ['1/V', '1/V'],
  ['V^½', 'V^½'],
  ['V^0.5', 'V^½'],
  ['V/K', 'V/K'],
  ['V/√Hz', 'V/√Hz'],
  ['V/sqrt(Hz)', 'V/√Hz'],
  ['A/√Hz', 'A/√Hz'],
  ['A/sqrt(Hz)', 'A/√Hz'],
]);

/**
 * The unit a symbol written in text stands for, aliases included.
 *
 * @param symbol - a unit symbol as written, without prefix (`'Ω'`, `'ohm'`, `'Hz'`)
 * @returns the unit, or undefined when the symbol is not recognised (case matters: `'hz'` is not)
 * @example
 * ```ts
 * unitOfSymbol('ohms'); // 'Ω'
 * unitOfSymbol('m');    // undefined: a prefix, not a unit
 * ```
 */
export function unitOfSymbol(symbol: string): Unit | undefined {
  return UNIT_SYMBOLS.get(symbol);
}

/**
 * Whether text may carry a symbol for `unit` (every unit does: the compound ones as `formatValue`
 * writes them, `A/V²` also as `A/V^2`, `V^½` also as `V^0.5`).
 *
 * @param unit - a unit symbol
 * @returns true when some symbol in text stands for `unit`
 * @example
 * ```ts
 * unitHasSymbol('Ω');    // true
 * unitHasSymbol('A/V²'); // true
 * ```
 */
export function unitHasSymbol(unit: Unit): boolean {
  for (const u of UNIT_SYMBOLS.values()) if (u === unit) return true;
  return false;
}

/**
 * Whether a formatted value of `unit` may carry an SI prefix. A prefix before `1/V` or `V^½` would
 * read as a prefix of the volt inside them, so those are printed as plain numbers.
 *
 * @param unit - a unit symbol
 * @returns false for `'1/V'` and `'V^½'`, true otherwise
 * @example
 * ```ts
 * unitTakesPrefix('A/V²'); // true: '2 mA/V²'
 * unitTakesPrefix('1/V');  // false: '0.02 1/V'
 * ```
 */
export function unitTakesPrefix(unit: Unit): boolean {
  return unit !== '1/V' && unit !== 'V^½';
}

/**
 * Prefix symbols accepted in text and their powers of ten (SI Brochure, 9th ed., Table 7). Micro
 * is written `µ` (U+00B5 MICRO SIGN), `μ` (U+03BC GREEK SMALL LETTER MU) or `u` where neither can
 * be typed.
 */
const PREFIX_EXPONENTS = new Map<string, number>([
  ['f', -15],
  ['p', -12],
  ['n', -9],
  ['u', -6],
  ['\u00b5', -6],
  ['\u03bc', -6],
  ['m', -3],
  ['k', 3],
  ['M', 6],
  ['G', 9],
  ['T', 12],
]);

/**
 * The power of ten of a prefix symbol.
 *
 * @param symbol - one prefix symbol as written (`'k'`, `'µ'`, `'u'`)
 * @returns its power of ten, or undefined when it is not one of `f p n u µ μ m k M G T`
 * @example
 * ```ts
 * prefixExponent('k'); // 3
 * prefixExponent('K'); // undefined: the kelvin, not a prefix
 * ```
 */
export function prefixExponent(symbol: string): number | undefined {
  return PREFIX_EXPONENTS.get(symbol);
}

/**
 * The prefixes accepted in text, for messages.
 *
 * @example
 * ```ts
 * `expected an SI prefix (${PREFIX_LIST})`; // 'expected an SI prefix (f p n u µ m k M G T)'
 * ```
 */
export const PREFIX_LIST = 'f p n u µ m k M G T';

/**
 * The smallest power of ten that has a prefix in output (femto).
 *
 * @example
 * ```ts
 * prefixSymbol(MIN_PREFIX_EXPONENT); // 'f'
 * ```
 */
export const MIN_PREFIX_EXPONENT = -15;

/**
 * The largest power of ten that has a prefix in output (tera).
 *
 * @example
 * ```ts
 * prefixSymbol(MAX_PREFIX_EXPONENT); // 'T'
 * ```
 */
export const MAX_PREFIX_EXPONENT = 12;

/** Output prefix symbols from femto to tera, one per power of 1000; micro is always U+00B5. */
const OUTPUT_PREFIXES: readonly string[] = ['f', 'p', 'n', '\u00b5', 'm', '', 'k', 'M', 'G', 'T'];

/**
 * The prefix symbol printed for a power of ten.
 *
 * @param exponent - a multiple of 3 from {@link MIN_PREFIX_EXPONENT} to {@link MAX_PREFIX_EXPONENT}
 * @returns the prefix symbol (`''` for 0, `'µ'` as U+00B5 for −6)
 * @throws RangeError when the exponent has no prefix
 * @example
 * ```ts
 * prefixSymbol(-6); // 'µ'
 * prefixSymbol(3);  // 'k'
 * ```
 */
export function prefixSymbol(exponent: number): string {
  const symbol = OUTPUT_PREFIXES[(exponent - MIN_PREFIX_EXPONENT) / 3];
  if (symbol === undefined) throw new RangeError(`no SI prefix for 10^${exponent}`);
  return symbol;
}
