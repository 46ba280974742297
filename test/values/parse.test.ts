import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { QuiescentError } from '../../src/errors/quiescent-error.js';
import { formatValue, parseValue, quantityName, type Unit } from '../../src/values/index.js';

/**
 * The SI prefixes from femto to tera and their powers of ten, typed in from BIPM, The International
 * System of Units (SI Brochure), 9th edition, 2019, Table 7. `u` is the common ASCII stand-in for
 * micro (common practice, no source); U+00B5 MICRO SIGN and U+03BC GREEK SMALL LETTER MU are the
 * two code points for µ (The Unicode Standard 15.0, §22.2, "Letterlike Symbols").
 */
const SI_PREFIXES: readonly (readonly [string, number])[] = [
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
];

/** Units whose symbol text may carry, with their quantities (SI Brochure, 9th ed., Tables 2 and 4; eV Table 8). */
const SYMBOL_UNITS: readonly (readonly [Unit, string])[] = [
  ['Ω', 'resistance'],
  ['F', 'capacitance'],
  ['H', 'inductance'],
  ['V', 'voltage'],
  ['A', 'current'],
  ['Hz', 'frequency'],
  ['s', 'time'],
  ['S', 'conductance'],
  ['K', 'temperature'],
  ['eV', 'energy'],
];

const PATH = ['R1', 'resistance'] as const;

/** Catches the error `parseValue` throws, failing the test when it returns instead. */
function rejection(text: unknown, unit?: Unit, path: readonly (string | number)[] = PATH): QuiescentError {
  let result: number | undefined;
  try {
    result = parseValue(text as string, unit, path);
  } catch (error) {
    expect(error).toBeInstanceOf(QuiescentError);
    return error as QuiescentError;
  }
  throw new Error(`parseValue(${JSON.stringify(text)}, ${unit}) returned ${result} instead of throwing`);
}

/** Checks code, details and that the message opens with the path and quotes the text. */
function expectRejected(text: string, unit: Unit | undefined, ...fragments: string[]): void {
  const error = rejection(text, unit);
  expect(error.code).toBe('invalid-value');
  expect(error.details).toMatchObject({ code: 'invalid-value', path: PATH, value: text });
  expect(error.message.startsWith(`R1.resistance: ${JSON.stringify(text)} is not `)).toBe(true);
  for (const fragment of fragments) expect(error.message).toContain(fragment);
}

describe('parseValue reads numbers', () => {
  it('returns a finite number unchanged, sign of zero included', () => {
    // Common practice, no source: a value already in SI units needs no conversion.
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        expect(Object.is(parseValue(x), x)).toBe(true);
      }),
    );
    expect(Object.is(parseValue(-0, 'V'), -0)).toBe(true);
  });

  it('reads back every finite double from its JavaScript string exactly', () => {
    // ECMA-262 (2024), Number::toString: the shortest decimal that converts back to the same double.
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        expect(parseValue(`${x}`) === x).toBe(true);
      }),
      { numRuns: 2000 },
    );
    for (const x of [
      Number.MAX_VALUE,
      Number.MIN_VALUE,
      -Number.MAX_VALUE,
      1e21,
      1e-7,
      123456789012345680000,
    ]) {
      expect(parseValue(`${x}`)).toBe(x);
    }
  });

  it('reads signs, fractions without an integer part and exponents', () => {
    // Decimal notation as ECMA-262 StringNumericLiteral spells it (without its Infinity and hex forms).
    expect(parseValue('-2')).toBe(-2);
    expect(parseValue('+3.3')).toBe(3.3);
    expect(parseValue('.5')).toBe(0.5);
    expect(parseValue('-.5')).toBe(-0.5);
    expect(parseValue('5.')).toBe(5);
    expect(parseValue('1.5e-3')).toBe(0.0015);
    expect(parseValue('1.5E-3')).toBe(0.0015);
    expect(parseValue('2e+3')).toBe(2000);
    expect(parseValue('  42  ')).toBe(42);
    expect(Object.is(parseValue('-0'), -0)).toBe(true);
  });
});

