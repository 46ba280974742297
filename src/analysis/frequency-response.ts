/**
 * Reading a frequency response: decibels, unwrapped phase, and level crossings interpolated between
 * sweep points (linear in dB against log frequency, the straight lines of a Bode plot).
 */
import type { Complex } from 'complex.js';
import { invalidValue } from '../errors/messages.js';

/** 20·log10|h| for each point, in dB (−Infinity for an exact zero). */
export function decibels(response: readonly Complex[]): Float64Array {
  const out = new Float64Array(response.length);
  for (let k = 0; k < response.length; k++) out[k] = 20 * Math.log10(response[k]!.abs());
  return out;
}

/**
 * The phase of each point in degrees, unwrapped along the sweep: each point differs from the one before
 * by less than 180°, and the first lies in (−180°, 180°].
 */
export function unwrappedPhase(response: readonly Complex[]): Float64Array {
  const out = new Float64Array(response.length);
  let previous = 0;
  for (let k = 0; k < response.length; k++) {
    let phase = (response[k]!.arg() * 180) / Math.PI;
    if (k > 0) phase -= 360 * Math.round((phase - previous) / 360);
    out[k] = phase;
    previous = phase;
  }
  return out;
}

/** Refuse grids that are not strictly ascending: crossings are only meaningful along an ordered sweep. */
export function checkAscending(frequencies: Float64Array): void {
  for (let k = 1; k < frequencies.length; k++) {
    if (!(frequencies[k]! > frequencies[k - 1]!)) {
      throw invalidValue(
        ['frequencies', k],
        frequencies[k],
        `greater than the frequency before it (${frequencies[k - 1]}) for crossings`,
      );
    }
  }
}

/**
 * Every frequency where `levelDb` (a dB array over ascending `frequencies`) crosses `target`, interpolated
 * linearly in dB against log10 of frequency (linearly in frequency on a segment that starts at 0 Hz).
 */
export function crossings(frequencies: Float64Array, levelDb: Float64Array, target: number): number[] {
  const out: number[] = [];
  for (let k = 0; k + 1 < frequencies.length; k++) {
    const a = levelDb[k]! - target;
    const b = levelDb[k + 1]! - target;
    if (a === 0) {
      out.push(frequencies[k]!);
      continue;
    }
    if (!(a * b < 0) || !Number.isFinite(a) || !Number.isFinite(b)) continue;
    const t = a / (a - b);
    const f0 = frequencies[k]!;
    const f1 = frequencies[k + 1]!;
    out.push(f0 > 0 ? f0 * (f1 / f0) ** t : f0 + t * (f1 - f0));
  }
  const last = frequencies.length - 1;
  if (last >= 0 && levelDb[last] === target) out.push(frequencies[last]!);
  return out;
}
