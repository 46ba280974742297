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
 * The most points a generated grid may have. A million points already take seconds per analysis;
 * a count beyond it is a slip (a points-per-decade of 1e15, say), refused before any allocation.
 */
export const MAX_GRID_POINTS = 1_000_000;

/**
 * The highest frequency an analysis accepts, in Hz: far above any circuit (1e20 Hz is a gamma ray)
 * and low enough that ω times any admissible capacitance or inductance (at most 1e60) stays finite.
 */
export const MAX_FREQUENCY = 1e20;

function checkGridSize(points: number, argument: string, given: number): void {
  if (!(points <= MAX_GRID_POINTS)) {
    throw invalidValue(
      [argument],
      given,
      `a value that gives at most ${MAX_GRID_POINTS.toLocaleString('en')} points (it gives ${points > 1e21 ? points.toExponential(1) : Math.ceil(points)})`,
    );
  }
}

/**
 * Logarithmically spaced points from `start` to `stop`, both included, `pointsPerDecade` per decade
 * (rounded up so the spacing never exceeds it), at most {@link MAX_GRID_POINTS} of them. Any range
 * of finite positive numbers works, 1e-300 to 1e300 included: the spacing is taken on log10 of
 * each end, never on their quotient.
 *
 * @throws QuiescentError `invalid-value` for an end that is not finite and above 0, stop below
 *   start, or more than {@link MAX_GRID_POINTS} points
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
  if (start === stop) return Float64Array.of(start);
  const low = Math.log10(start);
  const decades = Math.log10(stop) - low;
  const wanted = decades * pointsPerDecade - 1e-9;
  checkGridSize(wanted + 1, 'pointsPerDecade', pointsPerDecade);
  const intervals = Math.max(1, Math.ceil(wanted));
  const out = new Float64Array(intervals + 1);
  for (let k = 0; k <= intervals; k++) out[k] = 10 ** (low + (decades * k) / intervals);
  out[0] = start;
  out[intervals] = stop;
  return out;
}

/**
 * `count` evenly spaced points from `start` to `stop`, both included (count ≥ 2, or 1 when
 * start = stop; at most {@link MAX_GRID_POINTS}). Each point is start·(1 − t) + stop·t, which stays
 * finite for any finite ends, −1e308 to 1e308 included.
 *
 * @throws QuiescentError `invalid-value` for an end that is not finite or a count that is not a
 *   whole number from 2 to {@link MAX_GRID_POINTS}
 */
export function linearSweep(start: number, stop: number, count: number): Float64Array {
  if (typeof start !== 'number' || !Number.isFinite(start))
    throw invalidValue(['start'], start, 'a finite number');
  if (typeof stop !== 'number' || !Number.isFinite(stop))
    throw invalidValue(['stop'], stop, 'a finite number');
  if (!Number.isInteger(count) || count < 1 || (count === 1 && start !== stop)) {
    throw invalidValue(
      ['count'],
      count,
      'a whole number of points, at least 2 (1 only when start equals stop)',
    );
  }
  checkGridSize(count, 'count', count);
  const out = new Float64Array(count);
  for (let k = 0; k < count; k++) {
    const t = count === 1 ? 0 : k / (count - 1);
    out[k] = start * (1 - t) + stop * t;
  }
  out[0] = start;
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
    if (typeof f !== 'number' || !Number.isFinite(f) || f < 0 || f > MAX_FREQUENCY) {
      throw invalidValue(['frequencies', k], f, `a frequency from 0 to ${MAX_FREQUENCY} Hz`);
    }
    out[k] = f;
  }
  return out;
}