describe('parseValue reads SI prefixes', () => {
  it('applies each prefix as its power of ten, rounded once from the decimal', () => {
    // BIPM, SI Brochure, 9th edition, 2019, Table 7.
    for (const [prefix, exponent] of SI_PREFIXES) {
      expect(parseValue(`4.7${prefix}`), `4.7${prefix}`).toBe(Number(`4.7e${exponent}`));
      expect(parseValue(`-1.5 ${prefix}`), `-1.5 ${prefix}`).toBe(Number(`-1.5e${exponent}`));
    }
  });

  it('reads the examples of the value syntax', () => {
    // BIPM, SI Brochure, 9th edition, 2019, Table 7: k = 1e3, µ = 1e-6, n = 1e-9, M = 1e6, m = 1e-3.
    expect(parseValue('4.7k')).toBe(4700);
    expect(parseValue('10uF')).toBe(1e-5);
    expect(parseValue('10µF')).toBe(1e-5);
    expect(parseValue('10\u03bcF', 'F')).toBe(1e-5);
    expect(parseValue('2.2 nF')).toBe(2.2e-9);
    expect(parseValue('1M')).toBe(1e6);
    expect(parseValue('1m')).toBe(1e-3);
    expect(parseValue('330 Ω')).toBe(330);
    expect(parseValue('10 kHz', 'Hz')).toBe(1e4);
    expect(parseValue('1ms', 's')).toBe(1e-3);
  });

  it('combines a prefix with an exponent in the text', () => {
    // BIPM, SI Brochure, 9th edition, 2019, Table 7; 10^a·10^b = 10^(a+b).
    expect(parseValue('1.5e3k')).toBe(1.5e6);
    expect(parseValue('2e-3 MΩ', 'Ω')).toBe(2000);
    fc.assert(
      fc.property(
        fc.integer({ min: -99999, max: 99999 }),
        fc.integer({ min: -280, max: 280 }),
        fc.constantFrom(...SI_PREFIXES),
        (digits, exponent, [prefix, power]) => {
          const text = `${digits / 100}e${exponent}${prefix}`;
          expect(parseValue(text)).toBe(Number(`${digits / 100}e${exponent + power}`));
        },
      ),
    );
  });
});

describe('parseValue reads unit symbols', () => {
  it('accepts every spelling of the ohm', () => {
    // SI Brochure, 9th ed., Table 4: Ω; The Unicode Standard 15.0: U+2126 OHM SIGN is canonically
    // equivalent to U+03A9; the spelled-out forms are common practice, no source.
    for (const symbol of ['\u03a9', '\u2126', 'ohm', 'ohms', 'Ohm']) {
      expect(parseValue(`330 ${symbol}`, 'Ω'), symbol).toBe(330);
      expect(parseValue(`4.7k${symbol}`, 'Ω'), symbol).toBe(4700);
    }
  });

  it('accepts each unit symbol, alone and after a prefix', () => {
    // BIPM, SI Brochure, 9th edition, 2019, Tables 2, 4, 7 and 8.
    for (const [unit] of SYMBOL_UNITS) {
      expect(parseValue(`3${unit}`, unit), unit).toBe(3);
      expect(parseValue(`3 k${unit}`, unit), unit).toBe(3000);
      expect(parseValue(`3m${unit}`), unit).toBe(0.003);
    }
  });

  it('resolves case and letter ambiguities the way an engineer reads them', () => {
    // BIPM, SI Brochure, 9th edition, 2019, §3 and §5.2: prefix and unit symbols are case-sensitive.
    expect(parseValue('1F', 'F')).toBe(1); // farad
    expect(parseValue('1f', 'F')).toBe(1e-15); // femto
    expect(parseValue('1mS', 'S')).toBe(1e-3); // millisiemens
    expect(parseValue('1ms', 's')).toBe(1e-3); // millisecond
    expect(parseValue('1s', 's')).toBe(1); // second
    expect(parseValue('1S', 'S')).toBe(1); // siemens
    expect(parseValue('1m')).toBe(1e-3); // milli, never metres
    expect(parseValue('1M')).toBe(1e6); // mega
    expect(parseValue('300K', 'K')).toBe(300); // kelvin
    expect(parseValue('1T')).toBe(1e12); // tera
  });

  it('tells an exponent from the electronvolt', () => {
    // An e followed by digits is an exponent (ECMA-262 decimal literals); eV is the electronvolt
    // (SI Brochure, 9th ed., Table 8).
    expect(parseValue('1.12eV', 'eV')).toBe(1.12);
    expect(parseValue('1.12 eV', 'eV')).toBe(1.12);
    expect(parseValue('1eV')).toBe(1);
    expect(parseValue('1e3V', 'V')).toBe(1000);
    expect(parseValue('1e3eV', 'eV')).toBe(1000);
    expect(parseValue('1e-3meV', 'eV')).toBe(1e-6);
  });

  it('accepts one space of any usual width between the number and its prefix or unit', () => {
    // SI Brochure, 9th ed., §5.4.3: a space separates number and unit; typesetters use a thin or
    // no-break space (common practice, no source).
    for (const space of [' ', '\u00a0', '\u2009', '\u202f']) {
      expect(parseValue(`2.2${space}nF`, 'F')).toBe(2.2e-9);
      expect(parseValue(`330${space}Ω`, 'Ω')).toBe(330);
    }
  });

  it('ignores a known symbol when no unit is asked for', () => {
    // Common practice, no source: without an expected unit, the symbol only documents the value.
    expect(parseValue('10F')).toBe(10);
    expect(parseValue('5 V')).toBe(5);
    expect(parseValue('3 ohms')).toBe(3);
  });

  it('reads back what formatValue writes, to the printed precision', () => {
    // Common practice, no source: rounding to d significant digits moves a value by at most half a
    // unit in the last place, 0.5·10^(1−d) relative to a mantissa ≥ 1.
    fc.assert(
      fc.property(
        fc.double({ min: 1e-15, max: 1e13, noNaN: true }),
        fc.boolean(),
        fc.constantFrom<Unit | undefined>(undefined, ...SYMBOL_UNITS.map(([u]) => u)),
        fc.integer({ min: 1, max: 17 }),
        (magnitude, negative, unit, digits) => {
          const x = negative ? -magnitude : magnitude;
          const text = formatValue(x, unit, { digits });
          const back = parseValue(text, unit);
          const bound = 0.5 * 10 ** (1 - digits) + 2 * Number.EPSILON;
          expect(Math.abs(back - x) / Math.abs(x), `${x} → ${text} → ${back}`).toBeLessThanOrEqual(bound);
        },
      ),
      { numRuns: 2000 },
    );
  });
});

