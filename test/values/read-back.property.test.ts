/**
 * Every value formatValue writes reads back through parseValue to the number it was given, within
 * half a unit of the last printed digit (the rounding the formatter did).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatValue, parseValue, type Unit } from '../../src/index.js';
import { UNITS } from '../../src/values/units.js';

/** Half a unit in the last of `digits` significant digits of v (common practice, no source). */
function halfUnit(v: number, digits: number): number {
  const exponent = Number(
    Math.abs(v)
      .toExponential(digits - 1)
      .split('e')[1],
  );
  return 0.5 * 10 ** (exponent - digits + 1);
}

describe('formatValue then parseValue', () => {
  it('gives back every finite value within its printed digits, in every unit', () => {
    fc.assert(
      fc.property(
        fc.double({ noNaN: true, noDefaultInfinity: true }),
        fc.constantFrom<Unit | undefined>(undefined, ...UNITS),
        fc.integer({ min: 1, max: 17 }),
        (value, unit, digits) => {
          const text = formatValue(value, unit, { digits });
          const back = parseValue(text, unit);
          // The printed decimal is within half a unit of v; reading it back rounds once more, to the
          // nearest double (at most one unit roundoff of the value, IEEE 754).
          const allowed = value === 0 ? 0 : halfUnit(value, digits) + Math.abs(value) * Number.EPSILON;
          expect(Math.abs(back - value), `${value} → ${text} → ${back}`).toBeLessThanOrEqual(allowed);
        },
      ),
      { seed: 11, numRuns: 20000 },
    );
  });

  it('reads back the values that did not parse before', () => {
    expect(parseValue(formatValue(2e-3, 'A/V²'), 'A/V²')).toBe(2e-3);
    expect(parseValue(formatValue(0.02, '1/V'), '1/V')).toBe(0.02);
    expect(parseValue(formatValue(0.45, 'V^½'), 'V^½')).toBe(0.45);
    expect(formatValue(Number.MAX_VALUE, 'V', { digits: 2 })).toBe('1.8e308 V');
    expect(parseValue('1.8e308 V', 'V')).toBe(Number.MAX_VALUE);
  });
});
