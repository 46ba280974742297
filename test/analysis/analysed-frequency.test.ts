import { describe, expect, it } from 'vitest';
import { analysedFrequencyIndex, nearestFrequencies } from '../../src/analysis/analysed-frequency.js';
import { QuiescentError } from '../../src/errors/quiescent-error.js';

/** The error a call throws. */
function thrown(call: () => unknown): QuiescentError {
  try {
    call();
  } catch (error) {
    if (error instanceof QuiescentError) return error;
    throw error;
  }
  throw new Error('no error thrown');
}

// Decades from 1 Hz to 1 MHz, with 0 Hz (the small-signal DC solution) in front, as a sweep might be.
const sweep = [0, 1, 10, 100, 1e3, 1e4, 1e5, 1e6];

describe('finding an analysed frequency', () => {
  it('finds a frequency equal to 1 part in 10⁹', () => {
    expect(analysedFrequencyIndex(sweep, 1e3)).toBe(4);
    expect(analysedFrequencyIndex(sweep, 1e3 * (1 + 5e-10))).toBe(4);
    expect(analysedFrequencyIndex(sweep, 0)).toBe(0);
  });

  it('refuses another frequency, listing the four analysed ones nearest to it on a log scale', () => {
    // docs/testing.md, "Checks at one frequency": the nearest frequencies, not the first ones.
    const error = thrown(() => analysedFrequencyIndex(sweep, 2e5));
    expect(error.code).toBe('invalid-value');
    expect(error.message).toContain(
      'one of the analysed frequencies (1 kHz, 10 kHz, 100 kHz, 1 MHz, the nearest of 8)',
    );
  });

  it('puts 0 Hz last on a log scale and measures plain distance from a request of 0', () => {
    expect(nearestFrequencies(sweep, 3, 3)).toEqual([1, 10, 100]);
    expect(nearestFrequencies(sweep, 0, 3)).toEqual([0, 1, 10]);
    expect(nearestFrequencies([0, 50], 1e6, 4)).toEqual([0, 50]);
  });

  it('lists every frequency of a short sweep without saying there are more', () => {
    const error = thrown(() => analysedFrequencyIndex([100, 200], 150));
    expect(error.message).toContain('(100 Hz, 200 Hz)');
  });
});
