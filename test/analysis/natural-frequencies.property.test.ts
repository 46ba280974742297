/**
 * Properties of the poles of random passive RC networks: every natural frequency of a network of
 * resistors and capacitors lies on the negative real axis, one per capacitor from a node to ground
 * when every node has one, and the list is sorted as the documentation says.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { Circuit, GROUND, operatingPoint, poles } from '../../src/index.js';

/** A connected RC network: a random tree of resistors plus extra ones, a capacitor from every node to ground. */
const network = fc.integer({ min: 2, max: 12 }).chain((count) =>
  fc.record({
    count: fc.constant(count),
    tree: fc.tuple(...Array.from({ length: count - 1 }, (_, i) => fc.integer({ min: 0, max: i }))),
    extra: fc.array(
      fc.tuple(fc.integer({ min: 0, max: count - 1 }), fc.integer({ min: 0, max: count - 1 })),
      {
        maxLength: 6,
      },
    ),
    resistances: fc.array(fc.double({ min: 2, max: 5, noNaN: true }), {
      minLength: count + 6,
      maxLength: count + 6,
    }),
    capacitances: fc.array(fc.double({ min: -10, max: -7, noNaN: true }), {
      minLength: count,
      maxLength: count,
    }),
  }),
);

describe('poles of random RC networks (property)', () => {
  it('are real, negative, one per grounded capacitor, sorted by frequency', () => {
    // Source: the natural frequencies of an RC network are real and non-positive (G and C symmetric,
    // C positive definite here): E. A. Guillemin, "Synthesis of Passive Networks", 1957
    // (from memory).
    fc.assert(
      fc.property(network, ({ count, tree, extra, resistances, capacitances }) => {
        const c = new Circuit()
          .voltageSource('signal', 'in', GROUND, { ac: 1 })
          .resistor('drive', 'in', 'n0', 10 ** resistances[0]!);
        let r = 1;
        tree.forEach((parent, i) => {
          c.resistor(`tree${i}`, `n${parent}`, `n${i + 1}`, 10 ** resistances[r++ % resistances.length]!);
        });
        extra.forEach(([a, b], i) => {
          if (a !== b)
            c.resistor(`extra${i}`, `n${a}`, `n${b}`, 10 ** resistances[r++ % resistances.length]!);
        });
        for (let k = 0; k < count; k++) c.capacitor(`C${k}`, `n${k}`, GROUND, 10 ** capacitances[k]!);
        const p = poles(operatingPoint(c));
        expect(p).toHaveLength(count);
        for (const pole of p) {
          expect(pole.imaginary).toBe(0);
          expect(pole.real).toBeLessThan(0);
          expect(pole.q).toBe(0.5);
        }
        for (let k = 1; k < p.length; k++)
          expect(p[k]!.frequency).toBeGreaterThanOrEqual(p[k - 1]!.frequency);
      }),
      { seed: 15, numRuns: 60 },
    );
  });
});