describe('parseValue rejects what it cannot read', () => {
  it('rejects empty and blank text', () => {
    expectRejected('', 'Ω', 'the text is empty');
    expectRejected('  ', 'Ω', 'the text is empty');
  });

  it('rejects text that does not start with a decimal number', () => {
    for (const text of ['k', 'kΩ', 'Ω', '-', '.', 'e3', '- 5', 'one']) {
      expectRejected(text, 'Ω', 'a resistance in Ω', 'expected a decimal number first');
    }
  });

  it('rejects NaN and infinities written as text or passed as numbers', () => {
    for (const text of ['NaN', 'Infinity', '-Infinity', '+inf', 'nan']) {
      expectRejected(text, 'Ω', 'NaN and infinite values are not accepted');
    }
    for (const x of [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) {
      const error = rejection(x, 'Ω');
      expect(error.details).toMatchObject({ code: 'invalid-value', path: PATH, value: x });
      expect(error.message).toBe(`R1.resistance: ${x} is not a resistance in Ω (it must be a finite number)`);
    }
  });

  it('rejects values too large for a double', () => {
    // IEEE 754-2019: the largest finite binary64 is about 1.7976931348623157e308.
    expectRejected('1e400', 'Ω', 'too large');
    expectRejected('-1e400', 'Ω', 'too large');
    expectRejected('1e308k', 'Ω', 'too large');
    expectRejected('1e99999999999999999999999', undefined, 'too large');
  });

  it('rejects doubled points and prefixes, hex, other number forms and trailing garbage', () => {
    for (const text of [
      '1..2k',
      '1kk',
      '0x10',
      '1,5k',
      '1kΩx',
      '4.7 k2',
      '1e',
      '1E+',
      '1_000',
      '10 MEG',
      '1 hz',
    ]) {
      expectRejected(text, undefined, 'a valid value', 'unrecognised', 'after the number');
    }
  });

  it('rejects spaces inside prefix and unit, and more than one space', () => {
    // Decision: one optional space between the number and its prefix or unit, none inside them.
    expectRejected('1 k Ω', 'Ω', 'none inside them');
    expectRejected('1k Ω', 'Ω', 'none inside them');
    expectRejected('1  k', undefined, 'at most one space');
  });

  it('rejects a symbol of another quantity and names that quantity', () => {
    // BIPM, SI Brochure, 9th edition, 2019, Table 4: F is the farad, the unit of capacitance.
    const error = rejection('10F', 'Ω');
    expect(error.message).toBe(
      'R1.resistance: "10F" is not a resistance in Ω (F is the unit of capacitance)',
    );
    for (const [unit, quantity] of SYMBOL_UNITS) {
      for (const [other, otherQuantity] of SYMBOL_UNITS) {
        if (other === unit) continue;
        expectRejected(
          `2 k${other}`,
          unit,
          `a ${quantity} in ${unit}`,
          `${other} is the unit of ${otherQuantity}`,
        );
      }
    }
  });

  it('explains the usual slips of case', () => {
    // SI Brochure, 9th ed., §3: the symbol of kilo is a lowercase k; K is the kelvin (Table 2).
    expectRejected('10K', 'Ω', 'K is the unit of temperature', 'kilo is a lowercase k');
    expectRejected('1ms', 'S', 's is the unit of time', 'case-sensitive');
    expectRejected('1mS', 's', 'S is the unit of conductance', 'case-sensitive');
  });

  it('reads the compound units as formatValue writes them, so that every formatted value reads back', () => {
    expect(parseValue('2m', 'A/V²')).toBe(0.002);
    expect(parseValue('20m', '1/V')).toBe(0.02);
    expect(parseValue('0.5', 'V^½')).toBe(0.5);
    expect(parseValue('2 mA/V²', 'A/V²')).toBe(0.002);
    expect(parseValue('2 mA/V^2', 'A/V²')).toBe(0.002);
    expect(parseValue('0.02 1/V', '1/V')).toBe(0.02);
    expect(parseValue('0.5 V^½', 'V^½')).toBe(0.5);
    expect(parseValue('0.5 V^0.5', 'V^½')).toBe(0.5);
    // A prefix before 1/V would be ambiguous: milli of the quantity, or per millivolt.
    expectRejected('20 m1/V', '1/V', 'a reciprocal voltage in 1/V');
    expectRejected('2V', '1/V', 'V is the unit of voltage');
    expectRejected('2 mF', 'A/V²', 'F is the unit of capacitance');
  });

  it('reads text that rounds to the largest double within its printed digits as that double', () => {
    // 1.8e308 with two digits stands for [1.75e308, 1.85e308), which holds 1.7976931348623157e308.
    expect(parseValue('1.8e308 V', 'V')).toBe(Number.MAX_VALUE);
    expect(parseValue('-1.8e308')).toBe(-Number.MAX_VALUE);
    expectRejected('1.9e308', undefined, 'a valid value', 'too large');
  });

  it('rejects values that are neither numbers nor strings', () => {
    for (const value of [null, undefined, true, {}, [1]]) {
      const error = rejection(value, 'F');
      expect(error.code).toBe('invalid-value');
      expect(error.details).toMatchObject({ code: 'invalid-value', path: PATH, value });
      expect(error.message).toContain('expected a number or a string');
    }
  });

  it('carries in its details what the message says: the expected quantity, its unit and the reason', () => {
    const error = rejection('10F', 'Ω');
    expect(error.details).toEqual({
      code: 'invalid-value',
      path: PATH,
      value: '10F',
      expected: 'a resistance',
      unit: 'Ω',
      reason: 'F is the unit of capacitance',
    });
    expect(error.message).toBe(
      'R1.resistance: "10F" is not a resistance in Ω (F is the unit of capacitance)',
    );
  });

  it('rejects an unknown unit argument', () => {
    const error = rejection('1', 'ohm' as Unit);
    expect(error.details).toMatchObject({ code: 'invalid-value', path: ['unit'], value: 'ohm' });
    expect(error.message).toContain('unit: "ohm" is not a unit symbol');
  });

  it('formats the path with indices and leaves it out when there is none', () => {
    const error = rejection('1kk', 'Ω', ['elements', 3, 'resistance']);
    expect(error.message.startsWith('elements[3].resistance: "1kk" is not a resistance in Ω')).toBe(true);
    const bare = rejection('1kk', undefined, []);
    expect(bare.message.startsWith('"1kk" is not a valid value')).toBe(true);
    expect(bare.details).toMatchObject({ code: 'invalid-value', path: [], value: '1kk' });
    expect(() => parseValue('1kk')).toThrow(/^"1kk" is not a valid value/);
  });
});

describe('quantityName', () => {
  it('names the quantity of every unit', () => {
    // BIPM, SI Brochure, 9th edition, 2019, Tables 2, 4 and 8 (names of the quantities).
    for (const [unit, quantity] of SYMBOL_UNITS) expect(quantityName(unit)).toBe(quantity);
    // Common practice, no source: the three compound units of the transistor models.
    expect(quantityName('A/V²')).toBe('gain factor');
    expect(quantityName('1/V')).toBe('reciprocal voltage');
    expect(quantityName('V^½')).toBe('square root of voltage');
  });
});
