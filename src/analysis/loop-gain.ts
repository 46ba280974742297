/**
 * Loop gain of a feedback circuit, measured at a loop probe without breaking the loop: the double
 * injection of R. D. Middlebrook ("Measurement of loop gain in feedback systems", Int. J. Electronics
 * 38(4), 1975), computed with two small-signal solves as M. Tian, V. Visvanathan, J. Hantgan and
 * K. Kundert describe ("Striving for small-signal stability", IEEE Circuits and Devices Magazine 17(1),
 * 2001). With every independent source off, (i) a unit voltage in series in the probe gives v(to);
 * (ii) a unit current injected from ground into the probe's `from` node gives the probe current i_p;
 * then 1/(1 + T) = v(to) + i_p, exact for loops that pass signal both ways.
 */
import { Complex } from 'complex.js';
import type { LoopProbe } from '../devices/loop-probe/loop-probe.js';
import { invalidValue, unknownElement } from '../errors/messages.js';
import { AcWorkspace } from './ac-workspace.js';
import { checkFrequencies } from './frequency-grid.js';
import { checkAscending } from './frequency-response.js';
import type { OperatingPoint } from './operating-point.js';

/** 1/(1 + T) below this fraction of its two terms is zero to rounding: T is infinite. */
const INFINITE_GAIN = 1e-12;

/** Options of {@link loopGain}. */
export interface LoopGainOptions {
  /** The name of the loop probe (added with `Circuit.loopProbe`) where the loop is measured. */
  readonly probe: string;
  /** The frequencies in Hz, strictly ascending (the phase is unwrapped along them). */
  readonly frequencies: readonly number[] | Float64Array;
}

/** The loop gain as plain JSON (JSON has no Infinity: an infinite value is `null`). */
export interface LoopGainJson {
  /** The loop probe's name. */
  readonly probe: string;
  /** In Hz, ascending. */
  readonly frequencies: readonly number[];
  /** Real and imaginary parts of T at each frequency. */
  readonly gain: {
    /** Real parts, one per frequency. */
    readonly re: readonly number[];
    /** Imaginary parts, one per frequency. */
    readonly im: readonly number[];
  };
  /** 20·log10|T| at each frequency, in dB. */
  readonly magnitudeDb: readonly (number | null)[];
  /** arg T unwrapped along the sweep, in degrees. */
  readonly phaseDegrees: readonly number[];
  /** See {@link LoopGain.crossoverFrequency}. */
  readonly crossoverFrequency: number | null;
  /** See {@link LoopGain.phaseMargin}. */
  readonly phaseMargin: number | null;
  /** See {@link LoopGain.phaseCrossoverFrequency}. */
  readonly phaseCrossoverFrequency: number | null;
  /** See {@link LoopGain.gainMargin}. */
  readonly gainMargin: number | null;
}

/**
 * The loop gain T of a feedback loop at each frequency of a sweep, and the stability margins read from
 * it. Sign: negative feedback gives T near +|T| (arg T near 0°) at low frequency, and the closed loop is
 * A/(1 + T). Immutable.
 */
export class LoopGain {
  /** The loop probe the loop was measured at. */
  readonly probe: string;
  /** The analysed frequencies in Hz, ascending. */
  readonly frequencies: Float64Array;
  /** The loop gain T at each frequency. */
  readonly gain: Complex[];
  /** 20·log10|T| at each frequency, in dB. */
  readonly magnitudeDb: Float64Array;
  /** arg T in degrees, unwrapped along the sweep from the lowest frequency (the first in (−180°, 180°]). */
  readonly phaseDegrees: Float64Array;
  /**
   * The lowest frequency where |T| falls through 1 (0 dB), in Hz, interpolated linearly in dB against
   * log10 f between the two analysed frequencies that bracket it; null when |T| never falls through 1.
   */
  readonly crossoverFrequency: number | null;
  /** 180° plus the phase of T at the crossover (interpolated as the magnitude), in degrees; null without a crossover. */
  readonly phaseMargin: number | null;
  /** The lowest frequency where the unwrapped phase of T reaches −180°, in Hz (interpolated against log10 f); null if it never does. */
  readonly phaseCrossoverFrequency: number | null;
  /** −20·log10|T| at {@link LoopGain.phaseCrossoverFrequency}, in dB; null if the phase never reaches −180°. */
  readonly gainMargin: number | null;

