/**
 * Reading a peak and a pass band from a swept response: where the level is highest, how high, and
 * where it has fallen a given number of dB (3 by default) on either side, with the centre frequency,
 * bandwidth and quality factor those define. Samples in, numbers out; the sweep's density sets the
 * accuracy (the peak is refined by a parabola through the three highest-lying samples, the band edges
 * by the straight-line interpolation of `crossings`).
 */
import { requireOptions } from '../errors/arguments.js';
import { invalidValue, wrongArgument } from '../errors/messages.js';
import { crossings } from './frequency-response.js';

/** The highest point of a response. */
export interface ResponsePeak {
  /** The frequency of the peak, in Hz: refined between sweep points unless it lies at an end of the sweep. */
  readonly frequency: number;
  /** The level there, in dB. */
  readonly levelDb: number;
  /** The level as a plain ratio (or in V or A for a response without an input), 10^(levelDb/20). */
  readonly magnitude: number;
  /** Whether the peak lies inside the sweep, with lower levels on both sides (false at an end of it). */
  readonly interior: boolean;
}

/** A pass band around a peak. */
export interface PassBand {
  /** The peak the band is measured from. */
  readonly peak: ResponsePeak;
  /** The edge below the peak, where the level has fallen by `dropDb`, in Hz. */
  readonly lower: number;
  /** The edge above the peak, in Hz. */
  readonly upper: number;
  /** The centre frequency, the geometric mean √(lower·upper) of the edges, in Hz. */
  readonly centre: number;
  /** upper − lower, in Hz. */
  readonly bandwidth: number;
  /** The quality factor, centre ÷ bandwidth. */
  readonly q: number;
  /** How far below the peak the edges lie, in dB. */
  readonly dropDb: number;
}

/** Options of {@link passBand}. */
export interface PassBandOptions {
  /** How far below the peak the band edges lie, in dB, above 0 (default 10·log10 2, the half-power points). */
  readonly dropDb?: number;
}

/**
 * The highest point of `levelDb` over ascending `frequencies`. Inside the sweep the peak is refined by
 * the parabola through the highest sample and its two neighbours, in dB against log frequency (the
 * shape of any resonance near its top).
 *
 * @param frequencies - ascending, in Hz
 * @param levelDb - the level at each frequency, in dB
 * @returns the peak
 * @throws QuiescentError `invalid-value` when no level is finite
 */
export function responsePeak(frequencies: Float64Array, levelDb: Float64Array): ResponsePeak {
  for (const [name, list] of [
    ['frequencies', frequencies],
    ['levelDb', levelDb],
  ] as const) {
    if (!(list instanceof Float64Array) && !Array.isArray(list))
      throw wrongArgument(name, list, 'a list of numbers');
  }
  if (frequencies.length !== levelDb.length) {
    throw wrongArgument('levelDb', levelDb, `a list as long as the frequencies (${frequencies.length})`);
  }
  let best = -1;
  for (let k = 0; k < levelDb.length; k++) {
    if (Number.isFinite(levelDb[k]!) && (best < 0 || levelDb[k]! > levelDb[best]!)) best = k;
  }
  if (best < 0) throw invalidValue(['response'], 'no finite level', 'a response that is not zero everywhere');
  const edge = best === 0 || best === levelDb.length - 1;
  if (edge || !(frequencies[best - 1]! > 0)) return peakAt(frequencies[best]!, levelDb[best]!, !edge);
  // The vertex of the parabola through (x, y) at k − 1, k, k + 1, with x = log10 f.
  const x0 = Math.log10(frequencies[best - 1]!);
  const x1 = Math.log10(frequencies[best]!);
  const x2 = Math.log10(frequencies[best + 1]!);
  const [y0, y1, y2] = [levelDb[best - 1]!, levelDb[best]!, levelDb[best + 1]!];
  if (!Number.isFinite(y0) || !Number.isFinite(y2)) return peakAt(frequencies[best]!, y1, true);
  const d01 = (y1 - y0) / (x1 - x0);
  const d12 = (y2 - y1) / (x2 - x1);
  const curvature = (d12 - d01) / (x2 - x0);
  if (!(curvature < 0)) return peakAt(frequencies[best]!, y1, true);
  const vertex = (x0 + x1) / 2 - d01 / (2 * curvature);
  const level = y1 + d01 * (vertex - x1) + curvature * (vertex - x0) * (vertex - x1);
  return peakAt(10 ** vertex, Math.max(level, y1), true);
}

function peakAt(frequency: number, levelDb: number, interior: boolean): ResponsePeak {
  return { frequency, levelDb, magnitude: 10 ** (levelDb / 20), interior };
}

/**
 * The pass band around the peak of `levelDb`: the nearest frequencies below and above the peak where
 * the level has fallen by `dropDb`, and the centre, bandwidth and Q they define. `null` when the
 * response does not fall that far on both sides within the sweep (a low-pass or high-pass, or a sweep
 * too narrow).
 *
 * @param frequencies - ascending, in Hz
 * @param levelDb - the level at each frequency, in dB
 * @param options - `dropDb` (default the half-power 10·log10 2 ≈ 3.01 dB)
 * @returns the band, or `null`
 * @throws QuiescentError `invalid-value` for a `dropDb` that is not a finite number above 0, or no finite level
 */
export function passBand(
  frequencies: Float64Array,
  levelDb: Float64Array,
  options: PassBandOptions = {},
): PassBand | null {
  requireOptions(options);
  const dropDb = options.dropDb ?? 10 * Math.log10(2);
  if (!(Number.isFinite(dropDb) && dropDb > 0))
    throw invalidValue(['dropDb'], dropDb, 'a finite number of dB above 0');
  const peak = responsePeak(frequencies, levelDb);
  if (!peak.interior) return null;
  let lower = Number.NaN;
  let upper = Number.NaN;
  for (const f of crossings(frequencies, levelDb, peak.levelDb - dropDb)) {
    if (f < peak.frequency) lower = f;
    else if (f > peak.frequency && Number.isNaN(upper)) upper = f;
  }
  if (Number.isNaN(lower) || Number.isNaN(upper)) return null;
  const centre = Math.sqrt(lower * upper);
  const bandwidth = upper - lower;
  return { peak, lower, upper, centre, bandwidth, q: centre / bandwidth, dropDb };
}
