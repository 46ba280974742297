/**
 * Finding a frequency among those an AC analysis solved at, for checks and reports that read one
 * frequency. A frequency that was not analysed is refused with the analysed frequencies nearest to it,
 * so that the message shows what the caller most likely meant.
 */
import { invalidValue } from '../errors/messages.js';
import { formatValue } from '../values/format.js';

/** How many analysed frequencies a refusal lists. */
const LISTED = 4;

/** Relative difference below which two frequencies are the same (1 part in 10⁹). */
const SAME = 1e-9;

/**
 * The index of `frequency` among `frequencies`, equal to 1 part in 10⁹.
 *
 * @param frequencies - the analysed frequencies, in Hz, in any order
 * @param frequency - the frequency asked for, in Hz
 * @returns its index in `frequencies`
 * @throws QuiescentError `invalid-value` when no analysed frequency matches; the message lists the
 *   (up to) four nearest on a log scale, ascending, each to six significant digits
 */
export function analysedFrequencyIndex(frequencies: ArrayLike<number>, frequency: number): number {
  for (let k = 0; k < frequencies.length; k++) {
    const f = frequencies[k]!;
    if (Math.abs(f - frequency) <= SAME * Math.max(Math.abs(f), Math.abs(frequency))) return k;
  }
  const nearest = nearestFrequencies(frequencies, frequency, LISTED);
  const list = nearest.map((f) => formatValue(f, 'Hz', 6)).join(', ');
  const more = frequencies.length > nearest.length ? `, the nearest of ${frequencies.length}` : '';
  throw invalidValue(['frequency'], frequency, `one of the analysed frequencies (${list}${more})`);
}

/**
 * The `count` analysed frequencies nearest to `frequency`, measured on a log scale (a ratio, as a
 * sweep is read, with 0 Hz farthest; plain distance when the request is not a positive number),
 * ascending.
 */
export function nearestFrequencies(
  frequencies: ArrayLike<number>,
  frequency: number,
  count: number,
): number[] {
  const logScale = frequency > 0 && Number.isFinite(frequency);
  const distance = (f: number): number => {
    if (!logScale) return Math.abs(f - (Number.isFinite(frequency) ? frequency : 0));
    return f > 0 ? Math.abs(Math.log(f / frequency)) : Number.POSITIVE_INFINITY;
  };
  const byDistance = Array.from(frequencies).sort((a, b) => distance(a) - distance(b) || a - b);
  return byDistance.slice(0, count).sort((a, b) => a - b);
}