  /** @internal Built by {@link loopGain}. */
  constructor(probe: string, frequencies: Float64Array, gain: Complex[]) {
    this.probe = probe;
    this.frequencies = frequencies;
    this.gain = gain;
    const n = gain.length;
    this.magnitudeDb = new Float64Array(n);
    this.phaseDegrees = new Float64Array(n);
    let previous = 0;
    for (let k = 0; k < n; k++) {
      this.magnitudeDb[k] = 20 * Math.log10(gain[k]!.abs());
      let phase = (gain[k]!.arg() * 180) / Math.PI;
      if (k > 0) phase -= 360 * Math.round((phase - previous) / 360);
      this.phaseDegrees[k] = phase;
      previous = phase;
    }
    const crossover = firstFall(this.magnitudeDb, 0);
    if (crossover === null) {
      this.crossoverFrequency = null;
      this.phaseMargin = null;
    } else {
      this.crossoverFrequency = interpolateFrequency(frequencies, crossover);
      this.phaseMargin = 180 + interpolate(this.phaseDegrees, crossover);
    }
    const phaseCrossing = firstFall(this.phaseDegrees, -180);
    if (phaseCrossing === null) {
      this.phaseCrossoverFrequency = null;
      this.gainMargin = null;
    } else {
      this.phaseCrossoverFrequency = interpolateFrequency(frequencies, phaseCrossing);
      this.gainMargin = -interpolate(this.magnitudeDb, phaseCrossing);
    }
  }

  /** Plain data: the frequencies, T, its dB and phase, and the margins. */
  toJSON(): LoopGainJson {
    const finite = (v: number) => (Number.isFinite(v) ? v : null);
    return {
      probe: this.probe,
      frequencies: Array.from(this.frequencies),
      gain: { re: this.gain.map((t) => t.re), im: this.gain.map((t) => t.im) },
      magnitudeDb: Array.from(this.magnitudeDb, finite),
      phaseDegrees: Array.from(this.phaseDegrees),
      crossoverFrequency: this.crossoverFrequency,
      phaseMargin: this.phaseMargin,
      phaseCrossoverFrequency: this.phaseCrossoverFrequency,
      gainMargin: this.gainMargin,
    };
  }
}

/** A position between two sweep points: index k and the fraction t of the way to k+1. */
interface Bracket {
  readonly k: number;
  readonly t: number;
}

/**
 * The first place where `values` (over ascending frequencies) comes down to `level`: at a point equal
 * to it, or between a point above and the next below it. Null if it never does.
 */
function firstFall(values: Float64Array, level: number): Bracket | null {
  for (let k = 0; k < values.length; k++) {
    const a = values[k]! - level;
    const b = k + 1 < values.length ? values[k + 1]! - level : Number.NEGATIVE_INFINITY;
    if (a === 0 && b < 0) return { k, t: 0 };
    if (k + 1 === values.length) break;
    if (a > 0 && b < 0 && Number.isFinite(a) && Number.isFinite(b)) return { k, t: a / (a - b) };
    if (a > 0 && b === Number.NEGATIVE_INFINITY) return { k, t: 1 };
  }
  return null;
}

/** The value of `values` at a bracket, linear between its two points. */
function interpolate(values: Float64Array, { k, t }: Bracket): number {
  return t === 0 ? values[k]! : values[k]! + t * (values[k + 1]! - values[k]!);
}

/** The frequency at a bracket: geometric between the two points (linear in log f), linear from 0 Hz. */
function interpolateFrequency(frequencies: Float64Array, { k, t }: Bracket): number {
  if (t === 0) return frequencies[k]!;
  const f0 = frequencies[k]!;
  const f1 = frequencies[k + 1]!;
  return f0 > 0 ? f0 * (f1 / f0) ** t : f0 + t * (f1 - f0);
}

