/**
 * Frequency (or any positive quantity) grids for sweeps, and the validation of user-given grids.
 */
import { invalidValue } from '../errors/messages.js';

function checkPositiveFinite(value: number, name: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw invalidValue([name], value, 'a finite number greater than zero');
  }
}

/**
 * Logarithmically spaced points from `start` to `stop`, both included, `pointsPerDecade` per decade
 * (rounded up so the spacing never exceeds it).
 *
 * @example
 * ```ts
 * logSweep(10, 1e5, 10); // 41 points: 10, 12.59, 15.85, …, 1e5
 * ```
 */
export function logSweep(start: number, stop: number, pointsPerDecade: number): Float64Array {
  checkPositiveFinite(start, 'start');
  checkPositiveFinite(stop, 'stop');
  checkPositiveFinite(pointsPerDecade, 'pointsPerDecade');
  if (stop < start) throw invalidValue(['stop'], stop, `at least start (${start})`);
  const decades = Math.log10(stop / start);
  const intervals = Math.max(1, Math.ceil(decades * pointsPerDecade - 1e-9));
  if (start === stop) return Float64Array.of(start);
  const out = new Float64Array(intervals + 1);
  for (let k = 0; k <= intervals; k++) out[k] = start * 10 ** ((decades * k) / intervals);
  out[0] = start;
  out[intervals] = stop;
  return out;
}

/** `count` evenly spaced points from `start` to `stop`, both included (count ≥ 2, or 1 when start = stop). */
export function linearSweep(start: number, stop: number, count: number): Float64Array {
  if (!Number.isFinite(start)) throw invalidValue(['start'], start, 'a finite number');
  if (!Number.isFinite(stop)) throw invalidValue(['stop'], stop, 'a finite number');
  if (!Number.isInteger(count) || count < 1 || (count === 1 && start !== stop)) {
    throw invalidValue(
      ['count'],
      count,
      'a whole number of points, at least 2 (1 only when start equals stop)',
    );
  }
  const out = new Float64Array(count);
  for (let k = 0; k < count; k++) out[k] = count === 1 ? start : start + ((stop - start) * k) / (count - 1);
  if (count > 1) out[count - 1] = stop;
  return out;
}

/** Copy user frequencies into a Float64Array, refusing an empty list and negative or non-finite entries. */
export function checkFrequencies(frequencies: unknown): Float64Array {
  if (!(Array.isArray(frequencies) || frequencies instanceof Float64Array) || frequencies.length === 0) {
    throw invalidValue(['frequencies'], frequencies, 'a non-empty array of frequencies in Hz');
  }
  const out = new Float64Array(frequencies.length);
  for (let k = 0; k < frequencies.length; k++) {
    const f: unknown = frequencies[k];
    if (typeof f !== 'number' || !Number.isFinite(f) || f < 0) {
      throw invalidValue(['frequencies', k], f, 'a finite frequency of 0 Hz or more');
    }
    out[k] = f;
  }
  return out;
}
