/**
 * Typed arrays carved from one buffer (src/linalg/typed-arena.ts) behave as arrays of their own:
 * each starts at zero, has the length asked for, and no write to one reaches another (common
 * practice, no source).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { TypedArena } from '../../src/linalg/index.js';

describe('TypedArena', () => {
  it('gives zeroed, disjoint arrays of the lengths asked for, whatever the mix', () => {
    const lengths = fc.array(fc.nat(40), { maxLength: 6 });
    fc.assert(
      fc.property(lengths, lengths, lengths, (doubles, integers, bytes) => {
        const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);
        const arena = new TypedArena(sum(doubles), sum(integers), sum(bytes));
        const arrays = [
          ...doubles.map((m) => arena.float64(m)),
          ...integers.map((m) => arena.int32(m)),
          ...bytes.map((m) => arena.uint8(m)),
        ];
        expect(arrays.map((a) => a.length)).toEqual([...doubles, ...integers, ...bytes]);
        for (const a of arrays) expect(a.every((v) => v === 0)).toBe(true);
        // Fill each with its own mark (all marks fit a byte), then check none was overwritten.
        for (const [k, a] of arrays.entries()) a.fill(k + 1);
        for (const [k, a] of arrays.entries()) expect(a.every((v) => v === k + 1)).toBe(true);
      }),
    );
  });

  it('keeps doubles exact (the double region is 8-byte aligned after integers and bytes)', () => {
    const arena = new TypedArena(3, 5, 7);
    const bytes = arena.uint8(7);
    const integers = arena.int32(5);
    const doubles = arena.float64(3);
    doubles.set([Math.PI, -1e-300, 2 ** 60]);
    integers.fill(-1);
    bytes.fill(255);
    expect([...doubles]).toEqual([Math.PI, -1e-300, 2 ** 60]);
  });

  it('refuses to hand out more than it reserved', () => {
    const arena = new TypedArena(4, 2);
    arena.float64(3);
    expect(() => arena.float64(2)).toThrow(/more doubles/);
    arena.int32(2);
    expect(() => arena.int32(1)).toThrow(/more integers/);
    expect(() => arena.uint8(1)).toThrow(/more bytes/);
  });
});