/**
 * The loop gain at a loop probe, by double injection: two solves per frequency on one factorization,
 * every independent source off.
 *
 * @param op - the operating point to linearize at
 * @param options - `probe` (the loop probe's name) and `frequencies` (Hz, strictly ascending)
 * @returns the {@link LoopGain}, with the crossover frequency and the phase and gain margins
 * @throws QuiescentError `unknown-element` when `probe` is not a loop probe of the circuit;
 *   `invalid-value` for a bad frequency list or a loop whose gain is infinite (an ideal op-amp in the
 *   loop, or a loop that oscillates at exactly an analysed frequency); `singular` when the small-signal circuit has no unique
 *   solution at some frequency
 *
 * @example
 * ```ts no-run
 * const loop = loopGain(op, { probe: 'loopBreak', frequencies: logSweep(10, 1e8, 20) });
 * loop.crossoverFrequency; // Hz
 * loop.phaseMargin;        // degrees
 * ```
 */
export function loopGain(op: OperatingPoint, options: LoopGainOptions): LoopGain {
  if (options === null || typeof options !== 'object') {
    throw invalidValue(['options'], options, 'an object with the probe and the frequencies');
  }
  const { probe } = options;
  const device = typeof probe === 'string' ? op.system.deviceByName.get(probe) : undefined;
  if (device === undefined)
    throw unknownElement(String(probe), 'the circuit has no loop probe of that name', ['probe']);
  if (device.record.kind !== 'loop-probe') {
    throw unknownElement(probe, `it is a ${device.record.kind}, not a loop probe (add one with loopProbe)`, [
      'probe',
    ]);
  }
  const frequencies = checkFrequencies(options.frequencies);
  checkAscending(frequencies);
  const { branch, fromNode, toNode } = device as LoopProbe;
  const workspace = new AcWorkspace(op);
  const size = op.system.n + 1;
  const voltageRe = new Float64Array(size);
  const voltageIm = new Float64Array(size);
  const currentRe = new Float64Array(size);
  const currentIm = new Float64Array(size);
  const gain: Complex[] = new Array(frequencies.length);
  for (let k = 0; k < frequencies.length; k++) {
    workspace.factorAt(frequencies[k]!);
    // (i) v(to) − v(from) = 1 in series in the probe: its branch row reads v(from) − v(to) = −1.
    voltageRe.fill(0);
    voltageIm.fill(0);
    voltageRe[branch] = -1;
    workspace.solve(voltageRe, voltageIm);
    // (ii) 1 A from ground into `from`.
    currentRe.fill(0);
    currentIm.fill(0);
    currentRe[fromNode] = 1;
    currentRe[size - 1] = 0; // a grounded `from` injects into the ground index: nothing

    workspace.solve(currentRe, currentIm);
    // 1/(1 + T) = v(to) + i_p.
    const sumRe = voltageRe[toNode]! + currentRe[branch]!;
    const sumIm = voltageIm[toNode]! + currentIm[branch]!;
    const norm = sumRe * sumRe + sumIm * sumIm;
    // v(to) + i_p at the rounding level of its two terms: T is infinite.
    const terms =
      Math.hypot(voltageRe[toNode]!, voltageIm[toNode]!) + Math.hypot(currentRe[branch]!, currentIm[branch]!);
    if (!(Math.sqrt(norm) > INFINITE_GAIN * terms)) {
      throw invalidValue(
        ['frequencies', k],
        frequencies[k],
        `a frequency where the loop at '${probe}' has a finite gain: 1/(1 + T) is 0 there (an ideal amplifier in the loop, or a loop that oscillates at exactly that frequency)`,
      );
    }
    gain[k] = new Complex(sumRe / norm - 1, -sumIm / norm);
  }
  return new LoopGain(probe, frequencies, gain);
}
