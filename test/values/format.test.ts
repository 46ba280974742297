import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { QuiescentError } from '../../src/errors/quiescent-error.js';
import { DEFAULT_REPORT_DIGITS } from '../../src/report/table.js';
import { DEFAULT_DIGITS, formatValue, parseValue, type Unit } from '../../src/values/index.js';

/**
 * Output prefixes from femto to tera by power of ten, typed in from BIPM, The International System of
 * Units (SI Brochure), 9th edition, 2019, Table 7 (µ is printed as U+00B5 MICRO SIGN).
 */
const OUTPUT_PREFIXES = new Map<string, number>([
  ['f', -15],
  ['p', -12],
  ['n', -9],
  ['\u00b5', -6],
  ['m', -3],
  ['', 0],
  ['k', 3],
  ['M', 6],
  ['G', 9],
  ['T', 12],
]);

/** Catches the error `formatValue` throws, failing the test when it returns instead. */
function rejection(call: () => string): QuiescentError {
  let result: string | undefined;
  try {
    result = call();
  } catch (error) {
    expect(error).toBeInstanceOf(QuiescentError);
    return error as QuiescentError;
  }
  throw new Error(`formatValue returned ${JSON.stringify(result)} instead of throwing`);
}

describe('formatValue', () => {
  it('writes the examples in engineering notation', () => {
    // BIPM, SI Brochure, 9th edition, 2019, Table 7 (prefixes) and §5.4.3 (a space before the unit).
    expect(formatValue(0.0047, 'F')).toBe('4.7 mF');
    expect(formatValue(4700, 'Ω')).toBe('4.7 kΩ');
    expect(formatValue(1e-5, 'F')).toBe('10 \u00b5F');
    expect(formatValue(-0.0123, 'A')).toBe('-12.3 mA');
    expect(formatValue(1234567)).toBe('1.235 M');
    expect(formatValue(2.2e-9, 'F')).toBe('2.2 nF');
    expect(formatValue(10_000, 'Hz')).toBe('10 kHz');
    expect(formatValue(330, 'Ω')).toBe('330 Ω');
    expect(formatValue(1.12, 'eV')).toBe('1.12 eV');
    expect(formatValue(298.15, 'K', 5)).toBe('298.15 K');
    expect(formatValue(0.5)).toBe('500 m');
    expect(formatValue(3.3)).toBe('3.3');
  });

  it('writes zero without a prefix, and negative zero as zero', () => {
    // Common practice, no source: zero has no order of magnitude to pick a prefix from.
    expect(formatValue(0)).toBe('0');
    expect(formatValue(0, 'V')).toBe('0 V');
    expect(formatValue(-0, 'A')).toBe('0 A');
  });

  it('writes non-finite values as JavaScript does, followed by the unit', () => {
    // ECMA-262 (2024), Number::toString: "NaN", "Infinity", "-Infinity".
    expect(formatValue(Number.POSITIVE_INFINITY)).toBe('Infinity');
    expect(formatValue(Number.NEGATIVE_INFINITY, 'V')).toBe('-Infinity V');
    expect(formatValue(Number.NaN, 'A')).toBe('NaN A');
  });

  it('uses each prefix from femto to tera and an exponent outside that range', () => {
    // BIPM, SI Brochure, 9th edition, 2019, Table 7.
    for (const [prefix, exponent] of OUTPUT_PREFIXES) {
      const symbol = `${prefix}V`;
      expect(formatValue(Number(`4.7e${exponent}`), 'V')).toBe(`4.7 ${symbol}`);
      expect(formatValue(Number(`-47e${exponent}`), 'V')).toBe(`-47 ${symbol}`);
      expect(formatValue(Number(`470e${exponent}`), 'V')).toBe(`470 ${symbol}`);
    }
    expect(formatValue(1e-18, 'A')).toBe('1e-18 A');
    expect(formatValue(1.5e-16, 'A')).toBe('1.5e-16 A');
    expect(formatValue(-2.5e15)).toBe('-2.5e15');
    expect(formatValue(1e300, 'Hz')).toBe('1e300 Hz');
    expect(formatValue(Number.MIN_VALUE)).toBe('4.941e-324');
  });

  it('moves to the next prefix when rounding crosses a power of 1000', () => {
    // Common practice, no source: round first, then choose the prefix of the rounded value.
    expect(formatValue(999.9999999)).toBe('1 k');
    expect(formatValue(999.9999999, 'Ω')).toBe('1 kΩ');
    expect(formatValue(999_999.5, 'Ω')).toBe('1 MΩ');
    expect(formatValue(999.6, 'V', { digits: 3 })).toBe('1 kV');
    expect(formatValue(999.4, 'V', { digits: 3 })).toBe('999 V');
    expect(formatValue(9.9999999e-16, 'F')).toBe('1 fF');
    expect(formatValue(999.9999999e12, 'Hz')).toBe('1e15 Hz');
    expect(formatValue(-0.0009999999, 'A')).toBe('-1 mA');
  });

  it('rounds to the requested significant digits and drops trailing zeros', () => {
    // Common practice, no source: significant digits count from the first non-zero digit.
    expect(formatValue(1234567, undefined, { digits: 3 })).toBe('1.23 M');
    expect(formatValue(1234567, undefined, { digits: 1 })).toBe('1 M');
    expect(formatValue(470, undefined, { digits: 1 })).toBe('500');
    expect(formatValue(47_000, 'Ω', { digits: 1 })).toBe('50 kΩ');
    expect(formatValue(1.5, 'V', { digits: 10 })).toBe('1.5 V');
    expect(formatValue(1 / 3, 'V', { digits: 10 })).toBe('333.3333333 mV');
    expect(formatValue(2 / 3, 'V')).toBe('666.7 mV');
  });

  it('prints the units spelled for formatting', () => {
    // Common practice, no source: a prefix fits the ampere of A/V² but not the volt inside 1/V or V^½.
    expect(formatValue(2e-3, 'A/V²')).toBe('2 mA/V²');
    expect(formatValue(0.02, '1/V')).toBe('0.02 1/V');
    expect(formatValue(0.4, 'V^½')).toBe('0.4 V^½');
    expect(formatValue(1 / 3, 'V^½')).toBe('0.3333 V^½');
    expect(formatValue(0, '1/V')).toBe('0 1/V');
  });

  it('always writes a mantissa from 1 to below 1000 with a known prefix, inside the prefix range', () => {
    // BIPM, SI Brochure, 9th edition, 2019, Table 7; engineering notation uses powers of 1000.
    const shape = /^(-?)(\d{1,3})(?:\.(\d*[1-9]))? ([^ ]?)F$/u;
    fc.assert(
      fc.property(
        fc.double({ min: 1e-15, max: 9e14, noNaN: true }),
        fc.boolean(),
        fc.integer({ min: 1, max: 17 }),
        (magnitude, negative, digits) => {
          const x = negative ? -magnitude : magnitude;
          const text = formatValue(x, 'F', { digits });
          const match = shape.exec(text);
          expect(match, text).not.toBeNull();
          const [, sign, integer, fraction = '', prefix = ''] = match!;
          expect(sign).toBe(negative ? '-' : '');
          expect(OUTPUT_PREFIXES.has(prefix), text).toBe(true);
          expect(integer!.startsWith('0') && integer !== '0', text).toBe(false);
          expect(Number(integer), text).toBeGreaterThanOrEqual(1);
          expect((integer! + fraction).replace(/^0+/, '').length, text).toBeLessThanOrEqual(
            Math.max(digits, 3),
          );
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('round-trips through parseValue to within the printed precision for both signs', () => {
    // Common practice, no source: rounding to 4 significant digits (the default) moves a value by at
    // most half a unit in the fourth digit, 5e-4 relative to a mantissa ≥ 1 (plus one rounding of the
    // double).
    fc.assert(
      fc.property(fc.double({ min: 1e-15, max: 1e13, noNaN: true }), fc.boolean(), (magnitude, negative) => {
        const x = negative ? -magnitude : magnitude;
        for (const unit of [undefined, 'Ω', 'F', 'eV', 'A/V²'] as const) {
          const text = formatValue(x, unit);
          const back = parseValue(unit === 'A/V²' ? text.replace(/A\/V²$/, '') : text, unit);
          const error = Math.abs(back - x) / Math.abs(x);
          expect(error, `${x} → ${text} → ${back}`).toBeLessThanOrEqual(5e-4 + 2 * Number.EPSILON);
        }
      }),
      { numRuns: 2000 },
    );
  });

  it('round-trips every finite double exactly with 17 digits', () => {
    // IEEE 754-2019, §5.12.2: 17 significant decimal digits recover any binary64 number exactly.
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        const text = formatValue(x, 'S', { digits: 17 });
        expect(parseValue(text, 'S') === x, `${x} → ${text}`).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });

  it('rejects a digit count that is not an integer from 1 to 101', () => {
    for (const digits of [0, -1, 1.5, 102, Number.NaN, Number.POSITIVE_INFINITY]) {
      const error = rejection(() => formatValue(1, 'V', { digits }));
      expect(error.code).toBe('invalid-value');
      expect(error.details).toMatchObject({ code: 'invalid-value', path: ['digits'], value: digits });
      expect(error.message).toContain('digits: ');
      expect(error.message).toContain('an integer from 1 to 101');
    }
    expect(formatValue(1, 'V', { digits: 101 })).toBe('1 V');
  });

  it('takes the digit count as a plain number too, with the same limits', () => {
    // docs/getting-started.md, "Values and units": formatValue(value, unit, digits).
    expect(formatValue(0.0123456, 'A', 6)).toBe('12.3456 mA');
    expect(formatValue(0.0123456, 'A', 2)).toBe('12 mA');
    expect(formatValue(0.0123456, 'A', 6)).toBe(formatValue(0.0123456, 'A', { digits: 6 }));
    for (const digits of [0, 1.5, 102, Number.NaN]) {
      expect(rejection(() => formatValue(1, 'V', digits)).details).toMatchObject({
        code: 'invalid-value',
        path: ['digits'],
        value: digits,
      });
    }
    const options = rejection(() => formatValue(1, 'V', '4' as unknown as number));
    expect(options.details).toMatchObject({ code: 'invalid-value', path: ['options'], value: '4' });
  });

  it('shares its default of 4 digits with the report tables', () => {
    // docs/reports.md, "Text tables": the default precision is 4 significant digits.
    expect(DEFAULT_DIGITS).toBe(4);
    expect(DEFAULT_REPORT_DIGITS).toBe(DEFAULT_DIGITS);
    expect(formatValue(1 / 3, 'V')).toBe('333.3 mV');
  });

  it('rejects an unknown unit and a value that is not a number', () => {
    const unit = rejection(() => formatValue(1, 'ohm' as Unit));
    expect(unit.details).toMatchObject({ code: 'invalid-value', path: ['unit'], value: 'ohm' });
    expect(unit.message).toContain('unit: "ohm" is not a unit symbol');
    const value = rejection(() => formatValue('4.7k' as unknown as number));
    expect(value.details).toMatchObject({ code: 'invalid-value', path: ['value'], value: '4.7k' });
    expect(value.message).toBe('value: "4.7k" is not a number');
  });
});
